/** The map legend in plain words, shared by the interactive map and the SVG renderer. */
import type { MapView } from './views'
import type { MedianBlastCase, RunUpClass } from './overlays'
import { RUN_UP_CLASSES } from './overlays'
import type { PointKind, SceneRing } from './scene'
import { kmText, kPaText, sig } from './figures'

export const POINT_LABELS: Record<PointKind, string> = {
  sea: 'Sampled impact point, surface impact at sea',
  land: 'Sampled impact point, surface impact on land',
  air: 'Sampled impact point, airburst',
}

export const VIEW_LABELS: Record<MapView, string> = { ocean: 'Ocean', regional: 'Regional' }

/** Where the blast rings come from, in words (they are drawn for one burst, not for the spread). */
export function ringBasisText(b: MedianBlastCase | null): string {
  if (!b) return 'Blast rings unavailable for this solution; see the per-site exceedance table.'
  const how = b.regime === 'airburst' ? `an airburst at ${sig(b.burstAltitudeM / 1000)} km` : 'a surface burst'
  return `Blast rings: median case, the median entry energy ${sig(b.energyMt)} Mt TNT released as ${how} (engine overpressure law, Collins et al. 2005). Actual damage varies with the spread of energy and impact point.`
}

export function toneLabel(t: RunUpClass): string {
  return RUN_UP_CLASSES.find(c => c.key === t)?.label ?? t
}

/** Short label on a ring: "6.9 kPa (1.0 psi) · 59 km (32 nmi)" (the distance alone for a ring without a pressure). */
export function ringLabel(r: Pick<SceneRing, 'thresholdKPa' | 'radiusKm'>): string {
  return r.thresholdKPa === undefined ? kmText(r.radiusKm) : `${kPaText(r.thresholdKPa)} · ${kmText(r.radiusKm)}`
}

/** Short names of the footprint thresholds for the map's selector and labels. */
export const FOOTPRINT_NAMES: Record<string, string> = {
  windows: 'Windows shatter',
  houseCollapse: 'Houses collapse',
  multistoreyCollapse: 'Multistorey collapse',
  burn2: 'Second-degree burns',
}

/** What happens at a footprint threshold, as the middle of a sentence ("the chance … that <this> there"). */
const FOOTPRINT_EVENTS: Record<string, string> = {
  windows: 'windows shatter',
  houseCollapse: 'wood-frame houses collapse',
  multistoreyCollapse: 'multistorey wall-bearing buildings collapse',
  burn2: 'exposed skin gets second-degree burns',
}

/** The footprint levels in words, weakest first (FOOTPRINT_LEVELS of the engine). */
export const FOOTPRINT_LEVEL_WORDS: Record<number, string> = { 0.1: '1 in 10', 0.5: '1 in 2', 0.9: '9 in 10' }

export function footprintName(key: string): string {
  return FOOTPRINT_NAMES[key] ?? key
}

/**
 * The shading in words: "Shading: the chance, if it strikes, that windows shatter there — faintest 1 in 10, then even
 * odds, strongest 9 in 10 (from 2,000 sampled impacts, conditional on impact)." Several keys are named together.
 */
export function footprintShadingText(keys: readonly string[], samples: number): string {
  const what = keys.length === 1
    ? (FOOTPRINT_EVENTS[keys[0]!] ?? keys[0]!)
    : 'each threshold is passed (one colour each)'
  return `Shading: the chance, if it strikes, that ${what} there — faintest 1 in 10, then 1 in 2, strongest 9 in 10 `
    + `(from ${samples.toLocaleString('en-GB')} sampled impacts, conditional on impact).`
}

/** The thin line in words. */
export function footprintLineText(basis: MedianBlastCase | null): string {
  if (!basis) return 'Thin line: not available for this solution.'
  const how = basis.regime === 'airburst' ? `an airburst at ${sig(basis.burstAltitudeM / 1000)} km` : 'a surface burst'
  return `Thin line: the same threshold for the middle case, the median entry energy ${sig(basis.energyMt)} Mt TNT as ${how}.`
}
