import { foldEvents, latestImpactTime, type Feed } from '#shared/live/fold'
import { injectState, phaseAt } from '#shared/live/schedule'
import { DRILL } from '#shared/live/visibility'
import type { LiveView } from '#shared/live/types'
import { clockNow } from './clock'
import { type InjectDef, injectRows } from './injects'
import { latestSeq, liveExercise, visibleEvents } from './record'
import type { LiveExercise } from './types'

/** The control desk's schedule: every inject (scenario and ad-hoc) with its state and who answered. */
function schedule(exercise: LiveExercise, feed: Feed, t: number) {
  const rows = injectRows(useDB(), exercise.id)
  const answered = new Map<string, Set<string>>()
  for (const r of feed.responses) answered.set(r.injectKey, (answered.get(r.injectKey) ?? new Set()).add(r.teamKey))
  const releasedAt = new Map(feed.injects.map(i => [i.key, i.releasedAt] as [string, string]))
  const defs: InjectDef[] = [
    // A scenario inject as released (a jump may have moved its deadline), else as scripted.
    ...exercise.scenario.injects.map(i => rows.get(i.key)?.definition ?? i),
    // Ad-hoc messages (a scenario inject's row may carry its own definition too: a deadline moved by a jump).
    ...[...rows.values()].filter(r => r.definition?.adhoc).map(r => r.definition!),
  ]
  return defs.map((def) => {
    const row = rows.get(def.key)
    const teamsAnswered = answered.get(def.key) ?? new Set<string>()
    const deadline = def.decision ? Date.parse(def.decision.deadline) : null
    return {
      key: def.key, title: def.title, at: def.at, phase: def.phase, kind: def.kind, teams: def.teams, adhoc: !!def.adhoc,
      contingency: def.contingency?.condition ?? null, deadline: def.decision?.deadline ?? null,
      state: injectState({ at: Date.parse(def.at), deadline, teams: def.teams }, row?.status ?? null, teamsAnswered, t),
      answered: Object.fromEntries(def.teams.map(k => [k, teamsAnswered.has(k)])),
      releasedSeq: row?.releasedSeq ?? null, revision: row?.revision ?? 0, solutionKey: row?.solutionKey ?? null,
      // When it went out: against `at`, how late (the scheduler behind a fast clock) or early (by hand) it was.
      releasedAt: releasedAt.get(def.key) ?? null,
    }
  }).sort((a, b) => Date.parse(a.at) - Date.parse(b.at))
}

/** Answers per inject and observations a snapshot carries: the most recent; the live socket brings the rest. */
export const SNAPSHOT_WINDOW = { responsesPerInject: 30, observations: 300 } as const

/** The recent window of a feed: each inject's latest answers and the latest observations, with how many were left out. */
function windowed(feed: Feed) {
  const { responsesPerInject, observations } = SNAPSHOT_WINDOW
  return {
    injects: feed.injects.map(i => (i.responses.length > responsesPerInject
      ? { ...i, responses: i.responses.slice(-responsesPerInject), earlierResponses: i.responses.length - responsesPerInject }
      : i)),
    observations: feed.observations.slice(-observations),
    earlierObservations: Math.max(0, feed.observations.length - observations),
  }
}

/**
 * A desk's snapshot of a live exercise, by the reader's view: the clock, phase and current solution
 * for everyone; a player gets its team's released injects (current body, revisions, its responses);
 * evaluators all released traffic with expected actions, scores and observations; the facilitator
 * also the whole schedule with states. Figures carry the drill marking (`drill`). A long drill's snapshot carries
 * the recent window (SNAPSHOT_WINDOW) of answers and observations and says how many it left out.
 */
export function liveSnapshot(exerciseId: string, view: LiveView) {
  const exercise = liveExercise(useDB(), exerciseId)
  const { clock, scenarioNow } = clockNow(exercise)
  const events = visibleEvents(exerciseId, view)
  const feed = foldEvents(events)
  const { scenario } = exercise
  const recent = windowed(feed)
  const base = {
    exercise: { id: exercise.id, title: exercise.title, status: exercise.status },
    view: view.kind, teamKey: view.kind === 'player' ? view.teamKey : null,
    clock, scenarioNow: new Date(scenarioNow).toISOString(), serverTime: Date.now(), lastSeq: latestSeq(exerciseId),
    phase: phaseAt(scenario, scenarioNow), phases: scenario.phases, teams: scenario.teams,
    currentSolution: feed.currentSolution, solutions: feed.solutions, drill: DRILL,
    sites: scenario.sites,
    // Local time on every desk, and the countdown to the impact time of the latest published solution.
    timeZone: scenario.clock.timeZone ?? 'UTC',
    impactTime: latestImpactTime(events),
    injects: recent.injects,
    // The messages the teams wrote (a player's snapshot has its own team's only: the record's audience).
    teamMessages: feed.teamMessages.slice(-200),
    // Protective-action zones (every reader sees them), withdrawn ones marked.
    zones: feed.zones,
  }
  // One union, discriminated by `desk`: the team room's share, the evaluator desk's, the control desk's.
  if (view.kind === 'player') return { ...base, desk: 'room' as const }
  const staff = {
    ...base, scores: feed.scores, observations: recent.observations, earlierObservations: recent.earlierObservations,
    criteria: scenario.criteria,
  }
  if (view.kind !== 'control') return { ...staff, desk: 'evaluate' as const }
  return {
    ...staff, desk: 'control' as const,
    schedule: schedule(exercise, feed, scenarioNow), held: feed.held, plannedSolutions: scenario.solutions,
  }
}
