import { eq, inArray } from 'drizzle-orm'
import { clockBounds, clockDto, scenarioTimeAt, stopAtEnd } from '../../shared/live/clock'
import { dueItems } from '../../shared/live/schedule'

const isConflict = (err: unknown) => (err as { statusCode?: number })?.statusCode === 409

/** A running clock past the end of the scenario stops there (`clock.changed`, action `auto-pause`). */
function pauseAtEnd(exerciseId: string): void {
  liveWrite(exerciseId, (w) => {
    const stopped = w.exercise.status === 'running' ? stopAtEnd(w.clock, w.now, w.bounds) : null
    if (!stopped) return
    writeClock(w.tx, exerciseId, stopped, 'paused')
    w.append({ type: 'clock.changed', audience: 'all', scenarioTime: w.bounds.end, data: { action: 'auto-pause', clock: clockDto(stopped, 'paused', w.bounds) } })
  })
}

/**
 * Publishes the solutions and releases the (non-contingency, unheld) injects of one exercise that
 * are due at its scenario time now, in time order, each exactly once. Returns how many it did.
 */
export function runDue(exerciseId: string, now = Date.now()): number {
  const db = useDB()
  const exercise = db.select().from(schema.exercises).where(eq(schema.exercises.id, exerciseId)).get() as LiveExercise | undefined
  if (!exercise?.scenario || (exercise.status !== 'running' && exercise.status !== 'paused')) return 0
  const state = readClock(db, exercise)
  const bounds = clockBounds(exercise.scenario.clock)
  if (exercise.status === 'running' && stopAtEnd(state, now, bounds)) pauseAtEnd(exerciseId)
  const t = Math.min(scenarioTimeAt(state, now), bounds.end)
  const published = new Set(publishedSolutions(db, exerciseId).map(p => p.key))
  let done = 0
  for (const item of dueItems(exercise.scenario, published, injectRows(db, exerciseId), t)) {
    try {
      if (item.kind === 'solution') publishSolution(exerciseId, item.key, { manual: false })
      else releaseInject(exerciseId, item.key, { manual: false })
      done++
    }
    catch (err) {
      if (!isConflict(err)) throw err
    }
  }
  return done
}

/** One pass of the scheduler over the exercises in the given states; a failing exercise does not stop the others. */
export function schedulerTick(statuses: Array<'running' | 'paused'> = ['running']): void {
  const ids = useDB().select({ id: schema.exercises.id }).from(schema.exercises).where(inArray(schema.exercises.status, statuses)).all()
  for (const { id } of ids) {
    try { runDue(id) }
    catch (err) { console.error(`[scheduler] exercise ${id}:`, err) }
  }
}
