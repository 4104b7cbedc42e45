/** The inject schedule against the clock: what falls due, what comes next, the phase, desk states. */
import type { Scenario } from '../scenario/schema'

export interface DueItem { kind: 'solution' | 'inject'; key: string; at: number }

/** What the scheduler must do at scenario time `t`: unpublished solutions and unreleased, unheld, non-contingency injects that fell due,
 * in time order (a solution before an inject at the same time). */
export function dueItems(
  scenario: Pick<Scenario,
  'solutions' | 'injects'>,
  published: ReadonlySet<string>,
  injectStates: ReadonlyMap<string,
    unknown>,
  t: number,
): DueItem[] {
  const items: DueItem[] = []
  for (const s of scenario.solutions) {
    const at = Date.parse(s.releaseAt)
    if (at <= t && !published.has(s.key)) items.push({ kind: 'solution', key: s.key, at })
  }
  for (const i of scenario.injects) {
    const at = Date.parse(i.at)
    if (at <= t && !i.contingency && !injectStates.has(i.key)) items.push({ kind: 'inject', key: i.key, at })
  }
  return items.sort((a, b) => a.at - b.at || (a.kind === b.kind ? 0 : a.kind === 'solution' ? -1 : 1))
}

/** Scenario time of the next inject the scheduler would release after `t`; null when none is left. */
export function nextInjectAt(scenario: Pick<Scenario, 'injects'>, injectStates: ReadonlyMap<string, unknown>, t: number): number | null {
  let next: number | null = null
  for (const i of scenario.injects) {
    const at = Date.parse(i.at)
    if (at > t && !i.contingency && !injectStates.has(i.key) && (next === null || at < next)) next = at
  }
  return next
}

/** The phase at scenario time `t`: that of the latest inject due by then, else the first phase. */
export function phaseAt(scenario: Pick<Scenario, 'injects' | 'phases'>, t: number): string | null {
  let best: { at: number; phase: string } | null = null
  for (const i of scenario.injects) {
    const at = Date.parse(i.at)
    if (at <= t && (!best || at >= best.at)) best = { at, phase: i.phase }
  }
  return best?.phase ?? scenario.phases[0]?.key ?? null
}

export type InjectState = 'upcoming' | 'due' | 'released' | 'held' | 'answered' | 'overdue'

/**
 * The control desk's state of one inject at scenario time `t`. A released inject with a decision
 * is `answered` once every team has responded, `overdue` when its deadline passed before that.
 */
export function injectState(
  inject: { at: number; deadline: number | null; teams: readonly string[] },
  status: 'held' | 'released' | null,
  answeredTeams: ReadonlySet<string>,
  t: number,
): InjectState {
  if (status === 'held') return 'held'
  if (status !== 'released') return inject.at <= t ? 'due' : 'upcoming'
  if (inject.deadline === null) return 'released'
  if (inject.teams.every(k => answeredTeams.has(k))) return 'answered'
  return inject.deadline < t ? 'overdue' : 'released'
}
