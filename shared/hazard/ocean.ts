import { G_MS2, WATER_DENSITY_KGM3, DEG } from './units'
import type { TsunamiLawKey, TsunamiSourceLaw } from './types'

/**
 * Ocean impacts and the tsunami (sources and limits: shared/hazard/README.md, "Ocean impacts").
 * Cavity and sea-floor laws: Collins, Melosh & Marcus 2005 (MAPS 40(6), 817–840), checked against the
 * Earth Impact Effects Program (EIEP) source (subs `find_crater`, `find_tsunami`). The wave at the
 * source is reported as a band between two published source laws (TSUNAMI_SOURCE_LAWS), shoaled to
 * each coastal site by energy flux with the dispersive group speed, then run up on the site's shelf
 * and beach profile (ShoreProfile) with a continuous form of Synolakis 1987.
 */
export const OCEAN = {
  /** Drag coefficient of the impactor in water (Collins et al. 2005, sea-floor speed). */
  waterDragCoefficient: 0.877,
  /** Rim-wave amplitude per cavity diameter, the low source law (EIEP `find_tsunami`: 0.07, about 1/14). */
  rimWaveFactor: 0.07,
  /** Transient cavity depth per cavity diameter, 1/2.828 (EIEP `find_tsunami`, collapse-wave note). */
  cavityDepthRatio: 1 / 2.828,
  /** Breaking index: a wave breaks when its height exceeds 0.78 of the depth (McCowan 1894). */
  breakingIndex: 0.78,
  /** Beach slope of a coastal site when the scenario gives none, degrees (common practice, no source). */
  defaultBeachSlopeDeg: 1,
  /**
   * Shelf width when the scenario gives none, km: the distance over which the sea floor rises from the offshore
   * depth to the beach toe; 10 km makes an inner-shelf gradient of about 1:250 for a 50 m offshore depth
   * (typical inner shelves 1:100–1:1000; common practice, no source).
   */
  defaultShelfWidthKm: 10,
  /** Depth of the beach toe, where the shelf meets the beach slope, m (common practice, no source; at most the offshore depth). */
  toeDepthM: 10,
  /** Gradient of the continental slope seaward of the shelf edge, degrees (typical 2–5°, from memory). */
  continentalSlopeDeg: 3,
  /**
   * A realisation "makes a tsunami" when its wave (source laws mixed, 1/r decay) is at least tsunamiMinAmplitudeM at
   * tsunamiReferenceRangeM from the impact point: a wave that matters on a nearby coast, not the splash of a small
   * cavity (common practice, no source).
   */
  tsunamiMinAmplitudeM: 1,
  tsunamiReferenceRangeM: 10_000,
} as const

/**
 * The two ends of the published spread of impact-tsunami source laws. Both decay as 1/r beyond the
 * cavity radius; they differ in the amplitude at the rim (a factor 1/(2.828 × 0.07) = 5.05 unless
 * the sea depth caps it), which spans the factor 3–5 by which linear theory exceeds the rim-wave law.
 */
export const TSUNAMI_SOURCE_LAWS: readonly TsunamiSourceLaw[] = [
  {
    key: 'low',
    name: 'Rim wave, 1/r from the cavity radius',
    source: 'Collins, Melosh & Marcus 2005 (MAPS 40, 817–840) as coded in the Earth Impact Effects Program, after Wünnemann, '
      + 'Collins & Weiss 2010 (Rev. Geophys. 48, RG4006): A(r) = min(0.07 D_tcw, h) · min(1, (D_tcw/2)/r)',
  },
  {
    key: 'high',
    name: 'Cavity-depth wave, linear theory',
    source: 'Ward & Asphaug 2000 (Icarus 145, 64–78): the wave of a transient cavity of depth d_c = D_tcw/2.828 and radius '
      + 'R_c = D_tcw/2, A(r) = min(d_c, h) · min(1, R_c/r) (our summary of their linear-theory amplitudes, from memory)',
  },
]

/**
 * Transient cavity diameter in water, `D_tcw = 1.365 (rho_i/rho_w)^(1/3) L^0.78 v^0.44 g^-0.22 sin(theta)^(1/3)`
 * (pi-scaling, C = 1.88, beta = 0.22). Source: Collins et al. 2005, eq. 21 with the water constants (number from memory).
 * Continuous in the speed and 0 at 0, so the wave of a slow debris cloud fades smoothly.
 * @param i.diameterM impactor diameter, m; i.densityKgM3, kg/m³; i.speedKmS speed at the sea surface,
 *   km/s; i.angleDeg angle from the horizontal, degrees
 * @returns cavity diameter, m (0 when the speed is 0)
 */
export function waterCavityDiameterM(i: { diameterM: number; densityKgM3: number; speedKmS: number; angleDeg: number }): number {
  return cavityDiameterSI(i.diameterM, i.densityKgM3, i.speedKmS * 1000, Math.sin(i.angleDeg * DEG))
}

const G_POW = Math.pow(G_MS2, -0.22)
// Module-level copies for the Monte Carlo: imported bindings are read through accessors in some loaders.
const G = G_MS2, INV_RHO_W = 1 / WATER_DENSITY_KGM3

/** `waterCavityDiameterM` in SI numbers (m, kg/m³, m/s, sin of the angle), for the Monte Carlo. */
export function cavityDiameterSI(diameterM: number, densityKgM3: number, speedMS: number, sinAngle: number): number {
  if (!(speedMS > 0)) return 0
  return 1.365 * Math.cbrt(densityKgM3 * INV_RHO_W * sinAngle)
    * Math.exp(0.78 * Math.log(diameterM) + 0.44 * Math.log(speedMS)) * G_POW
}

/**
 * Speed at the sea floor after crossing a water layer, `v_sf = v exp(-3 rho_w C_D d / (2 rho_i L sin theta))`,
 * C_D = 0.877. Source: Collins et al. 2005 (sea-floor speed, eq. 22 — number from memory), verified in the EIEP source.
 * @param i.speedKmS speed at the sea surface, km/s; i.diameterM, m; i.densityKgM3, kg/m³;
 *   i.angleDeg, degrees; i.waterDepthM water depth d, m
 * @returns speed at the sea floor, km/s
 */
export function seafloorSpeedKmS(i: {
  speedKmS: number
  diameterM: number
  densityKgM3: number
  angleDeg: number
  waterDepthM: number
}): number {
  return i.speedKmS * Math.exp(-3 * WATER_DENSITY_KGM3 * OCEAN.waterDragCoefficient * i.waterDepthM
    / (2 * i.densityKgM3 * i.diameterM * Math.sin(i.angleDeg * DEG)))
}

/**
 * Wave amplitude at the cavity rim under a source law: low `min(0.07 D_tcw, h)` (EIEP rim wave),
 * high `min(D_tcw/2.828, h)` (Ward & Asphaug 2000, cavity depth). *Indicative*; see TSUNAMI_SOURCE_LAWS.
 * @param cavityDiameterM D_tcw, m; waterDepthM h, m; law 'low' (default) or 'high'
 * @returns amplitude, m
 */
export function rimWaveAmplitudeM(cavityDiameterM: number, waterDepthM: number, law: TsunamiLawKey = 'low'): number {
  return Math.min((law === 'high' ? OCEAN.cavityDepthRatio : OCEAN.rimWaveFactor) * cavityDiameterM, waterDepthM)
}

/**
 * Deep-water amplitude at a distance from an ocean impact under a source law: the rim amplitude
 * decaying as 1/r beyond the cavity radius, `A(r) = A0 min(1, (D_tcw/2)/r)`. Sources: TSUNAMI_SOURCE_LAWS
 * (Collins et al. 2005 / EIEP for 'low'; Ward & Asphaug 2000, Icarus 145, 64–78, for 'high'). *Indicative*.
 * @param i.cavityDiameterM D_tcw, m; i.waterDepthM depth at the impact, m; i.distanceM distance, m;
 *   i.law source law (default 'low')
 * @returns amplitude, m
 */
export function tsunamiAmplitudeAtM(i: { cavityDiameterM: number; waterDepthM: number; distanceM: number; law?: TsunamiLawKey }): number {
  const a0 = rimWaveAmplitudeM(i.cavityDiameterM, i.waterDepthM, i.law)
  const r0 = i.cavityDiameterM / 2
  return i.distanceM > r0 ? a0 * r0 / i.distanceM : a0
}

/**
 * Wavenumber k of a wave of angular frequency omega over depth h, from the linear dispersion relation
 * `omega^2 = g k tanh(k h)` (Airy theory; common practice): the explicit start of Fenton & McKee 1990
 * (Coastal Eng. 14, 499–513, from memory) refined by Newton steps.
 * @param omega rad/s; depthM h, m
 * @returns k, rad/m
 */
export function wavenumberFor(omega: number, depthM: number): number {
  const y = omega * omega * depthM / G_MS2
  let kh = y / Math.pow(Math.tanh(Math.pow(y, 0.75)), 2 / 3)
  for (let it = 0; it < 4; it++) {
    const t = Math.tanh(kh)
    const f = kh * t - y
    kh -= f / (t + kh * (1 - t * t))
  }
  return kh / depthM
}

/** `c_g = (c/2)(1 + 2kh / sinh 2kh)` for wavenumber k over depth h (m/s); the long-wave limit is sqrt(g h). */
function groupSpeedK(k: number, depthM: number): number {
  const kh = k * depthM
  const c = Math.sqrt(G / k * Math.tanh(kh))
  const x = 2 * kh
  return Math.min(0.5 * c * (1 + (x < 700 ? x / Math.sinh(x) : 0)), Math.sqrt(G * depthM))
}

/**
 * Energy-flux shoaling of a wave of wavelength lambda (at depth h1) from h1 to h2 at constant period,
 * `K_s = A2/A1 = sqrt(c_g1 / c_g2)` (linear theory, no breaking; e.g. Dean & Dalrymple 1991, from memory).
 * It equals Green's law `(h1/h2)^(1/4)` for long waves and tends to 1 for waves short against both depths,
 * which Green's law would over-amplify.
 * @param wavelengthM lambda at h1, m; fromDepthM h1, m; toDepthM h2, m
 * @returns K_s, dimensionless
 */
export function shoalingFactor(wavelengthM: number, fromDepthM: number, toDepthM: number): number {
  const k1 = 2 * Math.PI / wavelengthM
  const omega = Math.sqrt(G_MS2 * k1 * Math.tanh(k1 * fromDepthM))
  return Math.sqrt(groupSpeedK(k1, fromDepthM) / groupSpeedK(wavenumberFor(omega, toDepthM), toDepthM))
}

/**
 * Shoaling from depth h1 to h2, stopped at breaking (height <= 0.78 h2, McCowan 1894). With a wavelength:
 * energy flux with the dispersive group speed (`shoalingFactor`); without: Green's law `(h1/h2)^(1/4)`, valid
 * for long waves only (Green 1838, common practice). Short impact waves break on the outer shelf
 * (Korycansky & Lynett 2005, GRL 32, L10608).
 * @param i.amplitudeM amplitude at h1, m; i.fromDepthM h1, m; i.toDepthM h2, m; i.wavelengthM at h1, m (optional)
 * @returns amplitude at h2, m, and whether it was capped by breaking
 */
export function shoaledAmplitudeM(i: { amplitudeM: number; fromDepthM: number; toDepthM: number; wavelengthM?: number }):
{ amplitudeM: number; breaking: boolean } {
  const k = i.wavelengthM === undefined
    ? Math.pow(i.fromDepthM / i.toDepthM, 0.25)
    : shoalingFactor(i.wavelengthM, i.fromDepthM, i.toDepthM)
  const a = i.amplitudeM * k
  const cap = OCEAN.breakingIndex * i.toDepthM
  return a > cap ? { amplitudeM: cap, breaking: true } : { amplitudeM: a, breaking: false }
}

/** Synolakis 1987 limit of the non-breaking law, `0.818 (cot beta)^(-10/9)` (H/d, dimensionless). */
export function breakingLimit(cotBeta: number): number {
  return 0.818 * Math.pow(cotBeta, -10 / 9)
}

/**
 * Run-up per toe depth R/d of a wave of height H/d at the toe of a plane beach of slope cot beta, continuous:
 * below the limit `H/d < 0.818 cot^(-10/9)` the non-breaking law `2.831 sqrt(cot) (H/d)^(5/4)`; beyond it
 * Synolakis's breaking exponent 0.582 scaled to meet the non-breaking law at the limit, `R_lim (x/x_lim)^0.582`
 * (our continuous form: on his 1:19.85 laboratory beach it lies 8 % above his fit 1.109 (H/d)^0.582, which
 * would fall ×1.2–×1.7 at the limit on other slopes). Source: Synolakis 1987, JFM 185, 523–545 (numbers from memory).
 */
export function runUpRatio(heightOverDepth: number, cotBeta: number): number {
  if (!(heightOverDepth > 0)) return 0
  const lim = breakingLimit(cotBeta)
  const k = 2.831 * Math.sqrt(cotBeta)
  if (heightOverDepth < lim) return k * Math.pow(heightOverDepth, 1.25)
  return k * Math.pow(lim, 1.25) * Math.pow(heightOverDepth / lim, 0.582)
}

/**
 * Run-up on a plane beach (see `runUpRatio`): continuous and increasing in the wave height, with the slope
 * acting on both branches. Source: Synolakis 1987, J. Fluid Mech. 185, 523–545, eqs. 4.5 and 4.14 (numbers
 * from memory), breaking branch made continuous here. *Indicative* beyond the limit.
 * @param i.waveHeightM wave height H at the toe depth, m; i.depthM toe depth d, m; i.beachSlopeDeg beta, degrees
 * @returns run-up height, m, and whether the breaking branch was used
 */
export function runUpM(i: { waveHeightM: number; depthM: number; beachSlopeDeg: number }): { runUpM: number; breaking: boolean } {
  const cot = 1 / Math.tan(i.beachSlopeDeg * DEG)
  const hd = i.waveHeightM / i.depthM
  if (!(hd > 0)) return { runUpM: 0, breaking: false }
  return { runUpM: i.depthM * runUpRatio(hd, cot), breaking: hd >= breakingLimit(cot) }
}

/**
 * Long-wave speed `c = sqrt(g h)`: the fastest a water wave travels over depth h, so the earliest
 * arrival; impact waves are short and dispersive and the largest come later. Source: common practice (Lamb 1932).
 * @param depthM water depth, m
 * @returns speed, m/s
 */
export function longWaveSpeedMS(depthM: number): number {
  return Math.sqrt(G_MS2 * depthM)
}

/**
 * Speed of the main impact wave: the linear group speed of the dominant wavelength lambda = 2 D_tcw (as
 * in the EIEP program), `c_g = (c/2)(1 + 2kh / sinh 2kh)`, `c = sqrt(g/k tanh kh)`, k = 2 pi/lambda; the
 * energy travels at c_g (<= c <= sqrt(g h)). Source: Airy theory (e.g. Lamb 1932; common practice); EIEP `find_tsunami`.
 * @param cavityDiameterM D_tcw, m; depthM water depth, m
 * @returns speed, m/s
 */
export function impactWaveSpeedMS(cavityDiameterM: number, depthM: number): number {
  if (!(cavityDiameterM > 0)) return 0
  return groupSpeedK(Math.PI / cavityDiameterM, depthM)
}

/** Grid of ln(wavelength) on which each site tabulates its shoaling factors: 1 m to 2000 km. */
export const WAVELENGTH_GRID = { lnMin: 0, lnMax: Math.log(2e6), n: 97 } as const
const LN_STEP = (WAVELENGTH_GRID.lnMax - WAVELENGTH_GRID.lnMin) / (WAVELENGTH_GRID.n - 1)

/**
 * Position u of a wavelength on WAVELENGTH_GRID, clamped to [0, n - 1 - 1e-9]: with j = floor(u) and
 * f = u - j a tabulated value is T[j] + f (T[j+1] - T[j]).
 */
export function wavelengthGridPosition(wavelengthM: number): number {
  const u = (Math.log(wavelengthM) - WAVELENGTH_GRID.lnMin) * INV_STEP
  return u > 0 ? (u < U_MAX ? u : U_MAX) : 0
}
const INV_STEP = 1 / LN_STEP
const U_MAX = WAVELENGTH_GRID.n - 1 - 1e-9

/** Inputs of a site's shore profile (metres and degrees; absent fields take OCEAN's defaults). */
export interface ShoreProfileInput { openDepthM: number; offshoreDepthM: number; shelfWidthKm?: number; beachSlopeDeg?: number }

/**
 * A coastal site's profile, seen from the open ocean: open depth h0 (the impact's), a continental slope
 * (OCEAN.continentalSlopeDeg) up to the shelf edge at the offshore depth d_s, a shelf rising linearly over
 * its width to the beach toe at d_t = min(OCEAN.toeDepthM, d_s), and a plane beach of slope beta to the
 * shore. Holds the per-site constants the Monte Carlo reads: shoaling factors to d_s and to d_t on
 * WAVELENGTH_GRID, and the run-up per metre of breaking depth on each segment.
 */
export interface ShoreProfile {
  openDepthM: number
  offshoreDepthM: number
  toeDepthM: number
  shelfWidthM: number
  cotBeach: number
  cotShelf: number
  cotSlope: number
  /** Energy-flux shoaling factor from the open depth to d_s, and to d_t, per grid wavelength. */
  toOffshore: Float64Array
  toToe: Float64Array
  /** Run-up per metre of breaking depth, R/d of a breaking wave (H = 0.78 d), on the beach, shelf and continental slope. */
  rateBeach: number
  rateShelf: number
  rateSlope: number
}

/**
 * Builds a site's shore profile and its tables (see ShoreProfile). Shoaling: `shoalingFactor` (energy flux,
 * dispersive group speed). Sources as in `runUpOnProfileM`.
 */
export function shoreProfile(i: ShoreProfileInput): ShoreProfile {
  const h0 = i.openDepthM
  const ds = i.offshoreDepthM
  const dt = Math.min(OCEAN.toeDepthM, ds)
  const W = 1000 * (i.shelfWidthKm ?? OCEAN.defaultShelfWidthKm)
  const cotBeach = 1 / Math.tan((i.beachSlopeDeg ?? OCEAN.defaultBeachSlopeDeg) * DEG)
  const cotSlope = 1 / Math.tan(OCEAN.continentalSlopeDeg * DEG)
  // A shelf flatter than the beach, and no steeper than the continental slope.
  const cotShelf = ds > dt ? Math.max(cotSlope, W / (ds - dt)) : cotBeach
  const n = WAVELENGTH_GRID.n
  const toOffshore = new Float64Array(n), toToe = new Float64Array(n)
  for (let j = 0; j < n; j++) {
    const lambda = Math.exp(WAVELENGTH_GRID.lnMin + j * LN_STEP)
    toOffshore[j] = shoalingFactor(lambda, h0, ds)
    toToe[j] = shoalingFactor(lambda, h0, dt)
  }
  const rate = (cot: number) => runUpRatio(OCEAN.breakingIndex, cot)
  return {
    openDepthM: h0, offshoreDepthM: ds, toeDepthM: dt, shelfWidthM: W, cotBeach, cotShelf, cotSlope, toOffshore, toToe,
    rateBeach: rate(cotBeach), rateShelf: rate(cotShelf), rateSlope: rate(cotSlope),
  }
}

/**
 * Run-up at a site from the height the wave would have at the beach toe if it did not break (`toeHeightM`,
 * the open-ocean amplitude times the profile's shoaling factor to the toe). Below the breaking height
 * 0.78 d_t (McCowan 1894) it runs up the beach by `runUpRatio` (Synolakis 1987, continuous form). Beyond it
 * the wave breaks at the depth d_b where Green's law `H (d_t/d)^(1/4)` meets 0.78 d, and runs up as a wave
 * of height 0.78 d_b at a toe of depth d_b would on a plane beach — layer by layer: each metre of depth
 * between the shore and d_b adds the R/d of that plane-beach law at the local slope of its segment (beach,
 * shelf, continental slope). On a plane beach this is exactly Synolakis at the breaking point; a wide, gentle
 * shelf adds less run-up per metre of breaking depth. Continuous, strictly increasing in toeHeightM, no
 * cap; for waves that do not break, non-increasing in beach steepness.
 * Sources: Synolakis 1987 (JFM 185); McCowan 1894 (Phil. Mag. 38); Green 1838 (common practice). *Indicative*.
 * @param p the site's ShoreProfile; toeHeightM unbroken wave height at the toe, m
 * @returns run-up height above sea level, m
 */
export function runUpOnProfileM(p: ShoreProfile, toeHeightM: number): number {
  if (!(toeHeightM > 0)) return 0
  const dt = p.toeDepthM
  const x = toeHeightM / dt
  if (x < OCEAN.breakingIndex) return dt * runUpRatio(x, p.cotBeach)
  const db = dt * Math.pow(x / OCEAN.breakingIndex, 0.8)
  const ds = p.offshoreDepthM
  const onShelf = (db < ds ? db : ds) - dt
  return dt * p.rateBeach + (onShelf > 0 ? onShelf * p.rateShelf : 0) + (db > ds ? (db - ds) * p.rateSlope : 0)
}

/**
 * Least unbroken toe height whose run-up reaches `runUpM` on the profile (bisection of the monotone
 * `runUpOnProfileM`), m; Infinity when no wave on this profile runs up that high.
 */
export function toeHeightForRunUpM(p: ShoreProfile, runUpM: number): number {
  if (!(runUpM > 0)) return 0
  let hi = p.toeDepthM
  for (let k = 0; k < 200 && runUpOnProfileM(p, hi) < runUpM; k++) hi *= 2
  if (runUpOnProfileM(p, hi) < runUpM) return Infinity
  let lo = 0
  for (let k = 0; k < 100; k++) {
    const m = 0.5 * (lo + hi)
    if (runUpOnProfileM(p, m) >= runUpM) hi = m
    else lo = m
  }
  return hi
}

/** What `tsunamiAtSite` returns: lengths m, speed m/s. */
export interface SiteWave {
  cavityDiameterM: number
  sourceAmplitudeM: number
  offshoreAmplitudeM: number
  toeHeightM: number
  runUpM: number
  mainWaveSpeedMS: number
}

/**
 * The Monte Carlo's tsunami chain for one realisation and one site, as a plain function (the engine runs the
 * same steps inlined in sample.ts and sites.ts; a test checks that they agree): cavity from the speed at the
 * sea surface, source amplitude `low^(1-w) high^w` between the two source laws, 1/r decay beyond the cavity
 * radius, shoaling to the offshore depth (capped at breaking) and to the toe on the site's tables, run-up.
 * Sources: as the functions it calls. *Indicative*.
 * @param i.diameterM m; i.densityKgM3 kg/m³; i.surfaceSpeedMS speed reaching the sea, m/s; i.angleDeg degrees;
 *   i.surfaceDiameterM diameter of the body or debris cloud reaching the sea, m (default diameterM);
 *   i.distanceM from the impact, m; i.lawWeight w in [0, 1] (0: low law, 1: high law); i.profile the site's ShoreProfile
 */
export function tsunamiAtSite(i: {
  diameterM: number
  densityKgM3: number
  surfaceSpeedMS: number
  angleDeg: number
  distanceM: number
  lawWeight: number
  profile: ShoreProfile
  surfaceDiameterM?: number
}): SiteWave {
  const p = i.profile
  const h = p.openDepthM
  // What arrives may be a spread debris cloud (EntryResult.surfaceDiameterM): same mass, wider.
  const ds = i.surfaceDiameterM ?? i.diameterM, q = i.diameterM / ds
  const dtc = cavityDiameterSI(ds, i.densityKgM3 * q * q * q, i.surfaceSpeedMS, Math.sin(i.angleDeg * DEG))
  if (!(dtc > 0)) return { cavityDiameterM: 0, sourceAmplitudeM: 0, offshoreAmplitudeM: 0, toeHeightM: 0, runUpM: 0, mainWaveSpeedMS: 0 }
  const lo = Math.min(OCEAN.rimWaveFactor * dtc, h), hi = Math.min(OCEAN.cavityDepthRatio * dtc, h)
  const a0 = lo * Math.exp(i.lawWeight * Math.log(hi / lo))
  const rc = dtc / 2
  const a = i.distanceM > rc ? a0 * rc / i.distanceM : a0
  const u = wavelengthGridPosition(2 * dtc)
  const j = u | 0, f = u - j
  const ks = p.toOffshore[j]! + f * (p.toOffshore[j + 1]! - p.toOffshore[j]!)
  const kt = p.toToe[j]! + f * (p.toToe[j + 1]! - p.toToe[j]!)
  const toe = a * kt
  return {
    cavityDiameterM: dtc, sourceAmplitudeM: a0, offshoreAmplitudeM: Math.min(a * ks, OCEAN.breakingIndex * p.offshoreDepthM),
    toeHeightM: toe, runUpM: runUpOnProfileM(p, toe), mainWaveSpeedMS: impactWaveSpeedMS(dtc, h),
  }
}
