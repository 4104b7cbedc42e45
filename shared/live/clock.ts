/**
 * Clock math of a live exercise, shared by the server (which owns the clock) and clients (which
 * derive the displayed time from it). Scenario time = scenarioAnchor + (wall − wallAnchor) × factor,
 * or scenarioAnchor while paused. All times in ms since the epoch.
 */
import { scenarioEndTime } from '../scenario/checks'
import type { ScenarioClock } from '../scenario/schema'
import type { ClockActionName, ClockDto, ClockState, ExerciseStatus } from './types'

/** Real time. */
export const MIN_FACTOR = 1
/** About 116 scenario days per wall second. */
export const MAX_FACTOR = 10_000_000

/** The scenario window the clock may move in: scenario start to impact plus the aftermath. */
export interface ClockBounds { start: number; end: number }

export type ClockAction
  = | { action: 'start'; factor?: number }
    | { action: 'pause' }
    | { action: 'resume' }
    | { action: 'speed'; factor: number }
    | { action: 'jump'; to: number }
    | { action: 'end' }

export type ClockResult
  = | { ok: true; state: ClockState; status: ExerciseStatus; from: number }
    | { ok: false; code: 400 | 409; message: string; path?: string }

type ClockLike = Pick<ClockState, 'factor' | 'paused'> & { wallAnchor: number | string; scenarioAnchor: number | string }

const ms = (t: number | string) => (typeof t === 'number' ? t : Date.parse(t))

/** Scenario time (ms) at wall time `wallMs` (ms), for a stored clock or one received from the API. */
export function scenarioTimeAt(clock: ClockLike, wallMs: number): number {
  const anchor = ms(clock.scenarioAnchor)
  return clock.paused ? anchor : anchor + (wallMs - ms(clock.wallAnchor)) * clock.factor
}

/** Wall time (ms) at which a running clock reaches `scenarioMs`; null while paused. */
export function wallTimeOf(clock: ClockLike, scenarioMs: number): number | null {
  if (clock.paused) return null
  return ms(clock.wallAnchor) + (scenarioMs - ms(clock.scenarioAnchor)) / clock.factor
}

/** The scenario window of a scenario's clock plan. */
export function clockBounds(plan: ScenarioClock): ClockBounds {
  return { start: Date.parse(plan.scenarioStart), end: Date.parse(scenarioEndTime({ clock: plan })) }
}

/**
 * The default compression: the whole scenario (start to impact plus its aftermath allowance) played
 * in the planned wall minutes, clamped to MIN_FACTOR…MAX_FACTOR.
 */
export function defaultFactor(plan: ScenarioClock): number {
  const { start, end } = clockBounds(plan)
  return clampFactor((end - start) / (plan.plannedWallMinutes * 60_000))
}

export function clampFactor(factor: number): number {
  return Math.min(MAX_FACTOR, Math.max(MIN_FACTOR, factor))
}

/** The clock of an exercise not yet started: paused at the scenario start, default factor. */
export function initialClock(plan: ScenarioClock, now: number): ClockState {
  return { wallAnchor: now, scenarioAnchor: clockBounds(plan).start, factor: defaultFactor(plan), paused: true }
}

/** Re-anchors at `now` without changing the scenario time. */
function rebase(state: ClockState, now: number): ClockState {
  return { ...state, wallAnchor: now, scenarioAnchor: scenarioTimeAt(state, now) }
}

const refuse = (
  message: string,
  code: 400 | 409 = 409,
  path?: string,
): ClockResult => ({ ok: false, code, message, ...(path ? { path } : {}) })

const ALLOWED: Record<ClockActionName, readonly ExerciseStatus[]> = {
  start: ['planned'],
  pause: ['running'],
  resume: ['paused'],
  speed: ['planned', 'running', 'paused'],
  jump: ['running', 'paused'],
  end: ['running', 'paused'],
}

/**
 * Applies a facilitator's clock action at wall time `now`. The clock only moves forward, within
 * `bounds`; start needs a planned exercise, pause a running one, resume a paused one.
 */
export function applyClockAction(
  state: ClockState,
  status: ExerciseStatus,
  action: ClockAction,
  now: number,
  bounds: ClockBounds,
): ClockResult {
  if (!ALLOWED[action.action].includes(status)) return refuse(`Cannot ${action.action} the clock of a ${status} exercise.`)
  const from = Math.min(scenarioTimeAt(state, now), bounds.end)
  switch (action.action) {
    case 'start':
      return {
        ok: true,
        from,
        status: 'running',
        state: { wallAnchor: now, scenarioAnchor: bounds.start, factor: action.factor ?? state.factor, paused: false },
      }
    case 'pause':
      return { ok: true, from, status: 'paused', state: { ...rebase(state, now), scenarioAnchor: from, paused: true } }
    case 'resume':
      return { ok: true, from, status: 'running', state: { ...state, wallAnchor: now, paused: false } }
    case 'speed':
      return { ok: true, from, status, state: { ...rebase(state, now), factor: action.factor } }
    case 'jump':
      if (!(action.to > from)) return refuse('The clock only moves forward: jump to a later scenario time.', 409, 'to')
      if (action.to > bounds.end) return refuse('That is after the end of the scenario.', 400, 'to')
      return { ok: true, from, status, state: { ...state, wallAnchor: now, scenarioAnchor: action.to } }
    case 'end':
      return { ok: true, from, status: 'ended', state: { ...rebase(state, now), scenarioAnchor: from, paused: true } }
  }
}

/** A running clock that has passed the end of the scenario, paused at the end; null when it has not. */
export function stopAtEnd(state: ClockState, now: number, bounds: ClockBounds): ClockState | null {
  if (state.paused || scenarioTimeAt(state, now) < bounds.end) return null
  return { ...state, wallAnchor: now, scenarioAnchor: bounds.end, paused: true }
}

/** The clock as the API sends it. */
export function clockDto(state: ClockState, status: ExerciseStatus, bounds: ClockBounds): ClockDto {
  return {
    status, paused: state.paused, factor: state.factor,
    wallAnchor: new Date(state.wallAnchor).toISOString(),
    scenarioAnchor: new Date(state.scenarioAnchor).toISOString(),
    scenarioStart: new Date(bounds.start).toISOString(),
    scenarioEnd: new Date(bounds.end).toISOString(),
  }
}

/** Scenario time at `wallMs` for a clock from the API, held within the scenario window. */
export function displayedScenarioTime(clock: ClockDto, wallMs: number): number {
  return Math.min(scenarioTimeAt(clock, wallMs), Date.parse(clock.scenarioEnd))
}
