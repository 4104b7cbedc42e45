/** The two map views: the whole ocean (where the corridor may run) and the region around the nominal point. */
import { geoBounds, geoConicEqualArea, geoMercator, type GeoProjection } from 'd3-geo'
import type { Feature, FeatureCollection, Geometry } from 'geojson'
import type { LonLat } from '../hazard/schema'
import { corridorBand } from './corridor'
import { geodesicRing } from './rings'
import { distanceKm } from './sphere'

export type MapView = 'ocean' | 'regional'

export interface CorridorShape {
  path: LonLat[]
  halfWidthKm: number
  nominal: LonLat
  alongTrackSigmaKm?: number
}

export interface Padding { top: number; right: number; bottom: number; left: number }

export interface ViewFrame {
  width: number
  height: number
  /** Earliest first; the last is the current solution's corridor. */
  corridors: readonly CorridorShape[]
  sites: readonly LonLat[]
  /** Radius of the largest ring to show around the nominal point, km. */
  ringKm?: number
  padding?: number | Padding
}

const pad = (p: ViewFrame['padding']): Padding => typeof p === 'object'
  ? p
  : {
      top: p ?? 24,
      right: p ?? 24,
      bottom: p ?? 24,
      left: p ?? 24,
    }

function extent(f: ViewFrame): [[number, number], [number, number]] {
  const p = pad(f.padding)
  return [[p.left, p.top], [Math.max(p.left + 10, f.width - p.right), Math.max(p.top + 10, f.height - p.bottom)]]
}

const collection = (features: Array<Feature<Geometry>>): FeatureCollection => ({ type: 'FeatureCollection', features })
const points = (pts: readonly LonLat[]): Feature<Geometry> => ({
  type: 'Feature',
  properties: {},
  geometry: { type: 'MultiPoint', coordinates: pts.map(p => [p[0], p[1]]) },
})

/** The view a corridor calls for: regional once its spread fits within about 150 km of the nominal point. */
export function defaultView(c: CorridorShape): MapView {
  return Math.max(c.halfWidthKm, 2 * (c.alongTrackSigmaKm ?? 0)) <= 150 ? 'regional' : 'ocean'
}

/**
 * Whole-ocean view: an equal-area conic (no area is exaggerated, so corridor widths compare fairly)
 * with standard parallels inside the earliest corridor, fitted to that corridor, the sites and the
 * current nominal point.
 */
export function oceanProjection(f: ViewFrame): GeoProjection {
  const first = f.corridors[0], current = f.corridors[f.corridors.length - 1]
  const features: Array<Feature<Geometry>> = []
  if (first) features.push(corridorBand(first.path, first.halfWidthKm))
  const pts = [...f.sites, ...(current ? [current.nominal] : [])]
  if (pts.length) features.push(points(pts))
  const fc = collection(features.length ? features : [points([[0, 0]])])
  const [[w, s], [e, n]] = geoBounds(fc)
  const lon0 = w <= e ? (w + e) / 2 : (w + e + 360) / 2
  const span = Math.max(4, n - s)
  const proj = geoConicEqualArea().rotate([-lon0, 0]).parallels([s + span / 6, n - span / 6])
  proj.fitExtent(extent(f), fc)
  return proj.clipExtent([[0, 0], [f.width, f.height]])
}

/**
 * Regional view: Mercator (true shapes at this scale) fitted to the nominal point with the largest
 * ring around it (at least 30 km) and the sites within reach of it.
 */
export function regionalProjection(f: ViewFrame): GeoProjection {
  const current = f.corridors[f.corridors.length - 1]
  const centre: LonLat = current ? current.nominal : (f.sites[0] ?? [0, 0])
  const radius = Math.max(30, (f.ringKm ?? 0) * 1.1)
  const reach = Math.max(150, radius * 2.5)
  const near = f.sites.filter(s => distanceKm(s, centre) <= reach)
  const features: Array<Feature<Geometry>> = [geodesicRing(centre, radius)]
  if (near.length) features.push(points(near))
  const proj = geoMercator().fitExtent(extent(f), collection(features))
  return proj.clipExtent([[0, 0], [f.width, f.height]])
}

export function projectionFor(view: MapView, f: ViewFrame): GeoProjection {
  return view === 'ocean' ? oceanProjection(f) : regionalProjection(f)
}
