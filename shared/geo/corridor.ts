/** The risk corridor on the map: a band of constant half-width around the ground track. */
import { geoArea, geoInterpolate } from 'd3-geo'
import type { Feature, LineString, Polygon, Position } from 'geojson'
import type { LonLat } from '../hazard/schema'
import { bearingDeg, destination, distanceKm } from './sphere'

/** Length of a path of great-circle arcs, km. */
export function pathLengthKm(path: readonly LonLat[]): number {
  let total = 0
  for (let k = 0; k + 1 < path.length; k++) total += distanceKm(path[k]!, path[k + 1]!)
  return total
}

/** The path with extra points along each great-circle arc so that no step exceeds `stepKm`. */
export function densifyPath(path: readonly LonLat[], stepKm: number): LonLat[] {
  const out: LonLat[] = []
  for (let k = 0; k + 1 < path.length; k++) {
    const a = path[k]!, b = path[k + 1]!
    const n = Math.max(1, Math.ceil(distanceKm(a, b) / stepKm))
    const at = geoInterpolate(a, b)
    for (let i = 0; i < n; i++) out.push(i === 0 ? [a[0], a[1]] : at(i / n) as LonLat)
  }
  const last = path[path.length - 1]!
  out.push([last[0], last[1]])
  return out
}

function turn(a: number, b: number): number {
  return ((b - a + 540) % 360) - 180
}

/**
 * Left and right edges of the band: each track point offset by `halfWidthKm` at right angles to
 * the track (great-circle destination). Where two arcs meet, the offset runs along the bisector and
 * is lengthened by 1/cos(half the turn) (a mitre), so the edge stays `halfWidthKm` from both arcs.
 */
export function corridorEdges(path: readonly LonLat[], halfWidthKm: number, stepKm?: number): { left: LonLat[]; right: LonLat[] } {
  const clean = path.filter((p, i) => i === 0 || distanceKm(path[i - 1]!, p) > 1e-6)
  if (clean.length < 2) throw new Error('A corridor path needs two distinct points.')
  const step = stepKm ?? Math.min(100, Math.max(0.25, pathLengthKm(clean) / 64))
  const pts = densifyPath(clean, step)
  const left: LonLat[] = [], right: LonLat[] = []
  for (let i = 0; i < pts.length; i++) {
    const p = pts[i]!
    const out = i + 1 < pts.length ? bearingDeg(p, pts[i + 1]!) : null
    const inn = i > 0 ? (bearingDeg(p, pts[i - 1]!) + 180) % 360 : null
    const heading = out === null ? inn! : inn === null ? out : inn + turn(inn, out) / 2
    const half = out !== null && inn !== null ? Math.abs(turn(inn, out)) / 2 : 0
    const reach = halfWidthKm / Math.max(0.5, Math.cos(half * Math.PI / 180))
    left.push(destination(p, heading - 90, reach))
    right.push(destination(p, heading + 90, reach))
  }
  return { left, right }
}

/**
 * The corridor band as a GeoJSON polygon (d3-geo winding: the ring encloses the band, not the rest
 * of the globe). A half-width of 0 gives a hairline band; draw the track with `corridorLine` too.
 */
export function corridorBand(path: readonly LonLat[], halfWidthKm: number, stepKm?: number): Feature<Polygon> {
  const { left, right } = corridorEdges(path, Math.max(halfWidthKm, 0.01), stepKm)
  let ring: Position[] = [...left, ...right.reverse()]
  ring.push(ring[0]!)
  let geometry: Polygon = { type: 'Polygon', coordinates: [ring] }
  if (geoArea(geometry) > 2 * Math.PI) {
    ring = ring.slice().reverse()
    geometry = { type: 'Polygon', coordinates: [ring] }
  }
  return { type: 'Feature', properties: { halfWidthKm }, geometry }
}

/** The ground track as a GeoJSON line (drawn along great circles by d3-geo). */
export function corridorLine(path: readonly LonLat[]): Feature<LineString> {
  return { type: 'Feature', properties: {}, geometry: { type: 'LineString', coordinates: path.map(p => [p[0], p[1]]) } }
}
