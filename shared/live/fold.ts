/**
 * Folds a reader's events (already sanitised for them) into what a desk shows: released injects
 * with their current body and revision history, responses, solutions, scores and observations.
 * The server builds its snapshots with it and the client store derives the same from its feed.
 */
import type { ClockDto, Headline, InjectData, InjectHeldData, LiveEvent, ObservationData, ResponseData, ScoreData, SolutionPublishedData, TeamMessageData, WallSolutionData, ZoneDrawnData } from './types'

interface Stamp { seq: number; scenarioTime: string; wallTime: string }

export interface FeedRevision { revision: number; body: string; solutionKey: string | null; seq: number; scenarioTime: string }
export type FeedResponse = ResponseData & Stamp
export type FeedScore = ScoreData & Stamp
export type FeedObservation = ObservationData & Stamp
export type FeedTeamMessage = TeamMessageData & Stamp
/** A zone as drawn, with when it was withdrawn (if it was). */
export type FeedZone = ZoneDrawnData & Stamp & { withdrawn: (Stamp & { by: string }) | null }

export interface FeedInject extends InjectData {
  releasedSeq: number
  /** Scenario time of the release (ISO). */
  releasedAt: string
  /** Every rendering, the release first; the last is `body`. */
  revisions: FeedRevision[]
  responses: FeedResponse[]
  /** A snapshot's window left out this many earlier answers (the live socket brings them). */
  earlierResponses?: number
}

export interface FeedSolution { key: string; label: string; seq: number; publishedAt: string; headline: Headline }

export interface Feed {
  injects: FeedInject[]
  solutions: FeedSolution[]
  /** The latest published solution: the one injects without a pinned solution show. */
  currentSolution: FeedSolution | null
  clock: ClockDto | null
  responses: FeedResponse[]
  scores: FeedScore[]
  observations: FeedObservation[]
  /** Messages from teams (to control, or to another team through control), oldest first. */
  teamMessages: FeedTeamMessage[]
  /** Protective-action zones, oldest first, withdrawn ones included (marked). */
  zones: FeedZone[]
  held: Array<InjectHeldData & Stamp>
  lastSeq: number
}

export function emptyFeed(): Feed {
  return {
    injects: [],
    solutions: [],
    currentSolution: null,
    clock: null,
    responses: [],
    scores: [],
    observations: [],
    teamMessages: [],
    zones: [],
    held: [],
    lastSeq: 0,
  }
}

/** Folds events (in any order; duplicates by seq are ignored) into a feed. */
export function foldEvents(events: readonly LiveEvent[]): Feed {
  const feed = emptyFeed()
  const byKey = new Map<string, FeedInject>()
  const seen = new Set<number>()
  for (const e of [...events].sort((a, b) => a.seq - b.seq)) {
    if (seen.has(e.seq)) continue
    seen.add(e.seq)
    feed.lastSeq = e.seq
    const stamp: Stamp = { seq: e.seq, scenarioTime: e.scenarioTime, wallTime: e.wallTime }
    switch (e.type) {
      case 'clock.changed':
        feed.clock = e.data.clock
        break
      case 'solution.published': {
        const d = e.data as SolutionPublishedData | WallSolutionData
        const s = { key: d.key, label: d.label, seq: e.seq, publishedAt: e.scenarioTime, headline: d.headline }
        feed.solutions.push(s)
        feed.currentSolution = s
        break
      }
      case 'inject.released':
      case 'message.sent': {
        const d = e.data
        const item: FeedInject = {
          ...d, releasedSeq: e.seq, releasedAt: e.scenarioTime, responses: [],
          revisions: [{ revision: d.revision, body: d.body, solutionKey: d.solutionKey, seq: e.seq, scenarioTime: e.scenarioTime }],
        }
        byKey.set(d.key, item)
        feed.injects.push(item)
        feed.held = feed.held.filter(h => h.key !== d.key)
        break
      }
      case 'inject.revised': {
        const d = e.data
        const item = byKey.get(d.key)
        if (!item) break
        item.revisions.push({ revision: d.revision, body: d.body, solutionKey: d.solutionKey, seq: e.seq, scenarioTime: e.scenarioTime })
        Object.assign(item, { body: d.body, revision: d.revision, solutionKey: d.solutionKey })
        break
      }
      case 'inject.held':
        feed.held.push({ ...e.data, ...stamp })
        break
      case 'response.submitted': {
        const r = { ...e.data, ...stamp }
        feed.responses.push(r)
        byKey.get(r.injectKey)?.responses.push(r)
        break
      }
      case 'score.recorded':
        feed.scores.push({ ...e.data, ...stamp })
        break
      case 'observation.recorded':
        feed.observations.push({ ...e.data, ...stamp })
        break
      case 'team.message':
        feed.teamMessages.push({ ...e.data, ...stamp })
        break
      case 'zone.drawn':
        feed.zones.push({ ...e.data, ...stamp, withdrawn: null })
        break
      case 'zone.withdrawn': {
        const z = feed.zones.find(x => x.id === e.data.id)
        if (z && !z.withdrawn) z.withdrawn = { ...stamp, by: e.data.by.name }
        break
      }
    }
  }
  return feed
}

/** The nominal impact time of the latest published solution a reader has (ISO), null before any. */
export function latestImpactTime(events: readonly LiveEvent[]): string | null {
  const last = events.filter(e => e.type === 'solution.published').at(-1)
  if (last?.type !== 'solution.published') return null
  return 'solution' in last.data ? last.data.solution.impactTime : last.data.impactTime ?? null
}
