import { EARTH_RADIUS_M, J_PER_MT } from './units'

/**
 * Thermal radiation of the fireball (Collins, Melosh & Marcus 2005, MAPS 40(6), 817–840,
 * "Thermal radiation" section). Verified against the Earth Impact Effects Program source (sub
 * `find_thermal`): fireball radius 0.002 E^(1/3) m, luminous efficiency 3e-3, the visible fraction
 * `f = (2/pi)(delta - (h/R_f) sin delta)` with `h = (1 - cos Delta) R_E`, and no fireball below
 * 15 km/s. Our one adaptation: for an airburst the fireball centre is raised to the burst altitude
 * (the hidden height becomes h - z_b) and the range is the slant range; the program puts every
 * fireball on the ground.
 */
export const THERMAL = {
  luminousEfficiency: 3e-3,
  /** Below this speed (at the burst or at the surface) no fireball forms, km/s. */
  minSpeedKmS: 15,
} as const

/**
 * Fireball radius, `R_f = 0.002 E^(1/3)` (E in joules). Source: Collins et al. 2005, eq. 30 (number from memory).
 * @param energyJ fireball energy, J
 * @returns radius, m
 */
export function fireballRadiusM(energyJ: number): number {
  return 0.002 * Math.cbrt(energyJ)
}

/**
 * Fraction of the fireball above the horizon, `f = (2/pi)(delta - (h/R_f) sin delta)`,
 * `delta = arccos(h/R_f)`, clamped to 0..1. Source: Collins et al. 2005, eqs. 33–34 (numbers from memory).
 * @param hiddenHeightM height of the fireball centre below the observer's horizon, m (negative: above)
 * @param fireballRadiusM fireball radius, m
 * @returns visible fraction, 0..1
 */
export function visibleFraction(hiddenHeightM: number, fireballRadiusM: number): number {
  const q = hiddenHeightM / fireballRadiusM
  if (q >= 1) return 0
  if (q <= 0) return 1
  const d = Math.acos(q)
  return (2 / Math.PI) * (d - q * Math.sin(d))
}

/**
 * Thermal exposure at a ground range, `Phi = f eta E / (2 pi r^2)`, eta = 3e-3, f the visible
 * fraction over a curved Earth. Source: Collins et al. 2005, eqs. 31–35 (numbers from memory).
 * @param i.energyMt fireball energy, Mt TNT; i.groundRangeM ground range, m; i.burstAltitudeM burst
 *   altitude, m (0 at the surface)
 * @returns exposure, J/m²
 */
export function thermalExposureJM2(i: { energyMt: number; groundRangeM: number; burstAltitudeM: number }): number {
  const E = i.energyMt * J_PER_MT
  if (!(E > 0)) return 0
  const delta = i.groundRangeM / EARTH_RADIUS_M
  const h = (1 - Math.cos(delta)) * EARTH_RADIUS_M - i.burstAltitudeM
  const f = visibleFraction(h, fireballRadiusM(E))
  const r2 = i.groundRangeM * i.groundRangeM + i.burstAltitudeM * i.burstAltitudeM
  return f * THERMAL.luminousEfficiency * E / (2 * Math.PI * r2)
}

/**
 * Exposure that causes a burn of the given degree, scaled with yield: `Z E_Mt^(1/6)`, Z = 0.13,
 * 0.25, 0.42 MJ/m² for first, second and third degree. Source: Collins et al. 2005 (table of
 * thermal thresholds, after Glasstone & Dolan 1977); Mathias et al. 2017, Icarus 289, 106–119.
 * @param thresholdAt1MtJM2 Z, J/m² at 1 Mt; energyMt fireball energy, Mt TNT
 * @returns exposure threshold, J/m²
 */
export function burnThresholdJM2(thresholdAt1MtJM2: number, energyMt: number): number {
  return thresholdAt1MtJM2 * Math.pow(energyMt, 1 / 6)
}
