/** The exercise timeline as rows: one per event of the record, for the exports and the review desk. */
import type { StoredEvent } from '../live/types'
import type { Scenario } from '../scenario/schema'
import { localIsoText } from '../utils/zone'
import { zoneFiguresText, zoneKindLabel, zoneShapeText } from '../geo/zones'
import { THRESHOLDS, type ThresholdKey } from '../hazard/types'

const thresholdLabel = (k: ThresholdKey) => THRESHOLDS.find(t => t.key === k)?.label ?? k

export interface TimelineRow {
  seq: number
  wallTime: string
  scenarioTime: string
  /** Scenario time on the scenario's coast (its clock.timeZone), with the offset. */
  scenarioLocal: string
  type: string
  actor: string
  teams: string
  phase: string
  injectKey: string
  summary: string
  detail: string
}

export const TIMELINE_COLUMNS: Array<{ key: keyof TimelineRow; label: string }> = [
  { key: 'seq', label: 'Seq' },
  { key: 'wallTime', label: 'Wall time (UTC)' },
  { key: 'scenarioTime', label: 'Scenario time (UTC)' },
  { key: 'scenarioLocal', label: 'Scenario time (local)' },
  { key: 'type', label: 'Event' },
  { key: 'actor', label: 'By' },
  { key: 'teams', label: 'Teams' },
  { key: 'phase', label: 'Phase' },
  { key: 'injectKey', label: 'Inject' },
  { key: 'summary', label: 'Summary' },
  { key: 'detail', label: 'Detail' },
]

const pct = (p: number) => `${(p * 100).toFixed(p < 0.01 ? 3 : 1)} %`

function describe(e: StoredEvent, scenario: Scenario | null): Pick<TimelineRow, 'teams' | 'phase' | 'injectKey' | 'summary' | 'detail'> {
  const teamName = (k: string) => scenario?.teams.find(t => t.key === k)?.name ?? k
  const none = { teams: '', phase: '', injectKey: '', summary: '', detail: '' }
  switch (e.type) {
    case 'clock.changed': {
      const d = e.data
      return {
        ...none,
        summary: `Clock: ${d.action}${d.clock.paused ? ' (paused)' : ''}`,
        detail: `speed ×${Math.round(d.clock.factor)}${d.from ? `; from ${d.from}` : ''}`,
      }
    }
    case 'solution.published': {
      const d = e.data
      return {
        ...none,
        summary: `Orbit solution published: ${d.label}`,
        detail: `impact probability ${pct(d.headline.impactProbability)}; energy ${d.headline.text.energyMt}; Torino ${d.headline.torino}; ${d.manual ? 'by hand' : 'on schedule'}`,
      }
    }
    case 'inject.released':
    case 'message.sent': {
      const d = e.data
      return {
        teams: d.teams.map(teamName).join('; '), phase: d.phase ?? '', injectKey: d.key,
        summary: `${d.adhoc ? 'Message' : 'Inject released'}: ${d.title}`,
        detail: [
          d.kind,
          d.manual ? 'by hand' : 'on schedule',
          d.decision ? `decision due ${d.decision.deadline}` : '',
        ].filter(Boolean).join('; '),
      }
    }
    case 'inject.revised': {
      const d = e.data
      return {
        ...none,
        teams: d.teams.map(teamName).join('; '),
        injectKey: d.key,
        summary: `Figures revised (revision ${d.revision})`,
        detail: `from solution ${d.previousSolutionKey ?? '—'} to ${d.solutionKey ?? '—'}`,
      }
    }
    case 'inject.held': {
      const d = e.data
      return { ...none, teams: d.teams.map(teamName).join('; '), injectKey: d.key, summary: `Inject held: ${d.title}` }
    }
    case 'response.submitted': {
      const d = e.data
      return {
        ...none,
        teams: teamName(d.teamKey),
        injectKey: d.injectKey,
        summary: `Response${d.choice ? `: ${d.choice}` : ''}${d.late ? ' (late)' : ''}`,
        detail: d.text,
      }
    }
    case 'score.recorded': {
      const d = e.data
      return { ...none, summary: `Rating ${d.rating}: ${d.criterionKey} / ${d.taskKey}`, detail: d.note }
    }
    case 'team.message': {
      const d = e.data
      const to = d.to === 'control' ? 'control' : `${teamName(d.to)} (through control)`
      return { ...none, teams: teamName(d.from), summary: `Message from ${teamName(d.from)} to ${to}`, detail: d.body }
    }
    case 'zone.drawn': {
      const d = e.data
      const who = d.teamKey === 'control' ? 'control' : teamName(d.teamKey)
      return {
        ...none, teams: d.teamKey === 'control' ? '' : teamName(d.teamKey),
        summary: `Zone drawn by ${who}: ${zoneKindLabel(d.kind)} — ${d.name}`,
        detail: [zoneShapeText(d.shape), d.figures ? zoneFiguresText(d.figures, thresholdLabel) : '', d.note].filter(Boolean).join('. '),
      }
    }
    case 'zone.withdrawn': {
      const d = e.data
      return { ...none, teams: d.teamKey === 'control' ? '' : teamName(d.teamKey), summary: `Zone withdrawn: ${d.name}` }
    }
    case 'observation.recorded': {
      const d = e.data
      return { ...none, teams: d.teamKey ? teamName(d.teamKey) : '', injectKey: d.injectKey ?? '', summary: 'Observation', detail: d.text }
    }
    default:
      return { ...none, summary: (e as StoredEvent).type }
  }
}

/** One row per event, in sequence order. `actors` maps user ids to names. */
export function timelineRows(events: StoredEvent[], actors: Map<string, string>, scenario: Scenario | null): TimelineRow[] {
  return [...events].sort((a, b) => a.seq - b.seq).map(e => ({
    seq: e.seq,
    wallTime: new Date(e.wallTime).toISOString(),
    scenarioTime: new Date(e.scenarioTime).toISOString(),
    scenarioLocal: localIsoText(e.scenarioTime, scenario?.clock.timeZone ?? 'UTC'),
    type: e.type,
    actor: e.actorId ? (actors.get(e.actorId) ?? 'former member') : 'Brinkwater (scheduler)',
    ...describe(e, scenario),
  }))
}
