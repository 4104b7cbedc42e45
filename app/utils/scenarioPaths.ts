/** The editor's tabs, in order. */
export const EDITOR_TABS = [
  { key: 'overview', label: 'Overview & objectives' },
  { key: 'teams', label: 'Teams' },
  { key: 'clock', label: 'Clock' },
  { key: 'phases', label: 'Phases' },
  { key: 'solutions', label: 'Orbit solutions' },
  { key: 'sites', label: 'Sites' },
  { key: 'injects', label: 'Injects' },
  { key: 'criteria', label: 'Criteria' },
] as const
export type EditorTab = typeof EDITOR_TABS[number]['key']

const TAB_OF_HEAD: Record<string, EditorTab> = {
  teams: 'teams', clock: 'clock', phases: 'phases', injectKinds: 'phases', solutions: 'solutions',
  sites: 'sites', injects: 'injects', criteria: 'criteria',
}

/** The tab that shows a path such as `injects[4].teams[0]`. */
export function tabOfPath(path: string): EditorTab {
  return TAB_OF_HEAD[path.split(/[.[]/)[0] ?? ''] ?? 'overview'
}

/** The element id of the field that edits a path (`injects[4].title` → `f-injects-4-title`). */
export function fieldId(path: string): string {
  return `f-${path.replace(/[^A-Za-z0-9]+/g, '-').replace(/-+$/, '')}`
}

/** A scenario in the library list (GET /api/scenarios). */
export interface ScenarioSummary {
  id: string
  key: string
  title: string
  summary: string
  revision: number
  origin: string
  updatedAt: string | Date
  createdAt: string | Date
  counts: { teams: number; solutions: number; sites: number; injects: number; criteria: number }
  scenarioStart: string
  impactTime: string
  plannedWallMinutes: number
  finalImpactProbability: number | null
}
