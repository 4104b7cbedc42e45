import { and, asc, eq } from 'drizzle-orm'
import { assessmentHeadline, hasHazardFields } from '#shared/live/headline'
import { PUBLISH_SAMPLES, solutionSeed } from '#shared/live/seed'
import { DRILL, teamsAudience } from '#shared/live/visibility'
import { engineSolution } from '#shared/scenario/encounter'
import { type Published, publishedSolutions, rememberAssessment } from './assessments'
import { injectDef, renderInject } from './injects'
import { runTask } from '../workers/pool'
import { liveExercise, liveWrite, type LiveWriter } from './record'

export { PUBLISH_SAMPLES, solutionSeed } from '#shared/live/seed'

/** Re-renders released injects against the published solutions; appends `inject.revised` where the text changed. */
function reviseReleased(w: LiveWriter, published: readonly Published[]) {
  const allTeams = w.exercise.scenario.teams.map(t => t.key)
  const rows = w.tx.select().from(schema.exerciseInjects)
    .where(and(
      eq(schema.exerciseInjects.exerciseId, w.exercise.id),
      eq(schema.exerciseInjects.status, 'released'),
    )).orderBy(asc(schema.exerciseInjects.releasedSeq)).all()
  for (const row of rows) {
    const def = injectDef(w.exercise, row.injectKey, row)
    if (!def || !hasHazardFields(def.body)) continue
    const next = renderInject(w.tx, w.exercise.id, def, published)
    if (next.solutionKey === row.solutionKey || next.body === row.body) continue
    const revision = row.revision + 1
    w.tx.update(schema.exerciseInjects).set({
      body: next.body,
      solutionKey: next.solutionKey,
      revision,
    }).where(eq(schema.exerciseInjects.id, row.id)).run()
    w.append({
      type: 'inject.revised', audience: teamsAudience(def.teams, allTeams),
      data: {
        key: row.injectKey,
        teams: def.teams,
        revision,
        body: next.body,
        solutionKey: next.solutionKey,
        previousSolutionKey: row.solutionKey,
        drill: DRILL,
      },
    })
  }
}

/**
 * Publishes an orbit solution: runs the hazard model (PUBLISH_SAMPLES samples, the seed of the
 * scenario's solution), stores the assessment on the `solution.published` event, and revises the
 * released injects whose figures change. Exactly once per solution; again → 409. The model runs on a worker thread.
 */
export async function publishSolution(exerciseId: string, key: string, opts: { actorId?: string | null; manual: boolean }) {
  const exercise = liveExercise(useDB(), exerciseId)
  const entry = exercise.scenario.solutions.find(s => s.key === key)
  if (!entry) throw notFound('No such solution in this exercise.')
  const isPublished = (db: DB | Tx) => publishedSolutions(db, exerciseId).some(p => p.key === key)
  if (isPublished(useDB())) throw conflict('This solution was already published.')
  // The seed of the solution in its scenario: the library's brief shows the same figures.
  const seed = solutionSeed(exercise.scenario.key, key)
  // The model runs on a worker thread; the write below checks again that no one published meanwhile.
  const assessment = await runTask('assess', { solution: engineSolution(entry), sites: exercise.scenario.sites, samples: PUBLISH_SAMPLES, seed })
  return liveWrite(exerciseId, (w) => {
    if (w.exercise.status === 'ended') throw exerciseEnded()
    if (isPublished(w.tx)) throw conflict('This solution was already published.')
    const event = w.append({
      type: 'solution.published', audience: 'all', actorId: opts.actorId,
      data: {
        key,
        label: entry.label,
        releaseAt: entry.releaseAt,
        manual: opts.manual,
        samples: PUBLISH_SAMPLES,
        seed,
        solution: entry.solution,
        assessment,
        headline: assessmentHeadline(assessment),
        drill: DRILL,
      },
    })
    w.tx.insert(schema.exerciseSolutions).values({ exerciseId, solutionKey: key, seq: event.seq }).run()
    rememberAssessment(`${exerciseId}:${event.seq}`, assessment)
    reviseReleased(w, publishedSolutions(w.tx, exerciseId))
    return event
  })
}
