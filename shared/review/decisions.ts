/**
 * Decisions and response times from the event record: for every released inject that asks for a
 * decision, and every team it went to, the time from release to the team's first response (scenario
 * time, less any jump of the clock in between), set against the decision deadline (scenario time, as
 * released: a late release moves it) — then summarised per team and per phase.
 */
import type { ResponseData, StoredEvent } from '../live/types'
import { phaseAt } from '../live/schedule'
import type { Scenario } from '../scenario/schema'

export type DecisionStatus = 'on-time' | 'late' | 'missed' | 'pending'

export interface DecisionRow {
  injectKey: string
  title: string
  phase: string | null
  teamKey: string
  releasedSeq: number
  /** Scenario and wall time of the release (ISO). */
  releasedAt: string
  releasedWall: string
  deadline: string
  /** Scenario minutes from release to deadline (negative when released after it). */
  allowedMin: number
  /** Planned scenario time of a scripted inject (ISO); null for an ad-hoc message. */
  plannedAt: string | null
  /**
   * Scenario minutes it went out before (negative) or after (positive) its planned time, when more than a minute:
   * released early by hand, or late (a fast clock's scheduler, a jump); null otherwise.
   */
  releaseLagMin: number | null
  first: {
    seq: number
    scenarioTime: string
    wallTime: string
    choice: string | null
    text: string
    by: string
    late: boolean
    /** The inject's revision the team answered (0: as released). */
    injectRevision: number
  } | null
  /** The inject's latest revision in the record: above first.injectRevision, its figures changed after the answer. */
  revision: number
  /** Scenario minutes from release to the first response. */
  responseMin: number | null
  /** Wall-clock minutes from release to the first response. */
  responseWallMin: number | null
  /** Share of the allowed time used (1 = answered at the deadline). */
  shareOfAllowed: number | null
  responses: number
  status: DecisionStatus
}

export interface DecisionGroup {
  key: string
  decisions: number
  answered: number
  onTime: number
  late: number
  missed: number
  pending: number
  /** Median scenario and wall minutes to the first response over the answered decisions. */
  medianMin: number | null
  medianWallMin: number | null
}

export interface DecisionSummary {
  rows: DecisionRow[]
  byTeam: DecisionGroup[]
  byPhase: DecisionGroup[]
}

const MIN = 60_000

export function median(xs: readonly number[]): number | null {
  if (!xs.length) return null
  const s = [...xs].sort((a, b) => a - b)
  const mid = s.length >> 1
  return s.length % 2 ? s[mid]! : (s[mid - 1]! + s[mid]!) / 2
}

function group(key: string, rows: readonly DecisionRow[]): DecisionGroup {
  const answered = rows.filter(r => r.first)
  return {
    key, decisions: rows.length, answered: answered.length,
    onTime: rows.filter(r => r.status === 'on-time').length, late: rows.filter(r => r.status === 'late').length,
    missed: rows.filter(r => r.status === 'missed').length, pending: rows.filter(r => r.status === 'pending').length,
    medianMin: median(answered.map(r => r.responseMin!)), medianWallMin: median(answered.map(r => r.responseWallMin!)),
  }
}

/**
 * Response times of every decision in a record (events in any order, the control view), at scenario
 * time `scenarioNow` (ms): an unanswered decision is `missed` once its deadline has passed, else `pending`.
 */
export function decisionSummary(
  events: readonly StoredEvent[],
  scenario: Pick<Scenario,
  'teams' | 'phases' | 'injects'>,
  scenarioNow: number,
): DecisionSummary {
  const sorted = [...events].sort((a, b) => a.seq - b.seq)
  const responses = new Map<string, Array<{ e: StoredEvent; d: ResponseData }>>()
  for (const e of sorted) {
    if (e.type !== 'response.submitted') continue
    const d = e.data
    const k = `${d.injectKey}\u0000${d.teamKey}`
    responses.set(k, [...(responses.get(k) ?? []), { e, d }])
  }
  const revisions = new Map<string, number>()
  for (const e of sorted) if (e.type === 'inject.revised') revisions.set(e.data.key, e.data.revision)
  // Scenario time skipped by jumps of the clock (seq, distance): a team does not spend it.
  const jumps = sorted.flatMap(e => (e.type === 'clock.changed' && e.data.action === 'jump' && e.data.from
    ? [{ seq: e.seq, ms: e.scenarioTime - Date.parse(e.data.from) }]
    : []))
  const jumpedBetween = (fromSeq: number, toSeq: number) =>
    jumps.reduce((sum, j) => sum + (j.seq > fromSeq && j.seq < toSeq ? j.ms : 0), 0)
  const rows: DecisionRow[] = []
  for (const e of sorted) {
    if (e.type !== 'inject.released' && e.type !== 'message.sent') continue
    const d = e.data
    if (!d.decision) continue
    const deadline = Date.parse(d.decision.deadline)
    for (const teamKey of d.teams) {
      const all = responses.get(`${d.key}\u0000${teamKey}`) ?? []
      const f = all[0]
      const responseMin = f ? Math.max(0, f.e.scenarioTime - e.scenarioTime - jumpedBetween(e.seq, f.e.seq)) / MIN : null
      const allowedMin = (deadline - e.scenarioTime) / MIN
      const status: DecisionStatus = f ? (f.d.late ? 'late' : 'on-time') : scenarioNow > deadline ? 'missed' : 'pending'
      rows.push({
        injectKey: d.key, title: d.title, phase: d.phase ?? phaseAt(scenario, e.scenarioTime), teamKey,
        releasedSeq: e.seq, releasedAt: new Date(e.scenarioTime).toISOString(), releasedWall: new Date(e.wallTime).toISOString(),
        deadline: new Date(deadline).toISOString(), allowedMin,
        plannedAt: d.adhoc ? null : d.at,
        releaseLagMin: !d.adhoc && Math.abs(e.scenarioTime - Date.parse(d.at)) >= MIN ? (e.scenarioTime - Date.parse(d.at)) / MIN : null,
        first: f
          ? {
              seq: f.e.seq,
              scenarioTime: new Date(f.e.scenarioTime).toISOString(),
              wallTime: new Date(f.e.wallTime).toISOString(),
              choice: f.d.choice,
              text: f.d.text,
              by: f.d.by.name,
              late: f.d.late,
              injectRevision: f.d.injectRevision ?? 0,
            }
          : null,
        revision: revisions.get(d.key) ?? 0,
        responseMin, responseWallMin: f ? (f.e.wallTime - e.wallTime) / MIN : null,
        shareOfAllowed: f && allowedMin > 0 ? responseMin! / allowedMin : null,
        responses: all.length, status,
      })
    }
  }
  const teamOrder = scenario.teams.map(t => t.key)
  const phaseOrder = scenario.phases.map(p => p.key)
  const keysOf = (pick: (r: DecisionRow) => string | null, order: string[]) => {
    const present = new Set(rows.map(pick).filter((k): k is string => !!k))
    return [...order.filter(k => present.has(k)), ...[...present].filter(k => !order.includes(k))]
  }
  return {
    rows,
    byTeam: keysOf(r => r.teamKey, teamOrder).map(k => group(k, rows.filter(r => r.teamKey === k))),
    byPhase: keysOf(r => r.phase, phaseOrder).map(k => group(k, rows.filter(r => r.phase === k))),
  }
}

/** "2 h 05 min", "45 min", "3 d 4 h", "40 s" for a number of minutes (scenario or wall). */
export function durationText(min: number | null | undefined): string {
  if (min === null || min === undefined || !Number.isFinite(min)) return '—'
  const sign = min < 0 ? '−' : ''
  if (Math.abs(min) < 1) return `${sign}${Math.round(Math.abs(min) * 60)} s`
  let m = Math.round(Math.abs(min))
  const d = Math.floor(m / 1440)
  m -= d * 1440
  const h = Math.floor(m / 60)
  m -= h * 60
  if (d) return `${sign}${d} d${h ? ` ${h} h` : ''}`
  if (h) return `${sign}${h} h${m ? ` ${String(m).padStart(2, '0')} min` : ''}`
  return `${sign}${m} min`
}
