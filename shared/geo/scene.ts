/**
 * A map scene: everything the map shows, projected to pixels of a width × height frame. The Vue map
 * draws it (with zoom and pan on top), and `renderMapSvg` serialises it for reports.
 */
import { geoGraticule, geoPath, type GeoProjection } from 'd3-geo'
import type { FeatureCollection, Geometry } from 'geojson'
import type { LonLat } from '../hazard/schema'
import type { Footprint } from '../hazard/types'
import { boxesOverlap, type Atlas, type LonLatBox } from './atlas'
import { corridorBand, corridorLine } from './corridor'
import type { RunUpClass } from './overlays'
import { geodesicRing } from './rings'
import { destination, distanceKm } from './sphere'
import { projectionFor, type CorridorShape, type MapView, type Padding } from './views'

export interface SceneCorridor extends CorridorShape { label?: string }
export interface SceneSite { id: string; name: string; lon: number; lat: number; population: number; tone: RunUpClass }
/** A ring of equal distance around the nominal point: a blast threshold (kPa) or, beside footprints, a median-case contour. */
export interface SceneRing { key: string; label: string; radiusKm: number; thresholdKPa?: number }
/** sea: surface impact at sea; land: surface impact on land; air: airburst (over land or sea). */
export type PointKind = 'sea' | 'land' | 'air'

export interface SceneInput {
  width: number
  height: number
  view: MapView
  padding?: number | Padding
  atlas?: Atlas | null
  /** Earliest first; the last is the current solution, drawn strongest. */
  corridors: readonly SceneCorridor[]
  /** [lon, lat, flags] with flags bit0 = sea, bit1 = airburst (Assessment.impactPoints). */
  impactPoints?: ReadonlyArray<readonly [number, number, number]>
  sites?: readonly SceneSite[]
  /** Rings around the current nominal point. */
  rings?: readonly SceneRing[]
  /**
   * Probabilistic footprints to shade (Assessment.footprints, only the keys to show). With footprints the rings are
   * their median-case contours: drawn thin and unlabelled, each threshold labelled once at its footprint instead.
   */
  footprints?: readonly Footprint[]
}

export interface MapScene {
  width: number
  height: number
  view: MapView
  graticule: string
  land: string
  borders: string
  corridors: Array<{ band: string; track: string; current: boolean; label?: string }>
  /** Largest first; labels alternate between the top (north) and the bottom (south) of the rings (none beside footprints). */
  rings: Array<SceneRing & { d: string; labelAt: [number, number] | null; labelSide: 'top' | 'bottom' }>
  /**
   * Shaded footprint areas, one path per probability level (weakest first), and where the threshold's one label goes:
   * the northernmost point on screen of its even-odds area (else of its weakest), null when out of frame.
   */
  footprints: Array<{ key: string; label: string; levels: Array<{ probability: number; d: string }>; labelAt: [number, number] | null }>
  /** True when footprints were given: the rings are then median-case contours. */
  probabilistic: boolean
  points: Array<{ x: number; y: number; kind: PointKind }>
  /** Impact points left out because they fall outside the frame. */
  culledPoints: number
  sites: Array<SceneSite & { x: number; y: number }>
  nominal: [number, number] | null
  projection: GeoProjection
}

export function pointKind(flags: number): PointKind {
  return flags & 2 ? 'air' : flags & 1 ? 'sea' : 'land'
}

/** The lon/lat box a Mercator frame shows (for culling atlas parts before projecting them). */
function viewBox(p: GeoProjection, w: number, h: number): LonLatBox | null {
  const a = p.invert?.([0, 0]), b = p.invert?.([w, h])
  if (!a || !b) return null
  return [[Math.min(a[0], b[0]) - 1, Math.min(a[1], b[1]) - 1], [Math.max(a[0], b[0]) + 1, Math.max(a[1], b[1]) + 1]]
}

const fc = (geometries: Geometry[]): FeatureCollection => ({
  type: 'FeatureCollection',
  features: geometries.map(geometry => ({ type: 'Feature', properties: {}, geometry })),
})

export function buildScene(input: SceneInput): MapScene {
  const { width, height, view } = input
  const current = input.corridors[input.corridors.length - 1]
  const sites = input.sites ?? []
  const rings = input.rings ?? []
  const footprints = input.footprints ?? []
  const probabilistic = input.footprints !== undefined
  let ringKm = rings.reduce((m, r) => Math.max(m, r.radiusKm), 0)
  // The regional view also fits the weakest level of each footprint shown.
  if (current) {
    for (const f of footprints) {
      for (const poly of f.levels[0]?.geometry.coordinates ?? []) {
        for (const p of poly[0] ?? []) ringKm = Math.max(ringKm, distanceKm(current.nominal, [p[0]!, p[1]!]))
      }
    }
  }
  const projection = projectionFor(
    view,
    { width, height, corridors: input.corridors, sites: sites.map(s => [s.lon, s.lat] as LonLat), ringKm, padding: input.padding },
  )
  const path = geoPath(projection).digits(1)
  const inFrame = (xy: [number, number] | null): xy is [number, number] =>
    !!xy && xy[0] >= 0 && xy[0] <= width && xy[1] >= 0 && xy[1] <= height

  let land = '', borders = ''
  if (input.atlas) {
    const box = view === 'regional' ? viewBox(projection, width, height) : null
    const keep = <G>(parts: Array<{
      geometry: G
      bounds: LonLatBox
    }>) => parts.filter(p => !box || boxesOverlap(p.bounds, box)).map(p => p.geometry)
    land = path(fc(keep(input.atlas.land))) ?? ''
    borders = path(fc(keep(input.atlas.borders))) ?? ''
  }
  const graticule = path(geoGraticule().step(view === 'ocean' ? [10, 10] : [1, 1])()) ?? ''

  const corridors = input.corridors.map((c, i) => ({
    band: path(corridorBand(c.path, c.halfWidthKm)) ?? '',
    track: path(corridorLine(c.path)) ?? '',
    current: i === input.corridors.length - 1,
    ...(c.label ? { label: c.label } : {}),
  }))

  const sceneRings = current
    ? [...rings].sort((a, b) => b.radiusKm - a.radiusKm).map((r, i) => {
        const labelSide = i % 2 ? 'bottom' as const : 'top' as const
        const at = projection(destination(current.nominal, i % 2 ? 180 : 0, r.radiusKm))
        const centre = projection(current.nominal)
        // A ring a few pixels across gets no label: it would only cover the corridor.
        const wide = !probabilistic && !!at && !!centre && Math.hypot(at[0] - centre[0], at[1] - centre[1]) >= 36
        return { ...r, d: path(geodesicRing(current.nominal, r.radiusKm, 1)) ?? '', labelAt: wide && inFrame(at) ? at : null, labelSide }
      })
    : []

  const sceneFootprints: MapScene['footprints'] = footprints.map((f) => {
    const levels = f.levels.map(l => ({ probability: l.probability, d: path(l.geometry) ?? '' })).filter(l => l.d)
    const edge = f.levels.find(l => l.probability === 0.5) ?? f.levels[0]
    let labelAt: [number, number] | null = null
    for (const poly of edge?.geometry.coordinates ?? []) {
      for (const p of poly[0] ?? []) {
        const xy = projection([p[0]!, p[1]!])
        if (inFrame(xy) && (!labelAt || xy[1] < labelAt[1])) labelAt = xy
      }
    }
    return { key: f.key, label: f.label, levels, labelAt }
  })

  const points: MapScene['points'] = []
  let culledPoints = 0
  for (const [lon, lat, flags] of input.impactPoints ?? []) {
    const xy = projection([lon, lat])
    if (inFrame(xy)) points.push({ x: xy[0], y: xy[1], kind: pointKind(flags) })
    else culledPoints++
  }

  const placed: MapScene['sites'] = []
  for (const s of sites) {
    const xy = projection([s.lon, s.lat])
    if (inFrame(xy)) placed.push({ ...s, x: xy[0], y: xy[1] })
  }
  const nom = current ? projection(current.nominal) : null

  return {
    width,
    height,
    view,
    graticule,
    land,
    borders,
    corridors,
    rings: sceneRings,
    footprints: sceneFootprints,
    probabilistic,
    points,
    culledPoints,
    sites: placed,
    nominal: inFrame(nom) ? nom : null,
    projection,
  }
}

const r1 = (x: number) => Math.round(x * 10) / 10

/**
 * One SVG path for many impact points of a kind, in a zoomed frame (screen = base × k + t):
 * sea → dots (draw with round caps), land → squares, air → small rings.
 */
export function pointsPath(points: MapScene['points'], kind: PointKind, k = 1, tx = 0, ty = 0, sizePx = 2.2): string {
  const parts: string[] = []
  for (const p of points) {
    if (p.kind !== kind) continue
    const x = r1(p.x * k + tx), y = r1(p.y * k + ty)
    if (kind === 'sea') parts.push(`M${x} ${y}h0`)
    else if (kind === 'land') parts.push(`M${r1(x - sizePx)} ${r1(y - sizePx)}h${r1(2 * sizePx)}v${r1(2 * sizePx)}h${r1(-2 * sizePx)}z`)
    else parts.push(`M${r1(x - sizePx)} ${y}a${sizePx} ${sizePx} 0 1 0 ${r1(2 * sizePx)} 0a${sizePx} ${sizePx} 0 1 0 ${r1(-2 * sizePx)} 0`)
  }
  return parts.join('')
}

/**
 * A scale bar for the map at zoom `k`: the longest round distance (1, 2 or 5 × 10ⁿ km) that spans at most `maxPx`
 * screen pixels at the centre of the frame, measured east–west along the projection there. Null when the centre
 * is off the globe.
 */
export function scaleBar(projection: GeoProjection, width: number, height: number, k = 1, maxPx = 160): { km: number; px: number } | null {
  const centre = projection.invert?.([width / 2, height / 2])
  if (!centre || !Number.isFinite(centre[0]) || !Number.isFinite(centre[1])) return null
  const a = projection(centre as [number, number])
  const b = projection(destination(centre as [number, number], 90, 100))
  if (!a || !b) return null
  const pxPerKm = Math.hypot(b[0] - a[0], b[1] - a[1]) / 100 * k
  if (!(pxPerKm > 0)) return null
  const want = maxPx / pxPerKm
  const pow = 10 ** Math.floor(Math.log10(want))
  const km = [5, 2, 1].map(m => m * pow).find(x => x <= want) ?? pow
  return { km, px: km * pxPerKm }
}
