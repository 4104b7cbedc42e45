import type { Scenario } from '../scenario/schema'

/** The capabilities an objective names, with those its criteria add (null for an unknown objective). */
export function objectiveCapabilities(scenario: Pick<Scenario, 'objectives' | 'criteria'>, objectiveKey: string): string[] | null {
  const o = scenario.objectives.find(x => x.key === objectiveKey)
  if (!o) return null
  return [...new Set([...o.capabilities, ...scenario.criteria.filter(c => c.objective === o.key).map(c => c.capability)])]
}
