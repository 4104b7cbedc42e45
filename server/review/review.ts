import { eq } from 'drizzle-orm'
import { decisionSummary } from '#shared/review/decisions'
import { eventFacets } from '#shared/review/facets'
import { scoringSummary } from '#shared/review/scoring'
import type { LiveView, StoredEvent } from '#shared/live/types'
import { hasCapability } from '#shared/utils/permissions'
import { clockNow, liveExercise, storedEvents } from '../live'
import { exerciseTimeline } from './exports'

/**
 * The exercise with its frozen scenario, its record as the reader may see it (their own view: an evaluator does not
 * read the facilitator's holds; the control view by default, for exports) and the scenario time now.
 */
export function reviewRecord(exerciseId: string, view: LiveView = { kind: 'control' }) {
  const exercise = liveExercise(useDB(), exerciseId)
  const events = storedEvents(exerciseId, view)
  const { clock, scenarioNow } = clockNow(exercise)
  return { exercise, events, clock, scenarioNow }
}

/** Members of an exercise with name, e-mail, role and team, by name. */
export function exerciseMembers(exerciseId: string) {
  return useDB().select({
    userId: schema.users.id, name: schema.users.name, email: schema.users.email,
    role: schema.memberships.role, teamKey: schema.memberships.teamKey,
  }).from(schema.memberships).innerJoin(schema.users, eq(schema.users.id, schema.memberships.userId))
    .where(eq(schema.memberships.exerciseId, exerciseId)).orderBy(schema.users.name).all()
}

/** Wall times of the first start and of the end of the clock (ISO), from the record. */
export function drillDates(events: readonly StoredEvent[]) {
  const clock = events.filter(e => e.type === 'clock.changed')
  const start = clock.find(e => (e.data as { action: string }).action === 'start')
  const end = clock.findLast(e => (e.data as { action: string }).action === 'end')
  const iso = (e?: StoredEvent) => (e ? new Date(e.wallTime).toISOString() : null)
  return { startedAt: iso(start), endedAt: iso(end), lastEventAt: iso(events.at(-1)) }
}

/** The review desk's frame: the exercise, the parts of its scenario the desk needs, members, the timeline with filter facets, and what the
 * caller may do. */
export function reviewOverview(exerciseId: string, access: ExerciseAccess) {
  const { exercise, rows, events } = exerciseTimeline(exerciseId, access.view)
  const { scenario } = liveExercise(useDB(), exerciseId)
  const facets = new Map(events.map(e => [e.seq, eventFacets(e, scenario)]))
  const role = access.membership?.role ?? null
  return {
    exercise: {
      id: exercise.id,
      title: exercise.title,
      description: exercise.description,
      status: exercise.status,
      createdAt: exercise.createdAt.toISOString(),
      ...drillDates(events),
    },
    scenario: {
      key: scenario.key, title: scenario.title, summary: scenario.summary, clock: scenario.clock,
      objectives: scenario.objectives, teams: scenario.teams, phases: scenario.phases, criteria: scenario.criteria,
      injects: scenario.injects.map(i => ({
        key: i.key,
        title: i.title,
        at: i.at,
        phase: i.phase,
        teams: i.teams,
        kind: i.kind,
        decision: !!i.decision,
      })),
    },
    members: exerciseMembers(exerciseId).map(m => ({ ...m, email: role === 'evaluator' ? undefined : m.email })),
    timeline: rows.map(r => ({ ...r, teamKeys: facets.get(r.seq)?.teamKeys ?? [], phaseKey: facets.get(r.seq)?.phaseKey ?? null })),
    lastSeq: events.at(-1)?.seq ?? 0,
    role,
    can: {
      write: hasCapability(access.standing, 'review.write'), export: hasCapability(access.standing, 'review.export'),
      // The live desks this reader may open from the review (the evaluator desk follows every team's traffic).
      evaluate: access.view.kind === 'evaluator' || access.view.kind === 'control', control: hasCapability(access.standing, 'live.control'),
    },
  }
}

/** Decisions with response times, per team and per phase. */
export function reviewDecisions(exerciseId: string, view?: LiveView) {
  const { exercise, events, scenarioNow } = reviewRecord(exerciseId, view)
  return decisionSummary(events, exercise.scenario, scenarioNow)
}

/** Ratings by objective and capability, observations, agreement between evaluators and their disagreements. */
export function reviewScoring(exerciseId: string, view?: LiveView) {
  const { exercise, events } = reviewRecord(exerciseId, view)
  return scoringSummary(events, exercise.scenario)
}

/**
 * The record for the replay, a page at a time (the events after `after`, at most `limit`): every event with its
 * audience (so the page can show each room its share), with the assessments left out of solution publications
 * (fetched one at a time, see `publishedSolution`).
 */
export function replayRecord(exerciseId: string, view: LiveView = { kind: 'control' }, page = { after: 0, limit: 1000 }) {
  const exercise = liveExercise(useDB(), exerciseId)
  const rows = storedEvents(exerciseId, view, page.after, page.limit + 1)
  const events = rows.slice(0, page.limit)
  const slim = events.map((e) => {
    if (e.type !== 'solution.published') return e
    const { assessment: _a, ...data } = e.data
    return { ...e, data }
  })
  return {
    events: slim,
    /** More events follow the last one here: ask again with `after` = its seq. */
    more: rows.length > page.limit,
    sites: exercise.scenario.sites,
    teams: exercise.scenario.teams,
    phases: exercise.scenario.phases,
    injects: exercise.scenario.injects.map(i => ({ key: i.key, phase: i.phase, at: i.at })),
  }
}

/** A published solution of the exercise with its stored assessment; 404 when it was not published. */
export function publishedSolution(exerciseId: string, key: string) {
  const row = useDB().select().from(schema.exerciseSolutions)
    .where(eq(schema.exerciseSolutions.exerciseId, exerciseId)).all().find(s => s.solutionKey === key)
  if (!row) throw notFound('This solution was not published in this exercise.')
  const event = storedEvents(exerciseId, { kind: 'control' }, row.seq - 1, 1)[0]
  if (event?.type !== 'solution.published') throw notFound('This solution was not published in this exercise.')
  const d = event.data
  return {
    key: d.key,
    label: d.label,
    releaseAt: d.releaseAt,
    seq: event.seq,
    solution: d.solution,
    assessment: d.assessment,
    headline: d.headline,
  }
}
