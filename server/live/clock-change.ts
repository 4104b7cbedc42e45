import { applyClockAction, clockDto, scenarioTimeAt, type ClockAction } from '#shared/live/clock'
import { nextInjectAt } from '#shared/live/schedule'
import type { ClockActionInput } from '#shared/schemas/live'
import { writeClock } from './clock'
import { injectRows } from './injects'
import { liveWrite, type LiveWriter } from './record'

/** Holds the scheduled injects between two scenario times (a jump with `due: skip`), each with an `inject.held` event. */
function skipPassed(w: LiveWriter, from: number, to: number, actorId: string) {
  const rows = injectRows(w.tx, w.exercise.id)
  for (const i of w.exercise.scenario.injects) {
    const at = Date.parse(i.at)
    if (i.contingency || rows.has(i.key) || at <= from || at > to) continue
    w.tx.insert(schema.exerciseInjects).values({ exerciseId: w.exercise.id, injectKey: i.key, status: 'held' }).run()
    w.append({
      type: 'inject.held', audience: 'control', actorId,
      data: { key: i.key, title: i.title, at: i.at, teams: i.teams, skippedByJump: true },
    })
  }
}

/**
 * Applies a facilitator's clock action (start, pause, resume, speed, jump, end) and records it as a
 * `clock.changed` event in the same transaction. After a jump the caller releases what fell due (`runDue`).
 */
export function changeClock(exerciseId: string, input: ClockActionInput, actorId: string) {
  return liveWrite(exerciseId, (w) => {
    let action: ClockAction
    if (input.action === 'jump') {
      const to = input.to ? Date.parse(input.to) : nextInjectAt(w.exercise.scenario, injectRows(w.tx, exerciseId), w.scenarioNow)
      if (to === null) throw conflict('No scheduled inject is left to jump to.')
      action = { action: 'jump', to }
    }
    else if (input.action === 'speed') action = { action: 'speed', factor: input.factor! }
    else if (input.action === 'start') action = { action: 'start', factor: input.factor }
    else action = { action: input.action }
    const r = applyClockAction(w.clock, w.exercise.status, action, w.now, w.bounds)
    if (!r.ok) {
      const data = r.path ? { issues: [{ path: r.path, message: r.message }] } : undefined
      throw new DomainError(r.code === 400 ? 'invalid' : 'conflict', r.message, data)
    }
    writeClock(w.tx, exerciseId, r.state, r.status)
    // A forward jump that skips what falls due on the way holds it now, before any scheduler pass can release it.
    if (input.action === 'jump' && input.due === 'skip') skipPassed(w, r.from, scenarioTimeAt(r.state, w.now), actorId)
    const clock = clockDto(r.state, r.status, w.bounds)
    const event = w.append({
      type: 'clock.changed', audience: 'all', actorId, scenarioTime: scenarioTimeAt(r.state, w.now),
      data: { action: input.action, clock, from: new Date(r.from).toISOString() },
    })
    return { clock, seq: event.seq }
  })
}
