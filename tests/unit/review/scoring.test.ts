import { beforeEach, describe, expect, it } from 'vitest'
import { scoringSummary, summaryRating } from '../../../shared/review/scoring'
import { ev, person, resetSeq, scenario, score } from './fixtures'

beforeEach(resetSeq)

describe('the scoring summary', () => {
  it('keeps each evaluator\'s latest rating per task and groups them by objective and capability', () => {
    const events = [
      ev('score.recorded', 1, score('a', 'figures', 't1', 'U', 'first'), 'evaluators'),
      ev('score.recorded', 2, score('a', 'figures', 't1', 'P', 'second'), 'evaluators'),
      ev('score.recorded', 3, score('b', 'figures', 't1', 'P'), 'evaluators'),
      ev('score.recorded', 4, score('a', 'coord', 't3', 'M'), 'evaluators'),
      ev('observation.recorded', 5, { id: 'o1', text: 'Seen', injectKey: 'ask', teamKey: 'science', by: person('a') }, 'evaluators'),
      ev('observation.recorded', 6, { id: 'o2', text: 'General', injectKey: null, teamKey: null, by: person('b') }, 'evaluators'),
    ]
    const s = scoringSummary(events, scenario)
    const picture = s.objectives[0]!
    // Capabilities named by the objective first, then those its criteria add.
    expect(picture.capabilities.map(c => c.name)).toEqual(['Situational Assessment', 'Operational Coordination'])
    const t1 = picture.capabilities[0]!.criteria[0]!.tasks[0]!
    expect(t1.ratings.map(r => [r.by.id, r.rating, r.note, r.replaced])).toEqual([['a', 'P', 'second', 1], ['b', 'P', '', 0]])
    expect(picture.counts).toEqual({ P: 2, S: 0, M: 1, U: 0 })
    expect(picture.capabilities[0]!.observations.map(o => o.id)).toEqual(['o1'])
    expect(s.observations.map(o => o.id)).toEqual(['o1', 'o2'])
    expect(s.evaluators.map(e => e.id)).toEqual(['a', 'b'])
    expect(s.disagreements).toEqual([])
    expect(s.agreement).toEqual([expect.objectContaining({ n: 1, observed: 1, kappa: null })])
  })

  it('lists the tasks two evaluators rated differently, and their kappa', () => {
    const pairs: Array<[string, string, 'P' | 'S' | 'M' | 'U', 'P' | 'S' | 'M' | 'U']> = [
      ['figures', 't1', 'P', 'P'], ['figures', 't2', 'S', 'M'], ['coord', 't3', 'M', 'M'], ['statement', 't4', 'U', 'S'],
    ]
    const events = pairs.flatMap(([c, t, a, b], i) => [
      ev('score.recorded', i, score('a', c, t, a), 'evaluators'),
      ev('score.recorded', i, score('b', c, t, b), 'evaluators'),
    ])
    const s = scoringSummary(events, scenario)
    expect(s.disagreements.map(d => [d.taskKey, d.ratings.map(r => r.rating).join('')])).toEqual([['t2', 'SM'], ['t4', 'US']])
    // p_o = 2/4; A = P S M U, B = P M M S → p_e = (1·1 + 1·1 + 1·2 + 1·0)/16 = 1/4; kappa = (1/2 − 1/4)/(3/4) = 1/3.
    expect(s.agreement[0]!.kappa).toBeCloseTo(1 / 3, 10)
    expect(s.agreement[0]!.strength).toBe('fair')
  })

  it.each([
    [{ P: 0, S: 0, M: 0, U: 0 }, null],
    [{ P: 2, S: 1, M: 0, U: 0 }, 'P'],
    [{ P: 1, S: 1, M: 0, U: 0 }, 'S'],
    [{ P: 0, S: 2, M: 2, U: 1 }, 'M'],
  ] as const)('sums up %o as %s (ties go to the lower rating)', (counts, expected) => {
    expect(summaryRating({ ...counts })).toBe(expected)
  })
})
