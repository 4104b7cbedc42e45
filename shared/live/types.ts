/** Types of the live exercise: the clock, the event record as clients receive it, and its payloads. */
import type { Assessment, Percentiles } from '../hazard/types'
import type { OrbitSolution } from '../hazard/schema'
import type { Decision, Inject } from '../scenario/schema'
import type { ZoneFigures, ZoneKind, ZoneShape } from '../geo/zones'

export type ExerciseStatus = 'planned' | 'running' | 'paused' | 'ended'

/** The stored clock mapping; times in ms since the epoch, factor = scenario ms per wall ms. */
export interface ClockState {
  wallAnchor: number
  scenarioAnchor: number
  factor: number
  paused: boolean
}

/** The clock as the API sends it (ISO times). Derive the scenario time with `scenarioTimeAt`. */
export interface ClockDto {
  status: ExerciseStatus
  paused: boolean
  factor: number
  wallAnchor: string
  scenarioAnchor: string
  scenarioStart: string
  scenarioEnd: string
}

export type ClockActionName = 'start' | 'pause' | 'resume' | 'speed' | 'jump' | 'end'

/**
 * Who may read an event: `all`; `control` (facilitator only); `evaluators` (evaluators, analysts and
 * the facilitator); `teams:<k1>,<k2>` (players of those teams, and all staff).
 */
export type Audience = 'all' | 'control' | 'evaluators' | `teams:${string}`

/** What one reader sees: decides the audience filter and the sanitising of payloads. */
export type LiveView
  = | { kind: 'control' }
    | { kind: 'evaluator' }
    | { kind: 'player'; teamKey: string }
    | { kind: 'wall' }

/** The drill marking and caution that travel with every hazard figure. */
export interface DrillFlag { marking: string; caution: string }

/** Headline figures of an assessment, raw and formatted as inject text formats them. */
export interface Headline {
  impactProbability: number
  torino: number
  palermo: number
  airburstProbability: number
  tsunamiProbability: number
  diameterM: Percentiles
  energyMt: Percentiles
  text: { impactProbability: string; odds: string; torino: string; palermo: string; diameterM: string; energyMt: string }
  /** Energy deposited in the air and reaching the surface, Mt (absent from records of earlier hazard models). */
  airEnergyMt?: Percentiles
  surfaceEnergyMt?: Percentiles
  /** The coastal site with the highest run-up, m: the laws mixed, and each published source law's median when the model gives them. */
  worstRunUp?: { site: string; runUpM: Percentiles; lowLawM?: number; highLawM?: number } | null
  /** The site with the most heat (fireball or airburst flash): thermal exposure, MJ/m², and the chance of second-degree burns. */
  heat?: { site: string; thermalMJM2: Percentiles; burn2: number; source: string } | null
  drill: DrillFlag
}

export interface ClockChangedData {
  action: ClockActionName | 'auto-pause'
  clock: ClockDto
  /** Scenario time before the change (ISO), for jumps. */
  from?: string
}

export interface SolutionPublishedData {
  key: string
  label: string
  releaseAt: string
  manual: boolean
  samples: number
  seed: number
  solution: OrbitSolution
  assessment: Assessment
  headline: Headline
  drill: DrillFlag
}

/** The wall's part of a publication: headline and map, no full assessment. */
export interface WallSolutionData {
  key: string
  label: string
  headline: Headline
  corridor: OrbitSolution['corridor']
  /** Nominal impact time of the solution (ISO), for the wall's countdown. */
  impactTime?: string
  impactPoints: Assessment['impactPoints']
  drill: DrillFlag
}

export interface InjectAttachmentRef { name: string; path: string; id: string | null }

/** A released inject or ad-hoc message; `expectedActions` and `contingency` never reach players. */
export interface InjectData {
  key: string
  adhoc: boolean
  title: string
  kind: string
  phase: string | null
  teams: string[]
  /** Scheduled scenario time (ISO); for messages, when it was sent. */
  at: string
  /** The body with hazard fields filled in from `solutionKey`'s assessment. */
  body: string
  solutionKey: string | null
  revision: number
  manual: boolean
  wasHeld: boolean
  decision?: Decision
  attachments?: InjectAttachmentRef[]
  expectedActions?: string[]
  contingency?: { condition: string }
  drill: DrillFlag
}

export interface InjectRevisedData {
  key: string
  teams: string[]
  revision: number
  body: string
  solutionKey: string | null
  previousSolutionKey: string | null
  drill: DrillFlag
}

export interface InjectHeldData {
  key: string
  title: string
  at: string
  teams: string[]
  /** Held because a jump of the clock passed it with `due: skip` (absent: held by hand). */
  skippedByJump?: boolean
}

export interface PersonRef { id: string; name: string }

export interface ResponseData {
  id: string
  injectKey: string
  teamKey: string
  choice: string | null
  text: string
  /** Submitted after the decision deadline (scenario time). */
  late: boolean
  by: PersonRef
  /** The inject's revision the team answered (its text and figures then); absent in records before it was kept: 0. */
  injectRevision?: number
}

export type Rating = 'P' | 'S' | 'M' | 'U'

export interface ScoreData { id: string; criterionKey: string; taskKey: string; rating: Rating; note: string; by: PersonRef }

/**
 * A message from a team to control (the simulation cell that plays outside agencies, the press, the public), or to
 * another team through control (`to` names it; control passes it on or answers). Its team and control read it.
 */
export interface TeamMessageData {
  id: string
  from: string
  /** `control`, or the key of the team it is meant for (through control). */
  to: string
  body: string
  by: PersonRef
}

/**
 * A protective-action zone a team (or control) drew on its hazard map: evacuate, shelter or keep out. `figures` are
 * worked out on the server when it is drawn, against the solution current then (null before any solution).
 */
export interface ZoneDrawnData {
  id: string
  /** The team that drew it, or `control`. */
  teamKey: string
  kind: ZoneKind
  name: string
  note: string
  shape: ZoneShape
  figures: ZoneFigures | null
  by: PersonRef
}

/** A zone taken back by its team or by control. */
export interface ZoneWithdrawnData { id: string; teamKey: string; name: string; by: PersonRef }

export interface ObservationData { id: string; text: string; injectKey: string | null; teamKey: string | null; by: PersonRef }

/** Payload by event type. */
export interface EventDataMap {
  'clock.changed': ClockChangedData
  'solution.published': SolutionPublishedData
  'inject.released': InjectData
  'message.sent': InjectData
  'inject.revised': InjectRevisedData
  'inject.held': InjectHeldData
  'response.submitted': ResponseData
  'score.recorded': ScoreData
  'observation.recorded': ObservationData
  'team.message': TeamMessageData
  'zone.drawn': ZoneDrawnData
  'zone.withdrawn': ZoneWithdrawnData
}
export type LiveEventType = keyof EventDataMap

/** What a reader receives as an event's data: the wall gets a slimmer solution publication. */
export type ReaderDataMap = Omit<EventDataMap, 'solution.published'> & { 'solution.published': SolutionPublishedData | WallSolutionData }

/**
 * One event as a reader receives it (socket message `event`, GET …/events): a union discriminated
 * by `type`, so that `e.type === 'inject.released'` narrows `e.data` to InjectData.
 */
export type LiveEvent<T extends LiveEventType = LiveEventType> = {
  [K in T]: { seq: number; type: K; wallTime: string; scenarioTime: string; data: ReaderDataMap[K] }
}[T]

/** An event as stored: full payload and its audience; discriminated by `type` like LiveEvent. */
export type StoredEvent<T extends LiveEventType = LiveEventType> = {
  [K in T]: {
    seq: number
    type: K
    wallTime: number
    scenarioTime: number
    actorId: string | null
    audience: Audience
    data: EventDataMap[K]
  }
}[T]

/** Sent on the socket after the replay of missed events: who you are here and the clock now. */
export interface LiveReady {
  exerciseId: string
  view: LiveView['kind']
  teamKey: string | null
  clock: ClockDto
  /** The latest sequence number of the exercise (the replay covered everything up to it). */
  lastSeq: number
  serverTime: number
  /** The epoch of the event record: a page that saw another one (a restore from backup) replays from scratch. */
  epoch: string
}

/** An inject as the live services use it: a scenario inject, or an ad-hoc message's stored definition. */
export type InjectDefinition = Pick<Inject, 'key' | 'at' | 'kind' | 'teams' | 'title' | 'body'>
  & Partial<Pick<Inject, 'solution' | 'decision' | 'expectedActions' | 'contingency' | 'attachments'>>
  & { phase: string | null; adhoc?: boolean }
