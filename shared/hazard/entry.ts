import { G_MS2, J_PER_MT, DEG } from './units'
import { massKg } from './size'

/**
 * Atmospheric entry: the pancake model of Collins, Melosh & Marcus 2005 (Meteoritics & Planetary
 * Science 40(6), 817–840; "Collins 2005"), eqs. 8–20.
 *
 * Verified against the Earth Impact Effects Program source (Perl, © Collins, Melosh & Marcus,
 * public copies on GitHub, sub `atmospheric_entry`): eq. 9 strength, eq. 11 break-up altitude,
 * eq. 16 dispersion length, eq. 18 burst altitude, eq. 19 burst speed and the intact-body branch
 * (terminal speed) are the same forms as here. Two differences, recorded:
 * - The program computes the strength factor as `2.7185 * av * Y/(rho0 v0^2)`, half of the paper's
 *   eq. 12 (`4.07 C_D H Y/(rho_i L0 v0^2 sin theta)` = `2e * av * Y/(rho0 v0^2)`). The paper's factor
 *   follows from maximising the stagnation pressure along eq. 8 (done here), so we keep eq. 12.
 * - The program notes that the printed eq. 20 is wrong; its corrected integral equals our closed
 *   form `swarmIntegralM` below (derived from L(z), eq. 15, and checked against a numerical integral
 *   in tests/unit/hazard/entry.test.ts).
 */
export const ENTRY = {
  /** Atmospheric scale height H, m. */
  scaleHeightM: 8000,
  /** Surface air density rho0, kg/m³ (1, as in Collins 2005). */
  surfaceAirDensity: 1,
  /** Drag coefficient C_D. */
  dragCoefficient: 2,
  /** Pancake factor f_p: the swarm "bursts" when it has spread to f_p times its diameter. */
  pancakeFactor: 7,
} as const

const H = ENTRY.scaleHeightM
const RHO0 = ENTRY.surfaceAirDensity
const CD = ENTRY.dragCoefficient
const ALPHA = Math.sqrt(ENTRY.pancakeFactor * ENTRY.pancakeFactor - 1)
const FP2 = ENTRY.pancakeFactor * ENTRY.pancakeFactor

/**
 * Yield strength from bulk density, `Y = 10^(2.107 + 0.0624 sqrt(rho_i))`.
 * Source: Collins et al. 2005, MAPS 40(6), eq. 9.
 * @param densityKgM3 impactor bulk density, kg/m³
 * @returns strength, Pa
 */
export function strengthFromDensityPa(densityKgM3: number): number {
  return Math.exp(Math.LN10 * (2.107 + 0.0624 * Math.sqrt(densityKgM3)))
}

/**
 * Pancake diameter of the spreading swarm at altitude z below break-up,
 * `L(z) = L0 sqrt(1 + (2H/l)^2 (exp((z*-z)/(2H)) - 1)^2)`.
 * Source: Collins et al. 2005, eq. 15.
 * @param diameterM initial diameter L0, m; breakupAltitudeM z*, m; dispersionLengthM l, m; altitudeM z, m
 * @returns swarm diameter, m
 */
export function pancakeDiameterM(diameterM: number, breakupAltitudeM: number, dispersionLengthM: number, altitudeM: number): number {
  const k = 2 * H / dispersionLengthM
  const x = Math.expm1((breakupAltitudeM - altitudeM) / (2 * H))
  return diameterM * Math.sqrt(1 + k * k * x * x)
}

/**
 * Closed form of the swarm drag integral `J(z) = ∫_z^{z*} exp((z*-z')/H) (L(z')/L0)^2 dz'`, derived
 * here from eq. 15: with `x = exp((z*-z)/(2H)) - 1` and `k = 2H/l`,
 * `J = 2H [x + x^2/2 + k^2 (x^3/3 + x^4/4)]`. Speed below break-up is then (eq. 17)
 * `v(z) = v(z*) exp(-(3/4) C_D rho(z*) J / (rho_i L0 sin theta))`.
 * Source: Collins et al. 2005, eqs. 15 and 17 (replaces the misprinted eq. 20).
 * @param breakupAltitudeM z*, m; dispersionLengthM l, m; altitudeM z (< z*), m
 * @returns J, m
 */
export function swarmIntegralM(breakupAltitudeM: number, dispersionLengthM: number, altitudeM: number): number {
  const k = 2 * H / dispersionLengthM
  const x = Math.expm1((breakupAltitudeM - altitudeM) / (2 * H))
  return 2 * H * (x + x * x / 2 + k * k * x * x * x * (1 / 3 + x / 4))
}

/**
 * Input of `atmosphericEntry`: diameter m, bulk density kg/m³, entry speed km/s, angle from the horizontal degrees,
 * strength Pa (optional).
 */
export interface EntryInput {
  diameterM: number
  densityKgM3: number
  speedKmS: number
  angleDeg: number
  strengthPa?: number
}

/** Result of `atmosphericEntry` (units in the names; energies in Mt TNT). */
export interface EntryResult {
  strengthPa: number
  strengthFactor: number
  /** null when the body never breaks up. */
  breakupAltitudeM: number | null
  /** null when the body or its debris reaches the surface. */
  burstAltitudeM: number | null
  /** Speed at the burst altitude, km/s (null without an airburst). */
  burstSpeedKmS: number | null
  /** Speed with which the body, or after an airburst its decelerating debris, reaches the surface, km/s. */
  surfaceSpeedKmS: number
  /** Diameter of the body or of the spread debris cloud where it reaches the surface, m (same mass). */
  surfaceDiameterM: number
  /**
   * Height of the one point source that stands for the blast and the heat, m: the energy-weighted height of the
   * deposition — the air share at the burst altitude (airburst) or where an intact body's drag loss peaks,
   * H ln(2 a_v), and the surface share at 0. Continuous across the airburst boundary (ours, indicative).
   */
  sourceAltitudeM: number
  /** Kinetic energy at entry; energyAirMt + energySurfaceMt equals it. */
  energyMt: number
  energyAirMt: number
  energySurfaceMt: number
}

/** Allocation-free result used by the Monte Carlo; NaN marks "none". */
export interface EntryScratch {
  strengthPa: number
  strengthFactor: number
  breakupAltitudeM: number
  burstAltitudeM: number
  /** Speed at the burst (airburst) or at the surface, m/s. */
  finalSpeedMS: number
  /** Speed with which the body, or after an airburst its debris, reaches the surface, m/s. */
  surfaceSpeedMS: number
  /** Diameter of the body, or of the spread debris cloud, where it reaches the surface, m. */
  surfaceDiameterM: number
  /** Height of the equivalent point source of blast and heat, m (see EntryResult.sourceAltitudeM). */
  sourceAltitudeM: number
  airburst: boolean
  massKg: number
  energyJ: number
  energyAirJ: number
  energySurfaceJ: number
}

/** A fresh scratch record for `entryInto` (SI units, see EntryScratch). */
export function newEntryScratch(): EntryScratch {
  return {
    strengthPa: 0, strengthFactor: 0, breakupAltitudeM: NaN, burstAltitudeM: NaN, finalSpeedMS: 0, surfaceSpeedMS: 0,
    surfaceDiameterM: 0, sourceAltitudeM: 0, airburst: false,
    massKg: 0, energyJ: 0, energyAirJ: 0, energySurfaceJ: 0,
  }
}

/**
 * Pancake entry, writing into `out` (no allocation). SI units: m, kg/m³, m/s, radians, Pa.
 * Source: Collins et al. 2005, eqs. 8, 9, 11, 12, 16–19 and the corrected eq. 20 (see module note).
 */
export function entryInto(out: EntryScratch, L0: number, rhoI: number, v0: number, theta: number, Y: number): void {
  const sinT = Math.sin(theta)
  const m = massKg(L0, rhoI)
  // Exponent of eq. 8 at the surface, and the strength factor of eq. 12.
  const av = 3 * RHO0 * CD * H / (4 * rhoI * L0 * sinT)
  const rs = Y / (RHO0 * v0 * v0)
  const If = 2 * Math.E * av * rs
  out.strengthPa = Y
  out.strengthFactor = If
  out.massKg = m
  out.energyJ = 0.5 * m * v0 * v0
  let zStar = NaN
  if (If < 1) zStar = -H * (Math.log(rs) + 1.308 - 0.314 * If - 1.303 * Math.sqrt(1 - If))
  // Intact to the ground: eq. 8 at z = 0, not below the terminal speed (as the EIEP program does).
  const vTerm = Math.min(v0, Math.sqrt(4 * rhoI * L0 * G_MS2 / (3 * RHO0 * CD)))
  const vIntact = Math.max(vTerm, v0 * Math.exp(-av))
  // An intact body deposits most where eq. 8's energy loss peaks, z = H ln(2 a_v) (0 when that is below ground).
  const zIntact = av > 0.5 ? H * Math.log(2 * av) : 0
  if (!(zStar > 0)) {
    setSurface(out, m, v0, vIntact, NaN, L0)
    out.sourceAltitudeM = zIntact * (1 - (vIntact * vIntact) / (v0 * v0))
    return
  }
  // A body whose strength is within BLEND_LO..1 of the peak stagnation pressure (I_f) may or may not break: a
  // share w of its mass is taken to survive intact, so that the energy reaching the surface is continuous in I_f.
  const w = If > BLEND_LO ? smoothstep((If - BLEND_LO) / (1 - BLEND_LO)) : 0
  const rhoStar = RHO0 * Math.exp(-zStar / H)
  const vStar = v0 * Math.exp(-av * rhoStar / RHO0)
  const l = L0 * sinT * Math.sqrt(rhoI / (CD * rhoStar))
  const zb = zStar - 2 * H * Math.log(1 + (l / (2 * H)) * ALPHA)
  const fac = 0.75 * Math.sqrt(CD * rhoStar / rhoI)
  if (zb > 0) {
    const a = ALPHA
    const vb = vStar * Math.exp(-fac * (a / 24) * (24 + 8 * a * a + 6 * a * l / H + 3 * a * a * a * l / H))
    // Below the burst the debris keeps its mass and its pancake diameter f_p L0 and goes on decelerating by drag
    // (eq. 8 with f_p^2 times the area): whatever speed is left reaches the surface. At z_b -> 0 this equals the
    // swarm branch below, so the energy reaching the surface is continuous across the airburst boundary.
    const vBroken = vb * Math.exp(-FP2 * av * -Math.expm1(-zb / H))
    const vs = blendSpeed(vBroken, vIntact, w)
    out.sourceAltitudeM = (1 - w) * zb * (1 - (vBroken * vBroken) / (v0 * v0)) + w * zIntact * (1 - (vIntact * vIntact) / (v0 * v0))
    out.breakupAltitudeM = zStar
    out.burstAltitudeM = zb
    out.finalSpeedMS = vb
    out.surfaceSpeedMS = vs
    out.surfaceDiameterM = (1 - w) * ENTRY.pancakeFactor * L0 + w * L0
    out.airburst = true
    out.energySurfaceJ = 0.5 * m * vs * vs
    out.energyAirJ = out.energyJ - out.energySurfaceJ
    return
  }
  // Swarm reaches the surface: eq. 17 with the closed-form integral (fac * 2H/l * [...] = fac * J / l).
  const vs = vStar * Math.exp(-fac * swarmIntegralM(zStar, l, 0) / l)
  setSurface(out, m, v0, blendSpeed(vs, vIntact, w), zStar, (1 - w) * pancakeDiameterM(L0, zStar, l, 0) + w * L0)
  out.sourceAltitudeM = w * zIntact * (1 - (vIntact * vIntact) / (v0 * v0))
}

/** Strength factor from which a share of the mass is taken to survive intact (ours, indicative). */
const BLEND_LO = 0.7
function smoothstep(x: number): number {
  return x * x * (3 - 2 * x)
}
/** Speed whose kinetic energy is the mass-weighted mean of the broken (share 1 - w) and intact (w) outcomes. */
function blendSpeed(vBroken: number, vIntact: number, w: number): number {
  return w > 0 ? Math.sqrt((1 - w) * vBroken * vBroken + w * vIntact * vIntact) : vBroken
}

function setSurface(out: EntryScratch, m: number, v0: number, vs: number, zStar: number, diameterM: number): void {
  out.surfaceDiameterM = diameterM
  out.breakupAltitudeM = zStar
  out.burstAltitudeM = NaN
  out.finalSpeedMS = vs
  out.surfaceSpeedMS = vs
  out.airburst = false
  out.energySurfaceJ = 0.5 * m * vs * vs
  out.energyAirJ = out.energyJ - out.energySurfaceJ
}

/**
 * Fate of an impactor in the atmosphere (Collins et al. 2005 pancake model, eqs. 8–20).
 * @param i.diameterM diameter, m; i.densityKgM3 bulk density, kg/m³; i.speedKmS entry speed, km/s;
 *   i.angleDeg entry angle from the horizontal, degrees; i.strengthPa yield strength, Pa (default eq. 9)
 * Below an airburst the debris cloud (mass m, diameter f_p L0) decelerates as eq. 8 with f_p^2 times the
 * cross-section: `v_s = v_b exp(-f_p^2 a_v (1 - exp(-z_b/H)))`, `a_v = 3 rho0 C_D H / (4 rho_i L0 sin theta)`.
 * This continuation is ours (indicative): it conserves energy and joins the swarm branch at z_b = 0.
 * @returns strength (Pa), strength factor (eq. 12, dimensionless), break-up and burst altitudes (m, or
 *   null), speeds at the burst (km/s or null) and at the surface (km/s; the debris after an airburst),
 *   energies in Mt TNT: at entry, delivered to the surface (`m v_s^2/2`) and deposited in the air (the rest)
 */
export function atmosphericEntry(i: EntryInput): EntryResult {
  const s = newEntryScratch()
  const Y = i.strengthPa ?? strengthFromDensityPa(i.densityKgM3)
  entryInto(s, i.diameterM, i.densityKgM3, i.speedKmS * 1000, i.angleDeg * DEG, Y)
  return {
    strengthPa: s.strengthPa,
    strengthFactor: s.strengthFactor,
    breakupAltitudeM: Number.isNaN(s.breakupAltitudeM) ? null : s.breakupAltitudeM,
    burstAltitudeM: s.airburst ? s.burstAltitudeM : null,
    burstSpeedKmS: s.airburst ? s.finalSpeedMS / 1000 : null,
    surfaceSpeedKmS: s.surfaceSpeedMS / 1000,
    surfaceDiameterM: s.surfaceDiameterM,
    sourceAltitudeM: s.sourceAltitudeM,
    energyMt: s.energyJ / J_PER_MT,
    energyAirMt: s.energyAirJ / J_PER_MT,
    energySurfaceMt: s.energySurfaceJ / J_PER_MT,
  }
}
