import type { Feed } from '~~/shared/live/fold'
import { injectState, type InjectState } from '~~/shared/live/schedule'

/** A row of the control desk's schedule (GET …/live as the facilitator). */
export interface ScheduleRow {
  key: string
  title: string
  at: string
  phase: string | null
  kind: string
  teams: string[]
  adhoc: boolean
  contingency: string | null
  deadline: string | null
  state: InjectState
  answered: Record<string, boolean>
  /** When it went out (scenario time, ISO), once released: against `at`, how late or early it went. */
  releasedAt?: string | null
}

const RELEASED: ReadonlySet<InjectState> = new Set(['released', 'answered', 'overdue'])

/**
 * The schedule with states kept current between snapshots: releases, holds and answers from the live
 * feed, and due/overdue from the ticking scenario clock. Also the next scheduled inject and the phase
 * (that of the latest scenario inject due by now, as the server reckons it).
 */
export function useDeskSchedule(
  schedule: MaybeRefOrGetter<ScheduleRow[]>,
  feed: MaybeRefOrGetter<Feed>,
  scenarioNow: MaybeRefOrGetter<number | null>,
  phases: MaybeRefOrGetter<Array<{ key: string }>>,
) {
  const rows = computed<ScheduleRow[]>(() => {
    const f = toValue(feed)
    const t = toValue(scenarioNow) ?? 0
    const released = new Set(f.injects.map(i => i.key))
    const releasedAt = new Map(f.injects.map(i => [i.key, i.releasedAt] as [string, string]))
    const held = new Set(f.held.map(h => h.key))
    return toValue(schedule).map((r) => {
      const isReleased = released.has(r.key) || RELEASED.has(r.state)
      const isHeld = !isReleased && (held.has(r.key) || r.state === 'held')
      const answered = new Set([
        ...Object.keys(r.answered).filter(k => r.answered[k]),
        ...f.responses.filter(x => x.injectKey === r.key).map(x => x.teamKey),
      ])
      const state = injectState(
        { at: Date.parse(r.at), deadline: r.deadline ? Date.parse(r.deadline) : null, teams: r.teams },
        isHeld ? 'held' : isReleased ? 'released' : null,
        answered,
        t,
      )
      return {
        ...r, state, answered: Object.fromEntries(r.teams.map(k => [k, answered.has(k)])),
        releasedAt: releasedAt.get(r.key) ?? r.releasedAt ?? null,
      }
    })
  })
  const next = computed(() => {
    const t = toValue(scenarioNow) ?? 0
    return rows.value.find(r => !r.adhoc && !r.contingency && r.state === 'upcoming' && Date.parse(r.at) > t) ?? null
  })
  const phase = computed(() => {
    const t = toValue(scenarioNow) ?? 0
    const due = rows.value.filter(r => !r.adhoc && Date.parse(r.at) <= t)
    return due.at(-1)?.phase ?? toValue(phases)[0]?.key ?? null
  })
  return { rows, next, phase }
}
