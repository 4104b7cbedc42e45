import { describe, expect, it } from 'vitest'
import { isoToText, textToIso } from '../../../app/utils/scenarioTime'

describe('time fields (UTC, 24-hour, the same in every browser language)', () => {
  it('reads a typed time as UTC', () => {
    expect(textToIso('2031-03-04 06:30')).toBe('2031-03-04T06:30:00Z')
    expect(textToIso(' 2031-03-04T18:05:09 ')).toBe('2031-03-04T18:05:09Z')
    expect(textToIso('')).toBe('')
  })

  it('refuses what is not a time, rather than guessing', () => {
    for (const bad of ['04/03/2031 6:30 PM', '2031-02-30 10:00', '2031-03-04 24:10', '2031-3-4 6:30', 'tomorrow']) {
      expect(textToIso(bad), bad).toBeNull()
    }
  })

  it('writes a time back as it reads, seconds only when they are not zero', () => {
    expect(isoToText('2031-03-04T06:30:00Z')).toBe('2031-03-04 06:30')
    expect(isoToText('2031-03-04T06:30:15.000Z')).toBe('2031-03-04 06:30:15')
    expect(isoToText('2031-03-04T07:30:00+01:00')).toBe('2031-03-04 06:30')
    expect(textToIso(isoToText('2031-09-08T04:17:26Z'))).toBe('2031-09-08T04:17:26Z')
  })
})
