import { io } from 'socket.io-client'
import type { Socket } from 'socket.io-client'
import { storeToRefs } from 'pinia'
import type { MaybeRefOrGetter } from 'vue'
import type { LiveEvent, LiveEventType, LiveReady } from '~~/shared/live/types'
import { useLiveStore } from '~/stores/live'

type Handler = (e: LiveEvent) => void

/** What to follow: an exercise the signed-in user is a member of, or a wall view by its share token. */
export type LiveTarget = string | { wallToken: string }
const targetKey = (t: LiveTarget) => (typeof t === 'string' ? t : `wall:${t.wallToken}`)

// Client-only singletons: one live connection, shared by every component.
let socket: Socket | null = null
let ticker: ReturnType<typeof setInterval> | null = null
let users = 0
let closing: ReturnType<typeof setTimeout> | null = null
const handlers = new Map<string, Set<Handler>>()

function dispatch(e: LiveEvent) {
  for (const name of [e.type, '*']) for (const h of handlers.get(name) ?? []) h(e)
}

function close(store: ReturnType<typeof useLiveStore>) {
  socket?.close()
  socket = null
  if (ticker) clearInterval(ticker)
  ticker = null
  if (store.status !== 'idle') store.status = 'closed'
}

function open(store: ReturnType<typeof useLiveStore>, target: LiveTarget) {
  close(store)
  store.reset(targetKey(target))
  store.status = 'connecting'
  const who = typeof target === 'string' ? { exerciseId: target } : target
  // auth is read on every (re)connection, so a reconnect asks for what came after the last seq held.
  // tryAllTransports: where a proxy (hotel and conference networks) blocks WebSocket, fall back to long-polling.
  const s = io({
    path: '/socket.io/',
    transports: ['websocket', 'polling'],
    tryAllTransports: true,
    forceNew: true,
    auth: cb => cb({ ...who, lastSeq: store.lastSeq }),
  })
  s.on('event', (e: LiveEvent) => { if (store.ingest(e)) dispatch(e) })
  s.on('live:ready', (r: LiveReady) => {
    // After a restore from backup the record is another history: drop what we hold and replay it from the start.
    if (store.needsResync(r)) {
      store.reset(targetKey(target))
      store.status = 'connecting'
      s.disconnect().connect()
      return
    }
    store.ready(r)
    const t0 = Date.now()
    s.emit('ping:clock', ({ serverTime }: { serverTime: number }) => {
      const t1 = Date.now()
      store.setOffset(serverTime + (t1 - t0) / 2 - t1)
    })
  })
  // A membership change (role, team) drops this member's sockets: the page reloads to take its new desk. A removal
  // leaves the page refused with a plain reason.
  let membership: 'removed' | 'changed' | null = null
  s.on('live:membership', (m: { change: 'removed' | 'changed' }) => { membership = m.change })
  // The server disconnects a revoked wall link (and a failed join); Socket.IO does not retry those.
  s.on('disconnect', (reason) => {
    store.lost()
    store.status = reason === 'io client disconnect' ? 'closed' : reason === 'io server disconnect' ? 'refused' : 'reconnecting'
    if (reason !== 'io server disconnect' || !membership) return
    if (membership === 'changed') window.location.reload()
    else store.error = 'You are no longer a member of this exercise.'
  })
  s.on('connect_error', (err) => {
    store.lost()
    store.error = err.message
    store.status = s.active ? 'reconnecting' : 'refused'
  })
  socket = s
  ticker = setInterval(() => store.tick(), 250)
}

/**
 * Follows one live exercise: connects with auth { exerciseId, lastSeq } (or { wallToken, lastSeq }
 * for a wall view), keeps its events in the
 * live store (deduplicated by seq), resyncs from the last seq after every reconnect, and ticks the
 * scenario clock locally. Client-only; the connection closes when the last user unmounts.
 * `on(type, handler)` (or `on('*', …)`) runs for each new event and is removed on unmount.
 */
export function useExerciseLive(exerciseId: MaybeRefOrGetter<LiveTarget>) {
  const store = useLiveStore()
  const refs = storeToRefs(store)

  function on<T extends LiveEventType>(type: T | '*', handler: (e: LiveEvent<T>) => void) {
    const set = handlers.get(type) ?? new Set<Handler>()
    handlers.set(type, set.add(handler as Handler))
    if (getCurrentInstance()) onBeforeUnmount(() => set.delete(handler as Handler))
  }
  /** Drops the connection and starts afresh (a full replay). */
  const reconnect = () => open(store, toValue(exerciseId))
  const disconnect = () => close(store)

  if (import.meta.client) {
    const acquire = () => {
      users++
      if (closing) clearTimeout(closing)
      closing = null
      if (!socket || store.exerciseId !== targetKey(toValue(exerciseId))) open(store, toValue(exerciseId))
    }
    if (getCurrentInstance()) {
      onMounted(acquire)
      // A short grace period lets the next page reuse the connection.
      onBeforeUnmount(() => {
        if (--users === 0) closing = setTimeout(() => close(store), 2000)
      })
      watch(() => targetKey(toValue(exerciseId)), (id, old) => { if (id !== old) open(store, toValue(exerciseId)) })
    }
    else acquire()
  }

  return { store, ...refs, on, reconnect, disconnect }
}
