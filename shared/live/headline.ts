import type { Assessment, SiteAssessment } from '../hazard/types'
import { heatRows, heatSourceText } from '../geo/threat'
import { findHazardFields, renderHazardFields } from '../scenario/fields'
import type { Headline } from './types'
import { NO_SOLUTION_YET } from './pending'
import { DRILL } from './visibility'

const fill = (a: Assessment, field: string) => renderHazardFields(`{{ ${field} }}`, a)

/** Headline figures of an assessment for desks and the wall, formatted as inject text formats them. */
export function assessmentHeadline(a: Assessment): Headline {
  return {
    impactProbability: a.impactProbability, torino: a.torino, palermo: a.palermo,
    airburstProbability: a.airburstProbability, tsunamiProbability: a.tsunamiProbability,
    diameterM: a.diameterM, energyMt: a.energyMt,
    text: {
      impactProbability: fill(a, 'impactProbability'), odds: fill(a, 'impactProbability | odds'),
      torino: fill(a, 'torino'), palermo: fill(a, 'palermo'), diameterM: fill(a, 'diameterM'), energyMt: fill(a, 'energyMt'),
    },
    ...(a.airEnergyMt ? { airEnergyMt: a.airEnergyMt } : {}),
    surfaceEnergyMt: a.surfaceEnergyMt,
    worstRunUp: worstRunUp(a),
    heat: worstHeat(a),
    drill: DRILL,
  }
}

const topRunUp = (s: SiteAssessment) => Math.max(s.runUpM.p95, s.tsunamiBand?.high.runUpM.p95 ?? 0)

function worstRunUp(a: Assessment): Headline['worstRunUp'] {
  const wet = a.sites.filter(s => s.coastal !== false && topRunUp(s) > 0)
  if (!wet.length) return null
  const w = wet.reduce((m, s) => (topRunUp(s) > topRunUp(m) ? s : m))
  const band = w.tsunamiBand
  return { site: w.name, runUpM: w.runUpM, ...(band ? { lowLawM: band.low.runUpM.p50, highLawM: band.high.runUpM.p50 } : {}) }
}

function worstHeat(a: Assessment): Headline['heat'] {
  const w = heatRows(a)[0]
  return w ? { site: w.name, thermalMJM2: w.thermalMJM2, burn2: w.burn2, source: heatSourceText(a) } : null
}

/** What a hazard field shows while no orbit solution has been published. */
export { NO_SOLUTION_YET } from './pending'

/** True when a text quotes hazard fields. */
export function hasHazardFields(text: string): boolean {
  return findHazardFields(text).length > 0
}

/**
 * Fills the hazard fields of an inject body from an assessment, or with NO_SOLUTION_YET when there
 * is none (scenario checks forbid fields before the first solution, but a jump or an early release
 * can get there first).
 */
export function renderBody(text: string, assessment: Assessment | null): string {
  if (assessment) return renderHazardFields(text, assessment)
  let out = ''
  let from = 0
  for (const f of findHazardFields(text)) {
    out += text.slice(from, f.start) + NO_SOLUTION_YET
    from = f.end
  }
  return (out + text.slice(from)).replaceAll('\\{{', '{{')
}
