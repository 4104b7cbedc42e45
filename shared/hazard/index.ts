/**
 * Brinkwater hazard engine: the public face. A pure TypeScript library (no Nuxt, Node or browser API)
 * that turns an orbit solution into screening estimates of asteroid impact effects for training.
 * Physics and sources: shared/hazard/README.md and the doc comment of each function.
 */
export * from './schema'
export * from './types'
export { diameterFromMagnitude, kineticEnergyMt, massKg, entrySpeedFromVInfKmS, SIZE_LAW_KM } from './size'
export { atmosphericEntry, strengthFromDensityPa, pancakeDiameterM, swarmIntegralM, ENTRY } from './entry'
export type { EntryInput, EntryResult } from './entry'
export {
  overpressurePa, peakWindMS, overpressureRadiusM, surfaceBurstOverpressurePa, machOnsetScaledM, regularReflectionPa, blastAltitudeFactor,
  severeDamageRadiusKmHillsGoda, BLAST,
} from './blast'
export { thermalExposureJM2, radiantIntensityJSr, fireballRadiusM, visibleFraction, burnThresholdJM2, thermalRadiusM, THERMAL } from './thermal'
export { seismicMagnitude, effectiveMagnitude } from './seismic'
export {
  waterCavityDiameterM, seafloorSpeedKmS, rimWaveAmplitudeM, tsunamiAmplitudeAtM, shoaledAmplitudeM, runUpM,
  breakingLimit, longWaveSpeedMS, impactWaveSpeedMS, OCEAN, TSUNAMI_SOURCE_LAWS, shoalingFactor, runUpRatio,
  shoreProfile, runUpOnProfileM, tsunamiAtSite,
} from './ocean'
export type { ShoreProfile, ShoreProfileInput, SiteWave } from './ocean'
export { palermoScale, torinoScale } from './scales'
export { HazardRng, sampleAlbedoWright2016, sampleShoemakerAngleDeg, CLASS_ALBEDO, CLASS_DENSITY, WRIGHT_2016 } from './sampling'
export { sampleSolutionCorridorPoint } from './corridor'
export { isLand } from './land'
export { damageReach, damageFootprints, FOOTPRINT_LEVELS, FOOTPRINT_GRID_CELLS } from './footprint'
export { assessSolution, releaseHazardWorkspace, MODEL_VERSION, DEFAULT_SAMPLES, DEFAULT_SEED } from './assess'
export type { AssessOptionsInput } from './assess'
