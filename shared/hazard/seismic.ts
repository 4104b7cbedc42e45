import { EARTH_RADIUS_M } from './units'

/**
 * Ground shaking (Collins, Melosh & Marcus 2005, MAPS 40(6), 817–840, eqs. 40–41). Verified against
 * the Earth Impact Effects Program source (subs `find_seismic` and `seismic_radius`, 2010 version):
 * `M = 0.67 log10 E - 5.87`, and the three distance branches; the program evaluates the far branch
 * with the epicentral angle in radians, as here. Collins 2005 uses the energy that reaches the
 * ground (for an ocean impact, at the sea floor); the program computes no shaking for airbursts.
 */

/**
 * Seismic magnitude of an impact, `M = 0.67 log10(E) - 5.87` (seismic efficiency 1e-4 built in).
 * Source: Collins et al. 2005, eq. 40.
 * @param energyJ energy delivered to the ground, J
 * @returns Richter magnitude (−Infinity for no energy)
 */
export function seismicMagnitude(energyJ: number): number {
  return 0.67 * Math.log10(energyJ) - 5.87
}

/**
 * Effective magnitude felt at a range: `M - 0.0238 r` (r < 60 km), `M - 0.0048 r - 1.1644`
 * (60 <= r < 700 km), `M - 1.66 log10(Delta) - 6.399` beyond, Delta the epicentral angle in radians.
 * Source: Collins et al. 2005, eq. 41; far branch as in the EIEP program source.
 * @param magnitude source magnitude M; rangeKm ground range, km
 * @returns effective magnitude
 */
export function effectiveMagnitude(magnitude: number, rangeKm: number): number {
  if (rangeKm < 60) return magnitude - 0.0238 * rangeKm
  if (rangeKm < 700) return magnitude - 0.0048 * rangeKm - 1.1644
  return magnitude - 1.66 * Math.log10(rangeKm * 1000 / EARTH_RADIUS_M) - 6.399
}
