import { threatSummary, type ThreatSummary } from '#shared/geo'
import { zoneFigures, zoneFiguresText, zoneKindLabel, zoneShapeText } from '#shared/geo/zones'
import { THRESHOLDS, type ThresholdKey } from '#shared/hazard/types'
import { foldEvents } from '#shared/live/fold'
import type { LiveEvent, SolutionPublishedData, StoredEvent } from '#shared/live/types'
import { decisionSummary } from '#shared/review/decisions'
import { scoringSummary } from '#shared/review/scoring'
import { timelineRows } from '#shared/review/timeline'
import type { Scenario } from '#shared/scenario/schema'
import { DRILL_CAUTION, DRILL_MARKING } from '#shared/utils/drill'
import { ROLE_LABELS, EXERCISE_ROLES } from '#shared/utils/roles'
import { reviewFeedback } from '../feedback'
import { hotwashNotes } from '../notes'
import { listFindings, listImprovements } from '../plan'
import { drillDates, exerciseMembers, reviewRecord } from '../review'
import { finalMapSvg, type MapSource } from './map'

/**
 * Events the condensed timeline keeps: the clock, publications, releases, messages and holds (responses, scores and
 * observations have their own sections).
 */
const CONDENSED = new Set(['clock.changed', 'solution.published', 'inject.released', 'message.sent', 'inject.held', 'zone.drawn', 'zone.withdrawn'])

/**
 * The protective-action zones of the drill in the order drawn: who drew them and when, their shape and note, their
 * figures when drawn and against the last published solution, and when they were withdrawn.
 */
function zonesOf(events: readonly StoredEvent[], scenario: Scenario, last: SolutionPublishedData | null) {
  const iso = (ms: number) => new Date(ms).toISOString()
  const feed = foldEvents(events.map(e => ({ ...e, wallTime: iso(e.wallTime), scenarioTime: iso(e.scenarioTime) })) as LiveEvent[])
  const team = (k: string) => (k === 'control' ? 'Control' : scenario.teams.find(t => t.key === k)?.name ?? k)
  const label = (k: ThresholdKey) => THRESHOLDS.find(t => t.key === k)?.label ?? k
  return feed.zones.map(z => ({
    id: z.id, name: z.name, kind: zoneKindLabel(z.kind), kindKey: z.kind, shapeGeo: z.shape, team: team(z.teamKey), by: z.by.name,
    drawnAt: z.scenarioTime,
    withdrawnAt: z.withdrawn?.scenarioTime ?? null, shape: zoneShapeText(z.shape), note: z.note,
    whenDrawn: z.figures ? zoneFiguresText(z.figures, label) : 'Drawn before any orbit solution was published.',
    atEnd: last && (!z.figures || z.figures.solutionKey !== last.key)
      ? zoneFiguresText(zoneFigures(z.shape, last.key, last.assessment, scenario.sites), label)
      : null,
  }))
}

function threat(events: readonly StoredEvent[]) {
  return events.filter(e => e.type === 'solution.published').map((e) => {
    const d = e.data as SolutionPublishedData
    const h = d.headline
    return {
      key: d.key, label: d.label, seq: e.seq, publishedAt: new Date(e.scenarioTime).toISOString(), impactTime: d.solution.impactTime,
      impactProbability: h.impactProbability, probabilityText: h.text.impactProbability, odds: h.text.odds, torino: h.torino,
      palermo: h.text.palermo, energyText: h.text.energyMt, diameterText: h.text.diameterM,
      tsunamiProbability: h.tsunamiProbability, airburstProbability: h.airburstProbability,
    }
  })
}

/** The last published solution's hazard in words (energies, tsunami band with its laws, heat); null before any. */
function finalHazard(published: readonly SolutionPublishedData[]): ThreatSummary | null {
  const last = published.at(-1)
  return last ? threatSummary(last.assessment, last.label) : null
}

function participants(exerciseId: string, scenario: Scenario) {
  const members = exerciseMembers(exerciseId)
  const groups: Array<{ role: string; roleLabel: string; teamKey: string | null; teamName: string | null; people: string[] }> = []
  for (const role of EXERCISE_ROLES) {
    const teams = role === 'player' ? scenario.teams.map(t => t.key) : [null]
    for (const teamKey of teams) {
      const people = members.filter(m => m.role === role && (role !== 'player' || m.teamKey === teamKey)).map(m => m.name)
      const teamName = scenario.teams.find(t => t.key === teamKey)?.name ?? null
      if (people.length) groups.push({ role, roleLabel: ROLE_LABELS[role], teamKey, teamName, people })
    }
  }
  return { groups, total: members.length }
}

/**
 * Everything the after-action report shows, read from the record and the review tables, without the map;
 * `mapSource` is what the map is drawn from (the PDF's worker thread draws it).
 */
export function reportParts(exerciseId: string) {
  const { exercise, events, scenarioNow } = reviewRecord(exerciseId)
  const { scenario } = exercise
  const actors = new Map(exerciseMembers(exerciseId).map(m => [m.userId, m.name]))
  const published = events.filter(e => e.type === 'solution.published').map(e => e.data as SolutionPublishedData)
  const data = {
    drill: { marking: DRILL_MARKING, caution: DRILL_CAUTION },
    generatedAt: new Date().toISOString(),
    exercise: {
      id: exercise.id, title: exercise.title, description: exercise.description, status: exercise.status,
      createdAt: exercise.createdAt.toISOString(), ...drillDates(events),
    },
    scenario: {
      key: scenario.key, title: scenario.title, summary: scenario.summary, clock: scenario.clock,
      objectives: scenario.objectives, teams: scenario.teams, phases: scenario.phases,
      injectCount: scenario.injects.length, solutionCount: scenario.solutions.length,
    },
    participants: participants(exerciseId, scenario),
    threat: threat(events),
    hazard: finalHazard(published),
    map: null as string | null,
    timeline: timelineRows(events.filter(e => CONDENSED.has(e.type)), actors, scenario)
      .map(r => ({ seq: r.seq, wallTime: r.wallTime, scenarioTime: r.scenarioTime, summary: r.summary, teams: r.teams })),
    eventCount: events.length,
    decisions: decisionSummary(events, scenario, scenarioNow),
    zones: zonesOf(events, scenario, published.at(-1) ?? null),
    scoring: scoringSummary(events, scenario),
    findings: listFindings(exerciseId),
    improvements: listImprovements(exerciseId),
    feedback: reviewFeedback(exerciseId).summary,
    hotwash: hotwashNotes(exerciseId),
  }
  const mapSource: MapSource = {
    sites: scenario.sites,
    published: published.map(p => ({ solution: p.solution, assessment: p.assessment })),
    zones: data.zones.filter(z => !z.withdrawnAt).map(z => ({ kind: z.kindKey, name: z.name, shape: z.shapeGeo })),
  }
  return { data, mapSource }
}
export type ReportData = ReturnType<typeof reportParts>['data']

/**
 * Everything the after-action report shows, read from the record and the review tables: the PDF and
 * the printable page are both drawn from it. `map: true` adds the corridor map as SVG.
 */
export async function reportData(exerciseId: string, opts: { map?: boolean; mapFont?: string } = {}): Promise<ReportData> {
  const { data, mapSource } = reportParts(exerciseId)
  return { ...data, map: opts.map ? await finalMapSvg(mapSource, { fontFamily: opts.mapFont }) : null }
}
