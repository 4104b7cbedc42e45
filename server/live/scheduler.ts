import { eq, inArray } from 'drizzle-orm'
import { clockBounds, clockDto, scenarioTimeAt, stopAtEnd } from '#shared/live/clock'
import { dueItems, type DueItem } from '#shared/live/schedule'
import { publishedSolutions } from './assessments'
import { readClock, writeClock } from './clock'
import { injectRows, releaseInject } from './injects'
import { acquireLease, LEASE_HOLDER, releaseLease } from './lease'
import { liveWrite } from './record'
import type { LiveExercise } from './types'
import { publishSolution } from './solutions'

/** A running clock past the end of the scenario stops there (`clock.changed`, action `auto-pause`). */
function pauseAtEnd(exerciseId: string): void {
  liveWrite(exerciseId, (w) => {
    const stopped = w.exercise.status === 'running' ? stopAtEnd(w.clock, w.now, w.bounds) : null
    if (!stopped) return
    writeClock(w.tx, exerciseId, stopped, 'paused')
    w.append({
      type: 'clock.changed',
      audience: 'all',
      scenarioTime: w.bounds.end,
      data: { action: 'auto-pause', clock: clockDto(stopped, 'paused', w.bounds) },
    })
  })
}

/** What is due in one exercise at its scenario time now, in time order (a clock past the end stops there first). */
function dueNow(exerciseId: string, now: number) {
  const db = useDB()
  const exercise = db.select().from(schema.exercises).where(eq(schema.exercises.id, exerciseId)).get() as LiveExercise | undefined
  if (!exercise?.scenario || (exercise.status !== 'running' && exercise.status !== 'paused')) return []
  const state = readClock(db, exercise)
  const bounds = clockBounds(exercise.scenario.clock)
  if (exercise.status === 'running' && stopAtEnd(state, now, bounds)) pauseAtEnd(exerciseId)
  const t = Math.min(scenarioTimeAt(state, now), bounds.end)
  const published = new Set(publishedSolutions(db, exerciseId).map(p => p.key))
  return dueItems(exercise.scenario, published, injectRows(db, exerciseId), t)
}

/** Publishes or releases one due item; false when it was done already (or held since, or the drill ended). */
async function runItem(exerciseId: string, item: DueItem): Promise<boolean> {
  try {
    if (item.kind === 'solution') await publishSolution(exerciseId, item.key, { manual: false })
    else if (injectRows(useDB(), exerciseId).has(item.key)) return false
    else releaseInject(exerciseId, item.key, { manual: false })
    return true
  }
  catch (err) {
    // Released or published meanwhile (by hand or by another process), or the drill ended: nothing to do.
    if (!isDomainError(err, 'conflict', 'ended')) throw err
    return false
  }
}

/**
 * Publishes the solutions and releases the (non-contingency, unheld) injects of one exercise that
 * are due at its scenario time now, in time order, each exactly once. Returns how many it did.
 */
export async function runDue(exerciseId: string, now = Date.now()): Promise<number> {
  let done = 0
  for (const item of dueNow(exerciseId, now)) if (await runItem(exerciseId, item)) done++
  return done
}

const yieldToIO = () => new Promise<void>(resolve => setImmediate(resolve))

/**
 * The scheduler's pass over one exercise: like runDue, but it lets pending I/O run before each item,
 * so that what the previous release emitted reaches the sockets before the next one. `proceed` is asked before each item.
 */
export async function runDuePaced(exerciseId: string, proceed: () => boolean = () => true): Promise<number> {
  let done = 0
  for (const item of dueNow(exerciseId, Date.now())) {
    await yieldToIO()
    if (!proceed()) break
    if (await runItem(exerciseId, item)) done++
  }
  return done
}

/**
 * One pass of the scheduler over the exercises in the given states; a failing exercise does not stop
 * the others. `proceed` is asked before each release (the lease still ours?); false ends the pass.
 */
export async function schedulerTick(
  statuses: Array<'running' | 'paused'> = ['running'],
  proceed: () => boolean = () => true,
): Promise<void> {
  const ids = useDB().select({ id: schema.exercises.id }).from(schema.exercises).where(inArray(schema.exercises.status, statuses)).all()
  for (const { id } of ids) {
    if (!proceed()) return
    try { await runDuePaced(id, proceed) }
    catch (err) { logThrottled(`scheduler:${id}`, `[scheduler] exercise ${id} (repeats are logged once a minute):`, err) }
  }
}

/** The lease that says which process runs the scheduler when several share the database. */
export const SCHEDULER_LEASE = 'scheduler'

let held = false
let leaseUntil = 0

/**
 * One scheduler pass of this process, if it holds the scheduler lease (taken, renewed past half its
 * life, or taken over from an expired or dead holder); a process that finds the lease held by
 * another live process skips the pass. A process that has just taken the lease also covers paused
 * exercises, so what fell due while no process was scheduling goes out, once. The pass stops when
 * the lease runs out under it (a process frozen mid-pass does not go on releasing when it wakes);
 * the unique release rows keep a release single even then. Returns whether this process scheduled.
 */
export async function scheduleIfHolder(ttlMs: number, now = Date.now()): Promise<boolean> {
  const current = held && leaseUntil > now
  if (!current || leaseUntil - now < ttlMs / 2) {
    const lease = acquireLease(SCHEDULER_LEASE, ttlMs, LEASE_HOLDER, now)
    if (!lease) {
      if (held) console.warn('[scheduler] the scheduler lease went to another process')
      held = false
      leaseUntil = 0
      return false
    }
    leaseUntil = lease.expiresAt
  }
  held = true
  await schedulerTick(current ? ['running'] : ['running', 'paused'], () => Date.now() < leaseUntil)
  return true
}

/** Stops scheduling in this process and frees the lease for another one. */
export function stopScheduling(): void {
  if (held) releaseLease(SCHEDULER_LEASE)
  held = false
  leaseUntil = 0
}
