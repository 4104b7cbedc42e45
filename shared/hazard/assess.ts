import type { OrbitSolution, Site } from './schema'
import { THRESHOLDS, type Assessment, type AssessmentOptions, type ModelWarning, type ThresholdKey } from './types'
import { drawSamples, allocSamples, FLAG_AIRBURST, FLAG_TSUNAMI, ASSUMED_DEPTH_M, type SampleSet } from './sample'
import { evaluateSite, newSiteScratch, type SiteResult, type SiteScratch } from './sites'
import { percentiles } from './stats'
import { palermoScale, torinoScale } from './scales'
import { BLAST } from './blast'
import { OCEAN, TSUNAMI_SOURCE_LAWS } from './ocean'
import { damageFootprints, damageReach } from './footprint'

/** Engine version, stored with every assessment. */
export const MODEL_VERSION = 'brinkwater-hazard/2.2.0'
/** Default number of realisations, default seed, and the largest sample count accepted. */
export const DEFAULT_SAMPLES = 20_000
export const DEFAULT_SEED = 1
export const MAX_SAMPLES = 2_000_000
const MAX_MAP_POINTS = 2000
const YEAR_MS = 365.25 * 86_400_000

/** Options of `assessSolution` (see AssessmentOptions in types.ts). */
export interface AssessOptionsInput { samples?: number; seed?: number; strengthModel?: 'density' | 'log-uniform' }

/**
 * Monte Carlo hazard assessment of an orbit solution for a list of sites (see shared/hazard/README.md).
 * Draws `samples` realisations with a seeded xoroshiro128+ generator (same solution, sites and seed →
 * identical figures; the whole safe-integer seed is used), runs size (Bowell et al. 1989), entry (Collins,
 * Melosh & Marcus 2005, MAPS 40(6) 817–840), airblast, thermal and seismic effects (Collins 2005), ocean
 * cavity, the tsunami source band (Collins 2005 rim wave to Ward & Asphaug 2000, drawn per realisation as
 * model uncertainty), energy-flux shoaling and run-up (Synolakis 1987, JFM 185), and reports 5/50/95
 * percentiles. Torino (Binzel 2000, PSS 48) and Palermo (Chesley et al. 2002, Icarus 159) use the
 * solution's impact probability, the MEDIAN entry energy and the years from epoch to impact.
 *
 * Every probability, exceedance and exposed population in the result is CONDITIONAL ON IMPACT: a
 * share of the impact realisations. Multiply by `impactProbability` for the absolute figure.
 * Units are in the field names (m, kg, Mt TNT, km, kPa, m/s, MJ/m², minutes).
 * @param solution validated orbit solution; sites places to evaluate; options samples (default 20 000),
 *   seed (default 1; any safe integer, |seed| <= 2^53 - 1),
 *   strengthModel (`density`, Collins 2005 eq. 9, default; or `log-uniform` 0.1–10 MPa,
 *   Mathias et al. 2017, Icarus 289)
 */
export function assessSolution(solution: OrbitSolution, sites: Site[], options: AssessOptionsInput = {}): Assessment {
  const opts: AssessmentOptions = {
    samples: options.samples ?? DEFAULT_SAMPLES,
    seed: options.seed ?? DEFAULT_SEED,
    strengthModel: options.strengthModel ?? 'density',
  }
  if (!Number.isInteger(opts.samples) || opts.samples < 1 || opts.samples > MAX_SAMPLES) throw new RangeError(`samples must be an integer in 1..${MAX_SAMPLES}`)
  if (!Number.isSafeInteger(opts.seed)) throw new RangeError('seed must be a safe integer (|seed| <= 2^53 - 1)')
  const ws = workspace(opts.samples)
  const S = drawSamples(solution, opts.samples, opts.seed, opts.strengthModel, ws.S)
  const n = S.n
  const work = ws.w
  const results: SiteResult[] = sites.map(site => evaluateSite(site, S, work))
  const exposedPopulation = {} as Record<ThresholdKey, number>
  for (const t of THRESHOLDS) {
    exposedPopulation[t.key] = results.reduce((sum, r) => sum + r.assessment.population * r.assessment.exceedance[t.key], 0)
  }

  let air = 0, tsu = 0
  for (let i = 0; i < n; i++) { if (S.flags[i]! & FLAG_AIRBURST) air++; if (S.flags[i]! & FLAG_TSUNAMI) tsu++ }
  const energyMt = percentiles(S.energyMt, n)
  const years = Math.max(1 / 365.25, (Date.parse(solution.impactTime) - Date.parse(solution.epoch)) / YEAR_MS)
  const thinned = thinIndices(n)
  const r4 = (x: number) => Math.round(x * 1e4) / 1e4
  const impactPoints = thinned.map(i => [r4(S.lon[i]!), r4(S.lat[i]!), S.flags[i]! & 3] as [number, number, number])
  const reach = damageReach(S, thinned)
  const ps = palermoScale({ probability: solution.impactProbability, energyMt: energyMt.p50, yearsToImpact: years })
  return {
    modelVersion: MODEL_VERSION,
    options: opts,
    impactProbability: solution.impactProbability,
    diameterM: percentiles(S.diameterM, n),
    massKg: percentiles(S.massKg, n),
    energyMt,
    airburstProbability: air / n,
    burstAltitudeKm: air > 0 ? percentiles(gather(S, S.burstAltM, FLAG_AIRBURST, air), air, 1 / 1000) : null,
    oceanImpactProbability: S.counts.sea / n,
    tsunamiProbability: tsu / n,
    surfaceEnergyMt: percentiles(S.surfaceEnergyMt, n),
    airEnergyMt: percentiles(S.airEnergyMt, n),
    tsunamiSourceLaws: TSUNAMI_SOURCE_LAWS.map(l => ({ ...l })),
    waterCavityDiameterM: tsu > 0 ? percentiles(gather(S, S.cavityM, FLAG_TSUNAMI, tsu), tsu) : null,
    sites: results.map(r => r.assessment),
    exposedPopulation,
    torino: torinoScale({ probability: solution.impactProbability, energyMt: energyMt.p50 }),
    // Floored at −20 so that a zero probability stays a finite JSON number.
    palermo: Number.isFinite(ps) ? ps : -20,
    warnings: warnings(solution, S, results, air, tsu),
    impactPoints,
    reach,
    footprints: damageFootprints(impactPoints, reach),
  }
}

/**
 * Working columns (about 320 bytes per realisation) are kept between calls for up to POOL_MAX
 * realisations — 6.4 MB at the default 20 000, 64 MB at 200 000 — to spare the allocator and the garbage
 * collector; larger runs allocate afresh. Safe: the engine is synchronous and results hold no columns.
 */
const POOL_MAX = 200_000
let pool: { S: SampleSet; w: SiteScratch; capacity: number } | undefined
function workspace(n: number): { S: SampleSet; w: SiteScratch } {
  if (n > POOL_MAX) return { S: allocSamples(n), w: newSiteScratch(n) }
  if (!pool || pool.capacity < n) pool = { S: allocSamples(n), w: newSiteScratch(n), capacity: n }
  return pool
}

/** Frees the working columns kept between assessments (for a server after a large run). */
export function releaseHazardWorkspace(): void {
  pool = undefined
}

/** Values of the realisations that carry a flag, packed into a new array. */
function gather(S: SampleSet, x: Float64Array, flag: number, count: number): Float64Array {
  const out = new Float64Array(count)
  let m = 0
  for (let i = 0; i < S.n; i++) if (S.flags[i]! & flag) out[m++] = x[i]!
  return out
}

/**
 * The realisations kept for maps: every k-th, at most 2000. Their impact points are stored rounded to 1e-4°
 * ([lon, lat, flags], bit0 sea, bit1 airburst), with their reach and the footprints drawn from them.
 */
function thinIndices(n: number): number[] {
  const step = Math.ceil(n / MAX_MAP_POINTS)
  const out: number[] = []
  for (let i = 0; i < n; i += step) out.push(i)
  return out
}

/** Named warnings where the model leaves its range (codes are stable; the UI shows the message). */
function warnings(solution: OrbitSolution, S: SampleSet, results: SiteResult[], air: number, tsu: number): ModelWarning[] {
  const w: ModelWarning[] = []
  const n = S.n
  if (S.counts.highBurst > 0) w.push({ code: 'high-burst', fraction: S.counts.highBurst / n,
    message: `Scaled burst height above ${BLAST.highBurstScaledM} m/kt^1/3, beyond the nuclear-test data of the blast fits: `
      + 'the ground overpressure there comes from the surface-burst law at the slant range, reduced for the thin air at the '
      + 'burst (indicative; checked against the window damage of Chelyabinsk, Popova et al. 2013).' })
  if (tsu > 0) w.push({ code: 'tsunami-indicative', fraction: tsu / n,
    message: 'Tsunami figures are indicative and carry the spread of the published source laws, a factor of about 5 at the '
      + 'source: from the rim wave of Collins et al. 2005 (0.07 of the cavity, 1/r decay) to the cavity-depth wave of linear '
      + 'theory (Ward & Asphaug 2000). Each realisation draws a log-uniform weight between the two; each site shows both '
      + 'laws separately as a band. No bathymetry beyond each site\'s shelf profile; impact waves are dispersive and the '
      + 'largest arrive after the first.' })
  if (S.counts.sea > 0 && !(solution.waterDepthM > 0)) w.push({ code: 'depth-assumed', fraction: S.counts.sea / n,
    message: `The solution gives a water depth of 0 m (nominal point on land) but ${Math.round(100 * S.counts.sea / n)} % `
      + `of the impact points fall in the sea; they use ${ASSUMED_DEPTH_M} m, a typical shelf depth. `
      + 'Give the depth for ocean figures that matter.' })
  if (tsu > 0 && solution.waterDepthM > 8000) w.push({ code: 'depth-out-of-range', fraction: tsu / n,
    message: 'Water depth at the impact exceeds 8000 m, beyond the tested range of the ocean model.' })
  if (S.counts.seafloor > 0) w.push({ code: 'cavity-reaches-seafloor', fraction: S.counts.seafloor / n,
    message: 'The transient cavity is deeper than the sea: the wave at the source is capped at the water depth and a '
      + 'sea-floor crater forms; the source laws are least reliable here.' })
  if (air > 0 && S.counts.sea > 0) w.push({ code: 'airburst-over-sea', fraction: air / n,
    message: 'An airburst over the sea puts much less energy into the water than a surface impact of the same body '
      + '(Berger & Goodman 2018): here only the debris that keeps decelerating below the burst and reaches the sea makes a '
      + 'cavity and a wave (indicative; the blast loading of the sea surface is not modelled). A tsunami is counted when '
      + `the wave reaches ${OCEAN.tsunamiMinAmplitudeM} m at ${OCEAN.tsunamiReferenceRangeM / 1000} km from the impact point.` })
  for (const r of results) {
    const site = r.assessment
    if (!r.depthInRange) w.push({ code: 'depth-out-of-range', siteId: site.siteId, message: `Offshore depth of ${site.name} is outside 1–8000 m.` })
    if (r.breakingFraction > 0) w.push({ code: 'wave-breaking', siteId: site.siteId, fraction: r.breakingFraction,
      message: `At ${site.name} the wave breaks before the shore (height over 0.78 of the depth, McCowan 1894, or beyond `
        + 'Synolakis\'s non-breaking limit); its run-up follows the breaking branch of Synolakis 1987, made continuous, '
        + 'from the breaking depth: indicative.' })
  }
  return w
}
