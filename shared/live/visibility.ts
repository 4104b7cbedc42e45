/**
 * Who sees what of the event record. One audience per event (stored with it) and one view per
 * reader; `canSee` decides whether a reader gets an event at all and `sanitise` what of its payload.
 * The SQL filter in server/utils/events.ts follows the same rules.
 *
 * Players never see another team's traffic, expected actions, contingency conditions, holds,
 * scores or observations. The wall sees only public traffic: the clock, headline figures of each
 * solution, and injects sent to every team of the scenario (stored with audience `all`).
 */
import type {
  Audience,
  DrillFlag,
  InjectData,
  LiveEvent,
  LiveEventType,
  LiveView,
  SolutionPublishedData,
  StoredEvent,
  WallSolutionData,
} from './types'
import { DRILL_CAUTION, DRILL_MARKING } from '../utils/drill'

export const DRILL: DrillFlag = { marking: DRILL_MARKING, caution: DRILL_CAUTION }

/** The audience of traffic to some teams: `all` when they are every team of the scenario. */
export function teamsAudience(teams: readonly string[], allTeams: readonly string[]): Audience {
  return allTeams.every(t => teams.includes(t)) ? 'all' : `teams:${[...new Set(teams)].sort().join(',')}`
}

/** The team keys of a `teams:` audience (empty for the others). */
export function audienceTeams(audience: Audience): string[] {
  return audience.startsWith('teams:') ? audience.slice(6).split(',') : []
}

const WALL_TYPES: ReadonlySet<LiveEventType> = new Set([
  'clock.changed',
  'solution.published',
  'inject.released',
  'message.sent',
  'inject.revised',
  'zone.drawn',
  'zone.withdrawn',
])

/** Whether a reader with this view may receive an event with this audience (and type, for the wall). */
export function canSee(view: LiveView, audience: Audience, type?: LiveEventType): boolean {
  switch (view.kind) {
    case 'control': return true
    case 'evaluator': return audience !== 'control'
    case 'player': return audience === 'all' || audienceTeams(audience).includes(view.teamKey)
    case 'wall': return audience === 'all' && (type === undefined || WALL_TYPES.has(type))
  }
}

/** The event types the wall may receive. */
export function wallTypes(): LiveEventType[] { return [...WALL_TYPES] }

function forPlayer(data: InjectData): InjectData {
  const { expectedActions: _e, contingency: _c, ...rest } = data
  return rest
}

function forWall(data: InjectData): InjectData {
  const { expectedActions: _e, contingency: _c, decision: _d, attachments: _a, ...rest } = data
  return rest
}

function wallSolution(d: SolutionPublishedData): WallSolutionData {
  return {
    key: d.key,
    label: d.label,
    headline: d.headline,
    corridor: d.solution.corridor,
    impactTime: d.solution.impactTime,
    impactPoints: d.assessment.impactPoints,
    drill: d.drill,
  }
}

/** What one reader receives of a stored event; null when it may not see it at all. */
export function sanitise(event: StoredEvent, view: LiveView): LiveEvent | null {
  if (!canSee(view, event.audience, event.type)) return null
  let data: LiveEvent['data'] = event.data
  const restricted = view.kind === 'player' || view.kind === 'wall'
  if (restricted && (event.type === 'inject.released' || event.type === 'message.sent')) {
    data = view.kind === 'wall' ? forWall(event.data) : forPlayer(event.data)
  }
  if (view.kind === 'wall' && event.type === 'solution.published') data = wallSolution(event.data)
  // The wall shows a zone's outline, kind and name; its note and who drew it stay with the desks.
  if (view.kind === 'wall' && event.type === 'zone.drawn') data = { ...event.data, note: '', by: { id: '', name: '' } }
  if (view.kind === 'wall' && event.type === 'zone.withdrawn') data = { ...event.data, by: { id: '', name: '' } }
  return {
    seq: event.seq, type: event.type, data,
    wallTime: new Date(event.wallTime).toISOString(),
    scenarioTime: new Date(event.scenarioTime).toISOString(),
  } as LiveEvent
}

/** Socket.IO room names of an exercise. */
export const rooms = {
  team: (exerciseId: string, teamKey: string) => `exercise:${exerciseId}:team:${teamKey}`,
  control: (exerciseId: string) => `exercise:${exerciseId}:control`,
  evaluators: (exerciseId: string) => `exercise:${exerciseId}:evaluators`,
  wall: (exerciseId: string) => `exercise:${exerciseId}:wall`,
  wallToken: (tokenId: string) => `wall-token:${tokenId}`,
  /** Every socket of one member in one exercise, whatever their view: dropped when the membership changes. */
  member: (exerciseId: string, userId: string) => `exercise:${exerciseId}:member:${userId}`,
}
