import type { OrbitSolution } from './schema'
import { HazardRng, sampleAlbedoWright2016, sampleShoemakerAngleDeg, CLASS_ALBEDO, CLASS_DENSITY, MIN_ALBEDO, DENSITY_RANGE_KGM3 } from './sampling'
import { entryInto, newEntryScratch, strengthFromDensityPa } from './entry'
import { corridorGeometry, corridorPointInto } from './corridor'
import { isLand } from './land'
import { machOnsetScaledM, blastAltitudeFactor, BLAST } from './blast'
import { fireballRadiusM, radiantIntensityJSr } from './thermal'
import { seismicMagnitude } from './seismic'
import { cavityDiameterSI, impactWaveSpeedMS, wavelengthGridPosition, OCEAN } from './ocean'
import { SIZE_LAW_KM } from './size'
import { DEG, J_PER_KT, J_PER_MT, WATER_DENSITY_KGM3 } from './units'
import { EncounterSampler } from '../encounter/draw'

/**
 * Bit flags of a realisation: impact point at sea, airburst, tsunami (the body or its debris reaches the sea
 * and its wave, mixed between the source laws, is at least OCEAN.tsunamiMinAmplitudeM at OCEAN.tsunamiReferenceRangeM), cavity
 * reaches the sea floor.
 */
export const FLAG_SEA = 1
export const FLAG_AIRBURST = 2
export const FLAG_TSUNAMI = 4
export const FLAG_SEAFLOOR = 8

/**
 * Water depth used for the realisations that strike the sea when the solution gives 0 m (its nominal point
 * on land, the corridor reaching the coast): a typical shelf depth (common practice, no source). The
 * assessment names it in the warning `depth-assumed`; a scenario whose nominal point is at sea must give the depth.
 */
export const ASSUMED_DEPTH_M = 100
const LN10_5 = Math.LN10 / 5
const LN_1000 = Math.log(1000)
/** Fireball radius per kt^(1/3): 0.002 (J_PER_KT)^(1/3) m (Collins 2005). */
const FIREBALL_PER_CBRT_KT = fireballRadiusM(J_PER_KT)

/**
 * Layout of the packed record that the site loop reads for each realisation (one interleaved
 * Float64Array, read sequentially: far fewer cache misses than one column per field).
 */
export const REC = {
  /** Unit vector of the impact point. */
  x: 0, y: 1, z: 2,
  /** Blast (see blast.ts `overpressurePa`): E_kt^(1/3) (0: no blast), its log, scaled source height z1 (0: surface),
   * Mach onset range r_m1 E^(1/3) in metres (Infinity above the fit), regular-reflection p0 = 3.14e11 z1^-2.6 and
   * decay 34.87 z1^-1.73 / E^(1/3) per metre (Collins 2005): unscaled, so the site loop needs no division. */
  s: 3, lnS: 4, z1: 5, rm: 6, p0: 7, beta: 8,
  /** Thermal: radiant intensity J/sr (0: none), source height m (also the blast's), fireball radius m, E_Mt^(-1/6). */
  thK: 9, zb: 10, rf: 11, burn: 12,
  /** Seismic source magnitude (NaN: nothing reaches the ground). */
  mag: 13,
  /** Ocean wave (0 when the sea gets no energy): rim amplitude m mixed between the source laws, cavity radius m,
   * rim amplitude of the low and of the high law m, 1/(60 c_g) of the dominant wave (min/m), and the
   * dominant wavelength's place on WAVELENGTH_GRID (index plus fraction). */
  rimA: 14, rimR: 15, rimLo: 16, rimHi: 17, invC60: 18, lamU: 19,
  /** Blast altitude factor (P(z)/P0)^(1/6) of the source height. */
  alt: 20,
  size: 21,
} as const

// Module-level copies for the realisation loop: imported bindings are read through accessors in some loaders.
const O_RIMA = REC.rimA, O_RIMR = REC.rimR, O_RIMLO = REC.rimLo, O_RIMHI = REC.rimHi, O_INVC60 = REC.invC60, O_LAMU = REC.lamU
const RIM_FACTOR = OCEAN.rimWaveFactor, CAVITY_DEPTH = OCEAN.cavityDepthRatio
const TSU_MIN_M = OCEAN.tsunamiMinAmplitudeM, TSU_REF_M = OCEAN.tsunamiReferenceRangeM
const DRAG_W = 3 * WATER_DENSITY_KGM3 * OCEAN.waterDragCoefficient / 2

/** The realisations: summary columns plus the packed site-loop records. */
export interface SampleSet {
  n: number
  seaDepthM: number
  diameterM: Float64Array
  massKg: Float64Array
  energyMt: Float64Array
  surfaceEnergyMt: Float64Array
  airEnergyMt: Float64Array
  burstAltM: Float64Array
  cavityM: Float64Array
  flags: Uint8Array
  lon: Float64Array
  lat: Float64Array
  /** Entry angle from the horizontal, degrees, and entry speed, km/s, of each realisation. */
  angleDeg: Float64Array
  speedKmS: Float64Array
  rec: Float64Array
  counts: { highBurst: number; seafloor: number; sea: number }
  /**
   * With `sampling: 'encounter'`: b-plane points tried, hits kept (one per realisation) and the estimated share of the
   * encounter's b-plane points that hit (EncounterSampler); else null.
   */
  encounter: { tries: number; hits: number; hitShare: number } | null
}

type StrengthModel = 'density' | 'log-uniform'

/** Working columns for up to `capacity` realisations. */
export function allocSamples(capacity: number): SampleSet {
  const f64 = () => new Float64Array(capacity)
  return {
    n: 0, seaDepthM: 0,
    diameterM: f64(), massKg: f64(), energyMt: f64(), surfaceEnergyMt: f64(), airEnergyMt: f64(), burstAltM: f64(), cavityM: f64(),
    flags: new Uint8Array(capacity), lon: f64(), lat: f64(), angleDeg: f64(), speedKmS: f64(), rec: new Float64Array(REC.size * capacity),
    counts: { highBurst: 0, seafloor: 0, sea: 0 }, encounter: null,
  }
}

/**
 * Draws n realisations from an orbit solution and runs, for each, the steps of shared/hazard/README.md:
 * size, entry, blast scaling, fireball, seismic source and ocean cavity. Fills S (capacity >= n; every
 * field of every realisation is written, so S may be reused).
 * Impact point, entry angle and speed: by default from the corridor band (along-track Normal, cross-track uniform)
 * and the solution's speed and angle, drawn independently; with `sampling: 'encounter'` jointly from one hit of the
 * solution's encounter per realisation (EncounterSampler, shared/encounter/draw.ts: drawn conditional on impact, so
 * every realisation is an impact). Throws a RangeError when the encounter's hits are too rare to draw from.
 */
export function drawSamples(
  solution: OrbitSolution, n: number, seed: number, strengthModel: StrengthModel, S: SampleSet = allocSamples(n),
): SampleSet {
  S.n = n
  S.seaDepthM = solution.waterDepthM > 0 ? solution.waterDepthM : ASSUMED_DEPTH_M
  const counts = { highBurst: 0, seafloor: 0, sea: 0 }
  S.counts = counts
  S.encounter = null
  const rng = new HazardRng(seed)
  const scr = newEntryScratch()
  const c = solution.corridor
  const geo = corridorGeometry(c.path, c.nominal)
  const cls = solution.taxonomicClass
  const { H: H0, sigma: sH } = solution.magnitude
  const v = solution.entrySpeedKmS
  const h = S.seaDepthM
  const R = S.rec
  if (solution.sampling === 'encounter' && !solution.encounter) throw new RangeError('sampling \'encounter\' needs the solution\'s encounter')
  const enc = solution.sampling === 'encounter' ? new EncounterSampler(solution.encounter!, n) : null
  const vEnc = enc ? 1000 * enc.speedKmS : 0
  for (let i = 0; i < n; i++) {
    const H = H0 + sH * rng.normal()
    let p: number
    if (solution.albedo) p = solution.albedo.min + (solution.albedo.max - solution.albedo.min) * rng.uniform()
    else if (cls === 'unknown') p = sampleAlbedoWright2016(rng)
    else p = CLASS_ALBEDO[cls].median * Math.exp(CLASS_ALBEDO[cls].sigmaLn * rng.normal())
    if (p < MIN_ALBEDO) p = MIN_ALBEDO
    const D = SIZE_LAW_KM * 1000 / Math.sqrt(p) * Math.exp(-H * LN10_5)
    // Unknown class: dark bodies taken as carbonaceous, bright as stony (common practice, no source).
    const dens = solution.densityKgM3 ?? CLASS_DENSITY[cls === 'unknown' ? (p < 0.1 ? 'C' : 'S') : cls]
    const rho = rng.truncatedNormal(dens.mean, dens.sigma, DENSITY_RANGE_KGM3[0], DENSITY_RANGE_KGM3[1])
    const Y = strengthModel === 'density' ? strengthFromDensityPa(rho) : Math.exp(Math.LN10 * (5 + 2 * rng.uniform()))
    const o = REC.size * i
    let v0: number, theta: number
    if (enc) {
      // Point, angle and speed of one hit of the encounter, jointly.
      theta = enc.drawInto(rng, R, o)
      v0 = vEnc
    }
    else {
      v0 = 1000 * rng.truncatedNormal(v.mean, v.sigma, 11.2, 72)
      const a = solution.entryAngleDeg
      theta = (a ? rng.truncatedNormal(a.mean, a.sigma, 5, 90) : sampleShoemakerAngleDeg(rng)) * DEG
      const alongM = geo.nominalAlongM + c.alongTrackSigmaKm * 1000 * rng.normal()
      corridorPointInto(geo, alongM, (2 * rng.uniform() - 1) * c.halfWidthKm * 1000, R, o)
    }
    S.angleDeg[i] = theta / DEG
    S.speedKmS[i] = v0 / 1000
    entryInto(scr, D, rho, v0, theta, Y)
    const x = R[o]!, y = R[o + 1]!, z = R[o + 2]!
    const lon = Math.atan2(y, x) / DEG, lat = Math.asin(Math.max(-1, Math.min(1, z))) / DEG
    S.lon[i] = lon
    S.lat[i] = lat
    const sea = !isLand(lon, lat)
    const air = scr.airburst
    let flags = (sea ? FLAG_SEA : 0) | (air ? FLAG_AIRBURST : 0)
    S.diameterM[i] = D
    S.massKg[i] = scr.massKg
    S.energyMt[i] = scr.energyJ / J_PER_MT
    S.surfaceEnergyMt[i] = scr.energySurfaceJ / J_PER_MT
    S.airEnergyMt[i] = scr.energyAirJ / J_PER_MT
    const zb = air ? scr.burstAltitudeM : 0
    S.burstAltM[i] = zb
    // One source for blast and heat: the entry energy (air plus surface, conserved) at the energy-weighted height of
    // its deposition (entry.ts sourceAltitudeM): continuous across the airburst boundary.
    const E = scr.energyJ
    const zSrc = scr.sourceAltitudeM
    const s = Math.cbrt(E / J_PER_KT)
    const lnS = s > 0 ? Math.log(s) : 0
    const z1 = s > 0 ? zSrc / s : 0
    R[o + REC.s] = s
    R[o + REC.lnS] = lnS
    R[o + REC.z1] = z1
    if (z1 > 0) {
      const lz = Math.log(z1)
      R[o + REC.rm] = machOnsetScaledM(z1) * s
      R[o + REC.p0] = 3.14e11 * Math.exp(-2.6 * lz)
      R[o + REC.beta] = 34.87 * Math.exp(-1.73 * lz) / s
    }
    else {
      R[o + REC.rm] = 0
      R[o + REC.p0] = 0
      R[o + REC.beta] = 0
    }
    R[o + REC.alt] = blastAltitudeFactor(zSrc)
    if (z1 > BLAST.highBurstScaledM) counts.highBurst++
    // Heat: the air deposition radiates (Popova et al. 2013) and the impact fireball too (Collins 2005); no speed gate.
    R[o + REC.thK] = s > 0 ? radiantIntensityJSr(scr.energyAirJ, scr.energySurfaceJ) : 0
    R[o + REC.zb] = zSrc
    R[o + REC.rf] = FIREBALL_PER_CBRT_KT * s
    R[o + REC.burn] = s > 0 ? Math.exp(-(3 * lnS - LN_1000) / 6) : 0
    let eGround = scr.energySurfaceJ
    if (sea) counts.sea++
    // Model uncertainty of the tsunami source: a log-uniform weight between the low and the high law, drawn
    // for every realisation so that the random stream does not depend on where the point falls.
    const lawW = rng.uniform()
    let dtc = 0, rimA = 0, rimLo = 0, rimHi = 0, waveC = 0, lamU = 0
    const vs = scr.surfaceSpeedMS
    if (sea && vs > 0) {
      // Whatever reaches the sea surface (an impact, or the debris of a low burst) opens a cavity that is
      // continuous in its speed; the wave follows the cavity.
      const sinT = Math.sin(theta)
      // pi-scaling with the diameter of what arrives (body or debris cloud) and the same mass (indicative for a cloud).
      const Ds = scr.surfaceDiameterM, q = D / Ds
      dtc = cavityDiameterSI(Ds, rho * q * q * q, vs, sinT)
      rimLo = Math.min(RIM_FACTOR * dtc, h)
      rimHi = Math.min(CAVITY_DEPTH * dtc, h)
      rimA = rimLo > 0 ? rimLo * Math.exp(lawW * Math.log(rimHi / rimLo)) : 0
      if (rimA * Math.min(1, dtc / (2 * TSU_REF_M)) >= TSU_MIN_M) flags |= FLAG_TSUNAMI
      waveC = impactWaveSpeedMS(dtc, h)
      lamU = wavelengthGridPosition(2 * dtc)
      // Transient cavity depth D/2.828 (EIEP) deeper than the sea: the cavity reaches the sea floor.
      if (dtc * CAVITY_DEPTH > h) { flags |= FLAG_SEAFLOOR; counts.seafloor++ }
      const vsf = vs * Math.exp(-DRAG_W * h / (rho * q * q * D * sinT))
      eGround = 0.5 * scr.massKg * vsf * vsf
    }
    S.cavityM[i] = dtc
    R[o + O_RIMA] = rimA
    R[o + O_RIMR] = dtc / 2
    R[o + O_RIMLO] = rimLo
    R[o + O_RIMHI] = rimHi
    R[o + O_INVC60] = waveC > 0 ? 1 / (60 * waveC) : 0
    R[o + O_LAMU] = lamU
    R[o + REC.mag] = eGround > 0 ? seismicMagnitude(eGround) : NaN
    S.flags[i] = flags
  }
  S.encounter = enc ? { tries: enc.tries, hits: enc.hits, hitShare: enc.boxMass * enc.hits / Math.max(1, enc.tries) } : null
  return S
}
