import type { NitroApp } from 'nitropack'
import { Server as Engine } from 'engine.io'
import { Server } from 'socket.io'
import { createAdapter } from '@socket.io/redis-adapter'
import { Redis } from 'ioredis'
import type { Socket } from 'socket.io'
import { and, eq, gte, lte, min } from 'drizzle-orm'
import { liveAuthSchema } from '#shared/schemas/live'
import { rooms, sanitise } from '#shared/live/visibility'
import type { LiveReady, LiveView } from '#shared/live/types'
import { clockNow, findWallToken, latestSeq, liveExercise, setIO, storedEvents, userFromHandshake } from '~~/server/live'

interface LiveSocketData { exerciseId: string; view: LiveView; lastSeq: number; wallTokenId?: string; userId?: string }

/** The rooms a reader of an exercise joins (the facilitator hears evaluator traffic through control). */
function roomsOf(exerciseId: string, view: LiveView): string[] {
  switch (view.kind) {
    case 'control': return [rooms.control(exerciseId), rooms.evaluators(exerciseId)]
    case 'evaluator': return [rooms.evaluators(exerciseId)]
    case 'player': return [rooms.team(exerciseId, view.teamKey)]
    case 'wall': return [rooms.wall(exerciseId)]
  }
}

/** How far back (wall ms) events of another process may arrive after later ones, with the Redis adapter. */
const REORDER_WINDOW_MS = 5000
let clustered = false

/**
 * Where a replay starts. With one process, events reach a socket in seq order, so after lastSeq.
 * With the Redis adapter, an event committed by another process can arrive after a later local one
 * (delivery through Redis, or a process paused between commit and emit); a client that dropped in
 * between would have missed it. So the replay starts REORDER_WINDOW_MS of wall time before lastSeq;
 * clients keep events by seq and drop the ones they already have.
 */
function replayFrom(exerciseId: string, lastSeq: number): number {
  if (!clustered || lastSeq === 0) return lastSeq
  const e = schema.exerciseEvents
  const at = useDB().select({ wallTime: e.wallTime }).from(e).where(and(eq(e.exerciseId, exerciseId), eq(e.seq, lastSeq))).get()
  if (!at) return lastSeq
  const first = useDB().select({ seq: min(e.seq) }).from(e)
    .where(and(eq(e.exerciseId, exerciseId), gte(e.wallTime, at.wallTime - REORDER_WINDOW_MS), lte(e.seq, lastSeq))).get()
  return Math.max(0, (first?.seq ?? lastSeq + 1) - 1)
}

/** Events a replay sends before it lets other work run (a long record must not hold the server). */
const REPLAY_PAGE = 250

/**
 * Replays what the reader missed after lastSeq, joins its rooms and says it is ready. A long record goes out
 * in pages with other work let in between; the last page, the joins and the ready message share one tick, so no
 * live event falls between the replay and the rooms.
 */
async function joinLive(socket: Socket, live: LiveSocketData): Promise<void> {
  // The member room only serves to drop the socket when the membership changes: joined first, it covers the replay too.
  if (live.userId) socket.join(rooms.member(live.exerciseId, live.userId))
  let since = replayFrom(live.exerciseId, live.lastSeq)
  for (;;) {
    const page = storedEvents(live.exerciseId, live.view, since, REPLAY_PAGE)
    for (const e of page) {
      const reader = sanitise(e, live.view)
      if (reader) socket.emit('event', reader)
    }
    if (page.length) since = page.at(-1)!.seq
    if (page.length < REPLAY_PAGE) break
    await new Promise<void>(resolve => setImmediate(resolve))
    if (!socket.connected) return
  }
  socket.join(roomsOf(live.exerciseId, live.view))
  if (live.wallTokenId) socket.join(rooms.wallToken(live.wallTokenId))
  const exercise = liveExercise(useDB(), live.exerciseId)
  const ready: LiveReady = {
    exerciseId: live.exerciseId, view: live.view.kind, teamKey: live.view.kind === 'player' ? live.view.teamKey : null,
    clock: clockNow(exercise).clock, lastSeq: latestSeq(live.exerciseId), serverTime: Date.now(), epoch: recordEpoch(),
  }
  socket.emit('live:ready', ready)
}

/** Live connections per person in this process (tabs, desks): capped by socketsPerUser. */
const socketsOfUser = new Map<string, number>()

/**
 * With NUXT_REDIS_URL set, rooms span every process of the app: an event emitted in one process
 * reaches the sockets connected to the others through Redis pub/sub (@socket.io/redis-adapter).
 */
function attachRedisAdapter(io: Server): { close: () => Promise<void> } | null {
  const url = serverConfig().redisUrl
  if (!url) return null
  const pub = new Redis(url, { maxRetriesPerRequest: null })
  const sub = pub.duplicate()
  for (const [name, client] of [['pub', pub], ['sub', sub]] as const) {
    client.on('error', (err: Error) => console.error(`[socket.io] redis ${name}:`, err.message))
  }
  io.adapter(createAdapter(pub, sub, { key: 'brinkwater' }))
  clustered = true
  return {
    async close() {
      await Promise.allSettled([pub.quit(), sub.quit()])
    },
  }
}

// All realtime glue: Socket.IO bound to Nitro's router on /socket.io/ (HTTP long-polling and
// WebSocket upgrades through crossws). A connection carries a valid session cookie, optionally with
// auth { exerciseId, lastSeq } to follow an exercise it is a member of; or, for the wall view, only
// auth { wallToken, lastSeq }.
export default defineNitroPlugin((nitroApp: NitroApp) => {
  const engine = new Engine({ pingInterval: 10_000, pingTimeout: 8_000, path: '/socket.io/' } as ConstructorParameters<typeof Engine>[0])
  const io = new Server({ serveClient: false, connectionStateRecovery: undefined })
  io.bind(engine)
  setIO(io)
  const redis = attachRedisAdapter(io)

  io.use(async (socket, next) => {
    try {
      const auth = liveAuthSchema.safeParse(socket.handshake.auth ?? {})
      if (!auth.success) return next(new Error('invalid-auth'))
      const { exerciseId, wallToken, lastSeq } = auth.data
      if (wallToken !== undefined) {
        const wall = findWallToken(wallToken)
        if (!wall) return next(new Error('forbidden'))
        socket.data.live = { exerciseId: wall.exerciseId, view: { kind: 'wall' }, lastSeq, wallTokenId: wall.id } satisfies LiveSocketData
        return next()
      }
      const user = await userFromHandshake(socket.request)
      if (!user) return next(new Error('unauthorized'))
      if ((socketsOfUser.get(user.id) ?? 0) >= serverConfig().socketsPerUser) return next(new Error('too-many-connections'))
      socket.data.userId = user.id
      if (exerciseId) {
        // The same rule as the HTTP routes: the `live.follow` capability of the permission table.
        let access: ExerciseAccess
        try { access = exerciseAccess(user, exerciseId, 'live.follow') }
        catch (err) {
          if (isDomainError(err)) return next(new Error('forbidden'))
          throw err
        }
        socket.data.live = { exerciseId, view: access.view, lastSeq, userId: user.id } satisfies LiveSocketData
      }
      next()
    }
    catch {
      next(new Error('unauthorized'))
    }
  })

  io.on('connection', (socket) => {
    const userId = socket.data.userId as string | undefined
    if (userId) {
      socketsOfUser.set(userId, (socketsOfUser.get(userId) ?? 0) + 1)
      socket.on('disconnect', () => {
        const n = (socketsOfUser.get(userId) ?? 1) - 1
        if (n > 0) socketsOfUser.set(userId, n)
        else socketsOfUser.delete(userId)
      })
    }
    if (socket.data.live) {
      joinLive(socket, socket.data.live as LiveSocketData).catch((err) => {
        console.error('[socket.io] live join failed:', err)
        socket.disconnect(true)
      })
    }
    socket.on('ping:clock', (ack: unknown) => {
      if (typeof ack === 'function') ack({ serverTime: Date.now() })
    })
  })

  nitroApp.router.use('/socket.io/', defineEventHandler({
    handler(event) {
      engine.handleRequest(event.node.req, event.node.res)
      event._handled = true
    },
    websocket: {
      open(peer) {
        // crossws >= 0.3: the node request and raw WebSocket are private members.
        // @ts-expect-error private method and property
        engine.prepare(peer._internal.nodeReq)
        // @ts-expect-error private method and property
        engine.onWebSocket(peer._internal.nodeReq, peer._internal.nodeReq.socket, peer.websocket)
      },
    },
  }))

  nitroApp.hooks.hook('close', async () => {
    await io.close()
    await redis?.close()
  })
})
