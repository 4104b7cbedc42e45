import { nextFreeKey } from '#shared/utils/keys'
import type { Criterion, Inject, Objective, Phase, Scenario, SolutionEntry, Team } from '~~/shared/scenario'
import { currentSolutionAt } from '~~/shared/scenario'
import type { Site } from '~~/shared/hazard/schema'

const PALETTE = ['#0b73a0', '#d25d08', '#1f876b', '#6b4a9b', '#c22f45', '#40566b']

export function blankTeam(doc: Scenario): Team {
  return { key: nextFreeKey('team', doc.teams.map(t => t.key)), name: 'New team', colour: PALETTE[doc.teams.length % PALETTE.length]! }
}

export function blankPhase(doc: Scenario): Phase {
  return { key: nextFreeKey('phase', doc.phases.map(p => p.key)), title: 'New phase' }
}

export function blankObjective(doc: Scenario): Objective {
  return {
    key: nextFreeKey('objective', doc.objectives.map(o => o.key)),
    title: 'New objective',
    description: 'What the teams should achieve.',
    capabilities: ['Operational Coordination'],
  }
}

export function blankSite(doc: Scenario): Site {
  return { id: nextFreeKey('site', doc.sites.map(s => s.id)), name: 'New site', lon: 0, lat: 0, population: 0 }
}

/** A new solution: a copy of the last one released a day later, or a plain starting point. */
export function blankSolution(doc: Scenario): SolutionEntry {
  const key = nextFreeKey('solution', doc.solutions.map(s => s.key))
  const last = doc.solutions.at(-1)
  if (last) {
    const releaseAt = new Date(Date.parse(last.releaseAt) + 86_400_000).toISOString().replace('.000Z', 'Z')
    return { key, label: `${last.label} (revised)`, releaseAt, solution: structuredClone(toRaw(last.solution)) }
  }
  const start = doc.clock.scenarioStart
  return {
    key, label: 'First orbit solution', releaseAt: start,
    solution: {
      epoch: start, impactTime: doc.clock.impactTime, impactProbability: 0.001,
      magnitude: { H: 22, sigma: 0.5 }, taxonomicClass: 'unknown', entrySpeedKmS: { mean: 18, sigma: 1 },
      corridor: { path: [[-20, 35], [-10, 40]], halfWidthKm: 300, nominal: [-15, 37.5], alongTrackSigmaKm: 1000 },
      waterDepthM: 4000,
    },
  }
}

/** A new inject at `at` (default: the scenario start), to the first team, in the phase of its time. */
export function blankInject(doc: Scenario, at?: string): Inject {
  const when = at ?? doc.clock.scenarioStart
  const before = doc.injects.filter(i => Date.parse(i.at) <= Date.parse(when)).at(-1)
  return {
    key: nextFreeKey('inject', doc.injects.map(i => i.key)), at: when,
    phase: before?.phase ?? doc.phases[0]?.key ?? '', kind: 'message', teams: doc.teams[0] ? [doc.teams[0].key] : [],
    title: 'New inject', body: currentSolutionAt(doc.solutions, when) ? 'Impact probability {{ impactProbability }}.' : 'Write the message the teams receive.',
    expectedActions: [],
  }
}

export function blankCriterion(doc: Scenario): Criterion {
  const objective = doc.objectives[0]
  return {
    key: nextFreeKey('criterion', doc.criteria.map(c => c.key)), objective: objective?.key ?? '',
    capability: objective?.capabilities[0] ?? '', tasks: [{ key: 'task-1', text: 'Describe the critical task.' }], injects: [],
  }
}
