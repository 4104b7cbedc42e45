import type { Site } from './schema'
import { THRESHOLDS, type SiteAssessment, type ThresholdKey } from './types'
import type { SampleSet } from './sample'
import { FLAG_TSUNAMI, REC } from './sample'
import { peakWindMS, BLAST } from './blast'
import { visibleFractionOfRatio } from './thermal'
import { effectiveMagnitude } from './seismic'
import { OCEAN, breakingLimit, longWaveSpeedMS, shoreProfile, runUpOnProfileM, toeHeightForRunUpM, type ShoreProfile } from './ocean'
import { orderStats, toPercentiles } from './stats'
import { DEG, EARTH_RADIUS_M } from './units'

const LN_RX = Math.log(BLAST.crossoverRangeM)
const PXRX4 = BLAST.crossoverPressurePa * BLAST.crossoverRangeM / 4

/** Overpressure (Pa) at which the peak wind reaches u (inverse of `peakWindMS`, by bisection). */
function overpressureForWindPa(u: number): number {
  let a = 0, b = 1e7
  for (let k = 0; k < 80; k++) { const m = 0.5 * (a + b); if (peakWindMS(m) < u) a = m; else b = m }
  return b
}

const WIND_AS_PRESSURE = new Map<number, number>()
function windThresholdPa(u: number): number {
  let p = WIND_AS_PRESSURE.get(u)
  if (p === undefined) { p = overpressureForWindPa(u); WIND_AS_PRESSURE.set(u, p) }
  return p
}

// Module-level copies for the realisation loop: imported bindings are read through accessors in some loaders.
const O_S = REC.s, O_LNS = REC.lnS, O_Z1 = REC.z1, O_RM = REC.rm, O_P0 = REC.p0, O_BETA = REC.beta, O_ALT = REC.alt
const O_THK = REC.thK, O_ZB = REC.zb, O_RF = REC.rf, O_BURN = REC.burn, O_MAG = REC.mag
const O_RIMA = REC.rimA, O_RIMR = REC.rimR, O_RIMLO = REC.rimLo, O_RIMHI = REC.rimHi, O_INVC60 = REC.invC60, O_LAMU = REC.lamU
const REC_SIZE = REC.size, F_TSUNAMI = FLAG_TSUNAMI, R_E = EARTH_RADIUS_M

/**
 * A site's shore profile for an open-ocean depth, with the toe heights that reach given run-ups, kept
 * between assessments (the tables take about 0.1 ms to build; a scenario's sites recur).
 */
interface Coast { shore: ShoreProfile; toeFor: (runUpM: number) => number }
const COASTS = new Map<string, Coast>()
function coastOf(openDepthM: number, site: Site): Coast {
  const key = `${openDepthM}|${site.offshoreDepthM}|${site.shelfWidthKm}|${site.beachSlopeDeg}`
  let c = COASTS.get(key)
  if (!c) {
    if (COASTS.size >= 512) COASTS.clear()
    const shore = shoreProfile({
      openDepthM, offshoreDepthM: site.offshoreDepthM ?? 1, shelfWidthKm: site.shelfWidthKm, beachSlopeDeg: site.beachSlopeDeg,
    })
    const toe = new Map<number, number>()
    c = { shore, toeFor: (v) => { let h = toe.get(v); if (h === undefined) { h = toeHeightForRunUpM(shore, v); toe.set(v, h) } return h } }
    COASTS.set(key, c)
  }
  return c
}

/** Scratch columns reused from site to site. */
export interface SiteScratch {
  dist: Float64Array
  op: Float64Array
  th: Float64Array
  mag: Float64Array
  /** Offshore amplitude and unbroken toe height: mixed laws, low law, high law. */
  amp: Float64Array
  toe: Float64Array
  ampLo: Float64Array
  toeLo: Float64Array
  ampHi: Float64Array
  toeHi: Float64Array
  t1: Float64Array
  t2: Float64Array
  os: Float64Array
}
/** Per-site working columns for up to n realisations. */
export function newSiteScratch(n: number): SiteScratch {
  // Columns may be longer than the sample count (reused); only the first n entries are read.
  const f = () => new Float64Array(n)
  return {
    dist: f(), op: f(), th: f(), mag: f(), amp: f(), toe: f(), ampLo: f(), toeLo: f(), ampHi: f(), toeHi: f(),
    t1: f(), t2: f(), os: new Float64Array(9),
  }
}

/**
 * A site's assessment plus what the warnings need: the share of all realisations whose wave breaks before
 * the shore at this site, and whether the offshore depth is in 1–8000 m.
 */
export interface SiteResult { assessment: SiteAssessment; breakingFraction: number; depthInRange: boolean }

/**
 * Evaluates one site over every realisation: great-circle distance, overpressure (Collins 2005), wind,
 * thermal exposure, effective seismic magnitude, the tsunami (offshore amplitude and run-up under the mixed
 * source laws and under each law, see ocean.ts: energy-flux shoaling over the site's shore profile, breaking
 * at 0.78 of the depth, continuous Synolakis 1987 run-up), earliest long-wave and main-wave (group speed)
 * arrivals, and the share of realisations that exceed each threshold of THRESHOLDS. All probabilities are
 * conditional on impact.
 */
export function evaluateSite(site: Site, S: SampleSet, w: SiteScratch): SiteResult {
  const n = S.n
  const cl = Math.cos(site.lat * DEG)
  const sx = cl * Math.cos(site.lon * DEG), sy = cl * Math.sin(site.lon * DEG), sz = Math.sin(site.lat * DEG)
  // A site without an offshore depth is inland: no tsunami figures for it.
  const coastal = site.offshoreDepthM !== undefined
  const d2 = site.offshoreDepthM ?? 1
  // Per-site constants of the shore profile: shoaling tables against wavelength, run-up against toe height.
  const coast = coastal ? coastOf(S.seaDepthM, site) : undefined
  // An offshore installation: the wave at its depth counts, nothing runs up (no beach, no breaking on one).
  const hasShore = coastal && site.shore !== false
  const shore = coast?.shore
  const KS = shore?.toOffshore ?? new Float64Array(2), KT = shore?.toToe ?? new Float64Array(2)
  const cap = OCEAN.breakingIndex * d2
  // A wave breaks before the shore once its toe height passes Synolakis's non-breaking limit (below 0.78 d_t).
  const breakToeM = shore && hasShore ? breakingLimit(shore.cotBeach) * shore.toeDepthM : Infinity
  const runUpOf = (h: number) => shore && hasShore ? runUpOnProfileM(shore, h) : 0
  const cLong = longWaveSpeedMS(S.seaDepthM)
  // Thresholds by kind, ascending, so each realisation counts the levels it passes with an early exit.
  // Wind thresholds become overpressures (the wind law is monotone).
  const levels = (k: 'p' | 'th' | 'run') => THRESHOLDS
    .map((t, idx) => ({ idx, v: t.kind === 'wind' ? windThresholdPa(t.value) : t.value, k: t.kind === 'thermal' ? 'th' : t.kind === 'runUp' ? 'run' : 'p' }))
    .filter(t => t.k === k).sort((a, b) => a.v - b.v)
  const P = levels('p'), TH = levels('th'), RU = levels('run')
  const pv = Float64Array.from(P, t => t.v), tv = Float64Array.from(TH, t => t.v)
  // Run-up thresholds as toe heights (run-up is non-decreasing in the toe height), so the loop needs no run-up.
  const rv = Float64Array.from(RU, t => coast && hasShore ? coast.toeFor(t.v) : Infinity)
  const pHits = new Float64Array(P.length + 1), tHits = new Float64Array(TH.length + 1), rHits = new Float64Array(RU.length + 1)
  const nP = pv.length, nTv = tv.length, nR = rv.length
  const { dist, op, th, mag, amp, toe, ampLo, toeLo, ampHi, toeHi, t1, t2 } = w
  const Rc = S.rec
  const F = S.flags
  let m = 0, mt = 0, broken = 0, nTh = 0, nMag = 0
  // Least and greatest value of each column, so that orderStats can skip a pass.
  let dLo = Infinity, dHi = -Infinity, pLo = Infinity, pHi = -Infinity, thLo = Infinity, thHi = -Infinity
  let mLo = Infinity, mHi = -Infinity
  // Bounds of the amplitude and toe-height columns: per realisation low law <= mixed <= high law.
  let aLo = Infinity, aHi = -Infinity, hLo = Infinity, hHi = -Infinity
  let t1Lo = Infinity, t1Hi = -Infinity, t2Lo = Infinity, t2Hi = -Infinity
  const invCLong60 = 1 / (60 * cLong)
  for (let i = 0, o = 0; i < n; i++, o += REC_SIZE) {
    let dot = Rc[o]! * sx + Rc[o + 1]! * sy + Rc[o + 2]! * sz
    if (dot > 1) dot = 1
    else if (dot < -1) dot = -1
    let r = Math.acos(dot) * R_E
    if (r < 1) r = 1
    // One division per realisation; everything else multiplies by 1/r.
    const invR = 1 / r
    const lr = Math.log(r)
    const rKm = r * 1e-3
    dist[i] = rKm
    if (rKm < dLo) dLo = rKm
    if (rKm > dHi) dHi = rKm
    const s = Rc[o + O_S]!
    let p = 0
    if (s > 0) {
      // blast.ts `overpressurePa`: eq. 54 at min(max(r, r_m), slant range), at least the regular-reflection fit,
      // times the altitude factor. (rx/x)^1.3 = exp(1.3 (ln rx + ln s - ln x)).
      const zs = Rc[o + O_ZB]!
      const rm = Rc[o + O_RM]!
      let x = r > rm ? r : rm
      if (zs > 0) { const sl = Math.sqrt(r * r + zs * zs); if (sl < x) x = sl }
      const lx = x === r ? lr : Math.log(x)
      p = PXRX4 * s / x * (1 + 3 * Math.exp(1.3 * (LN_RX + Rc[o + O_LNS]! - lx)))
      if (Rc[o + O_Z1]! > 0) { const pr = Rc[o + O_P0]! * Math.exp(-Rc[o + O_BETA]! * r); if (pr > p) p = pr }
      p *= Rc[o + O_ALT]!
    }
    op[i] = p
    if (p < pLo) pLo = p
    if (p > pHi) pHi = p
    let c = 0
    while (c < nP && p >= pv[c]!) c++
    pHits[c]!++
    const K = Rc[o + O_THK]!
    if (K > 0) {
      const zb = Rc[o + O_ZB]!
      const hidden = (1 - dot) * R_E - zb
      const rf = Rc[o + O_RF]!
      if (hidden < rf) {
        const phi = visibleFractionOfRatio(hidden / rf) * K / (r * r + zb * zb)
        const rel = phi * Rc[o + O_BURN]!
        c = 0
        while (c < nTv && rel >= tv[c]!) c++
        tHits[c]!++
        // Sparse columns keep only their non-zero values; the zeros are counted (see orderStats).
        if (phi > 0) {
          const v = phi * 1e-6
          th[nTh++] = v
          if (v < thLo) thLo = v
          if (v > thHi) thHi = v
        }
      }
    }
    const M = Rc[o + O_MAG]!
    if (M === M) {
      // Collins 2005 eq. 41 (as effectiveMagnitude), inlined.
      const me = rKm < 60 ? M - 0.0238 * rKm : rKm < 700 ? M - 0.0048 * rKm - 1.1644 : effectiveMagnitude(M, rKm)
      if (me > 0) {
        mag[nMag++] = me
        if (me < mLo) mLo = me
        if (me > mHi) mHi = me
      }
    }
    const rimA = Rc[o + O_RIMA]!
    if (coastal && rimA > 0) {
      // Every realisation that puts energy into the sea makes a wave (continuous in the surface speed).
      // Open-ocean decay 1/r beyond the cavity radius (both source laws), then the site's shoaling factors
      // to the offshore depth and to the beach toe at the dominant wavelength (tabulated, interpolated).
      const rc = Rc[o + O_RIMR]!
      const dec = r > rc ? rc * invR : 1
      const u = Rc[o + O_LAMU]!
      const j = u | 0, f = u - j
      const ks = KS[j]! + f * (KS[j + 1]! - KS[j]!), kt = KT[j]! + f * (KT[j + 1]! - KT[j]!)
      const dMix = rimA * dec, dLo = Rc[o + O_RIMLO]! * dec, dHi = Rc[o + O_RIMHI]! * dec
      // Offshore amplitudes never exceed the breaking height there (McCowan 1894).
      const a = dMix * ks, aL = dLo * ks, aH = dHi * ks
      amp[m] = a < cap ? a : cap
      const aLc = aL < cap ? aL : cap, aHc = aH < cap ? aH : cap
      ampLo[m] = aLc
      ampHi[m] = aHc
      if (aLc < aLo) aLo = aLc
      if (aHc > aHi) aHi = aHc
      const ht = dMix * kt, hL = dLo * kt, hH = dHi * kt
      toe[m] = ht
      toeLo[m] = hL
      toeHi[m] = hH
      if (hL < hLo) hLo = hL
      if (hH > hHi) hHi = hH
      m++
      if (ht >= breakToeM) broken++
      c = 0
      while (c < nR && ht >= rv[c]!) c++
      rHits[c]!++
      if (F[i]! & F_TSUNAMI) {
        const u1 = r * invCLong60, u2 = r * Rc[o + O_INVC60]!
        t1[mt] = u1
        t2[mt] = u2
        mt++
        if (u1 < t1Lo) t1Lo = u1
        if (u1 > t1Hi) t1Hi = u1
        if (u2 < t2Lo) t2Lo = u2
        if (u2 > t2Hi) t2Hi = u2
      }
    }
  }
  const exceedance = {} as Record<ThresholdKey, number>
  const tally = (lv: Array<{ idx: number }>, hits: Float64Array) => {
    let above = 0
    for (let j = lv.length - 1; j >= 0; j--) { above += hits[j + 1]!; exceedance[THRESHOLDS[lv[j]!.idx]!.key] = above / n }
  }
  tally(P, pHits)
  tally(TH, tHits)
  tally(RU, rHits)
  const o = w.os
  const pct = (x: Float64Array, count: number, zeros: number, lo: number, hi: number) => {
    orderStats(x, count, o, zeros, lo, hi)
    return toPercentiles(o)
  }
  const zero = { p5: 0, p50: 0, p95: 0 }
  // Run-up percentiles are those of the toe height mapped through the site's non-decreasing run-up law.
  const runUpPct = (x: Float64Array) => { orderStats(x, m, o, n - m, hLo, hHi); return toPercentiles(o, runUpOf) }
  orderStats(op, n, o, 0, pLo, pHi)
  const overpressureKPa = toPercentiles(o, v => v / 1000)
  const windMS = toPercentiles(o, peakWindMS)
  const distanceKm = pct(dist, n, 0, dLo, dHi)
  // When every realisation makes a tsunami, the first arrival is a monotone map of the distance: reuse its order statistics.
  const firstArrival = mt === n ? toPercentiles(o, km => km * 1000 * invCLong60) : mt > 0 ? pct(t1, mt, 0, t1Lo, t1Hi) : zero
  const assessment: SiteAssessment = {
    siteId: site.id,
    name: site.name,
    population: site.population,
    coastal,
    ...(coastal && !hasShore ? { shore: false } : {}),
    distanceKm,
    overpressureKPa,
    windMS,
    thermalMJM2: pct(th, nTh, n - nTh, thLo, thHi),
    seismicMagnitude: pct(mag, nMag, n - nMag, mLo, mHi),
    tsunamiAmplitudeM: pct(amp, m, n - m, aLo, aHi),
    tsunamiArrivalMin: firstArrival,
    tsunamiMainArrivalMin: mt > 0 ? pct(t2, mt, 0, t2Lo, t2Hi) : zero,
    runUpM: runUpPct(toe),
    tsunamiBand: {
      low: { amplitudeM: pct(ampLo, m, n - m, aLo, aHi), runUpM: runUpPct(toeLo) },
      high: { amplitudeM: pct(ampHi, m, n - m, aLo, aHi), runUpM: runUpPct(toeHi) },
    },
    exceedance,
  }
  const inRange = (x: number) => x >= 1 && x <= 8000
  return { assessment, breakingFraction: broken / n, depthInRange: !coastal || inRange(d2) }
}
