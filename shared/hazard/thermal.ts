import { EARTH_RADIUS_M, J_PER_MT } from './units'

/**
 * Thermal radiation (Collins, Melosh & Marcus 2005, MAPS 40(6), 817–840, "Thermal radiation" section, for the
 * fireball of a surface impact). Verified against the Earth Impact Effects Program source (sub `find_thermal`):
 * fireball radius 0.002 E^(1/3) m, luminous efficiency 3e-3 and the visible fraction
 * `f = (2/pi)(delta - (h/R_f) sin delta)` with `h = (1 - cos Delta) R_E`. Our changes:
 * - Energy deposited in the air radiates too, isotropically from the burst (or, for a body reaching the surface,
 *   from the ground), with the panchromatic luminous efficiency measured for the Chelyabinsk airburst,
 *   7 ± 3 % (Popova et al. 2013, Science 342, 1069–1073; theory there spans 5.6–13.2 %).
 * - No speed gate: the program forms no fireball below 15 km/s; that switch made the heat jump with size and
 *   left airbursts without heat. The impact fireball keeps 3e-3 of the surface energy at every speed.
 * - The source is raised to the burst height (the hidden height becomes h - z) and the range is the slant range.
 */
export const THERMAL = {
  /** Share of the energy reaching the surface radiated by the impact fireball (Collins 2005). */
  luminousEfficiency: 3e-3,
  /** Share of the energy deposited in the air that is radiated (Popova et al. 2013, Chelyabinsk, 7 ± 3 %). */
  airburstLuminousEfficiency: 0.07,
} as const

/**
 * Radiant energy per steradian towards the ground, J/sr: `eta_air E_air / (4 pi) + eta E_surface / (2 pi)` (the
 * air deposition radiates into the whole sphere, the impact fireball into the half-space above the ground).
 * Sources: Popova et al. 2013 (eta_air), Collins et al. 2005 (eta, eq. 31).
 * @param airEnergyJ energy deposited in the air, J; surfaceEnergyJ energy reaching the surface, J
 * @returns J/sr
 */
export function radiantIntensityJSr(airEnergyJ: number, surfaceEnergyJ: number): number {
  return THERMAL.airburstLuminousEfficiency * airEnergyJ / (4 * Math.PI) + THERMAL.luminousEfficiency * surfaceEnergyJ / (2 * Math.PI)
}

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

/** `visibleFraction` tabulated on q = hidden / R_f in [0, 1] (the Monte Carlo's site loop; absolute error below 1e-6). */
const VF_STEPS = 4096
const VF_TABLE = Float64Array.from({ length: VF_STEPS + 2 }, (_, k) => visibleFraction(Math.min(k, VF_STEPS) / VF_STEPS, 1))
/**
 * Fraction of the fireball above the horizon from the table (linear interpolation), for q = hidden / R_f.
 * Source: as `visibleFraction`.
 */
export function visibleFractionOfRatio(q: number): number {
  if (q <= 0) return 1
  if (q >= 1) return 0
  const u = q * VF_STEPS, j = u | 0
  return VF_TABLE[j]! + (u - j) * (VF_TABLE[j + 1]! - VF_TABLE[j]!)
}

/**
 * Thermal exposure at a ground range, `Phi = f I / (r^2 + z^2)`, I from `radiantIntensityJSr`, f the visible
 * fraction of a fireball of radius 0.002 E^(1/3) over a curved Earth. Sources: Collins et al. 2005, eqs. 30–35
 * (numbers from memory); Popova et al. 2013 for the air share.
 * @param i.energyMt total energy (entry energy), Mt TNT; i.groundRangeM ground range, m; i.burstAltitudeM
 *   height of the source, m (0 at the surface); i.airEnergyMt the part deposited in the air, Mt TNT (default:
 *   all of it for a source above the ground, none at the surface)
 * @returns exposure, J/m²
 */
export function thermalExposureJM2(i: { energyMt: number; groundRangeM: number; burstAltitudeM: number; airEnergyMt?: number }): number {
  const E = i.energyMt * J_PER_MT
  if (!(E > 0)) return 0
  const eAir = Math.min(E, Math.max(0, (i.airEnergyMt ?? (i.burstAltitudeM > 0 ? i.energyMt : 0)) * J_PER_MT))
  const delta = i.groundRangeM / EARTH_RADIUS_M
  const h = (1 - Math.cos(delta)) * EARTH_RADIUS_M - i.burstAltitudeM
  const f = visibleFraction(h, fireballRadiusM(E))
  const r2 = i.groundRangeM * i.groundRangeM + i.burstAltitudeM * i.burstAltitudeM
  return f * radiantIntensityJSr(eAir, E - eAir) / r2
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

/**
 * Ground range within which the thermal exposure reaches a burn level (for the map's median-case contour): the
 * largest range at which `thermalExposureJM2` is at least `burnThresholdJM2(thresholdAt1MtJM2, energyMt)`. The
 * exposure never rises with range (the hidden height of the source grows, 1/(r² + z²) falls), so bisection on
 * log range is exact to 0.5 m. Sources: as `thermalExposureJM2` and `burnThresholdJM2`.
 * @param i as `thermalExposureJM2` without the range; thresholdAt1MtJM2 burn level at 1 Mt, J/m²
 * @returns ground range, m (0 when the level is not reached at 1 m)
 */
export function thermalRadiusM(i: { energyMt: number; burstAltitudeM: number; airEnergyMt?: number }, thresholdAt1MtJM2: number): number {
  if (!(i.energyMt > 0) || !(thresholdAt1MtJM2 > 0)) return 0
  const level = burnThresholdJM2(thresholdAt1MtJM2, i.energyMt)
  const at = (r: number) => thermalExposureJM2({ ...i, groundRangeM: r })
  if (!(at(1) >= level)) return 0
  let lo = 0, hi = Math.log(Math.PI * EARTH_RADIUS_M)
  if (at(Math.exp(hi)) >= level) return Math.exp(hi)
  for (let k = 0; k < 64 && Math.exp(hi) - Math.exp(lo) > 0.5; k++) {
    const m = 0.5 * (lo + hi)
    if (at(Math.exp(m)) >= level) lo = m
    else hi = m
  }
  return Math.exp(lo)
}
