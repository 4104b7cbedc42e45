import { beforeEach, describe, expect, it } from 'vitest'
import { momentAt, replayRooms, roomFeed, seqAtScenarioTime } from '../../../shared/review/replay'
import { ev, inject, MIN, resetSeq, response, scenario, T0 } from './fixtures'

beforeEach(resetSeq)

function record() {
  return [
    ev('clock.changed', 0, { action: 'start', clock: { status: 'running' } }),
    ev('solution.published', 10, { key: 's1', label: 'Solution 1', headline: { impactProbability: 0.01 } }),
    ev('inject.released', 20, inject('ask', ['science'], 'detection', 600, { expectedActions: ['Do it'] }), 'teams:science'),
    ev('inject.released', 30, inject('warn-now', ['civil'], 'warning', 900), 'teams:civil'),
    ev('response.submitted', 40, response('ask', 'science'), 'teams:science'),
    ev(
      'score.recorded',
      50,
      { id: 'x', criterionKey: 'figures', taskKey: 't1', rating: 'P', note: '', by: { id: 'a', name: 'A' } },
      'evaluators',
    ),
    ev('solution.published', 60, { key: 's2', label: 'Solution 2', headline: { impactProbability: 0.5 } }),
  ]
}

describe('the replay', () => {
  it('shows a team only its own traffic, without expected actions, up to the chosen moment', () => {
    const events = record()
    const science = roomFeed(events, { kind: 'player', teamKey: 'science' }, 5)
    expect(science.injects.map(i => i.key)).toEqual(['ask'])
    expect(science.injects[0]!.expectedActions).toBeUndefined()
    expect(science.injects[0]!.responses).toHaveLength(1)
    expect(science.scores).toEqual([])
    expect(science.currentSolution?.key).toBe('s1')
    expect(roomFeed(events, { kind: 'player', teamKey: 'science' }, 7).currentSolution?.key).toBe('s2')
    expect(roomFeed(events, { kind: 'player', teamKey: 'civil' }, 3).injects).toEqual([])
  })

  it('shows the evaluators everything but control traffic, with expected actions', () => {
    const f = roomFeed(record(), { kind: 'evaluator' }, 7)
    expect(f.injects.map(i => i.key)).toEqual(['ask', 'warn-now'])
    expect(f.injects[0]!.expectedActions).toEqual(['Do it'])
    expect(f.scores).toHaveLength(1)
  })

  it('gives the time and phase at a moment, and the moment at a scenario time', () => {
    const events = record()
    expect(momentAt(events, scenario, 0)).toMatchObject({ scenarioTime: null, phase: 'detection' })
    expect(momentAt(events, scenario, 7)).toMatchObject({ scenarioTime: new Date(T0 + 60 * MIN).toISOString(), type: 'solution.published' })
    expect(seqAtScenarioTime(events, T0 + 35 * MIN)).toBe(4)
    expect(seqAtScenarioTime(events, T0 - 1)).toBe(0)
  })

  it('offers every team, then the control desk, the evaluators and the wall', () => {
    expect(replayRooms(scenario).map(r => r.id)).toEqual(['team:science', 'team:civil', 'control', 'evaluator', 'wall'])
  })
})
