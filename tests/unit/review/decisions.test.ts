import { beforeEach, describe, expect, it } from 'vitest'
import { decisionSummary, durationText, median } from '../../../shared/review/decisions'
import { ev, inject, MIN, resetSeq, response, scenario, T0 } from './fixtures'

beforeEach(resetSeq)

describe('decision response times', () => {
  it('times each team from release to its first response, against the deadline', () => {
    const events = [
      ev('inject.released', 0, inject('ask', ['science', 'civil'], 'detection', 600), 'all', 0),
      ev('response.submitted', 120, response('ask', 'science'), 'teams:science', 3),
      ev('response.submitted', 150, { ...response('ask', 'science'), choice: 'No' }, 'teams:science', 4),
      ev('response.submitted', 900, response('ask', 'civil', true), 'teams:civil', 9),
    ]
    const { rows, byTeam, byPhase } = decisionSummary(events, scenario, T0 + 1000 * MIN)
    expect(rows.map(r => [r.teamKey, r.status, r.responseMin, r.responseWallMin, r.responses, r.first?.choice])).toEqual([
      ['science', 'on-time', 120, 3, 2, 'Yes'],
      ['civil', 'late', 900, 9, 1, 'Yes'],
    ])
    expect(rows[0]!.allowedMin).toBe(600)
    expect(rows[0]!.shareOfAllowed).toBeCloseTo(0.2)
    expect(byTeam.map(g => g.key)).toEqual(['science', 'civil'])
    expect(byPhase).toEqual([expect.objectContaining({
      key: 'detection',
      decisions: 2,
      answered: 2,
      onTime: 1,
      late: 1,
      medianMin: 510,
      medianWallMin: 6,
    })])
  })

  it('leaves a jump of the clock out of a response time, and says when the answer was to an earlier revision', () => {
    const events = [
      ev('inject.released', 0, inject('ask', ['science'], 'detection', 600), 'all', 0),
      // A jump of 4 scenario hours an hour after the release.
      ev('clock.changed', 300, { action: 'jump', clock: {}, from: new Date(T0 + 60 * MIN).toISOString() }, 'all', 1),
      ev('inject.revised', 310, { key: 'ask', teams: ['science'], revision: 1, body: 'New', solutionKey: 's2', previousSolutionKey: 's1' }),
      ev('response.submitted', 330, { ...response('ask', 'science'), injectRevision: 0 }, 'teams:science', 3),
    ]
    const [row] = decisionSummary(events, scenario, T0 + 400 * MIN).rows
    // 330 scenario minutes after the release, of which the jump took 240: the team took 90.
    expect(row!.responseMin).toBe(90)
    expect(row!.first!.injectRevision).toBe(0)
    expect(row!.revision).toBe(1)
  })

  it('says how early a release by hand went out, and how late a scheduler behind a fast clock released', () => {
    const events = [
      // Planned two days in, released by hand at T0: 2 d early, with the whole time to the deadline allowed.
      ev('inject.released', 0, inject('early', ['science'], 'detection', 3000, { at: new Date(T0 + 2880 * MIN).toISOString() })),
      ev('response.submitted', 5, response('early', 'science'), 'teams:science', 1),
      // Planned at T0 + 10 min, went out 33 scenario minutes after that.
      ev('inject.released', 43, inject('late', ['civil'], 'detection', 600, { at: new Date(T0 + 10 * MIN).toISOString(), manual: false })),
      // On time within the minute: no lag reported.
      ev('inject.released', 60.5, inject('punctual', ['civil'], 'detection', 600, { at: new Date(T0 + 60 * MIN).toISOString() })),
      ev('message.sent', 70, inject('msg', ['civil'], 'detection', 600, { adhoc: true, at: new Date(T0 + 70 * MIN).toISOString() })),
    ]
    const rows = decisionSummary(events, scenario, T0 + 100 * MIN).rows
    const lag = Object.fromEntries(rows.map(r => [r.injectKey, r.releaseLagMin]))
    expect(lag).toEqual({ early: -2880, late: 33, punctual: null, msg: null })
    // The response time still runs from the release, in scenario time; the allowed time from release to deadline.
    const early = rows.find(r => r.injectKey === 'early')!
    expect(early.responseMin).toBe(5)
    expect(early.allowedMin).toBe(3000)
    expect(early.plannedAt).toBe(new Date(T0 + 2880 * MIN).toISOString())
    expect(rows.find(r => r.injectKey === 'msg')!.plannedAt).toBeNull()
  })

  it.each([
    ['pending before the deadline', 500, 'pending'],
    ['missed once the deadline has passed', 700, 'missed'],
  ])('leaves an unanswered decision %s', (_what, now, status) => {
    const events = [ev('inject.released', 0, inject('ask', ['science'], 'detection', 600))]
    expect(decisionSummary(events, scenario, T0 + now * MIN).rows[0]!.status).toBe(status)
  })

  it('ignores injects without a decision and counts messages with one', () => {
    const events = [
      ev('inject.released', 0, inject('brief', ['science'], 'detection')),
      ev('message.sent', 10, inject('msg-1', ['civil'], 'warning', 60, { adhoc: true })),
    ]
    const { rows, byPhase } = decisionSummary(events, scenario, T0)
    expect(rows.map(r => r.injectKey)).toEqual(['msg-1'])
    expect(byPhase.map(g => g.key)).toEqual(['warning'])
  })
})

describe('durations and medians', () => {
  it.each([
    [null, '—'], [0.5, '30 s'], [45, '45 min'], [125, '2 h 05 min'], [120, '2 h'], [60 * 24 * 3 + 60 * 4, '3 d 4 h'], [-90, '−1 h 30 min'],
  ])('writes %s minutes as %s', (min, text) => {
    expect(durationText(min)).toBe(text)
  })

  it('takes the middle value, or the mean of the two middle ones', () => {
    expect(median([])).toBeNull()
    expect(median([3, 1, 2])).toBe(2)
    expect(median([4, 1, 3, 2])).toBe(2.5)
  })
})
