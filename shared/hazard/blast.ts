import { ENTRY } from './entry'

/**
 * Airblast (Collins, Melosh & Marcus 2005, MAPS 40(6), 817–840, eqs. 54–58, after Glasstone & Dolan 1977).
 * Verified against the Earth Impact Effects Program source (sub `air_blast`): the crossover constants
 * px = 75 000 Pa and rx = 290 m, the Mach-stem onset `r_m1 = 550 z1 / (1.2 (550 - z1))` (none for z1 >= 550 m)
 * are the same. Three changes of ours make the ground overpressure one continuous law, non-increasing with
 * range and continuous in burst height (see `overpressurePa`): the regular- and Mach-reflection fits are joined
 * by their maximum instead of a switch at the Mach onset; the surface-burst law at the slant range bounds the
 * field from below, which carries the fits above their reference data (at z1 = 550 m/kt^(1/3) the regular-
 * reflection fit and this bound agree to 1 % below the burst); and an altitude factor for the thinner air at the
 * burst. Equation numbers of Collins 2005 quoted below are from memory (the forms are verified).
 */
export const BLAST = {
  crossoverPressurePa: 75_000,
  crossoverRangeM: 290,
  ambientPressurePa: 1e5,
  soundSpeedMS: 330,
  /**
   * Scaled burst height (m per kt^(1/3)) at which the Mach-reflection fit of Collins 2005 ends (550 m): above
   * it the ground overpressure comes from the slant-range bound with the altitude factor, outside the
   * nuclear-test data (indicative; the assessment warns).
   */
  highBurstScaledM: 550,
} as const

const PX = BLAST.crossoverPressurePa
const RX = BLAST.crossoverRangeM
const SIX_H = 6 * ENTRY.scaleHeightM

/**
 * Peak overpressure of a 1 kt surface burst at scaled range r1, `p = (px rx / (4 r1)) (1 + 3 (rx/r1)^1.3)`.
 * Source: Collins et al. 2005, eq. 54.
 * @param r1 scaled range, m kt^(-1/3)
 * @returns overpressure, Pa
 */
export function surfaceBurstOverpressurePa(r1: number): number {
  return (PX * RX / (4 * r1)) * (1 + 3 * Math.pow(RX / r1, 1.3))
}

/**
 * Mach-stem onset range of an airburst, `r_m1 = 550 z1 / (1.2 (550 - z1))`, Infinity for z1 >= 550.
 * Source: Collins et al. 2005, eq. 56.
 * @param z1 scaled burst altitude, m kt^(-1/3)
 * @returns scaled range, m kt^(-1/3)
 */
export function machOnsetScaledM(z1: number): number {
  return z1 < 550 ? 550 * z1 / (1.2 * (550 - z1)) : Infinity
}

/**
 * Regular-reflection overpressure of an airburst, `p = 3.14e11 z1^-2.6 exp(-34.87 z1^-1.73 r1)`.
 * Source: Collins et al. 2005, eq. 57.
 * @param z1 scaled burst altitude, r1 scaled ground range, m kt^(-1/3)
 * @returns overpressure, Pa
 */
export function regularReflectionPa(z1: number, r1: number): number {
  return 3.14e11 * Math.pow(z1, -2.6) * Math.exp(-34.87 * Math.pow(z1, -1.73) * r1)
}

/**
 * Altitude factor of the ground overpressure below a burst at altitude z: `(P(z)/P0)^(1/6) = exp(-z/(6H))`,
 * H = 8 km. Derivation (ours, indicative): Sachs scaling at the burst altitude (Glasstone & Dolan 1977,
 * ch. 3: overpressure scales with the ambient pressure, distance with (E/P)^(1/3)) gives a far-field
 * amplitude proportional to P_b^(2/3); an acoustic wave travelling down into denser air keeps its energy flux,
 * so its amplitude grows as sqrt(rho c) (ray acoustics, e.g. Pierce 1981, Acoustics, ch. 8 — from memory);
 * together (P_b/P0)^(2/3 - 1/2). 1 at the surface; 0.52 at 31 km.
 * @param burstAltitudeM burst altitude, m
 * @returns factor, 0..1
 */
export function blastAltitudeFactor(burstAltitudeM: number): number {
  return Math.exp(-Math.max(0, burstAltitudeM) / SIX_H)
}

/**
 * Peak overpressure on the ground, one law for surface and air bursts:
 * `p = A(z) max(p_regular(r), p_surface(min(max(r, r_m), sqrt(r^2 + z^2))))`, where p_surface is eq. 54,
 * p_regular eq. 57 (airbursts only), r_m the Mach-stem onset (eq. 56) and A the altitude factor. Beyond the
 * Mach onset this is eq. 54 at the ground range (Collins 2005); inside it, the larger of the regular-reflection
 * fit and the surface-burst law held at its value at the onset (no jump, ours); the slant range keeps high
 * bursts from vanishing. Non-increasing with range; continuous in energy and burst altitude (at z = 0 it is
 * eq. 54). Ranges are scaled to 1 kt by E_kt^(1/3).
 * @param i.energyMt blast energy, Mt TNT; i.groundRangeM ground range, m; i.burstAltitudeM burst
 *   altitude, m (0 = surface burst)
 * @returns overpressure, Pa (Infinity at zero range of a surface burst)
 */
export function overpressurePa(i: { energyMt: number; groundRangeM: number; burstAltitudeM: number }): number {
  if (!(i.energyMt > 0)) return 0
  const s = Math.cbrt(i.energyMt * 1000)
  const r = Math.max(0, i.groundRangeM)
  const z = Math.max(0, i.burstAltitudeM)
  const z1 = z / s
  const x = Math.min(Math.max(r, machOnsetScaledM(z1) * s), Math.hypot(r, z))
  let p = surfaceBurstOverpressurePa(x / s)
  if (z1 > 0) p = Math.max(p, regularReflectionPa(z1, r / s))
  return p * blastAltitudeFactor(z)
}

/**
 * Peak wind speed behind the shock, `u = (5p/(7 P0)) c0 / sqrt(1 + 6p/(7 P0))`, P0 = 1e5 Pa, c0 = 330 m/s.
 * Source: Collins et al. 2005, eq. 58 (Glasstone & Dolan 1977).
 * @param overpressurePa peak overpressure, Pa
 * @returns wind speed, m/s
 */
export function peakWindMS(overpressurePa: number): number {
  const q = overpressurePa / (7 * BLAST.ambientPressurePa)
  return 5 * q * BLAST.soundSpeedMS / Math.sqrt(1 + 6 * q)
}

/**
 * Ground range at which the peak overpressure falls to a threshold (for map rings). Same law as
 * `overpressurePa`, which is non-increasing with range: found by bisection on log range.
 * Source: Collins et al. 2005, eqs. 54–57, with the changes named in `overpressurePa`.
 * @param energyMt blast energy, Mt TNT; burstAltitudeM burst altitude, m (0 = surface); thresholdPa, Pa
 * @returns ground range, m (0 when the threshold is never reached)
 */
export function overpressureRadiusM(energyMt: number, burstAltitudeM: number, thresholdPa: number): number {
  if (!(energyMt > 0) || !(thresholdPa > 0)) return 0
  const at = (r: number) => overpressurePa({ energyMt, groundRangeM: r, burstAltitudeM })
  const s = Math.cbrt(energyMt * 1000)
  let lo = Math.log(1e-2 * s), hi = Math.log(1e7 * s)
  if (at(Math.exp(lo)) < thresholdPa) return at(0) >= thresholdPa ? Math.exp(lo) : 0
  if (at(Math.exp(hi)) >= thresholdPa) return Math.exp(hi)
  for (let k = 0; k < 60; k++) {
    const m = 0.5 * (lo + hi)
    if (at(Math.exp(m)) >= thresholdPa) lo = m
    else hi = m
  }
  return Math.exp(lo)
}

/**
 * Radius of severe (4 psi) blast damage after Hills & Goda 1993 (AJ 105, 1114–1144) as fitted by
 * Mathias et al. 2017 (Icarus 289, 106–119): `R[km] = 2.09 h - 0.449 h^2 E^(-1/3) + 5.08 E^(1/3)`,
 * clamped at 0. A cross-check of the Collins 2005 law, not used by the Monte Carlo.
 * @param energyMt burst energy, Mt TNT; burstAltitudeKm burst altitude, km
 * @returns ground radius, km
 */
export function severeDamageRadiusKmHillsGoda(energyMt: number, burstAltitudeKm: number): number {
  const c = Math.cbrt(energyMt)
  const h = burstAltitudeKm
  return Math.max(0, 2.09 * h - 0.449 * h * h / c + 5.08 * c)
}
