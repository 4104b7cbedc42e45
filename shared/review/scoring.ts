/**
 * The scoring summary of a drill: each evaluator's latest P/S/M/U rating of every critical task,
 * grouped by objective and capability with the observations that bear on them; agreement between
 * every two evaluators who rated the same tasks (Cohen's kappa, see agreement.ts) and the tasks
 * they rated differently, for the hotwash.
 */
import type { PersonRef, Rating, StoredEvent } from '../live/types'
import type { Scenario } from '../scenario/schema'
import { cohenKappa, type KappaResult } from './agreement'
import { RATINGS } from './plan'

export type RatingCounts = Record<Rating, number>

export interface RatingEntry {
  by: PersonRef
  rating: Rating
  note: string
  seq: number
  scenarioTime: string
  wallTime: string
  /** Earlier ratings of the same task by the same evaluator, replaced by this one. */
  replaced: number
}
export interface ObservationEntry {
  id: string
  seq: number
  scenarioTime: string
  wallTime: string
  text: string
  injectKey: string | null
  teamKey: string | null
  by: PersonRef
}
export interface TaskScore { key: string; text: string; ratings: RatingEntry[]; summary: Rating | null; disagreement: boolean }
export interface CriterionScore { key: string; capability: string; injects: string[]; tasks: TaskScore[] }
export interface CapabilityScore {
  name: string
  criteria: CriterionScore[]
  counts: RatingCounts
  summary: Rating | null
  observations: ObservationEntry[]
}
export interface ObjectiveScore {
  key: string
  title: string
  capabilities: CapabilityScore[]
  counts: RatingCounts
  summary: Rating | null
}
export interface AgreementPair extends KappaResult { a: PersonRef; b: PersonRef }
export interface Disagreement {
  objectiveKey: string
  capability: string
  criterionKey: string
  taskKey: string
  taskText: string
  ratings: RatingEntry[]
}

export interface ScoringSummary {
  objectives: ObjectiveScore[]
  evaluators: PersonRef[]
  counts: RatingCounts
  /** One entry per two evaluators with at least one task rated by both. */
  agreement: AgreementPair[]
  disagreements: Disagreement[]
  observations: ObservationEntry[]
}

const zero = (): RatingCounts => ({ P: 0, S: 0, M: 0, U: 0 })
const iso = (ms: number) => new Date(ms).toISOString()

/** The most frequent rating; a tie goes to the lower rating (the more cautious reading). */
export function summaryRating(counts: RatingCounts): Rating | null {
  let best: Rating | null = null
  for (const r of RATINGS) if (counts[r] > 0 && (best === null || counts[r] >= counts[best])) best = r
  return best
}

function add(into: RatingCounts, from: RatingCounts) {
  for (const r of RATINGS) into[r] += from[r]
}

/** The latest rating of each evaluator for each task, keyed `criterion/task`, then by evaluator id. */
function latestRatings(events: readonly StoredEvent[]): Map<string, Map<string, RatingEntry>> {
  const out = new Map<string, Map<string, RatingEntry>>()
  for (const e of [...events].sort((a, b) => a.seq - b.seq)) {
    if (e.type !== 'score.recorded') continue
    const d = e.data
    const k = `${d.criterionKey}/${d.taskKey}`
    const byEvaluator = out.get(k) ?? new Map<string, RatingEntry>()
    const before = byEvaluator.get(d.by.id)
    byEvaluator.set(
      d.by.id,
      {
        by: d.by,
        rating: d.rating,
        note: d.note,
        seq: e.seq,
        scenarioTime: iso(e.scenarioTime),
        wallTime: iso(e.wallTime),
        replaced: before ? before.replaced + 1 : 0,
      },
    )
    out.set(k, byEvaluator)
  }
  return out
}

function agreementPairs(latest: Map<string, Map<string, RatingEntry>>, evaluators: PersonRef[]): AgreementPair[] {
  const pairs: AgreementPair[] = []
  for (let i = 0; i < evaluators.length; i++) {
    for (let j = i + 1; j < evaluators.length; j++) {
      const a = evaluators[i]!, b = evaluators[j]!
      const both: Array<[Rating, Rating]> = []
      for (const byEvaluator of latest.values()) {
        const ra = byEvaluator.get(a.id), rb = byEvaluator.get(b.id)
        if (ra && rb) both.push([ra.rating, rb.rating])
      }
      if (both.length) pairs.push({ a, b, ...cohenKappa(both, RATINGS) })
    }
  }
  return pairs
}

/** The scoring summary of a record (events in any order; scores and observations are read, the rest ignored). */
export function scoringSummary(events: readonly StoredEvent[], scenario: Pick<Scenario, 'objectives' | 'criteria'>): ScoringSummary {
  const latest = latestRatings(events)
  const observations: ObservationEntry[] = events.filter(e => e.type === 'observation.recorded').sort((a, b) => a.seq - b.seq).map((e) => {
    const d = e.data
    return {
      id: d.id,
      seq: e.seq,
      scenarioTime: iso(e.scenarioTime),
      wallTime: iso(e.wallTime),
      text: d.text,
      injectKey: d.injectKey,
      teamKey: d.teamKey,
      by: d.by,
    }
  })
  const evaluatorMap = new Map<string, PersonRef>()
  for (const byEvaluator of latest.values()) for (const r of byEvaluator.values()) evaluatorMap.set(r.by.id, r.by)
  const evaluators = [...evaluatorMap.values()].sort((a, b) => a.name.localeCompare(b.name) || a.id.localeCompare(b.id))
  const disagreements: Disagreement[] = []
  const total = zero()

  const objectives = scenario.objectives.map((o) => {
    const criteria = scenario.criteria.filter(c => c.objective === o.key)
    const names = [...o.capabilities, ...criteria.map(c => c.capability).filter(c => !o.capabilities.includes(c))]
    const objectiveCounts = zero()
    const capabilities = [...new Set(names)].map((name) => {
      const counts = zero()
      const own = criteria.filter(c => c.capability === name).map((c) => {
        const tasks = c.tasks.map((t) => {
          const ratings = [...(latest.get(`${c.key}/${t.key}`)?.values() ?? [])].sort((a, b) => a.seq - b.seq)
          const taskCounts = zero()
          for (const r of ratings) taskCounts[r.rating]++
          add(counts, taskCounts)
          const disagreement = new Set(ratings.map(r => r.rating)).size > 1
          if (disagreement) disagreements.push({
            objectiveKey: o.key,
            capability: name,
            criterionKey: c.key,
            taskKey: t.key,
            taskText: t.text,
            ratings,
          })
          return { key: t.key, text: t.text, ratings, summary: summaryRating(taskCounts), disagreement }
        })
        return { key: c.key, capability: c.capability, injects: c.injects, tasks }
      })
      const injects = new Set(own.flatMap(c => c.injects))
      add(objectiveCounts, counts)
      return {
        name,
        criteria: own,
        counts,
        summary: summaryRating(counts),
        observations: observations.filter(x => x.injectKey && injects.has(x.injectKey)),
      }
    })
    add(total, objectiveCounts)
    return { key: o.key, title: o.title, capabilities, counts: objectiveCounts, summary: summaryRating(objectiveCounts) }
  })
  return { objectives, evaluators, counts: total, agreement: agreementPairs(latest, evaluators), disagreements, observations }
}
