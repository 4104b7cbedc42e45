/** Geodesic circles (rings of equal distance) around a point. */
import { geoCircle } from 'd3-geo'
import type { Feature, Polygon } from 'geojson'
import type { LonLat } from '../hazard/schema'
import { EARTH_RADIUS_KM } from './sphere'

/**
 * A small circle of `radiusKm` around `center` (d3-geo geoCircle: every vertex lies at that
 * great-circle distance). `precisionDeg` is the angular step between vertices.
 */
export function geodesicRing(center: LonLat, radiusKm: number, precisionDeg = 2): Feature<Polygon> {
  const radiusDeg = (radiusKm / EARTH_RADIUS_KM) * 180 / Math.PI
  const geometry = geoCircle().center(center).radius(radiusDeg).precision(precisionDeg)()
  return { type: 'Feature', properties: { radiusKm }, geometry }
}
