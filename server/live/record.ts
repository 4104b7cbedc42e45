import { and, asc, eq, gt, inArray, like, ne, or, sql } from 'drizzle-orm'
import type { SQL } from 'drizzle-orm'
import { scenarioTimeAt, clockBounds, type ClockBounds } from '#shared/live/clock'
import { canSee, rooms, sanitise, wallTypes } from '#shared/live/visibility'
import type { Audience, ClockState, EventDataMap, LiveEvent, LiveEventType, LiveView, StoredEvent } from '#shared/live/types'
import { readClock } from './clock'
import { useIO } from './realtime'
import type { LiveExercise } from './types'

export interface NewEvent<T extends LiveEventType = LiveEventType> {
  type: T
  audience: Audience
  data: EventDataMap[T]
  actorId?: string | null
  idempotencyKey?: string
  /** Defaults to the scenario time of the write. */
  scenarioTime?: number
}

/** What a service sees inside `liveWrite`: the transaction, the exercise and its clock at the time of the write. */
export interface LiveWriter {
  tx: Tx
  exercise: LiveExercise
  clock: ClockState
  bounds: ClockBounds
  /** Wall time of the write, ms. */
  now: number
  /** Scenario time of the write, ms (held within the scenario window). */
  scenarioNow: number
  /** Appends an event with the next sequence number; it is emitted once the transaction commits. */
  append: <T extends LiveEventType>(e: NewEvent<T>) => StoredEvent<T>
}

/** An exercise with its frozen scenario; 404 when missing, 409 when it has no scenario. */
export function liveExercise(db: DB | Tx, exerciseId: string): LiveExercise {
  const exercise = db.select().from(schema.exercises).where(eq(schema.exercises.id, exerciseId)).get()
  if (!exercise) throw notFound('No such exercise.')
  if (!exercise.scenario) throw conflict('This exercise has no scenario to play.')
  return exercise as LiveExercise
}

/** The SQL condition for the events a view may read (the same rule as `canSee`). */
export function audienceWhere(view: LiveView): SQL | undefined {
  const { audience, type } = schema.exerciseEvents
  switch (view.kind) {
    case 'control': return undefined
    case 'evaluator': return ne(audience, 'control')
    case 'player': return or(
      eq(audience, 'all'),
      and(like(audience, 'teams:%'), sql`(',' || substr(${audience}, 7) || ',') like ${`%,${view.teamKey},%`}`),
    )
    case 'wall': return and(eq(audience, 'all'), inArray(type, wallTypes()))
  }
}

function toStored(row: typeof schema.exerciseEvents.$inferSelect): StoredEvent {
  // A row pairs its type and payload as written by `append`; the column types cannot say so.
  return {
    seq: row.seq, type: row.type, wallTime: row.wallTime, scenarioTime: row.scenarioTime,
    actorId: row.actorId, audience: row.audience, data: row.payload,
  } as StoredEvent
}

/** Events that carry text people write; their size counts against the record's cap (NUXT_RECORD_LIMIT_MB). */
export const WRITTEN_TEXT_EVENTS: ReadonlySet<LiveEventType> = new Set([
  'response.submitted', 'observation.recorded', 'score.recorded', 'message.sent', 'team.message', 'zone.drawn',
])

/** Counts a written event's bytes against the exercise's record; 413 (record-full) past the cap, nothing stored. */
function countWrittenText(tx: Tx, exercise: LiveExercise, e: NewEvent): void {
  if (!WRITTEN_TEXT_EVENTS.has(e.type)) return
  const bytes = Buffer.byteLength(JSON.stringify(e.data))
  const { recordLimitMb } = serverConfig()
  const { recordBytes } = tx.select({ recordBytes: schema.exercises.recordBytes }).from(schema.exercises)
    .where(eq(schema.exercises.id, exercise.id)).get()!
  if (recordBytes + bytes > recordLimitMb * 1024 * 1024) throw recordFull(recordLimitMb)
  tx.update(schema.exercises).set({ recordBytes: recordBytes + bytes }).where(eq(schema.exercises.id, exercise.id)).run()
}

function insertEvent(tx: Tx, exerciseId: string, e: NewEvent, wallTime: number, scenarioTime: number): StoredEvent {
  const { next } = tx.select({ next: sql<number>`coalesce(max(${schema.exerciseEvents.seq}), 0) + 1` })
    .from(schema.exerciseEvents).where(eq(schema.exerciseEvents.exerciseId, exerciseId)).get()!
  const row = tx.insert(schema.exerciseEvents).values({
    exerciseId, seq: next, type: e.type, wallTime, scenarioTime, actorId: e.actorId ?? null, audience: e.audience,
    payload: e.data, idempotencyKey: e.idempotencyKey ?? null,
  }).returning().get()
  return toStored(row)
}

/**
 * Runs a write on a live exercise in one transaction: whatever `work` appends with `w.append` is
 * committed with the change it records, then pushed to the rooms that may see it.
 */
export function liveWrite<T>(exerciseId: string, work: (w: LiveWriter) => T): T {
  const appended: StoredEvent[] = []
  let exercise: LiveExercise | undefined
  // IMMEDIATE takes the write lock first: with several processes on one file, a deferred read-then-write fails with SQLITE_BUSY instead of
  // waiting.
  const result = useDB().transaction((tx) => {
    exercise = liveExercise(tx, exerciseId)
    const clock = readClock(tx, exercise)
    const bounds = clockBounds(exercise.scenario.clock)
    const now = Date.now()
    const scenarioNow = Math.min(scenarioTimeAt(clock, now), bounds.end)
    const append = <E extends LiveEventType>(e: NewEvent<E>) => {
      countWrittenText(tx, exercise!, e as NewEvent)
      const stored = insertEvent(tx, exerciseId, e as NewEvent, now, e.scenarioTime ?? scenarioNow)
      appended.push(stored)
      return stored as StoredEvent<E>
    }
    return work({ tx, exercise, clock, bounds, now, scenarioNow, append })
  }, { behavior: 'immediate' })
  if (exercise && appended.length) emitLive(exercise, appended)
  return result
}

/** The event a caller already wrote with this idempotency key (null if none); 409 when it was another kind of write. */
export function findIdempotent<T extends LiveEventType>(
  tx: Tx, exerciseId: string, actorId: string, key: string, type: T,
): StoredEvent<T> | null {
  const e = schema.exerciseEvents
  const row = tx.select().from(e)
    .where(and(eq(e.exerciseId, exerciseId), eq(e.actorId, actorId), eq(e.idempotencyKey, key))).get()
  if (!row) return null
  if (row.type !== type) throw conflict(
    'This idempotency key was already used for another write.',
    { issues: [{ path: 'idempotencyKey', message: 'already used' }] },
  )
  return toStored(row) as StoredEvent<T>
}

/** Stored events of an exercise after `since` that a view may read, in sequence order. */
export function storedEvents(exerciseId: string, view: LiveView, since = 0, limit?: number): StoredEvent[] {
  const q = useDB().select().from(schema.exerciseEvents)
    .where(and(eq(schema.exerciseEvents.exerciseId, exerciseId), gt(schema.exerciseEvents.seq, since), audienceWhere(view)))
    .orderBy(asc(schema.exerciseEvents.seq))
  return (limit ? q.limit(limit).all() : q.all()).map(toStored)
}

/** Events after `since` as a view receives them (sanitised), in sequence order. */
export function visibleEvents(exerciseId: string, view: LiveView, since = 0, limit?: number): LiveEvent[] {
  return storedEvents(exerciseId, view, since, limit).map(e => sanitise(e, view)).filter((e): e is LiveEvent => e !== null)
}

/** The latest sequence number of an exercise (0 before the first event). */
export function latestSeq(exerciseId: string): number {
  return useDB().select({ max: sql<number>`coalesce(max(${schema.exerciseEvents.seq}), 0)` })
    .from(schema.exerciseEvents).where(eq(schema.exerciseEvents.exerciseId, exerciseId)).get()!.max
}

/**
 * Pushes committed events to the exercise's rooms as message `event`, each room getting its own
 * sanitised copy: control, evaluators (without the facilitator, who has control), the teams that
 * may see it, and the wall.
 */
export function emitLive(exercise: LiveExercise, events: readonly StoredEvent[]): void {
  const io = useIO()
  if (!io) return
  const id = exercise.id
  const teams = exercise.scenario.teams.map(t => t.key)
  for (const e of events) {
    const control = sanitise(e, { kind: 'control' })
    if (control) io.to(rooms.control(id)).emit('event', control)
    const evaluator = sanitise(e, { kind: 'evaluator' })
    if (evaluator) io.to(rooms.evaluators(id)).except(rooms.control(id)).emit('event', evaluator)
    const seeing = teams.filter(teamKey => canSee({ kind: 'player', teamKey }, e.audience, e.type))
    if (seeing.length) io.to(seeing.map(t => rooms.team(id, t))).emit('event', sanitise(e, { kind: 'player', teamKey: seeing[0]! }))
    const wall = sanitise(e, { kind: 'wall' })
    if (wall) io.to(rooms.wall(id)).emit('event', wall)
  }
}
