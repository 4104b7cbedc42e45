import { DEG, EARTH_RADIUS_KM, HILL_RADIUS_KM, MU_EARTH_KM3S2 } from './constants'
import { greenwichSiderealRad, timeMs, type TimeInput } from './sidereal'

/** Geocentric radiant: the direction the body comes from, right ascension and declination in degrees (equator of date). */
export interface Radiant { raDeg: number; decDeg: number }

/** A point of the b-plane, km, in the project's axes (see bPlaneAxes). */
export interface BPlanePoint { xiKm: number; zetaKm: number }

/**
 * The b-plane axes of a radiant as unit vectors of the geocentric equatorial frame (x to the equinox, z to the
 * celestial north pole). The b-plane passes through the Earth's centre perpendicular to the incoming asymptote.
 * Project's convention (the heliocentric axes of Valsecchi et al. 2003, A&A 408, 1179–1196, need the Earth's
 * heliocentric velocity, which a geocentric radiant does not give):
 * - `radiant` R̂ = (cos δ cos α, cos δ sin α, sin δ): towards the radiant; the body moves along -R̂ (η = -R̂);
 * - `zeta` ζ̂ = ∂R̂/∂δ = (-sin δ cos α, -sin δ sin α, cos δ): the projection of celestial north onto the plane;
 * - `xi` ξ̂ = ζ̂ × R̂ = (-sin α, cos α, 0): towards increasing right ascension; (ξ̂, η̂, ζ̂) is right-handed.
 * At the celestial poles ζ̂ is the limit of the same formula (it depends on α there).
 */
export function bPlaneAxes(radiant: Radiant): { radiant: number[]; xi: number[]; zeta: number[] } {
  const a = radiant.raDeg * DEG, d = radiant.decDeg * DEG
  const ca = Math.cos(a), sa = Math.sin(a), cd = Math.cos(d), sd = Math.sin(d)
  return { radiant: [cd * ca, cd * sa, sd], xi: [-sa, ca, 0], zeta: [-sd * ca, -sd * sa, cd] }
}

/**
 * Radius of the Earth's capture cross-section (gravitational focusing), km: `b⊕ = r sqrt(1 + v_esc(r)² / v∞²)`,
 * `v_esc(r)² = 2 GM⊕ / r`, r = R⊕ + altitude. Source: Öpik 1951 (Proc. R. Irish Acad. 54A, 165–199) in the form of
 * Valsecchi et al. 2003 (A&A 408, 1179–1196, sect. 2); angular momentum and energy conservation of the hyperbola.
 * @param vInfKmS hyperbolic excess speed v∞, km/s (> 0)
 * @param altitudeKm altitude of the entry sphere above R⊕ = 6 371 km, km (default 0)
 * @returns capture radius, km
 */
export function captureRadiusKm(vInfKmS: number, altitudeKm = 0): number {
  const r = EARTH_RADIUS_KM + altitudeKm
  return r * Math.sqrt(1 + 2 * MU_EARTH_KM3S2 / (r * vInfKmS * vInfKmS))
}

/**
 * Speed where the hyperbola crosses the sphere of radius r, km/s: `v = sqrt(v∞² + 2 GM⊕ / r)` (vis-viva / energy
 * conservation; e.g. Valsecchi et al. 2003). At r = R⊕: `sqrt(v∞² + 11.186²)`.
 */
export function entrySpeedKmS(vInfKmS: number, altitudeKm = 0): number {
  return Math.sqrt(vInfKmS * vInfKmS + 2 * MU_EARTH_KM3S2 / (EARTH_RADIUS_KM + altitudeKm))
}

/**
 * Angle through which the radius vector turns from the incoming asymptote (direction R̂) to the crossing of the
 * sphere r, rad, for impact parameter b: `φ = arccos((1 - p/r)/e) - arccos(1/e)` written with atan2 so it stays exact
 * near b = 0: `φ = atan2(b s, A - b²/r) - atan2(b, A)`, `A = GM⊕/v∞²`, `s = sqrt(1 + 2A/r - b²/r²)`. From the orbit
 * equation `r = p / (1 + e cos f)`, `p = b²v∞²/GM⊕`, `e = sqrt(1 + b²v∞⁴/GM⊕²)`, on the incoming branch (f < 0)
 * (two-body conic; e.g. Murray & Dermott 1999, Solar System Dynamics, ch. 2). Requires b <= capture radius.
 */
export function turnAngleRad(bKm: number, A: number, r: number): number {
  const s = Math.sqrt(Math.max(0, 1 + 2 * A / r - bKm * bKm / (r * r)))
  return Math.atan2(bKm * s, A - bKm * bKm / r) - Math.atan2(bKm, A)
}

/** Precomputed geometry of one encounter (radiant, v∞, altitude, time): what every sample shares. */
export interface EncounterFrame {
  /** R̂, ξ̂, ζ̂ (see bPlaneAxes), 9 numbers. */
  axes: Float64Array
  vInfKmS: number
  /** Radius of the entry sphere, km. */
  rKm: number
  /** GM⊕ / v∞², km (the hyperbola's semi-major axis). */
  aKm: number
  /** Entry speed, km/s. */
  vEntryKmS: number
  /** Capture radius, km. */
  bCapKm: number
  /** Greenwich mean sidereal time at the entry, rad. */
  gmstRad: number
  timeMs: number
}

/** Builds the shared geometry of an encounter. */
export function encounterFrame(i: { vInfKmS: number; radiant: Radiant; timeUtc: TimeInput; altitudeKm?: number }): EncounterFrame {
  if (!(i.vInfKmS > 0) || !Number.isFinite(i.vInfKmS)) throw new RangeError('vInfKmS must be a positive number')
  const alt = i.altitudeKm ?? 0
  if (!(alt >= 0) || !Number.isFinite(alt)) throw new RangeError('altitudeKm must be >= 0')
  const ax = bPlaneAxes(i.radiant)
  const ms = timeMs(i.timeUtc)
  return {
    axes: Float64Array.from([...ax.radiant, ...ax.xi, ...ax.zeta]),
    vInfKmS: i.vInfKmS,
    rKm: EARTH_RADIUS_KM + alt,
    aKm: MU_EARTH_KM3S2 / (i.vInfKmS * i.vInfKmS),
    vEntryKmS: entrySpeedKmS(i.vInfKmS, alt),
    bCapKm: captureRadiusKm(i.vInfKmS, alt),
    gmstRad: greenwichSiderealRad(ms),
    timeMs: ms,
  }
}

/**
 * The inner step shared by every entry computation: for b-plane point (ξ, ζ) writes into out[o..o+4] the inertial
 * unit vector of the entry point (x, y, z), the entry angle from the horizontal (rad) and the turn angle φ (rad).
 * @returns false (out untouched) when the body misses (b > capture radius)
 */
export function entryUnitInto(f: EncounterFrame, xiKm: number, zetaKm: number, out: Float64Array, o = 0): boolean {
  const b2 = xiKm * xiKm + zetaKm * zetaKm
  if (b2 > f.bCapKm * f.bCapKm) return false
  const b = Math.sqrt(b2), X = f.axes
  const phi = turnAngleRad(b, f.aKm, f.rKm)
  const c = Math.cos(phi), s = b > 0 ? Math.sin(phi) / b : 0
  // û = cos φ R̂ + sin φ b̂, with b̂ = (ξ ξ̂ + ζ ζ̂) / b.
  out[o] = c * X[0]! + s * (xiKm * X[3]! + zetaKm * X[6]!)
  out[o + 1] = c * X[1]! + s * (xiKm * X[4]! + zetaKm * X[7]!)
  out[o + 2] = c * X[2]! + s * (xiKm * X[5]! + zetaKm * X[8]!)
  // Angular momentum b v∞ = r v cos γ (Valsecchi et al. 2003; two-body conservation law).
  out[o + 3] = Math.acos(Math.min(1, b * f.vInfKmS / (f.rKm * f.vEntryKmS)))
  out[o + 4] = phi
  return true
}

/** Longitude (degrees, [-180, 180)) and latitude of an inertial unit vector at sidereal angle gmstRad. */
export function groundLonLat(x: number, y: number, z: number, gmstRad: number): [number, number] {
  let lon = (Math.atan2(y, x) - gmstRad) / DEG
  lon = ((lon + 180) % 360 + 360) % 360 - 180
  return [lon, Math.asin(Math.max(-1, Math.min(1, z))) / DEG]
}

/** Input of entryFromBPlane. */
export interface BPlaneEntryInput extends BPlanePoint {
  /** Hyperbolic excess speed (geocentric speed at infinity), km/s, > 0. */
  vInfKmS: number
  radiant: Radiant
  /** When the body reaches the entry sphere (ISO 8601 with offset, Date or epoch ms). */
  timeUtc: TimeInput
  /** Altitude of the entry sphere above R⊕, km (default 0: the ground). */
  altitudeKm?: number
}

/** Where and how a body enters; the position fields are null when it misses. */
export interface BPlaneEntry {
  hit: boolean
  /** Ground point on the rotating Earth, degrees (spherical Earth, longitude in [-180, 180)). */
  lon: number | null
  lat: number | null
  /** Angle of the path below the local horizontal at the entry sphere, degrees (90 = vertical). */
  entryAngleDeg: number | null
  /** Speed at the entry sphere, km/s (inertial: the Earth's rotation, < 0.47 km/s, is not subtracted). */
  entrySpeedKmS: number | null
  /** Direction of travel at the entry, degrees clockwise from north (inertial); null when vertical. */
  azimuthDeg: number | null
  /** The time given (ISO 8601, UTC). */
  timeUtc: string
  /** Impact parameter b = sqrt(ξ² + ζ²) and the capture radius, km. */
  bKm: number
  captureRadiusKm: number
  /** Periapsis distance of the hyperbola, km: `q = A (e - 1)`, A = GM⊕/v∞²; a hit has q <= R⊕ + altitude. */
  periapsisKm: number
}

/**
 * Entry of a body from its b-plane point: the two-body hyperbola from the geocentric radiant, its crossing of the
 * sphere R⊕ + altitude, the entry angle to the local horizontal, the speed there and the ground point on the
 * rotating Earth (Greenwich mean sidereal time of Meeus 1998, eq. 12.4). A body aimed at the centre (ξ = ζ = 0)
 * enters vertically where the radiant is at the zenith: latitude = δ, longitude = α - GMST.
 * Sources: Öpik 1951; Valsecchi et al. 2003 (A&A 408, 1179–1196); two-body conic; see shared/encounter/README.md.
 */
export function entryFromBPlane(i: BPlaneEntryInput): BPlaneEntry {
  const f = encounterFrame(i)
  const out = new Float64Array(5)
  const b = Math.hypot(i.xiKm, i.zetaKm)
  const e = Math.sqrt(1 + (b / f.aKm) ** 2)
  const base = {
    timeUtc: new Date(f.timeMs).toISOString(), bKm: b, captureRadiusKm: f.bCapKm, periapsisKm: f.aKm * (e - 1),
  }
  if (!entryUnitInto(f, i.xiKm, i.zetaKm, out)) {
    return { hit: false, lon: null, lat: null, entryAngleDeg: null, entrySpeedKmS: null, azimuthDeg: null, ...base }
  }
  const [lon, lat] = groundLonLat(out[0]!, out[1]!, out[2]!, f.gmstRad)
  return {
    hit: true, lon, lat, entryAngleDeg: out[3]! / DEG, entrySpeedKmS: f.vEntryKmS,
    azimuthDeg: travelAzimuthDeg(f, i.xiKm, i.zetaKm, out), ...base,
  }
}

/** Azimuth of travel at the entry point (inertial), degrees clockwise from north; null for a vertical entry. */
function travelAzimuthDeg(f: EncounterFrame, xi: number, zeta: number, u: Float64Array): number | null {
  const b = Math.hypot(xi, zeta)
  if (b === 0 || u[3]! > Math.PI / 2 - 1e-9) return null
  const X = f.axes, phi = u[4]!
  // Horizontal direction of motion ŵ = -sin φ R̂ + cos φ b̂ (in the orbital plane, ahead of û).
  const w = [0, 1, 2].map(k => -Math.sin(phi) * X[k]! + Math.cos(phi) * (xi * X[3 + k]! + zeta * X[6 + k]!) / b)
  const lam = Math.atan2(u[1]!, u[0]!), la = Math.asin(Math.max(-1, Math.min(1, u[2]!)))
  const east = -Math.sin(lam) * w[0]! + Math.cos(lam) * w[1]!
  const north = -Math.sin(la) * Math.cos(lam) * w[0]! - Math.sin(la) * Math.sin(lam) * w[1]! + Math.cos(la) * w[2]!
  return ((Math.atan2(east, north) / DEG) + 360) % 360
}

/** Input of findBPlanePoint: the encounter, and the ground target [lon, lat] in degrees at timeUtc. */
export interface FindBPlaneInput {
  vInfKmS: number
  radiant: Radiant
  timeUtc: TimeInput
  target: readonly [number, number]
  altitudeKm?: number
}

/**
 * The b-plane point whose entry lands on a given ground point at the given time (the inverse of entryFromBPlane):
 * the target fixes the plane of the orbit (through R̂ and the target) and the turn angle φ; b follows from φ(b),
 * which rises monotonically from 0 at b = 0 to its largest value at the capture radius, by bisection to 1e-9 km.
 * @returns the point, or null when the target is beyond the reach of this radiant and v∞ (near the anti-radiant)
 */
export function findBPlanePoint(i: FindBPlaneInput): BPlanePoint | null {
  const f = encounterFrame(i)
  const lam = i.target[0] * DEG + f.gmstRad, la = i.target[1] * DEG
  const T = [Math.cos(la) * Math.cos(lam), Math.cos(la) * Math.sin(lam), Math.sin(la)]
  const X = f.axes
  const cosPhi = T[0]! * X[0]! + T[1]! * X[1]! + T[2]! * X[2]!
  const p = [T[0]! - cosPhi * X[0]!, T[1]! - cosPhi * X[1]!, T[2]! - cosPhi * X[2]!]
  const sinPhi = Math.hypot(p[0]!, p[1]!, p[2]!)
  const phiT = Math.atan2(sinPhi, cosPhi)
  if (sinPhi < 1e-15) return cosPhi > 0 ? { xiKm: 0, zetaKm: 0 } : null
  if (phiT > turnAngleRad(f.bCapKm, f.aKm, f.rKm)) return null
  let lo = 0, hi = f.bCapKm
  for (let k = 0; k < 200 && hi - lo > 1e-9; k++) {
    const mid = 0.5 * (lo + hi)
    if (turnAngleRad(mid, f.aKm, f.rKm) < phiT) lo = mid
    else hi = mid
  }
  const b = 0.5 * (lo + hi)
  const pXi = p[0]! * X[3]! + p[1]! * X[4]! + p[2]! * X[5]!
  const pZeta = p[0]! * X[6]! + p[1]! * X[7]! + p[2]! * X[8]!
  return { xiKm: b * pXi / sinPhi, zetaKm: b * pZeta / sinPhi }
}

/** Earth's sidereal rotation rate, rad/s: 360.98564736629° per day of UT (Meeus 1998, eq. 12.4, linear term). */
export const EARTH_ROTATION_RAD_S = 360.98564736629 * DEG / 86_400

/**
 * Arrival time at the sphere r of a body of impact parameter b, seconds, relative to the moment the b-plane cloud
 * it belongs to is abreast (all points of a b-plane cross-section travel together far upstream, the b-plane picture):
 * `τ(b) = t_r + (A/v∞) ln e`, with `t_r = (A/v∞)(e sinh F - F)`, `F = -arcosh((1 + r/A)/e)` the time from
 * periapsis on the incoming branch. The `(A/v∞) ln e` term is what remains of the time from a far plane at the same
 * distance for every sample, `v∞ t + d -> A ln(2d/(A e)) - A` (expansion of the hyperbolic Kepler equation; ours).
 * Only differences of τ mean something; at large v∞ they tend to the straight-line `-sqrt(r² - b²)/v∞`. For a body
 * that misses (b > capture radius) F is 0: τ is then its periapsis passage.
 */
export function arrivalTimeS(bKm: number, vInfKmS: number, rKm = EARTH_RADIUS_KM): number {
  const A = MU_EARTH_KM3S2 / (vInfKmS * vInfKmS)
  const e = Math.sqrt(1 + (bKm / A) ** 2)
  const F = -Math.acosh(Math.max(1, (1 + rKm / A) / e))
  return (A / vInfKmS) * (e * Math.sinh(F) - F + Math.log(e))
}

/**
 * Time of flight on the incoming hyperbola from distance r1 to distance r2 (r1 >= r2 >= periapsis), seconds:
 * `t(r) = (A / v∞)(e sinh F - F)`, `r = A (e cosh F - 1)`, A = GM⊕/v∞² (hyperbolic Kepler equation; e.g. Murray &
 * Dermott 1999, ch. 2). e = 1 (b = 0) is the rectilinear orbit, for which the same expressions hold.
 */
export function approachTimeS(vInfKmS: number, bKm: number, r1Km = HILL_RADIUS_KM, r2Km = EARTH_RADIUS_KM): number {
  const A = MU_EARTH_KM3S2 / (vInfKmS * vInfKmS)
  const e = Math.sqrt(1 + (bKm / A) ** 2)
  const t = (r: number) => {
    const F = Math.acosh(Math.max(1, (1 + r / A) / e))
    return (A / vInfKmS) * (e * Math.sinh(F) - F)
  }
  return t(r1Km) - t(r2Km)
}
