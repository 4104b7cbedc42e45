import { G_MS2, WATER_DENSITY_KGM3, DEG } from './units'

/**
 * Ocean impacts and the tsunami. The cavity and sea-floor laws are those of Collins, Melosh & Marcus
 * 2005 (MAPS 40(6), 817–840), verified against the Earth Impact Effects Program source (subs
 * `calc_energy`, `find_crater`, `find_tsunami`): the water cavity `1.88 (m/rho_w)^(1/3) (1.61 g L/v^2)^-0.22
 * sin^(1/3)theta` (= 1.365 (rho_i/rho_w)^(1/3) L^0.78 v^0.44 g^-0.22 sin^(1/3)theta, the form here),
 * the sea-floor speed with C_D = 0.877, and the rim wave `min(0.07 D_tcw, h)` (≈ D_tcw/14) decaying as
 * 1/r. The program bounds the distance scale between D_tcw/2 (lower) and D_tcw (upper); following
 * hazard-model.md we decay from the cavity radius D_tcw/2, the lower bound: the figure is
 * *indicative* and may be low by up to a factor of 2 (Ward & Asphaug 2000, Icarus 145, 64–78;
 * Wünnemann, Collins & Weiss 2010, Rev. Geophys. 48, RG4006).
 */
export const OCEAN = {
  /** Drag coefficient of the impactor in water (Collins et al. 2005, sea-floor speed). */
  waterDragCoefficient: 0.877,
  /** Rim-wave amplitude per cavity diameter (EIEP program: 0.07, about 1/14). */
  rimWaveFactor: 0.07,
  /** Breaking index: a wave breaks when its height exceeds 0.78 of the depth (McCowan 1894). */
  breakingIndex: 0.78,
  /** Beach slope of a coastal site when the scenario gives none, degrees (common practice, no source). */
  defaultBeachSlopeDeg: 1,
} as const

/**
 * Transient cavity diameter in water, `D_tcw = 1.365 (rho_i/rho_w)^(1/3) L^0.78 v^0.44 g^-0.22 sin(theta)^(1/3)`
 * (pi-scaling, C = 1.88, beta = 0.22). Source: Collins et al. 2005, eq. 21 with the water constants (number from memory).
 * @param i.diameterM impactor diameter, m; i.densityKgM3, kg/m³; i.speedKmS speed at the sea surface,
 *   km/s; i.angleDeg angle from the horizontal, degrees
 * @returns cavity diameter, m (0 when the speed is 0)
 */
export function waterCavityDiameterM(i: { diameterM: number; densityKgM3: number; speedKmS: number; angleDeg: number }): number {
  return cavityDiameterSI(i.diameterM, i.densityKgM3, i.speedKmS * 1000, Math.sin(i.angleDeg * DEG))
}

const G_POW = Math.pow(G_MS2, -0.22)

/** `waterCavityDiameterM` in SI numbers (m, kg/m³, m/s, sin of the angle), for the Monte Carlo. */
export function cavityDiameterSI(diameterM: number, densityKgM3: number, speedMS: number, sinAngle: number): number {
  if (!(speedMS > 0)) return 0
  return 1.365 * Math.cbrt(densityKgM3 / WATER_DENSITY_KGM3 * sinAngle)
    * Math.exp(0.78 * Math.log(diameterM) + 0.44 * Math.log(speedMS)) * G_POW
}

/**
 * Speed at the sea floor after crossing a water layer, `v_sf = v exp(-3 rho_w C_D d / (2 rho_i L sin theta))`,
 * C_D = 0.877. Source: Collins et al. 2005 (sea-floor speed, eq. 22 — number from memory), verified in the EIEP source.
 * @param i.speedKmS speed at the sea surface, km/s; i.diameterM, m; i.densityKgM3, kg/m³;
 *   i.angleDeg, degrees; i.waterDepthM water depth d, m
 * @returns speed at the sea floor, km/s
 */
export function seafloorSpeedKmS(i: { speedKmS: number; diameterM: number; densityKgM3: number; angleDeg: number; waterDepthM: number }): number {
  return i.speedKmS * Math.exp(-3 * WATER_DENSITY_KGM3 * OCEAN.waterDragCoefficient * i.waterDepthM
    / (2 * i.densityKgM3 * i.diameterM * Math.sin(i.angleDeg * DEG)))
}

/**
 * Rim-wave amplitude at the cavity, `min(0.07 D_tcw, h)`. Source: EIEP program after Wünnemann,
 * Collins & Weiss 2010 (Rev. Geophys. 48, RG4006); *indicative*.
 * @param cavityDiameterM D_tcw, m; waterDepthM h, m
 * @returns amplitude, m
 */
export function rimWaveAmplitudeM(cavityDiameterM: number, waterDepthM: number): number {
  return Math.min(OCEAN.rimWaveFactor * cavityDiameterM, waterDepthM)
}

/**
 * Deep-water wave amplitude at a distance from an ocean impact: the rim wave decaying as 1/r beyond the
 * cavity radius, `A(r) = A0 min(1, (D_tcw/2)/r)`. Sources: Ward & Asphaug 2000 (Icarus 145, 64–78);
 * Wünnemann et al. 2010; EIEP program. *Indicative* (see module note).
 * @param i.cavityDiameterM D_tcw, m; i.waterDepthM depth at the impact, m; i.distanceM distance, m
 * @returns amplitude, m
 */
export function tsunamiAmplitudeAtM(i: { cavityDiameterM: number; waterDepthM: number; distanceM: number }): number {
  const a0 = rimWaveAmplitudeM(i.cavityDiameterM, i.waterDepthM)
  const r0 = i.cavityDiameterM / 2
  return i.distanceM > r0 ? a0 * r0 / i.distanceM : a0
}

/**
 * Green's law shoaling, `A2 = A1 (h1/h2)^(1/4)`, stopped at breaking (height <= 0.78 h2, McCowan 1894).
 * Sources: Green 1838 (common practice); McCowan 1894, Phil. Mag. 38, 351–358; short impact waves break
 * on the outer shelf (Korycansky & Lynett 2005, GRL 32, L10608).
 * @param i.amplitudeM amplitude at depth h1, m; i.fromDepthM h1, m; i.toDepthM h2, m
 * @returns amplitude at h2, m, and whether it was capped by breaking
 */
export function shoaledAmplitudeM(i: { amplitudeM: number; fromDepthM: number; toDepthM: number }): { amplitudeM: number; breaking: boolean } {
  const a = i.amplitudeM * Math.pow(i.fromDepthM / i.toDepthM, 0.25)
  const cap = OCEAN.breakingIndex * i.toDepthM
  return a > cap ? { amplitudeM: cap, breaking: true } : { amplitudeM: a, breaking: false }
}

/**
 * Run-up on a plane beach. Non-breaking solitary wave: `R/d = 2.831 sqrt(cot beta) (H/d)^(5/4)`, valid
 * while `H/d < 0.818 (cot beta)^(-10/9)`; beyond it the breaking-wave fit of the same paper,
 * `R/d = 1.109 (H/d)^0.582` (laboratory beach 1:19.85; used for every slope — indicative).
 * Source: Synolakis 1987, J. Fluid Mech. 185, 523–545, eqs. 4.5 and 4.14 (numbers from memory; the
 * breaking fit's constants are from memory and could not be verified here).
 * @param i.waveHeightM wave height H at the toe depth, m; i.depthM toe depth d, m; i.beachSlopeDeg beta, degrees
 * @returns run-up height, m, and whether the breaking branch was used
 */
export function runUpM(i: { waveHeightM: number; depthM: number; beachSlopeDeg: number }): { runUpM: number; breaking: boolean } {
  const cot = 1 / Math.tan(i.beachSlopeDeg * DEG)
  const hd = i.waveHeightM / i.depthM
  if (!(hd > 0)) return { runUpM: 0, breaking: false }
  if (hd < breakingLimit(cot)) return { runUpM: i.depthM * 2.831 * Math.sqrt(cot) * Math.pow(hd, 1.25), breaking: false }
  return { runUpM: i.depthM * 1.109 * Math.pow(hd, 0.582), breaking: true }
}

/** Synolakis 1987 limit of the non-breaking law, `0.818 (cot beta)^(-10/9)` (H/d, dimensionless). */
export function breakingLimit(cotBeta: number): number {
  return 0.818 * Math.pow(cotBeta, -10 / 9)
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
 * Linear (Airy) phase speed of the dominant impact wave, wavelength 2 D_tcw as in the EIEP program:
 * `c = sqrt(g lambda/(2 pi) tanh(2 pi h/lambda))`. Source: EIEP source (sub `find_tsunami`); Airy theory.
 * @param cavityDiameterM D_tcw, m; depthM water depth, m
 * @returns speed, m/s
 */
export function impactWaveSpeedMS(cavityDiameterM: number, depthM: number): number {
  const lambda = 2 * cavityDiameterM
  return Math.sqrt(G_MS2 * lambda / (2 * Math.PI) * Math.tanh(2 * Math.PI * depthM / lambda))
}
