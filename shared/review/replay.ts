/**
 * Replay of a drill from its record: what one room (a team, the control desk, the evaluators or the
 * wall) had received up to a sequence number, folded as its desk folds it (shared/live/fold.ts).
 * The record is read with the control view; each room's share follows shared/live/visibility.ts.
 */
import { foldEvents, type Feed } from '../live/fold'
import { phaseAt } from '../live/schedule'
import { canSee } from '../live/visibility'
import type { LiveEvent, LiveView, StoredEvent } from '../live/types'
import type { Scenario } from '../scenario/schema'

/** The rooms a reviewer can look through: every team, then the control desk, the evaluators and the wall. */
export function replayRooms(scenario: Pick<Scenario, 'teams'>): Array<{ id: string; label: string; view: LiveView }> {
  return [
    ...scenario.teams.map(t => ({ id: `team:${t.key}`, label: t.name, view: { kind: 'player', teamKey: t.key } as LiveView })),
    { id: 'control', label: 'Control desk', view: { kind: 'control' } },
    { id: 'evaluator', label: 'Evaluators', view: { kind: 'evaluator' } },
    { id: 'wall', label: 'Wall view', view: { kind: 'wall' } },
  ]
}

function strip(e: StoredEvent, view: LiveView): LiveEvent['data'] {
  if ((view.kind === 'player' || view.kind === 'wall') && (e.type === 'inject.released' || e.type === 'message.sent')) {
    const { expectedActions: _e, contingency: _c, ...rest } = e.data
    if (view.kind === 'wall') {
      const { decision: _d, attachments: _a, ...wall } = rest
      return wall
    }
    return rest
  }
  return e.data as LiveEvent['data']
}

/** What a room had received up to and including `seq`, as LiveEvents. */
export function roomEvents(events: readonly StoredEvent[], view: LiveView, seq: number): LiveEvent[] {
  return events
    .filter(e => e.seq <= seq && canSee(view, e.audience, e.type))
    .sort((a, b) => a.seq - b.seq)
    .map(e => ({
      seq: e.seq,
      type: e.type,
      data: strip(e, view),
      wallTime: new Date(e.wallTime).toISOString(),
      scenarioTime: new Date(e.scenarioTime).toISOString(),
    }) as LiveEvent)
}

/** A room's desk at `seq`: its feed (injects with the bodies current then, responses, solutions …). */
export function roomFeed(events: readonly StoredEvent[], view: LiveView, seq: number): Feed {
  return foldEvents(roomEvents(events, view, seq))
}

export interface Moment { seq: number; scenarioTime: string | null; wallTime: string | null; phase: string | null; type: string | null }

/** The drill at `seq`: the times of the last event up to it and the phase then. */
export function momentAt(
  events: readonly StoredEvent[],
  scenario: { injects: ReadonlyArray<{ at: string; phase: string }>; phases: ReadonlyArray<{ key: string }> },
  seq: number,
): Moment {
  let last: StoredEvent | null = null
  for (const e of events) if (e.seq <= seq && (!last || e.seq > last.seq)) last = e
  if (!last) return { seq, scenarioTime: null, wallTime: null, phase: scenario.phases[0]?.key ?? null, type: null }
  return {
    seq,
    scenarioTime: new Date(last.scenarioTime).toISOString(),
    wallTime: new Date(last.wallTime).toISOString(),
    phase: phaseAt(scenario as Pick<Scenario, 'injects' | 'phases'>, last.scenarioTime),
    type: last.type,
  }
}

/** The last sequence number at or before a scenario time (0 before the first event). */
export function seqAtScenarioTime(events: readonly StoredEvent[], t: number): number {
  let seq = 0
  for (const e of events) if (e.scenarioTime <= t && e.seq > seq) seq = e.seq
  return seq
}
