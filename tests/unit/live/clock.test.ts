import { describe, expect, it } from 'vitest'
import {
  applyClockAction, clampFactor, clockBounds, clockDto, defaultFactor, displayedScenarioTime, initialClock,
  MAX_FACTOR, scenarioTimeAt, stopAtEnd, wallTimeOf, type ClockAction,
} from '../../../shared/live/clock'
import type { ClockState, ExerciseStatus } from '../../../shared/live/types'

const plan = { scenarioStart: '2031-03-03T21:00:00Z', impactTime: '2031-09-08T04:17:26Z', plannedWallMinutes: 210, aftermathDays: 10 }
const bounds = clockBounds(plan)
const T0 = Date.parse('2026-12-01T10:00:00Z')
const H = 3_600_000

const running = (scenario: string, factor = 100): ClockState => ({
  wallAnchor: T0,
  scenarioAnchor: Date.parse(scenario),
  factor,
  paused: false,
})

function apply(state: ClockState, status: ExerciseStatus, action: ClockAction, now = T0) {
  const r = applyClockAction(state, status, action, now, bounds)
  if (!r.ok) throw new Error(r.message)
  return r
}

describe('scenario time', () => {
  it('runs at factor scenario milliseconds per wall millisecond from the anchors', () => {
    const c = running('2031-04-01T00:00:00Z', 3600)
    expect(scenarioTimeAt(c, T0)).toBe(Date.parse('2031-04-01T00:00:00Z'))
    expect(scenarioTimeAt(c, T0 + 1000)).toBe(Date.parse('2031-04-01T01:00:00Z'))
  })

  it('stands still while paused', () => {
    const c = { ...running('2031-04-01T00:00:00Z', 3600), paused: true }
    expect(scenarioTimeAt(c, T0 + 10 * H)).toBe(Date.parse('2031-04-01T00:00:00Z'))
    expect(wallTimeOf(c, Date.parse('2031-05-01T00:00:00Z'))).toBeNull()
  })

  it('accepts the API\'s ISO anchors and gives the same time', () => {
    const state = running('2031-04-01T00:00:00Z', 3600)
    const dto = clockDto(state, 'running', bounds)
    expect(scenarioTimeAt(dto, T0 + 12_345)).toBe(scenarioTimeAt(state, T0 + 12_345))
  })

  it('inverts: the wall time at which a running clock reaches a scenario time', () => {
    const c = running('2031-04-01T00:00:00Z', 3600)
    const target = Date.parse('2031-04-01T06:00:00Z')
    expect(wallTimeOf(c, target)).toBe(T0 + 6000)
    expect(scenarioTimeAt(c, wallTimeOf(c, target)!)).toBe(target)
  })

  it('displays no time beyond the end of the scenario', () => {
    const dto = clockDto(running('2031-09-18T00:00:00Z', 1e6), 'running', bounds)
    expect(displayedScenarioTime(dto, T0 + 10 * H)).toBe(bounds.end)
  })
})

describe('default factor', () => {
  it('plays scenario start to impact plus the aftermath in the planned wall minutes', () => {
    const span = Date.parse('2031-09-18T04:17:26Z') - Date.parse('2031-03-03T21:00:00Z')
    expect(defaultFactor(plan)).toBeCloseTo(span / (210 * 60_000), 6)
  })

  it('uses the 14-day default aftermath when the plan gives none', () => {
    const { aftermathDays: _, ...rest } = plan
    expect(clockBounds(rest).end - Date.parse(plan.impactTime)).toBe(14 * 24 * H)
  })

  it('is clamped to real time and to the maximum', () => {
    expect(clampFactor(0.2)).toBe(1)
    expect(clampFactor(1e12)).toBe(MAX_FACTOR)
    expect(defaultFactor({
      scenarioStart: '2031-01-01T00:00:00Z',
      impactTime: '2031-01-01T00:05:00Z',
      plannedWallMinutes: 600,
      aftermathDays: 0,
    })).toBe(1)
  })

  it('starts paused at the scenario start', () => {
    const c = initialClock(plan, T0)
    expect(c.paused).toBe(true)
    expect(scenarioTimeAt(c, T0 + H)).toBe(bounds.start)
  })
})

describe('clock actions', () => {
  const planned = initialClock(plan, T0 - H)

  it('start: from the scenario start, running, with the given or default factor', () => {
    const r = apply(planned, 'planned', { action: 'start' })
    expect(r.status).toBe('running')
    expect(r.state).toEqual({ wallAnchor: T0, scenarioAnchor: bounds.start, factor: defaultFactor(plan), paused: false })
    expect(apply(planned, 'planned', { action: 'start', factor: 42 }).state.factor).toBe(42)
  })

  it('pause then resume: the scenario time does not move while paused', () => {
    const c = running('2031-04-01T00:00:00Z', 3600)
    const paused = apply(c, 'running', { action: 'pause' }, T0 + 1000)
    expect(paused.status).toBe('paused')
    expect(scenarioTimeAt(paused.state, T0 + 50_000)).toBe(Date.parse('2031-04-01T01:00:00Z'))
    const resumed = apply(paused.state, 'paused', { action: 'resume' }, T0 + 60_000)
    expect(resumed.status).toBe('running')
    expect(scenarioTimeAt(resumed.state, T0 + 61_000)).toBe(Date.parse('2031-04-01T02:00:00Z'))
  })

  it('speed: re-anchors so the time is continuous across the change', () => {
    const c = running('2031-04-01T00:00:00Z', 3600)
    const r = apply(c, 'running', { action: 'speed', factor: 7200 }, T0 + 1000)
    expect(scenarioTimeAt(r.state, T0 + 1000)).toBe(Date.parse('2031-04-01T01:00:00Z'))
    expect(scenarioTimeAt(r.state, T0 + 2000)).toBe(Date.parse('2031-04-01T03:00:00Z'))
    expect(apply(planned, 'planned', { action: 'speed', factor: 5 }).status).toBe('planned')
  })

  it('jump: forward only, within the scenario', () => {
    const c = running('2031-04-01T00:00:00Z', 3600)
    const to = Date.parse('2031-05-01T00:00:00Z')
    const r = apply(c, 'running', { action: 'jump', to }, T0 + 1000)
    expect(r.from).toBe(Date.parse('2031-04-01T01:00:00Z'))
    expect(scenarioTimeAt(r.state, T0 + 1000)).toBe(to)
    expect(scenarioTimeAt(r.state, T0 + 2000)).toBe(to + H)
    expect(applyClockAction(
      c,
      'running',
      { action: 'jump', to: Date.parse('2031-03-20T00:00:00Z') },
      T0,
      bounds,
    )).toMatchObject({ ok: false, code: 409, path: 'to' })
    expect(applyClockAction(
      c,
      'running',
      { action: 'jump', to: bounds.end + 1 },
      T0,
      bounds,
    )).toMatchObject({ ok: false, code: 400, path: 'to' })
  })

  it('end: stops the clock for good', () => {
    const r = apply(running('2031-04-01T00:00:00Z', 3600), 'running', { action: 'end' }, T0 + 1000)
    expect(r.status).toBe('ended')
    expect(r.state.paused).toBe(true)
    expect(scenarioTimeAt(r.state, T0 + 10 * H)).toBe(Date.parse('2031-04-01T01:00:00Z'))
  })

  const refusals: Array<[ExerciseStatus, ClockAction['action']]> = [
    ['planned', 'pause'], ['planned', 'resume'], ['planned', 'jump'], ['planned', 'end'],
    ['running', 'start'], ['running', 'resume'], ['paused', 'start'], ['paused', 'pause'],
    ['ended', 'start'], ['ended', 'resume'], ['ended', 'speed'], ['ended', 'jump'], ['ended', 'end'],
  ]
  for (const [status, action] of refusals) {
    it(`refuses ${action} on a ${status} exercise (409)`, () => {
      const a = (action === 'jump' ? { action, to: bounds.end } : action === 'speed' ? { action, factor: 2 } : { action }) as ClockAction
      expect(applyClockAction(planned, status, a, T0, bounds)).toMatchObject({ ok: false, code: 409 })
    })
  }
})

describe('the end of the scenario', () => {
  it('stops a running clock that passed the end, at the end', () => {
    const c = running('2031-09-18T00:00:00Z', 1e6)
    const stopped = stopAtEnd(c, T0 + 60_000, bounds)!
    expect(stopped.paused).toBe(true)
    expect(scenarioTimeAt(stopped, T0 + H)).toBe(bounds.end)
    expect(stopAtEnd(running('2031-04-01T00:00:00Z'), T0, bounds)).toBeNull()
  })
})
