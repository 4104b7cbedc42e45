import { eq } from 'drizzle-orm'
import { applyClockAction, clockBounds, clockDto, initialClock, scenarioTimeAt, type ClockAction } from '../../shared/live/clock'
import { nextInjectAt } from '../../shared/live/schedule'
import type { ClockDto, ClockState, ExerciseStatus } from '../../shared/live/types'
import type { ClockActionInput } from '../../shared/schemas/live'

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

/** Injects that are held or released, by key. */
export function injectRows(db: DB | Tx, exerciseId: string) {
  const rows = db.select().from(schema.exerciseInjects).where(eq(schema.exerciseInjects.exerciseId, exerciseId)).all()
  return new Map(rows.map(r => [r.injectKey, r]))
}

/**
 * Applies a facilitator's clock action (start, pause, resume, speed, jump, end) and records it as a
 * `clock.changed` event in the same transaction. A jump then releases what fell due at once.
 */
export function changeClock(exerciseId: string, input: ClockActionInput, actorId: string) {
  const result = liveWrite(exerciseId, (w) => {
    let action: ClockAction
    if (input.action === 'jump') {
      const to = input.to ? Date.parse(input.to) : nextInjectAt(w.exercise.scenario, injectRows(w.tx, exerciseId), w.scenarioNow)
      if (to === null) throw createError({ statusCode: 409, message: 'No scheduled inject is left to jump to.' })
      action = { action: 'jump', to }
    }
    else if (input.action === 'speed') action = { action: 'speed', factor: input.factor! }
    else if (input.action === 'start') action = { action: 'start', factor: input.factor }
    else action = { action: input.action }
    const r = applyClockAction(w.clock, w.exercise.status, action, w.now, w.bounds)
    if (!r.ok) throw createError({ statusCode: r.code, message: r.message, data: r.path ? { issues: [{ path: r.path, message: r.message }] } : undefined })
    writeClock(w.tx, exerciseId, r.state, r.status)
    const clock = clockDto(r.state, r.status, w.bounds)
    const event = w.append({
      type: 'clock.changed', audience: 'all', actorId, scenarioTime: scenarioTimeAt(r.state, w.now),
      data: { action: input.action, clock, from: new Date(r.from).toISOString() },
    })
    return { clock, seq: event.seq }
  })
  if (input.action === 'jump') runDue(exerciseId)
  return result
}
