/** Great-circle helpers on a spherical Earth (degrees in, kilometres out). */
import { geoDistance } from 'd3-geo'
import type { LonLat } from '../hazard/schema'

/** Mean Earth radius, km (IUGG mean radius; the hazard engine uses the same). */
export const EARTH_RADIUS_KM = 6371
/** Kilometres in one international nautical mile (common practice, no source). */
export const KM_PER_NMI = 1.852

const DEG = Math.PI / 180

/** Great-circle distance between two [lon, lat] points, km. */
export function distanceKm(a: LonLat, b: LonLat): number {
  return geoDistance(a, b) * EARTH_RADIUS_KM
}

/** Initial bearing from a to b, degrees clockwise from north. */
export function bearingDeg(a: LonLat, b: LonLat): number {
  const [l1, p1] = [a[0] * DEG, a[1] * DEG]
  const [l2, p2] = [b[0] * DEG, b[1] * DEG]
  const y = Math.sin(l2 - l1) * Math.cos(p2)
  const x = Math.cos(p1) * Math.sin(p2) - Math.sin(p1) * Math.cos(p2) * Math.cos(l2 - l1)
  return Math.atan2(y, x) / DEG
}

/** The point `km` away from p along the great circle leaving it at `bearing` degrees (spherical destination formula). */
export function destination(p: LonLat, bearing: number, km: number): LonLat {
  const d = km / EARTH_RADIUS_KM
  const t = bearing * DEG
  const l1 = p[0] * DEG, p1 = p[1] * DEG
  const p2 = Math.asin(Math.sin(p1) * Math.cos(d) + Math.cos(p1) * Math.sin(d) * Math.cos(t))
  const l2 = l1 + Math.atan2(Math.sin(t) * Math.sin(d) * Math.cos(p1), Math.cos(d) - Math.sin(p1) * Math.sin(p2))
  return [((l2 / DEG + 540) % 360) - 180, p2 / DEG]
}

/**
 * Distance from p to the great-circle arc a→b, km: the cross-track distance when the foot of the
 * perpendicular falls on the arc, otherwise the distance to the nearer end.
 */
export function distanceToArcKm(p: LonLat, a: LonLat, b: LonLat): number {
  const d13 = geoDistance(a, p)
  const t13 = (bearingDeg(a, p) - bearingDeg(a, b)) * DEG
  const xt = Math.asin(Math.sin(d13) * Math.sin(t13))
  const along = Math.acos(Math.max(-1, Math.min(1, Math.cos(d13) / Math.cos(xt))))
  const ab = geoDistance(a, b)
  if (Math.cos(t13) > 0 && along <= ab) return Math.abs(xt) * EARTH_RADIUS_KM
  return Math.min(d13, geoDistance(b, p)) * EARTH_RADIUS_KM
}

/** Distance from p to a polyline of great-circle arcs, km. */
export function distanceToPathKm(p: LonLat, path: readonly LonLat[]): number {
  let best = Infinity
  for (let k = 0; k + 1 < path.length; k++) best = Math.min(best, distanceToArcKm(p, path[k]!, path[k + 1]!))
  return best
}
