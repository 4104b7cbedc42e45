import { J_PER_MT } from './units'

/** Bowell et al. (1989) constant of the H–D–albedo law, km (Pravec & Harris 2007, appendix A). */
export const SIZE_LAW_KM = 1329

/**
 * Diameter of an asteroid from its absolute magnitude and geometric albedo:
 * `D[km] = 1329 / sqrt(p) * 10^(-H/5)`.
 * Source: Bowell et al. 1989, Asteroids II, 524–556; Pravec & Harris 2007, Icarus 190, 250–259, appendix A (eq. A7, number from memory).
 * @param H absolute magnitude (mag)
 * @param albedo geometric albedo p_V (dimensionless, > 0)
 * @returns diameter in metres
 */
export function diameterFromMagnitude(H: number, albedo: number): number {
  return (SIZE_LAW_KM * 1000 / Math.sqrt(albedo)) * Math.pow(10, -H / 5)
}

/**
 * Mass of a spherical body, `m = (pi/6) rho D^3`.
 * Source: Collins, Melosh & Marcus 2005, Meteoritics & Planetary Science 40(6), 817–840, text before eq. 1.
 * @param diameterM diameter, m
 * @param densityKgM3 bulk density, kg/m³
 * @returns mass, kg
 */
export function massKg(diameterM: number, densityKgM3: number): number {
  return (Math.PI / 6) * densityKgM3 * diameterM * diameterM * diameterM
}

/**
 * Kinetic energy at the top of the atmosphere, `E = m v^2 / 2`, in megatons of TNT (1 Mt = 4.184e15 J).
 * Source: Collins et al. 2005, MAPS 40(6), eq. 1.
 * @param i.diameterM diameter, m; i.densityKgM3 bulk density, kg/m³; i.speedKmS entry speed, km/s
 * @returns energy, Mt TNT
 */
export function kineticEnergyMt(i: { diameterM: number; densityKgM3: number; speedKmS: number }): number {
  const v = i.speedKmS * 1000
  return 0.5 * massKg(i.diameterM, i.densityKgM3) * v * v / J_PER_MT
}

/**
 * Entry speed from the hyperbolic excess speed, `v = sqrt(vinf^2 + 11.19^2)` (escape speed 11.19 km/s).
 * Source: energy conservation (common practice, no source).
 * @param vInfKmS hyperbolic excess speed, km/s
 * @returns entry speed, km/s
 */
export function entrySpeedFromVInfKmS(vInfKmS: number): number {
  return Math.sqrt(vInfKmS * vInfKmS + 11.19 * 11.19)
}
