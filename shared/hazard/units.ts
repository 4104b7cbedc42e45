/** Physical constants and unit conversions shared by the hazard engine (SI inside the code). */

/** Joules in one megaton of TNT (common practice, 1 t TNT = 4.184e9 J). */
export const J_PER_MT = 4.184e15
/** Joules in one kiloton of TNT. */
export const J_PER_KT = 4.184e12
/** Gravitational acceleration at the surface, m/s² (standard gravity rounded; common practice). */
export const G_MS2 = 9.81
/** Mean Earth radius, m (IUGG mean radius; common practice). */
export const EARTH_RADIUS_M = 6_371_000
/** Sea-water density used by the cavity and drag laws, kg/m³ (Collins et al. 2005). */
export const WATER_DENSITY_KGM3 = 1000
/** Radians per degree. */
export const DEG = Math.PI / 180
