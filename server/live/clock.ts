import { eq } from 'drizzle-orm'
import { clockBounds, clockDto, initialClock, scenarioTimeAt } from '#shared/live/clock'
import type { ClockDto, ClockState, ExerciseStatus } from '#shared/live/types'
import type { LiveExercise } from './types'

/** The stored clock of an exercise, or (before its start) the clock paused at the scenario start. */
export function readClock(db: DB | Tx, exercise: LiveExercise): ClockState {
  const row = db.select().from(schema.exerciseClocks).where(eq(schema.exerciseClocks.exerciseId, exercise.id)).get()
  if (!row) return initialClock(exercise.scenario.clock, Date.now())
  return { wallAnchor: row.wallAnchor, scenarioAnchor: row.scenarioAnchor, factor: row.factor, paused: row.paused }
}

/** Stores a clock and the exercise status that goes with it. */
export function writeClock(tx: Tx, exerciseId: string, state: ClockState, status: ExerciseStatus): void {
  tx.insert(schema.exerciseClocks).values({ exerciseId, ...state })
    .onConflictDoUpdate({ target: schema.exerciseClocks.exerciseId, set: { ...state, updatedAt: new Date() } }).run()
  tx.update(schema.exercises).set({ status }).where(eq(schema.exercises.id, exerciseId)).run()
}

/** The clock of an exercise as the API sends it, with the scenario time now (ms). */
export function clockNow(exercise: LiveExercise, now = Date.now()): { clock: ClockDto; scenarioNow: number } {
  const state = readClock(useDB(), exercise)
  const bounds = clockBounds(exercise.scenario.clock)
  return { clock: clockDto(state, exercise.status, bounds), scenarioNow: Math.min(scenarioTimeAt(state, now), bounds.end) }
}
