import { emptyFeed, latestImpactTime, type Feed } from '~~/shared/live/fold'
import type { LiveEvent } from '~~/shared/live/types'

interface DeskOptions {
  /** Fetch the snapshot again after every event (the control desk's schedule); otherwise only when the phase may have moved. */
  everyEvent?: boolean
  /** Stagger those fetches over so many ms, so that forty screens do not ask at once. */
  spread?: number
  /** Fetch it again this often while the clock runs (the phase moves with scenario time). */
  pollMs?: number
}

/**
 * A desk's view of a live exercise: the role's snapshot (GET …/live, rendered on the server too) and
 * the live store fed by the socket. The feed comes from the snapshot until the socket has replayed
 * the record, then from the store. The snapshot (schedule, states, phase) is fetched again after a
 * reconnect, after clock changes and releases from another phase (or every event, for the control
 * desk), and now and then while the clock runs — sparingly, for a room full of screens on one
 * hotel network. A failed fetch keeps what was there: a drop must not blank a desk.
 */
export function useLiveDesk(exerciseId: string, opts: DeskOptions = {}) {
  const live = useExerciseLive(exerciseId)
  const { store } = live
  const snapshot = useFetch(`/api/exercises/${exerciseId}/live`, { key: `live-${exerciseId}` })
  const kept = shallowRef(snapshot.data.value)
  watch(snapshot.data, (d) => { if (d) kept.value = d })
  const data = computed(() => snapshot.data.value ?? kept.value)
  // Scenario times on this page in the scenario's own time zone, UTC beside them.
  watch(() => data.value?.timeZone, z => setScenarioZone(z), { immediate: true })

  let timer: ReturnType<typeof setTimeout> | null = null
  let poll: ReturnType<typeof setInterval> | null = null
  function refreshSoon(delay = 250 + Math.random() * (opts.spread ?? 0)) {
    if (import.meta.server) return
    if (timer) clearTimeout(timer)
    timer = setTimeout(() => {
      timer = null
      void snapshot.refresh()
    }, delay)
  }
  const movesPhase = (e: LiveEvent) => e.type === 'clock.changed'
    || ((e.type === 'inject.released' || e.type === 'message.sent') && e.data.phase !== data.value?.phase)
  live.on('*', (e) => { if (opts.everyEvent || movesPhase(e)) refreshSoon() })
  watch(() => store.status, (s) => { if (s === 'live') refreshSoon() })
  onMounted(() => { poll = setInterval(() => { if (store.running) refreshSoon() }, opts.pollMs ?? 60_000) })
  onBeforeUnmount(() => {
    if (poll) clearInterval(poll)
    if (timer) clearTimeout(timer)
  })

  /** The socket has replayed the record at least once: the store holds everything the snapshot had. */
  const caughtUp = computed(() => store.view !== null && store.exerciseId === exerciseId)
  const feed = computed<Feed>(() => {
    if (caughtUp.value) return store.feed
    const d = data.value
    if (!d) return emptyFeed()
    const injects = d.injects as Feed['injects']
    const staff = d as Partial<Pick<Feed, 'scores' | 'observations' | 'held'>>
    return {
      ...emptyFeed(), injects, solutions: d.solutions, currentSolution: d.currentSolution, clock: d.clock, lastSeq: d.lastSeq,
      responses: injects.flatMap(i => i.responses),
      scores: staff.scores ?? [], observations: staff.observations ?? [], held: staff.held ?? [],
      teamMessages: (d as Partial<Pick<Feed, 'teamMessages'>>).teamMessages ?? [],
      zones: (d as Partial<Pick<Feed, 'zones'>>).zones ?? [],
    }
  })
  // The store appends in place: a fresh array lets child components see that it changed.
  const events = computed(() => store.events.slice())
  const clock = computed(() => (caughtUp.value ? store.clock : null) ?? data.value?.clock ?? null)
  /** Scenario time now (ms): ticking once live; the snapshot's moment before that. */
  const scenarioNow = computed<number | null>(() => {
    if (caughtUp.value && store.scenarioNow !== null) return store.scenarioNow
    return data.value ? Date.parse(data.value.scenarioNow) : null
  })

  /** Nominal impact time of the latest published solution: from the live record once caught up. */
  const impactTime = computed(() => (caughtUp.value ? latestImpactTime(store.events) : null) ?? data.value?.impactTime ?? null)

  return { live, store, snapshot, data, feed, events, clock, scenarioNow, caughtUp, refreshSoon, impactTime }
}
