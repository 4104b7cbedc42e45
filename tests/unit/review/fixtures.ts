// A small scenario and hand-made records for the review unit tests.
import type { Audience, LiveEventType, StoredEvent } from '../../../shared/live/types'
import type { Scenario } from '../../../shared/scenario/schema'

export const T0 = Date.parse('2031-03-04T00:00:00Z')
export const W0 = Date.parse('2026-12-01T09:00:00Z')
export const MIN = 60_000

export const scenario = {
  teams: [{ key: 'science', name: 'Science', colour: '#2563eb' }, { key: 'civil', name: 'Civil', colour: '#dc2626' }],
  phases: [{ key: 'detection', title: 'Detection' }, { key: 'warning', title: 'Warning' }],
  objectives: [
    { key: 'picture', title: 'One shared picture', description: 'd', capabilities: ['Situational Assessment'] },
    { key: 'warn', title: 'Warn the public', description: 'd', capabilities: ['Public Information and Warning'] },
  ],
  criteria: [
    {
      key: 'figures',
      objective: 'picture',
      capability: 'Situational Assessment',
      tasks: [{ key: 't1', text: 'Task one' }, { key: 't2', text: 'Task two' }],
      injects: ['ask'],
    },
    { key: 'coord', objective: 'picture', capability: 'Operational Coordination', tasks: [{ key: 't3', text: 'Task three' }], injects: [] },
    {
      key: 'statement',
      objective: 'warn',
      capability: 'Public Information and Warning',
      tasks: [{ key: 't4', text: 'Task four' }],
      injects: ['warn-now'],
    },
  ],
  injects: [
    { key: 'ask', at: '2031-03-04T00:00:00Z', phase: 'detection' },
    { key: 'warn-now', at: '2031-03-05T00:00:00Z', phase: 'warning' },
  ],
} as unknown as Scenario

let seq = 0
export function resetSeq() { seq = 0 }

/** An event `min` scenario minutes and `wallMin` wall minutes after the start. */
export function ev(type: LiveEventType, min: number, data: unknown, audience: Audience = 'all', wallMin = min / 100): StoredEvent {
  seq += 1
  return {
    seq,
    type,
    wallTime: W0 + wallMin * MIN,
    scenarioTime: T0 + min * MIN,
    actorId: null,
    audience,
    data: data as StoredEvent['data'],
  }
}

export const person = (id: string) => ({ id, name: id.toUpperCase() })

export function inject(key: string, teams: string[], phase: string, deadlineMin?: number, extra: Record<string, unknown> = {}) {
  return {
    key, adhoc: false, title: `Inject ${key}`, kind: 'decision-request', phase, teams, at: new Date(T0).toISOString(), body: 'Body',
    solutionKey: null, revision: 0, manual: true, wasHeld: false, drill: { marking: 'M', caution: 'C' },
    ...(deadlineMin === undefined
      ? {}
      : { decision: {
          prompt: 'Decide',
          choices: ['Yes', 'No'],
          freeText: true,
          deadline: new Date(T0 + deadlineMin * MIN).toISOString(),
        } }),
    ...extra,
  }
}

export const response = (injectKey: string, teamKey: string, late = false, choice: string | null = 'Yes') =>
  ({ id: `r-${injectKey}-${teamKey}`, injectKey, teamKey, choice, text: '', late, by: person(teamKey) })

export const score = (by: string, criterionKey: string, taskKey: string, rating: 'P' | 'S' | 'M' | 'U', note = '') =>
  ({ id: `s-${by}-${taskKey}-${rating}`, criterionKey, taskKey, rating, note, by: person(by) })
