import { describe, expect, it } from 'vitest'
import { isTimeZone, localIsoText, offsetText, zonedText } from '../../../shared/utils/zone'
import { scenarioSchema } from '../../../shared/scenario/schema'

describe('scenario time zones', () => {
  it('knows IANA names and refuses others', () => {
    expect(isTimeZone('Europe/Lisbon')).toBe(true)
    expect(isTimeZone('UTC')).toBe(true)
    expect(isTimeZone('Atlantis/Coast')).toBe(false)
  })

  // Portugal keeps UTC+0 in winter and UTC+1 in summer (EU summer time, last Sundays of March and October):
  // a fact of the civil calendar, common practice, no source.
  it('gives local time with the offset of the day, UTC beside it', () => {
    expect(zonedText('2031-03-03T21:00:00Z', 'Europe/Lisbon')).toBe('3 Mar 2031 21:00 (UTC+0) · 21:00 UTC')
    expect(zonedText('2031-09-08T04:17:26Z', 'Europe/Lisbon')).toBe('8 Sep 2031 05:17 (UTC+1) · 04:17 UTC')
    expect(zonedText('2031-09-08T23:30:00Z', 'Europe/Lisbon', { year: false })).toBe('9 Sep 00:30 (UTC+1) · 23:30 UTC')
    expect(offsetText(Date.parse('2031-01-10T12:00:00Z'), 'America/St_Johns')).toBe('UTC−3:30')
  })

  it('gives a sortable local time for tables and exports', () => {
    expect(localIsoText(Date.parse('2031-09-08T04:17:26Z'), 'Europe/Lisbon')).toBe('2031-09-08 05:17:26 UTC+1')
    expect(localIsoText(Date.parse('2031-09-08T04:17:26Z'))).toBe('2031-09-08 04:17:26 UTC')
  })

  it('writes a UTC scenario in UTC only', () => {
    expect(zonedText('2031-09-08T04:17:26Z')).toBe('8 Sep 2031 04:17 UTC')
    expect(zonedText(null)).toBe('—')
  })

  it('is checked in the scenario file', () => {
    const clock = { scenarioStart: '2031-03-03T21:00:00Z', impactTime: '2031-09-08T04:17:26Z', plannedWallMinutes: 120 }
    const shape = scenarioSchema.shape as unknown as { clock: { safeParse: (v: unknown) => { success: boolean } } }
    expect(shape.clock.safeParse({ ...clock, timeZone: 'Europe/Lisbon' }).success).toBe(true)
    expect(shape.clock.safeParse({ ...clock, timeZone: 'Nowhere/Land' }).success).toBe(false)
  })
})
