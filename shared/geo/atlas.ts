/**
 * Land and country borders from Natural Earth through world-atlas (public domain). Loaded on demand
 * (dynamic import), so a browser bundle fetches an atlas only when a map is drawn; everything stays
 * offline. 110m for the whole-ocean view, 50m for the regional view.
 */
import { geoBounds } from 'd3-geo'
import { feature, mesh } from 'topojson-client'
import type { GeometryCollection, Topology } from 'topojson-specification'
import type { LineString, Polygon } from 'geojson'

export type AtlasResolution = '110m' | '50m'
/** [[west, south], [east, north]] in degrees; west > east when the box crosses the antimeridian. */
export type LonLatBox = [[number, number], [number, number]]

export interface AtlasPart<G> { geometry: G; bounds: LonLatBox }

export interface Atlas {
  resolution: AtlasResolution
  /** Land polygons (one per island or continent). */
  land: Array<AtlasPart<Polygon>>
  /** Borders between countries (shared arcs only, not the coastline). */
  borders: Array<AtlasPart<LineString>>
}

type AtlasTopology = Topology<{ countries: GeometryCollection; land: GeometryCollection }>

/** Splits a world-atlas `countries-*.json` topology into bounded parts for quick culling. */
export function atlasFromTopology(topology: AtlasTopology, resolution: AtlasResolution): Atlas {
  const land: Atlas['land'] = []
  const fc = feature(topology, topology.objects.land)
  for (const f of fc.features) {
    const g = f.geometry
    const polys = g.type === 'Polygon' ? [g.coordinates] : g.type === 'MultiPolygon' ? g.coordinates : []
    for (const coordinates of polys) {
      const geometry: Polygon = { type: 'Polygon', coordinates }
      land.push({ geometry, bounds: geoBounds(geometry) as LonLatBox })
    }
  }
  const lines = mesh(topology, topology.objects.countries, (a, b) => a !== b)
  const borders = lines.coordinates.map((coordinates) => {
    const geometry: LineString = { type: 'LineString', coordinates }
    return { geometry, bounds: geoBounds(geometry) as LonLatBox }
  })
  return { resolution, land, borders }
}

const cache = new Map<AtlasResolution, Promise<Atlas>>()

/** The atlas at a resolution, loaded once per process or page. */
export function loadAtlas(resolution: AtlasResolution): Promise<Atlas> {
  let p = cache.get(resolution)
  if (!p) {
    const load = resolution === '50m' ? import('world-atlas/countries-50m.json') : import('world-atlas/countries-110m.json')
    p = load.then(m => atlasFromTopology((m.default ?? m) as unknown as AtlasTopology, resolution))
    p.catch(() => cache.delete(resolution))
    cache.set(resolution, p)
  }
  return p
}

/** True when two boxes overlap (a box crossing the antimeridian always counts as overlapping). */
export function boxesOverlap(a: LonLatBox, b: LonLatBox): boolean {
  if (a[0][0] > a[1][0] || b[0][0] > b[1][0]) return a[0][1] <= b[1][1] && b[0][1] <= a[1][1]
  return a[0][0] <= b[1][0] && b[0][0] <= a[1][0] && a[0][1] <= b[1][1] && b[0][1] <= a[1][1]
}
