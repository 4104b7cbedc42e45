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

/** Short label on a ring: "6.9 kPa (1.0 psi) · 59 km (32 nmi)". */
export function ringLabel(r: Pick<SceneRing, 'thresholdKPa' | 'radiusKm'>): string {
  return `${kPaText(r.thresholdKPa)} · ${kmText(r.radiusKm)}`
}
