/** Types of the hazard engine's results. Units are in the names. */

/** A distribution summarised by its 5th, 50th and 95th percentiles. */
export interface Percentiles { p5: number; p50: number; p95: number }

/** Damage thresholds of the hazard model (Collins et al. 2005; Glasstone & Dolan 1977; see shared/hazard/README.md). */
export const THRESHOLDS = [
  { key: 'windows', kind: 'overpressure', value: 6900, label: 'Windows shatter' },
  { key: 'houseDamage', kind: 'overpressure', value: 22900, label: 'Wood-frame houses badly damaged' },
  { key: 'houseCollapse', kind: 'overpressure', value: 26800, label: 'Wood-frame houses collapse' },
  { key: 'multistoreyCracked', kind: 'overpressure', value: 38500, label: 'Multistorey wall-bearing buildings badly cracked' },
  { key: 'multistoreyCollapse', kind: 'overpressure', value: 42600, label: 'Multistorey wall-bearing buildings collapse' },
  { key: 'bridgeCollapse', kind: 'overpressure', value: 121000, label: 'Truss bridges collapse' },
  { key: 'steelFrameCollapse', kind: 'overpressure', value: 273000, label: 'Steel-frame buildings begin to collapse' },
  { key: 'trees30', kind: 'wind', value: 40, label: 'About 30 % of trees blown down' },
  { key: 'trees90', kind: 'wind', value: 62, label: 'About 90 % of trees blown down' },
  { key: 'burn1', kind: 'thermal', value: 0.13e6, label: 'First-degree burns' },
  { key: 'burn2', kind: 'thermal', value: 0.25e6, label: 'Second-degree burns' },
  { key: 'burn3', kind: 'thermal', value: 0.42e6, label: 'Third-degree burns' },
  { key: 'runUp1m', kind: 'runUp', value: 1, label: 'Tsunami run-up above 1 m' },
  { key: 'runUp3m', kind: 'runUp', value: 3, label: 'Tsunami run-up above 3 m' },
] as const
export type ThresholdKey = typeof THRESHOLDS[number]['key']
/**
 * Thresholds whose reach and probabilistic footprint each assessment carries (and whose median-case contours the
 * map draws): the overpressures at which windows shatter, wood-frame houses collapse and multistorey wall-bearing
 * buildings collapse, and second-degree burns.
 */
export const FOOTPRINT_KEYS = ['windows', 'houseCollapse', 'multistoreyCollapse', 'burn2'] as const satisfies readonly ThresholdKey[]
/** Units of threshold values: overpressure Pa, wind m/s, thermal J/m² at 1 Mt (scaled by E_Mt^(1/6)), runUp m. */
export type ThresholdKind = typeof THRESHOLDS[number]['kind']

export interface ModelWarning {
  /** Stable code, e.g. `high-burst`, `wave-breaking`, `depth-out-of-range`. */
  code: string
  message: string
  /** Share of samples affected, 0..1. */
  fraction?: number
  siteId?: string
}

export interface SiteAssessment {
  siteId: string
  name: string
  population: number
  /**
   * True when the site gives an offshore depth; inland sites (none given) get no tsunami figures (all 0).
   * Always set by the engine; optional so that hand-made fixtures need not carry it.
   */
  coastal?: boolean
  /** False for a coastal site with no shore (offshore installation): wave height only, run-up 0. Absent: true. */
  shore?: boolean
  distanceKm: Percentiles
  overpressureKPa: Percentiles
  windMS: Percentiles
  thermalMJM2: Percentiles
  seismicMagnitude: Percentiles
  /**
   * Wave amplitude at the site's offshore depth, metres (indicative), capped at the breaking height there;
   * the source laws mixed as model uncertainty (see tsunamiBand).
   */
  tsunamiAmplitudeM: Percentiles
  /**
   * Earliest long-wave arrival after impact, minutes (largest waves come later), over the realisations
   * that make a tsunami (see Assessment.tsunamiProbability); all 0 when none does.
   */
  tsunamiArrivalMin: Percentiles
  /** Arrival of the dominant impact wave (linear group speed of wavelength 2 D_tcw), minutes; same conditioning. */
  tsunamiMainArrivalMin: Percentiles
  /** Run-up above sea level on the site's shore profile, metres (indicative); the source laws mixed. */
  runUpM: Percentiles
  /**
   * The tsunami under each published source law separately (the band the literature spans):
   * offshore amplitude and run-up, metres, over the same realisations as `tsunamiAmplitudeM`
   * and `runUpM` (which mix the laws as model uncertainty). Keys match Assessment.tsunamiSourceLaws.
   */
  tsunamiBand?: Record<TsunamiLawKey, { amplitudeM: Percentiles; runUpM: Percentiles }>
  /**
   * Probability of exceeding each threshold at this site, 0..1, CONDITIONAL ON IMPACT (the share of
   * impact realisations that exceed it); multiply by Assessment.impactProbability for the absolute risk.
   */
  exceedance: Record<ThresholdKey, number>
}

/** The two ends of the published spread of impact-tsunami source laws. */
export type TsunamiLawKey = 'low' | 'high'

/** A published tsunami source law the Monte Carlo draws from (model uncertainty). */
export interface TsunamiSourceLaw {
  key: TsunamiLawKey
  /** Short name for screens, e.g. "Rim wave, 1/r decay". */
  name: string
  /** Authors, year, journal and the equation used. */
  source: string
}

export interface AssessmentOptions {
  samples: number
  seed: number
  /** `density`: Collins et al. 2005 eq. 9; `log-uniform`: strength log-uniform over 0.1–10 MPa (Mathias et al. 2017). */
  strengthModel: 'density' | 'log-uniform'
}

export interface Assessment {
  /** Engine version, so stored assessments can be told apart after model changes. */
  modelVersion: string
  options: AssessmentOptions
  impactProbability: number
  diameterM: Percentiles
  massKg: Percentiles
  energyMt: Percentiles
  /** Share of impact realisations that burst in the air (conditional on impact). */
  airburstProbability: number
  /** Over the airburst samples only; null when none burst in the air. */
  burstAltitudeKm: Percentiles | null
  /** Share of impact realisations whose impact point is at sea (Natural Earth 1:50m land), airburst or not. */
  oceanImpactProbability: number
  /**
   * Share of realisations that make a tsunami: the body or its debris reaches the sea and its wave (source laws mixed)
   * is at least 1 m at 10 km from the impact point (OCEAN.tsunamiMinAmplitudeM, tsunamiReferenceRangeM). Smaller waves
   * still enter the site figures.
   */
  tsunamiProbability: number
  /** Energy delivered to the surface (water or ground), Mt. */
  surfaceEnergyMt: Percentiles
  /** Energy deposited in the air (airburst and entry losses), Mt; air + surface = entry energy. */
  airEnergyMt?: Percentiles
  /** The tsunami source laws whose spread the tsunami figures carry (see SiteAssessment.tsunamiBand). */
  tsunamiSourceLaws?: TsunamiSourceLaw[]
  /** Over the realisations that make a tsunami only; null when none. */
  waterCavityDiameterM: Percentiles | null
  sites: SiteAssessment[]
  /** Expected population exposed to each threshold, CONDITIONAL ON IMPACT (sum over sites of population × exceedance). */
  exposedPopulation: Record<ThresholdKey, number>
  torino: number
  palermo: number
  warnings: ModelWarning[]
  /** A thinned, reproducible subset of sampled impact points for maps: [lon, lat, flags] (flags bit0 = sea, bit1 = airburst). */
  impactPoints: Array<[number, number, number]>
  /** Reach of each footprint threshold for the realisations of impactPoints (since 2.2.0; absent in older assessments). */
  reach?: DamageReach
  /** Probabilistic footprints of the FOOTPRINT_KEYS thresholds (since 2.2.0; absent in older assessments). */
  footprints?: Footprint[]
}

/**
 * Per thinned realisation (index-aligned with Assessment.impactPoints): ground radius, km, within which each threshold
 * is exceeded (0: nowhere).
 */
export interface DamageReach { keys: ThresholdKey[]; radiiKm: number[][] } // radiiKm[i][j] ↔ impactPoints[i], keys[j]
/** lon/lat, area where P(exceeded) ≥ probability (conditional on impact, over the thinned realisations). */
export interface FootprintLevel { probability: number; geometry: import('geojson').MultiPolygon }
/** The probabilistic footprint of one threshold: areas at FOOTPRINT_LEVELS (0.1, 0.5, 0.9), levels without area left out. */
export interface Footprint { key: ThresholdKey; label: string; levels: FootprintLevel[] }
