/**
 * Cross-reference checks of a scenario whose shapes already passed: unknown or duplicate keys,
 * times outside the scenario, deadlines before their inject, solutions out of order, a water depth of
 * 0 m under a nominal impact point at sea, a solution that disagrees with its encounter, shore-profile
 * fields on an inland site, and the hazard fields of inject bodies.
 */
import type { Scenario } from './schema'
import { BUILT_IN_INJECT_KINDS, DEFAULT_AFTERMATH_DAYS } from './constants'
import { findHazardFields, validateHazardFields } from './fields'
import { scenarioTime } from './time'
import { isLand } from '../hazard/land'
import { checkEncounters } from './encounter'

export type IssuePath = Array<string | number>

/** One problem, at a path into the scenario; `offset` points into a text value (hazard fields). */
export interface CheckIssue { path: IssuePath; message: string; offset?: number }

const DAY_MS = 86_400_000

/** The last scenario time of a scenario: impact plus the aftermath allowance. */
export function scenarioEndTime(scenario: Pick<Scenario, 'clock'>): string {
  const { impactTime, aftermathDays = DEFAULT_AFTERMATH_DAYS } = scenario.clock
  const t = scenarioTime(impactTime)
  return Number.isNaN(t) ? impactTime : new Date(t + aftermathDays * DAY_MS).toISOString()
}

/** The solution current at a scenario time: the last one released at or before it, if any. */
export function currentSolutionAt<S extends { releaseAt: string }>(solutions: readonly S[], at: string): S | undefined {
  const t = scenarioTime(at)
  let current: S | undefined
  for (const s of solutions) if (scenarioTime(s.releaseAt) <= t) current = s
  return current
}

export function checkScenario(s: Scenario): CheckIssue[] {
  const issues: CheckIssue[] = []
  const add = (path: IssuePath, message: string, offset?: number) =>
    issues.push(offset === undefined ? { path, message } : { path, message, offset })

  const unique = <T>(list: readonly T[], keyOf: (item: T) => string, path: (i: number) => IssuePath, what: string) => {
    const seen = new Map<string, number>()
    list.forEach((item, i) => {
      const key = keyOf(item)
      const first = seen.get(key)
      if (first === undefined) seen.set(key, i)
      else add(path(i), `duplicate ${what} "${key}" (first at index ${first})`)
    })
    return new Set(seen.keys())
  }

  unique(s.objectives, o => o.key, i => ['objectives', i, 'key'], 'objective key')
  const teams = unique(s.teams, t => t.key, i => ['teams', i, 'key'], 'team key')
  const phases = unique(s.phases, p => p.key, i => ['phases', i, 'key'], 'phase key')
  unique(s.solutions, x => x.key, i => ['solutions', i, 'key'], 'solution key')
  const sites = unique(s.sites, x => x.id, i => ['sites', i, 'id'], 'site id')
  const injects = unique(s.injects, x => x.key, i => ['injects', i, 'key'], 'inject key')
  unique(s.criteria, x => x.key, i => ['criteria', i, 'key'], 'criterion key')
  const declaredKinds = unique(s.injectKinds ?? [], k => k, i => ['injectKinds', i], 'inject kind')
  const kinds = new Set<string>([...BUILT_IN_INJECT_KINDS, ...declaredKinds])
  s.objectives.forEach((o, i) => unique(o.capabilities, c => c, j => ['objectives', i, 'capabilities', j], 'capability'))

  // Times: everything happens between the scenario start and the end of the aftermath.
  const start = scenarioTime(s.clock.scenarioStart)
  const impact = scenarioTime(s.clock.impactTime)
  const endIso = scenarioEndTime(s)
  const end = scenarioTime(endIso)
  if (impact <= start) add(['clock', 'impactTime'], `impact time ${s.clock.impactTime} must be after the scenario start ${s.clock.scenarioStart}`)
  const inWindow = (iso: string, path: IssuePath, what: string) => {
    const t = scenarioTime(iso)
    if (t < start || t > end) add(path, `${what} ${iso} lies outside the scenario (${s.clock.scenarioStart} to ${endIso})`)
  }

  s.solutions.forEach((entry, i) => {
    const path: IssuePath = ['solutions', i]
    inWindow(entry.releaseAt, [...path, 'releaseAt'], 'release time')
    const previous = s.solutions[i - 1]
    if (previous && scenarioTime(entry.releaseAt) <= scenarioTime(previous.releaseAt)) {
      add([...path, 'releaseAt'], `solutions must be listed in order of release: ${entry.releaseAt} is not after "${previous.key}" (${previous.releaseAt})`)
    }
    if (scenarioTime(entry.solution.epoch) > scenarioTime(entry.releaseAt)) {
      add([...path, 'solution', 'epoch'], `epoch ${entry.solution.epoch} is after the release time ${entry.releaseAt}`)
    }
    if (scenarioTime(entry.solution.impactTime) <= scenarioTime(entry.solution.epoch)) {
      add([...path, 'solution', 'impactTime'], `impact time ${entry.solution.impactTime} must be after the epoch ${entry.solution.epoch}`)
    }
    const [lon, lat] = entry.solution.corridor.nominal
    if (!(entry.solution.waterDepthM > 0) && !isLand(lon, lat)) {
      add([...path, 'solution', 'waterDepthM'],
        `the nominal impact point (${lon}, ${lat}) is at sea: give the water depth there (0 m means land)`)
    }
  })

  for (const issue of checkEncounters(s.solutions)) add(issue.path, issue.message)

  // Shore-profile fields only act on coastal sites, which an offshore depth marks.
  s.sites.forEach((site, i) => {
    if (site.offshoreDepthM !== undefined) return
    for (const field of ['shelfWidthKm', 'beachSlopeDeg'] as const) {
      if (site[field] === undefined) continue
      add(['sites', i, field], `${field} has no effect on an inland site: give offshoreDepthM to make "${site.id}" coastal`)
    }
  })

  s.injects.forEach((inject, i) => {
    const path: IssuePath = ['injects', i]
    const at = scenarioTime(inject.at)
    inWindow(inject.at, [...path, 'at'], 'inject time')
    if (!phases.has(inject.phase)) add([...path, 'phase'], `unknown phase "${inject.phase}"`)
    if (!kinds.has(inject.kind)) add([...path, 'kind'], `unknown inject kind "${inject.kind}" (declare it in injectKinds)`)
    inject.teams.forEach((team, j) => {
      if (!teams.has(team)) add([...path, 'teams', j], `unknown team "${team}"`)
    })
    unique(inject.teams, t => t, j => [...path, 'teams', j], 'team')
    if (inject.solution !== undefined) {
      const entry = s.solutions.find(x => x.key === inject.solution)
      if (!entry) add([...path, 'solution'], `unknown solution "${inject.solution}"`)
      else if (scenarioTime(entry.releaseAt) > at) {
        add([...path, 'solution'], `solution "${entry.key}" is released at ${entry.releaseAt}, after this inject (${inject.at})`)
      }
    }
    const d = inject.decision
    if (d) {
      if (!d.choices && !d.freeText) add([...path, 'decision'], 'a decision needs choices, free text, or both')
      if (d.choices) unique(d.choices, c => c, j => [...path, 'decision', 'choices', j], 'choice')
      if (scenarioTime(d.deadline) <= at) add([...path, 'decision', 'deadline'], `deadline ${d.deadline} is not after the inject time ${inject.at}`)
      else inWindow(d.deadline, [...path, 'decision', 'deadline'], 'deadline')
    }
    for (const issue of validateHazardFields(inject.body, sites)) add([...path, 'body'], issue.message, issue.start)
    const firstField = findHazardFields(inject.body)[0]
    if (firstField && s.solutions.length && !currentSolutionAt(s.solutions, inject.at) && !Number.isNaN(at)) {
      add([...path, 'body'], `hazard field "${firstField.path}" before any orbit solution is released (the first is released at ${s.solutions[0]?.releaseAt})`, firstField.start)
    }
    else if (firstField && !s.solutions.length) {
      add([...path, 'body'], `hazard field "${firstField.path}" but the scenario has no orbit solutions`, firstField.start)
    }
  })

  s.criteria.forEach((criterion, i) => {
    const path: IssuePath = ['criteria', i]
    const objective = s.objectives.find(o => o.key === criterion.objective)
    if (!objective) add([...path, 'objective'], `unknown objective "${criterion.objective}"`)
    else if (!objective.capabilities.includes(criterion.capability)) {
      add([...path, 'capability'], `capability "${criterion.capability}" is not a target of objective "${objective.key}" (${objective.capabilities.join(', ')})`)
    }
    unique(criterion.tasks, t => t.key, j => [...path, 'tasks', j, 'key'], 'task key')
    criterion.injects.forEach((key, j) => {
      if (!injects.has(key)) add([...path, 'injects', j], `unknown inject "${key}"`)
    })
  })
  return issues
}
