import { HazardRng } from '../hazard/sampling'
import type { LonLat, OrbitSolution } from '../hazard/schema'
import { DEG, EARTH_RADIUS_KM, FEW_HITS, LONG_APPROACH_DAYS, LOW_V_INF_KMS } from './constants'
import {
  approachTimeS, arrivalTimeS, encounterFrame, entryFromBPlane, entryUnitInto, groundLonLat, EARTH_ROTATION_RAD_S,
  type BPlaneEntry, type BPlanePoint, type EncounterFrame, type Radiant,
} from './bplane'
import type { TimeInput } from './sidereal'

/** An encounter as the editor gives it: the nominal b-plane point and its uncertainty ellipse. */
export interface EncounterInput {
  /** Hyperbolic excess speed, km/s (> 0). */
  vInfKmS: number
  radiant: Radiant
  /**
   * When the nominal body reaches the entry sphere (a nominal that misses: its periapsis passage). The other samples
   * cross the b-plane together with it and reach the sphere earlier or later by τ(b) - τ(b_nominal) (arrivalTimeS):
   * the Earth turns meanwhile.
   */
  timeUtc: TimeInput
  /** Nominal b-plane point, km (project axes: see bPlaneAxes). */
  nominal: BPlanePoint
  /** One-sigma of the b-plane uncertainty along the line of variations and across it, km (>= 0). */
  sigmaAlongKm: number
  sigmaAcrossKm: number
  /** Direction of the line of variations in the b-plane, degrees from the ξ axis towards the ζ axis. */
  lineAngleDeg: number
  /** Altitude of the entry sphere above R⊕, km (default 0: ground points and speed at the surface). */
  altitudeKm?: number
}

/** Sampling options: number of b-plane samples (default 20 000) and seed of the project's xoroshiro128+ (default 1). */
export interface EncounterOptions { samples?: number; seed?: number }

/** A named condition under which the result needs care: a code for the software and a plain sentence for people. */
export interface EncounterWarning {
  code: 'low-v-inf' | 'long-approach' | 'few-hits' | 'no-hits' | 'speed-clamped' | 'angle-clamped' | 'width-clamped'
  message: string
}

/** The part of an orbit solution that the encounter determines. */
export type EncounterSolutionPart = Pick<OrbitSolution, 'impactProbability' | 'entrySpeedKmS' | 'impactTime'> & {
  /** The risk corridor; null when no sample hits. */
  corridor: OrbitSolution['corridor'] | null
  entryAngleDeg: { mean: number; sigma: number }
}

/** Result of solutionFromEncounter: the solution fields, the encounter itself and the warnings. */
export interface EncounterSolution extends EncounterSolutionPart {
  encounter: EncounterInput & {
    /** Capture radius, km. */
    captureRadiusKm: number
    /** Entry of the nominal b-plane point. */
    nominalEntry: BPlaneEntry
    samples: number
    seed: number
    hits: number
    /** Time of flight of the nominal body from the Hill sphere (about 1.5 million km) to the entry sphere, days. */
    approachDays: number
  }
  warnings: EncounterWarning[]
}

/** Upper limits of the orbit-solution schema (shared/hazard/schema.ts). */
const SPEED_RANGE = [11.2, 72] as const
const ANGLE_RANGE = [5, 90] as const
const MAX_HALF_WIDTH_KM = 5000
const MAX_ALONG_SIGMA_KM = 20000
/** Most samples one call may draw (two Float64Arrays of this length are allocated). */
export const MAX_SAMPLES = 2_000_000
/** Points of the corridor path (the schema allows 2 to 2000). */
export const CORRIDOR_POINTS = 241

/**
 * Turns the inertial entry vector tmp[0..2] of a body of impact parameter bKm into the Earth-fixed frame at its own
 * arrival time `timeUtc + τ(b) - τ(b_nominal)` (see arrivalTimeS): a rotation about the pole by -(GMST + ω Δt).
 */
export function earthFixedInto(f: EncounterFrame, tmp: Float64Array, bKm: number, tauNominalS: number, out: Float64Array, o: number): void {
  const ang = f.gmstRad + EARTH_ROTATION_RAD_S * (arrivalTimeS(bKm, f.vInfKmS, f.rKm) - tauNominalS)
  const c = Math.cos(ang), sn = Math.sin(ang)
  out[o] = c * tmp[0]! + sn * tmp[1]!
  out[o + 1] = -sn * tmp[0]! + c * tmp[1]!
  out[o + 2] = tmp[2]!
}

/**
 * Ground track of a straight b-plane line `p(s) = origin + s (cos ψ, sin ψ)` for s in [s1, s2] (all inside the
 * capture disk): CORRIDOR_POINTS entry points spaced as `s = m - h cos(π j / (n - 1))`, denser towards the ends,
 * where the ground track stretches (dφ/db grows without bound at the capture radius). Each point is placed on the
 * Earth as it turns at that point's own arrival time (arrivalTimeS, relative to tauNominalS).
 * @returns Earth-fixed unit vectors (3 per point), cumulative ground distance (km) and the parameters of each node
 */
export function lineTrack(f: EncounterFrame, origin: BPlanePoint, lineAngleRad: number, s1: number, s2: number, n = CORRIDOR_POINTS,
  tauNominalS = 0) {
  const u = new Float64Array(3 * n), along = new Float64Array(n), s = new Float64Array(n)
  const tmp = new Float64Array(5)
  const m = 0.5 * (s1 + s2), h = 0.5 * (s2 - s1), c = Math.cos(lineAngleRad), sn = Math.sin(lineAngleRad)
  // A hair inside the disk: rounding must not push the end points out of it.
  const shrink = 1 - 1e-12
  for (let j = 0; j < n; j++) {
    s[j] = m - h * Math.cos(Math.PI * j / (n - 1))
    const xi = (origin.xiKm + s[j]! * c) * shrink, zeta = (origin.zetaKm + s[j]! * sn) * shrink
    if (!entryUnitInto(f, xi, zeta, tmp)) throw new RangeError('lineTrack: the line leaves the capture disk')
    earthFixedInto(f, tmp, Math.hypot(xi, zeta), tauNominalS, u, 3 * j)
    if (j > 0) {
      const d = u[3 * j]! * u[3 * j - 3]! + u[3 * j + 1]! * u[3 * j - 2]! + u[3 * j + 2]! * u[3 * j - 1]!
      along[j] = along[j - 1]! + Math.acos(Math.min(1, d)) * EARTH_RADIUS_KM
    }
  }
  return { u, along, s, m, h, n }
}

/**
 * Samples the b-plane uncertainty of an encounter, keeps the hits and turns them into the encounter part of an orbit
 * solution that the hazard engine accepts:
 * - impactProbability: the share of the samples inside the capture disk;
 * - corridor.path: the ground track of the b-plane line through the hits, parallel to the line of variations at the
 *   hits' mean cross-line offset, over the hits' extent along it (CORRIDOR_POINTS points);
 * - corridor.nominal: the ground point of the nominal b-plane point if it hits, else of the median hit on the track;
 * - corridor.alongTrackSigmaKm: the root mean square along-track ground distance of the hits from the nominal;
 * - corridor.halfWidthKm: `sqrt(3)` times the RMS cross-track ground distance (the hazard engine draws uniformly
 *   within ± half-width: this gives the same variance), never beyond the widest hit;
 * - entrySpeedKmS: the entry speed (the same for every hit: it depends on v∞ and r only), sigma 0;
 * - entryAngleDeg: mean and standard deviation over the hits.
 * Each hit's ground point is taken at its own arrival time (arrivalTimeS; see README). Values outside the schema's ranges
 * are clamped and named in `warnings`. Deterministic for a given seed (the project's HazardRng).
 */
export function solutionFromEncounter(input: EncounterInput, options: EncounterOptions = {}): EncounterSolution {
  const samples = options.samples ?? 20_000, seed = options.seed ?? 1
  if (!Number.isInteger(samples) || samples < 1 || samples > MAX_SAMPLES) {
    throw new RangeError(`samples must be an integer in 1..${MAX_SAMPLES}`)
  }
  if (!(input.sigmaAlongKm >= 0) || !(input.sigmaAcrossKm >= 0)) throw new RangeError('sigmas must be >= 0')
  const f = encounterFrame(input)
  const rng = new HazardRng(seed)
  const psi = input.lineAngleDeg * DEG, cp = Math.cos(psi), sp = Math.sin(psi)
  const nx = input.nominal.xiKm, nz = input.nominal.zetaKm
  const bCap2 = f.bCapKm * f.bCapKm, kAngle = f.vInfKmS / (f.rKm * f.vEntryKmS)
  const hitS = new Float64Array(samples), hitC = new Float64Array(samples)
  let hits = 0, sumA = 0, sumA2 = 0, sumC = 0, sMin = Infinity, sMax = -Infinity
  for (let k = 0; k < samples; k++) {
    const s = input.sigmaAlongKm * rng.normal(), c = input.sigmaAcrossKm * rng.normal()
    const xi = nx + s * cp - c * sp, zeta = nz + s * sp + c * cp
    const b2 = xi * xi + zeta * zeta
    if (b2 > bCap2) continue
    // Entry angle from b alone: cos γ = b v∞ / (r v).
    const g = Math.acos(Math.min(1, Math.sqrt(b2) * kAngle))
    sumA += g; sumA2 += g * g; sumC += c
    if (s < sMin) sMin = s
    if (s > sMax) sMax = s
    hitS[hits] = s; hitC[hits] = c; hits++
  }
  const nominalEntry = entryFromBPlane({ ...input, xiKm: nx, zetaKm: nz })
  const approachDays = approachTimeS(f.vInfKmS, nominalEntry.hit ? nominalEntry.bKm : 0, undefined, f.rKm) / 86400
  const warnings: EncounterWarning[] = []
  if (f.vInfKmS < LOW_V_INF_KMS) {
    warnings.push({
      code: 'low-v-inf',
      message: `v∞ ${f.vInfKmS.toFixed(2)} km/s is below ${LOW_V_INF_KMS} km/s: the Sun and Moon shape so slow an approach; `
        + 'the two-body b-plane is a rough screening only.',
    })
  }
  if (approachDays > LONG_APPROACH_DAYS) {
    warnings.push({
      code: 'long-approach',
      message: `The body takes ${approachDays.toFixed(1)} days from the edge of the Earth's sphere of influence to entry: `
        + 'the two-body approach ignores the Sun and Moon over that time.',
    })
  }
  const impactTime = new Date(f.timeMs).toISOString()
  const encounter = { ...input, captureRadiusKm: f.bCapKm, nominalEntry, samples, seed, hits, approachDays }
  const P = hits / samples
  const speed = f.vEntryKmS
  const speedMean = clamp(speed, SPEED_RANGE, warnings, 'speed-clamped', 'entry speed', 'km/s')
  if (hits === 0) {
    warnings.push({ code: 'no-hits', message: `None of the ${samples} b-plane samples hits the Earth: no corridor.` })
    return {
      impactProbability: 0, impactTime, corridor: null, entrySpeedKmS: { mean: speedMean, sigma: 0 },
      entryAngleDeg: { mean: 45, sigma: 0 }, encounter, warnings,
    }
  }
  if (hits < FEW_HITS) {
    warnings.push({
      code: 'few-hits',
      message: `Only ${hits} of ${samples} samples hit (${(100 * P).toPrecision(2)} %): the probability and the corridor are `
        + `uncertain by about ${Math.round(100 / Math.sqrt(hits))} %. More samples help.`,
    })
  }
  const angleMean = sumA / hits / DEG
  const angleSigma = Math.sqrt(Math.max(0, sumA2 / hits - (sumA / hits) ** 2)) / DEG
  const corridor = corridorFromHits(f, input, hitS.subarray(0, hits), hitC.subarray(0, hits), sumC / hits, sMin, sMax,
    nominalEntry, warnings)
  return {
    impactProbability: P, impactTime, corridor,
    entrySpeedKmS: { mean: speedMean, sigma: 0 },
    entryAngleDeg: {
      mean: clamp(angleMean, ANGLE_RANGE, warnings, 'angle-clamped', 'mean entry angle', '°'),
      sigma: Math.min(45, angleSigma),
    },
    encounter, warnings,
  }
}

function clamp(v: number, range: readonly [number, number], warnings: EncounterWarning[], code: EncounterWarning['code'],
  what: string, unit: string): number {
  const c = Math.min(range[1], Math.max(range[0], v))
  if (c !== v) {
    warnings.push({ code, message: `The ${what} ${v.toFixed(2)} ${unit} is outside ${range[0]}–${range[1]} ${unit}: set to ${c}.` })
  }
  return c
}

/**
 * The risk corridor of a set of hits given by their offsets along (s) and across (c) the line of variations from the
 * nominal b-plane point, km. See solutionFromEncounter for the definitions. Each hit is placed on the track by its
 * nearest node (same s) plus the first-order projection of its offset on the node's tangent and normal.
 */
export function corridorFromHits(f: EncounterFrame, input: EncounterInput, hitS: Float64Array, hitC: Float64Array,
  cMean: number, sMin: number, sMax: number, nominalEntry: BPlaneEntry, warnings: EncounterWarning[] = []): OrbitSolution['corridor'] {
  const psi = input.lineAngleDeg * DEG, cp = Math.cos(psi), sp = Math.sin(psi)
  const origin = { xiKm: input.nominal.xiKm - cMean * sp, zetaKm: input.nominal.zetaKm + cMean * cp }
  // Chord of the line through origin with the capture disk: s² + 2 s (o·d) + |o|² - b⊕² = 0.
  const od = origin.xiKm * cp + origin.zetaKm * sp
  const disc = Math.max(0, od * od - (origin.xiKm ** 2 + origin.zetaKm ** 2) + f.bCapKm ** 2)
  const lo = -od - Math.sqrt(disc), hi = -od + Math.sqrt(disc)
  let s1 = Math.max(lo, sMin), s2 = Math.min(hi, sMax)
  if (!(s2 - s1 > 1e-3)) {
    const mid = Math.min(hi, Math.max(lo, 0.5 * (s1 + s2)))
    s1 = Math.max(lo, mid - 1); s2 = Math.min(hi, mid + 1)
  }
  const tauNom = arrivalTimeS(Math.hypot(input.nominal.xiKm, input.nominal.zetaKm), f.vInfKmS, f.rKm)
  const t = lineTrack(f, origin, psi, s1, s2, CORRIDOR_POINTS, tauNom)
  const n = t.n, U = t.u, R = EARTH_RADIUS_KM
  // Tangent and normal of each node (central differences, made perpendicular to the node).
  const T = new Float64Array(3 * n), N = new Float64Array(3 * n)
  for (let j = 0; j < n; j++) {
    const a = Math.max(0, j - 1), b = Math.min(n - 1, j + 1)
    let tx = U[3 * b]! - U[3 * a]!, ty = U[3 * b + 1]! - U[3 * a + 1]!, tz = U[3 * b + 2]! - U[3 * a + 2]!
    const ux = U[3 * j]!, uy = U[3 * j + 1]!, uz = U[3 * j + 2]!
    const d = tx * ux + ty * uy + tz * uz
    tx -= d * ux; ty -= d * uy; tz -= d * uz
    const tn = Math.hypot(tx, ty, tz) || 1
    tx /= tn; ty /= tn; tz /= tn
    T[3 * j] = tx; T[3 * j + 1] = ty; T[3 * j + 2] = tz
    N[3 * j] = uy * tz - uz * ty; N[3 * j + 1] = uz * tx - ux * tz; N[3 * j + 2] = ux * ty - uy * tx
  }
  const tmp = new Float64Array(5), fixed = new Float64Array(3)
  const place = (s: number, c: number, out: Float64Array): boolean => {
    const xi = input.nominal.xiKm + s * cp - c * sp, zeta = input.nominal.zetaKm + s * sp + c * cp
    if (!entryUnitInto(f, xi, zeta, tmp)) return false
    earthFixedInto(f, tmp, Math.hypot(xi, zeta), tauNom, fixed, 0)
    const x = Math.min(1, Math.max(-1, (t.m - s) / (t.h || 1)))
    const j = Math.min(n - 1, Math.max(0, Math.round(Math.acos(x) * (n - 1) / Math.PI)))
    const dx = fixed[0]! - U[3 * j]!, dy = fixed[1]! - U[3 * j + 1]!, dz = fixed[2]! - U[3 * j + 2]!
    out[0] = t.along[j]! + R * (dx * T[3 * j]! + dy * T[3 * j + 1]! + dz * T[3 * j + 2]!)
    out[1] = R * (dx * N[3 * j]! + dy * N[3 * j + 1]! + dz * N[3 * j + 2]!)
    return true
  }
  const hits = hitS.length, alongs = new Float64Array(hits), ac = new Float64Array(2)
  let sumC2 = 0, maxC = 0
  for (let k = 0; k < hits; k++) {
    place(hitS[k]!, hitC[k]!, ac)
    alongs[k] = ac[0]!
    sumC2 += ac[1]! * ac[1]!
    maxC = Math.max(maxC, Math.abs(ac[1]!))
  }
  let nominal: LonLat, nominalAlong: number
  if (nominalEntry.hit && place(0, 0, ac)) {
    nominal = [nominalEntry.lon!, nominalEntry.lat!]
    nominalAlong = ac[0]!
  }
  else {
    nominalAlong = median(alongs)
    let j = 0
    while (j < n - 1 && t.along[j + 1]! < nominalAlong) j++
    nominal = groundLonLat(U[3 * j]!, U[3 * j + 1]!, U[3 * j + 2]!, 0)
  }
  let sumA2 = 0
  for (let k = 0; k < hits; k++) sumA2 += (alongs[k]! - nominalAlong) ** 2
  const path: LonLat[] = []
  for (let j = 0; j < n; j++) path.push(groundLonLat(U[3 * j]!, U[3 * j + 1]!, U[3 * j + 2]!, 0))
  let halfWidthKm = Math.min(Math.sqrt(3 * sumC2 / hits), maxC)
  if (halfWidthKm > MAX_HALF_WIDTH_KM) {
    const message = `The corridor half-width ${halfWidthKm.toFixed(0)} km is set to ${MAX_HALF_WIDTH_KM} km.`
    warnings.push({ code: 'width-clamped', message })
    halfWidthKm = MAX_HALF_WIDTH_KM
  }
  return { path, halfWidthKm, nominal, alongTrackSigmaKm: Math.min(MAX_ALONG_SIGMA_KM, Math.sqrt(sumA2 / hits)) }
}

/**
 * Ground track of the whole line of variations: the b-plane line through the nominal point at lineAngleDeg, over its
 * chord inside the capture disk, each point at its own arrival time (as the corridor). For the editor's map.
 * @param points number of points, 2..2000 (default CORRIDOR_POINTS)
 * @returns [lon, lat] points in degrees from the -s end to the +s end, or null when the line misses the Earth
 */
export function lineOfVariationsTrack(
  input: Pick<EncounterInput, 'vInfKmS' | 'radiant' | 'timeUtc' | 'nominal' | 'lineAngleDeg' | 'altitudeKm'>,
  points = CORRIDOR_POINTS,
): LonLat[] | null {
  if (!Number.isInteger(points) || points < 2 || points > 2000) throw new RangeError('points must be an integer in 2..2000')
  const f = encounterFrame(input)
  const psi = input.lineAngleDeg * DEG, o = input.nominal
  const od = o.xiKm * Math.cos(psi) + o.zetaKm * Math.sin(psi)
  const disc = od * od - (o.xiKm ** 2 + o.zetaKm ** 2) + f.bCapKm ** 2
  if (!(disc > 0)) return null
  const tauNom = arrivalTimeS(Math.hypot(o.xiKm, o.zetaKm), f.vInfKmS, f.rKm)
  const t = lineTrack(f, o, psi, -od - Math.sqrt(disc), -od + Math.sqrt(disc), points, tauNom)
  const path: LonLat[] = []
  for (let j = 0; j < t.n; j++) path.push(groundLonLat(t.u[3 * j]!, t.u[3 * j + 1]!, t.u[3 * j + 2]!, 0))
  return path
}

function median(xs: Float64Array): number {
  const s = Float64Array.from(xs).sort()
  return s[Math.floor(s.length / 2)]!
}
