import { describe, expect, it } from 'vitest'
import { audienceTeams, canSee, DRILL, sanitise, teamsAudience } from '../../../shared/live/visibility'
import { foldEvents } from '../../../shared/live/fold'
import { renderBody, NO_SOLUTION_YET } from '../../../shared/live/headline'
import type { Audience, InjectData, LiveView, StoredEvent } from '../../../shared/live/types'

const ALL = ['science', 'civil', 'comms']
const control: LiveView = { kind: 'control' }
const evaluator: LiveView = { kind: 'evaluator' }
const science: LiveView = { kind: 'player', teamKey: 'science' }
const civil: LiveView = { kind: 'player', teamKey: 'civil' }
const wall: LiveView = { kind: 'wall' }

const inject = (key: string, teams: string[]): InjectData => ({
  key, adhoc: false, title: key, kind: 'briefing', phase: 'detection', teams, at: '2031-03-04T02:10:00Z', body: 'Body', solutionKey: null,
  revision: 0, manual: false, wasHeld: false, expectedActions: ['Do the thing'], contingency: { condition: 'If they ask' },
  decision: { prompt: 'Decide', choices: ['A', 'B'], freeText: true, deadline: '2031-03-05T00:00:00Z' }, drill: DRILL,
})
const stored = (seq: number, type: StoredEvent['type'], audience: Audience, data: unknown): StoredEvent =>
  ({ seq, type, audience, data: data as StoredEvent['data'], wallTime: 1000 * seq, scenarioTime: 2000 * seq, actorId: null })

describe('audiences', () => {
  it('traffic to every team of the scenario is for all; to some, names them in order', () => {
    expect(teamsAudience(['comms', 'science', 'civil'], ALL)).toBe('all')
    expect(teamsAudience(['science', 'civil'], ALL)).toBe('teams:civil,science')
    expect(audienceTeams('teams:civil,science')).toEqual(['civil', 'science'])
    expect(audienceTeams('all')).toEqual([])
  })

  const table: Array<[Audience, Record<string, boolean>]> = [
    ['all', { control: true, evaluator: true, science: true, civil: true, wall: true }],
    ['teams:science', { control: true, evaluator: true, science: true, civil: false, wall: false }],
    ['teams:civil,comms', { control: true, evaluator: true, science: false, civil: true, wall: false }],
    ['evaluators', { control: true, evaluator: true, science: false, civil: false, wall: false }],
    ['control', { control: true, evaluator: false, science: false, civil: false, wall: false }],
  ]
  const views: Record<string, LiveView> = { control, evaluator, science, civil, wall }
  for (const [audience, expected] of table) {
    it(`${audience}: ${Object.entries(expected).filter(([, v]) => v).map(([k]) => k).join(', ')}`, () => {
      for (const [name, view] of Object.entries(views)) expect(canSee(view, audience, 'inject.released'), name).toBe(expected[name])
    })
  }

  it('a team key that is a prefix of another does not match it', () => {
    expect(canSee({ kind: 'player', teamKey: 'civ' }, 'teams:civil', 'inject.released')).toBe(false)
  })

  it('the wall hears only public types, even with audience all', () => {
    expect(canSee(wall, 'all', 'clock.changed')).toBe(true)
    expect(canSee(wall, 'all', 'response.submitted')).toBe(false)
  })
})

describe('sanitising', () => {
  const e = stored(3, 'inject.released', 'teams:science', inject('survey-candidate', ['science']))

  it('gives control and evaluators the whole inject', () => {
    expect(sanitise(e, control)!.data).toEqual(e.data)
    expect(sanitise(e, evaluator)!.data).toEqual(e.data)
  })

  it('strips expected actions and contingency conditions for players, keeps the decision', () => {
    const d = sanitise(e, science)!.data as InjectData
    expect(d.expectedActions).toBeUndefined()
    expect(d.contingency).toBeUndefined()
    expect(d.decision?.choices).toEqual(['A', 'B'])
    expect(d.drill.marking).toMatch(/EXERCISE/)
  })

  it('gives another team nothing at all', () => {
    expect(sanitise(e, civil)).toBeNull()
  })

  it('gives the wall public injects without decision or expected actions', () => {
    const pub = stored(4, 'inject.released', 'all', inject('precovery-release', ALL))
    const d = sanitise(pub, wall)!.data as InjectData
    expect(d.decision).toBeUndefined()
    expect(d.expectedActions).toBeUndefined()
    expect(d.title).toBe('precovery-release')
  })

  it('stamps times as ISO strings', () => {
    expect(sanitise(e, control)).toMatchObject({
      seq: 3,
      type: 'inject.released',
      wallTime: new Date(3000).toISOString(),
      scenarioTime: new Date(6000).toISOString(),
    })
  })
})

describe('folding a feed', () => {
  it('keeps the current body and every revision, attaches responses, ignores duplicates', () => {
    const rel = sanitise(
      stored(1, 'inject.released', 'teams:science', { ...inject('a', ['science']), body: 'p = 1 %', solutionKey: 's1' }),
      science,
    )!
    const rev = sanitise(
      stored(
        5,
        'inject.revised',
        'teams:science',
        { key: 'a', teams: ['science'], revision: 1, body: 'p = 9 %', solutionKey: 's2', previousSolutionKey: 's1', drill: DRILL },
      ),
      science,
    )!
    const resp = sanitise(
      stored(
        7,
        'response.submitted',
        'teams:science',
        { id: 'r', injectKey: 'a', teamKey: 'science', choice: 'A', text: '', late: false, by: { id: 'u', name: 'U' } },
      ),
      science,
    )!
    const feed = foldEvents([resp, rev, rel, rev])
    expect(feed.lastSeq).toBe(7)
    expect(feed.injects).toHaveLength(1)
    expect(feed.injects[0]).toMatchObject({ key: 'a', body: 'p = 9 %', revision: 1, solutionKey: 's2', releasedSeq: 1 })
    expect(feed.injects[0]!.revisions.map(r => r.body)).toEqual(['p = 1 %', 'p = 9 %'])
    expect(feed.injects[0]!.responses.map(r => r.choice)).toEqual(['A'])
  })
})

describe('inject bodies without a published solution', () => {
  it('shows each hazard field as not yet available, and unescapes literal braces', () => {
    expect(renderBody('p {{ impactProbability }} and \\{{ not a field }}', null)).toBe(`p ${NO_SOLUTION_YET} and {{ not a field }}`)
    expect(renderBody('No fields here.', null)).toBe('No fields here.')
  })
})
