import { defineStore } from 'pinia'
import { displayedScenarioTime } from '~~/shared/live/clock'
import { foldEvents } from '~~/shared/live/fold'
import type { ClockDto, LiveEvent, LiveReady, LiveView } from '~~/shared/live/types'

/** idle → connecting → live; reconnecting after a drop; refused (forbidden/unauthorized); closed by us. */
export type LiveStatus = 'idle' | 'connecting' | 'live' | 'reconnecting' | 'refused' | 'closed'

/**
 * The live exercise on the client: its events by sequence number (deduplicated, in order), the
 * clock with a scenario time that ticks locally, and the connection status. Fed by
 * useExerciseLive(); pages read it with storeToRefs.
 */
export const useLiveStore = defineStore('live', () => {
  const exerciseId = ref<string | null>(null)
  const status = ref<LiveStatus>('idle')
  const error = ref<string | null>(null)
  const epoch = ref<string | null>(null)
  const view = ref<LiveView['kind'] | null>(null)
  const teamKey = ref<string | null>(null)
  /** Every event received, ascending by seq, each once (shallow: payloads are not made reactive). */
  const events = shallowRef<LiveEvent[]>([])
  /** The highest seq received: sent on (re)connect so the server replays only what came after. */
  const lastSeq = ref(0)
  const clock = ref<ClockDto | null>(null)
  /** Server clock minus local clock, ms. */
  const offsetMs = ref(0)
  /** Local wall time, advanced by tick(). */
  const now = ref(Date.now())
  /** Local wall time (ms) when the live connection dropped: what is shown dates from then. Null while live. */
  const lostAt = ref<number | null>(null)
  let clockSeq = 0
  const seen = new Set<number>()

  /** Scenario time now (ms), held within the scenario; null before the clock is known. */
  const scenarioNow = computed(() => (clock.value ? displayedScenarioTime(clock.value, now.value + offsetMs.value) : null))
  const scenarioNowIso = computed(() => (scenarioNow.value === null ? null : new Date(scenarioNow.value).toISOString()))
  const running = computed(() => clock.value?.status === 'running' && !clock.value.paused)
  /** Released injects with current bodies and revisions, responses, solutions, scores, observations. */
  const feed = computed(() => foldEvents(events.value))
  const connected = computed(() => status.value === 'live')

  function reset(id: string | null) {
    exerciseId.value = id
    epoch.value = null
    status.value = 'idle'
    error.value = null
    view.value = null
    teamKey.value = null
    events.value = []
    lastSeq.value = 0
    clock.value = null
    lostAt.value = null
    clockSeq = 0
    seen.clear()
  }

  /** The connection dropped: remember when (the first drop counts until the next `ready`). */
  function lost(t = Date.now()) {
    if (lostAt.value === null) lostAt.value = t
  }

  /** Adds an event unless already held; returns whether it was new. */
  function ingest(e: LiveEvent): boolean {
    if (seen.has(e.seq)) return false
    seen.add(e.seq)
    const list = events.value
    let i = list.length
    while (i > 0 && list[i - 1]!.seq > e.seq) i--
    list.splice(i, 0, e)
    triggerRef(events)
    if (e.seq > lastSeq.value) lastSeq.value = e.seq
    if (e.type === 'clock.changed' && e.seq >= clockSeq) {
      clock.value = (e.data as { clock: ClockDto }).clock
      clockSeq = e.seq
    }
    return true
  }

  /**
   * Whether what we hold belongs to another history of the record than the server's: its epoch changed (a restore
   * from backup) or its last sequence number went backwards. Then the page must drop everything and replay.
   */
  function needsResync(r: LiveReady): boolean {
    return (epoch.value !== null && !!r.epoch && r.epoch !== epoch.value) || r.lastSeq < lastSeq.value
  }

  /** The server finished replaying: who we are here, the clock now. */
  function ready(r: LiveReady) {
    epoch.value = r.epoch || null
    view.value = r.view
    teamKey.value = r.teamKey
    if (r.lastSeq >= clockSeq) {
      clock.value = r.clock
      clockSeq = r.lastSeq
    }
    offsetMs.value = r.serverTime - Date.now()
    if (r.lastSeq > lastSeq.value) lastSeq.value = r.lastSeq
    status.value = 'live'
    error.value = null
    lostAt.value = null
  }

  function setOffset(ms: number) { offsetMs.value = ms }
  function tick(t = Date.now()) { now.value = t }

  return {
    exerciseId, status, error, view, teamKey, events, lastSeq, clock, offsetMs, now, lostAt,
    scenarioNow, scenarioNowIso, running, feed, connected,
    reset, ingest, ready, needsResync, lost, setOffset, tick,
  }
})
