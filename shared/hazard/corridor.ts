import type { LonLat, OrbitSolution } from './schema'
import { EARTH_RADIUS_M, DEG } from './units'

/**
 * Geometry of a risk corridor on the sphere: the ground track is a chain of great-circle arcs.
 * A point is placed `s` metres along the track (beyond the ends, along the end arcs) and `c` metres
 * across it (rotated about the arc's pole, so exactly perpendicular to the track).
 */
export interface CorridorGeometry {
  /** Per arc: start unit vector a, tangent unit vector u at a, pole p = a × u (9 numbers). */
  frames: Float64Array
  /** Cumulative length at the start of each arc, m (length = arcs + 1). */
  starts: Float64Array
  /** Along-track coordinate of the nominal point projected on the track, m. */
  nominalAlongM: number
  totalM: number
}

/** Unit vector (x, y, z) of a point given in degrees, written to out[o..o+2] (spherical Earth; common practice). */
export function toUnit(lon: number, lat: number, out: Float64Array, o = 0): void {
  const cl = Math.cos(lat * DEG)
  out[o] = cl * Math.cos(lon * DEG)
  out[o + 1] = cl * Math.sin(lon * DEG)
  out[o + 2] = Math.sin(lat * DEG)
}

/** Builds the arc frames of a corridor path and projects the nominal point onto it. */
export function corridorGeometry(path: readonly LonLat[], nominal: LonLat): CorridorGeometry {
  const n = path.length - 1
  const frames = new Float64Array(9 * n)
  const starts = new Float64Array(n + 1)
  const a = new Float64Array(3), b = new Float64Array(3), q = new Float64Array(3)
  toUnit(nominal[0], nominal[1], q)
  let best = Infinity, nominalAlongM = 0
  for (let k = 0; k < n; k++) {
    const pa = path[k]!, pb = path[k + 1]!
    toUnit(pa[0], pa[1], a)
    toUnit(pb[0], pb[1], b)
    const d = a[0]! * b[0]! + a[1]! * b[1]! + a[2]! * b[2]!
    let ux = b[0]! - d * a[0]!, uy = b[1]! - d * a[1]!, uz = b[2]! - d * a[2]!
    const un = Math.hypot(ux, uy, uz)
    const len = Math.acos(Math.min(1, Math.max(-1, d))) * EARTH_RADIUS_M
    if (un < 1e-12) { ux = 0; uy = 0; uz = 0 }
    else { ux /= un; uy /= un; uz /= un }
    const f = 9 * k
    frames[f] = a[0]!; frames[f + 1] = a[1]!; frames[f + 2] = a[2]!
    frames[f + 3] = ux; frames[f + 4] = uy; frames[f + 5] = uz
    frames[f + 6] = a[1]! * uz - a[2]! * uy
    frames[f + 7] = a[2]! * ux - a[0]! * uz
    frames[f + 8] = a[0]! * uy - a[1]! * ux
    starts[k + 1] = starts[k]! + len
    // Nominal projected on this arc: angle along it, clamped to the arc, and the miss distance.
    const along = Math.atan2(q[0]! * ux + q[1]! * uy + q[2]! * uz, q[0]! * a[0]! + q[1]! * a[1]! + q[2]! * a[2]!)
    const t = Math.min(len, Math.max(0, along * EARTH_RADIUS_M))
    const ct = Math.cos(t / EARTH_RADIUS_M), st = Math.sin(t / EARTH_RADIUS_M)
    const miss = Math.acos(Math.min(1, q[0]! * (a[0]! * ct + ux * st) + q[1]! * (a[1]! * ct + uy * st) + q[2]! * (a[2]! * ct + uz * st)))
    if (miss < best) { best = miss; nominalAlongM = starts[k]! + t }
  }
  return { frames, starts, nominalAlongM, totalM: starts[n]! }
}

/**
 * Writes the unit vector of the point `alongM` metres along the track and `acrossM` metres across it
 * into out[o..o+2]. Beyond the ends the end arcs are extended along their great circles.
 */
export function corridorPointInto(g: CorridorGeometry, alongM: number, acrossM: number, out: Float64Array, o: number): void {
  const n = g.starts.length - 1
  let k = 0
  while (k < n - 1 && alongM >= g.starts[k + 1]!) k++
  const F = g.frames, f = 9 * k
  const phi = (alongM - g.starts[k]!) / EARTH_RADIUS_M
  const dl = acrossM / EARTH_RADIUS_M
  const cp = Math.cos(phi), sp = Math.sin(phi), cd = Math.cos(dl), sd = Math.sin(dl)
  out[o] = (F[f]! * cp + F[f + 3]! * sp) * cd + F[f + 6]! * sd
  out[o + 1] = (F[f + 1]! * cp + F[f + 4]! * sp) * cd + F[f + 7]! * sd
  out[o + 2] = (F[f + 2]! * cp + F[f + 5]! * sp) * cd + F[f + 8]! * sd
}

/** [lon, lat] in degrees of a unit vector. */
export function unitToLonLat(x: number, y: number, z: number): LonLat {
  return [Math.atan2(y, x) / DEG, Math.asin(Math.max(-1, Math.min(1, z))) / DEG]
}

/**
 * One impact point of the corridor: along-track offset `zAlong` standard deviations from the nominal
 * (Normal, sigma = alongTrackSigmaKm) and cross-track fraction `uAcross` in [0, 1) of the full width
 * (uniform within ± halfWidthKm: the corridor width bounds the track, it is not a sigma).
 * Source: sampling choice of this engine (shared/hazard/README.md; common practice, no source).
 * @param solution orbit solution; zAlong standard normal deviate; uAcross uniform in [0, 1)
 * @returns [lon, lat] in degrees
 */
export function sampleSolutionCorridorPoint(solution: Pick<OrbitSolution, 'corridor'>, zAlong: number, uAcross: number): LonLat {
  const c = solution.corridor
  const g = corridorGeometry(c.path, c.nominal)
  const out = new Float64Array(3)
  corridorPointInto(g, g.nominalAlongM + zAlong * c.alongTrackSigmaKm * 1000, (2 * uAcross - 1) * c.halfWidthKm * 1000, out, 0)
  return unitToLonLat(out[0]!, out[1]!, out[2]!)
}
