/**
 * What the map draws from an assessment: the probabilistic footprints chosen, their median-case contours (blast
 * rings before assessments carried footprints) and run-up classes of sites.
 */
import { overpressureRadiusM } from '../hazard/blast'
import { thermalRadiusM } from '../hazard/thermal'
import { FOOTPRINT_KEYS, THRESHOLDS, type Assessment, type Footprint, type SiteAssessment, type ThresholdKey } from '../hazard/types'

/** The single burst the map's rings and the curves are drawn for: the median of the assessment. */
export interface MedianBlastCase {
  /** Blast energy, Mt TNT. */
  energyMt: number
  /** Burst altitude, m (0 for a surface burst). */
  burstAltitudeM: number
  regime: 'airburst' | 'surface'
}

export type BlastInputs = Pick<Assessment, 'energyMt' | 'surfaceEnergyMt' | 'airburstProbability' | 'burstAltitudeKm'>

/**
 * The median case: the median entry energy (the engine's blast energy: air plus surface, conserved) at the median
 * burst altitude when most realisations burst in the air, otherwise at the surface. The engine raises each
 * realisation's source to the energy-weighted height of its deposition, which for a burst is close to the burst
 * altitude; the rings are a sketch of the median case, the site figures come from every realisation.
 */
export function medianBlastCase(a: BlastInputs): MedianBlastCase {
  if (a.airburstProbability >= 0.5 && a.burstAltitudeKm) {
    return { energyMt: a.energyMt.p50, burstAltitudeM: a.burstAltitudeKm.p50 * 1000, regime: 'airburst' }
  }
  return { energyMt: a.energyMt.p50, burstAltitudeM: 0, regime: 'surface' }
}

/**
 * Overpressure thresholds drawn as rings by default (assessments without footprints): windows, wood-frame houses
 * collapse, multistorey collapse — the overpressure keys of the engine's FOOTPRINT_KEYS.
 */
export const DEFAULT_RING_KEYS: readonly ThresholdKey[] = FOOTPRINT_KEYS.filter(k => THRESHOLDS.find(t => t.key === k)?.kind === 'overpressure')
export { FOOTPRINT_KEYS }

export interface BlastRing {
  key: ThresholdKey
  label: string
  thresholdKPa: number
  radiusKm: number
}

/**
 * Ground radii at which the peak overpressure of the median case falls to each threshold, from the
 * engine's law (Collins et al. 2005, `overpressureRadiusM`). Thresholds never reached are left out.
 */
export function blastRings(
  a: BlastInputs,
  keys: readonly ThresholdKey[] = DEFAULT_RING_KEYS,
): { basis: MedianBlastCase; rings: BlastRing[] } {
  const basis = medianBlastCase(a)
  const rings: BlastRing[] = []
  for (const key of keys) {
    const t = THRESHOLDS.find(x => x.key === key)
    if (!t || t.kind !== 'overpressure') continue
    const r = Number.isFinite(basis.energyMt) ? overpressureRadiusM(basis.energyMt, basis.burstAltitudeM, t.value) : 0
    if (r > 0) rings.push({ key, label: t.label, thresholdKPa: t.value / 1000, radiusKm: r / 1000 })
  }
  return { basis, rings }
}

export type NominalInputs = BlastInputs & Pick<Assessment, 'airEnergyMt'>

/** A median-case contour of a footprint threshold: the ground radius within which the median case exceeds it. */
export interface NominalContour { key: ThresholdKey; label: string; radiusKm: number; thresholdKPa?: number }

/**
 * The median-case contour of each footprint key: overpressure radii as `blastRings`, burn radii from the engine's
 * heat law (`thermalRadiusM`, Collins et al. 2005 with the air share of Popova et al. 2013) for the median entry
 * energy, its median air share and the median case's height. Thresholds never reached are left out.
 */
export function nominalContours(
  a: NominalInputs,
  keys: readonly ThresholdKey[] = FOOTPRINT_KEYS,
): { basis: MedianBlastCase; contours: NominalContour[] } {
  const { basis, rings } = blastRings(a, keys)
  const contours: NominalContour[] = []
  for (const key of keys) {
    const t = THRESHOLDS.find(x => x.key === key)
    if (!t) continue
    if (t.kind === 'overpressure') {
      const r = rings.find(x => x.key === key)
      if (r) contours.push(r)
      continue
    }
    if (t.kind !== 'thermal' || !Number.isFinite(basis.energyMt)) continue
    const air = a.airEnergyMt ? Math.min(basis.energyMt, a.airEnergyMt.p50) : undefined
    const r = thermalRadiusM({ energyMt: basis.energyMt, burstAltitudeM: basis.burstAltitudeM, airEnergyMt: air }, t.value)
    if (r > 0) contours.push({ key, label: t.label, radiusKm: r / 1000 })
  }
  return { basis, contours }
}

/** Whether an assessment carries footprints (engine 2.2.0 and later); older stored ones get the rings. */
export function hasFootprints(a: Pick<Assessment, 'footprints'> | null | undefined): a is { footprints: Footprint[] } {
  return Array.isArray(a?.footprints) && a.footprints.length > 0
}

/** How a site is marked for the tsunami: by its 95th-percentile run-up (thresholds of the model: 1 m, 3 m). */
export type RunUpClass = 'inland' | 'offshore' | 'none' | 'low' | 'moderate' | 'high'

export const RUN_UP_CLASSES: ReadonlyArray<{ key: RunUpClass; label: string }> = [
  { key: 'high', label: 'Run-up 3 m or more (95th percentile)' },
  { key: 'moderate', label: 'Run-up 1–3 m (95th percentile)' },
  { key: 'low', label: 'Run-up under 1 m (95th percentile)' },
  { key: 'none', label: 'Coastal, no tsunami in these figures' },
  { key: 'offshore', label: 'Offshore site, no shore (wave height only)' },
  { key: 'inland', label: 'Inland site (no tsunami figures)' },
]

export function runUpClass(s: Pick<SiteAssessment, 'coastal' | 'runUpM' | 'shore'>): RunUpClass {
  if (s.coastal === false) return 'inland'
  if (s.shore === false) return 'offshore'
  const p95 = s.runUpM.p95
  if (!(p95 > 0)) return 'none'
  return p95 >= 3 ? 'high' : p95 >= 1 ? 'moderate' : 'low'
}

/** The footprint the map shows first: where windows shatter (the widest, and the one most people would meet). */
export const DEFAULT_FOOTPRINT_KEY: ThresholdKey = 'windows'

/**
 * What the map overlays for an assessment: with footprints (engine 2.2.0 on), the footprints of `keys` and their
 * median-case contours as thin lines; without (older stored assessments), the labelled blast rings of the median case.
 */
export function mapOverlays(
  a: (NominalInputs & Pick<Assessment, 'footprints'>) | null | undefined,
  keys: readonly ThresholdKey[] = [DEFAULT_FOOTPRINT_KEY],
): { basis: MedianBlastCase | null; rings: NominalContour[]; footprints?: Footprint[] } {
  if (!a) return { basis: null, rings: [] }
  if (!hasFootprints(a)) {
    const { basis, rings } = blastRings(a)
    return { basis, rings }
  }
  const { basis, contours } = nominalContours(a, keys)
  return { basis, rings: contours, footprints: a.footprints.filter(f => keys.includes(f.key)) }
}
