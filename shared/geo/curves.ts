/** Curves for the hazard charts, computed with the engine's pure laws at the median case. */
import { overpressurePa } from '../hazard/blast'
import { tsunamiAmplitudeAtM } from '../hazard/ocean'
import type { TsunamiLawKey } from '../hazard/types'
import type { MedianBlastCase } from './overlays'

/** `n` distances from `fromKm` to `toKm`, evenly spaced on a log scale. */
export function logSpace(fromKm: number, toKm: number, n: number): number[] {
  const a = Math.log(fromKm), b = Math.log(toKm)
  return Array.from({ length: n }, (_, i) => Math.exp(a + (b - a) * i / (n - 1)))
}

/** Peak overpressure against ground range for the median case (Collins et al. 2005), [km, kPa] pairs. */
export function overpressureCurve(basis: MedianBlastCase, fromKm = 1, toKm = 300, n = 80): Array<[number, number]> {
  return logSpace(fromKm, toKm, n).map(km => [
    km,
    overpressurePa({ energyMt: basis.energyMt, groundRangeM: km * 1000, burstAltitudeM: basis.burstAltitudeM }) / 1000,
  ])
}

/**
 * Deep-water wave amplitude against distance for the median cavity under one published source law (rim
 * amplitude decaying as 1/r: 'low' after Collins et al. 2005, 'high' after Ward & Asphaug 2000; see
 * TSUNAMI_SOURCE_LAWS; indicative), [km, m] pairs. Before shoaling at the coast.
 */
export function tsunamiCurve(
  cavityDiameterM: number, waterDepthM: number, fromKm = 1, toKm = 500, n = 80, law: TsunamiLawKey = 'low',
): Array<[number, number]> {
  return logSpace(fromKm, toKm, n).map(km => [km, tsunamiAmplitudeAtM({ cavityDiameterM, waterDepthM, distanceM: km * 1000, law })])
}
