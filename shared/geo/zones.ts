/**
 * Protective-action zones drawn by teams (evacuate, shelter, exclusion): their outline on the sphere, the sites
 * inside, and what they leave exposed — for each damage threshold the chance, conditional on impact, that the area
 * where it is exceeded reaches beyond the zone.
 *
 * The exposure comes from the assessment's thinned realisations (`impactPoints`) and their reach radii
 * (`Assessment.reach`): a realisation leaves a threshold exceeded outside the zone unless its whole disc of that
 * radius around its impact point lies inside the zone. A disc lies inside a circle zone when the distance between
 * the centres plus its radius is at most the zone's radius; inside a polygon zone when its centre is inside and
 * every edge (a great-circle arc) is at least its radius away. Distances are great-circle distances on a sphere of
 * 6 371 km (as in the hazard engine).
 */
import { geoArea, geoCentroid, geoContains } from 'd3-geo'
import type { Feature, Polygon } from 'geojson'
import type { LonLat } from '../hazard/schema'
import type { Assessment, SiteAssessment, ThresholdKey } from '../hazard/types'
import { geodesicRing } from './rings'
import { distanceKm, distanceToArcKm, EARTH_RADIUS_KM } from './sphere'

const DEG = Math.PI / 180

export type ZoneKind = 'evacuate' | 'shelter' | 'exclusion'

/** Names and meanings of the zone kinds, in the words the screens use. */
export const ZONE_KINDS: ReadonlyArray<{ key: ZoneKind; label: string; help: string }> = [
  { key: 'evacuate', label: 'Evacuate', help: 'People leave the area before the impact time.' },
  { key: 'shelter', label: 'Shelter in place', help: 'People stay indoors, away from windows, until told otherwise.' },
  { key: 'exclusion', label: 'Keep out', help: 'No one enters: closed to traffic, shipping and aircraft.' },
]
export const zoneKindLabel = (k: ZoneKind) => ZONE_KINDS.find(z => z.key === k)?.label ?? k

/** A zone's shape: a circle around a centre, or a polygon (its ring of [lon, lat] corners, not closed). */
export type ZoneShape
  = | { type: 'circle'; centre: LonLat; radiusKm: number }
    | { type: 'polygon'; ring: LonLat[] }

/** A polygon's corners in the order that makes d3-geo take the smaller side as its inside. */
function smallSide(ring: readonly LonLat[]): LonLat[] {
  const closed = [...ring, ring[0]!]
  const poly: Polygon = { type: 'Polygon', coordinates: [closed] }
  return geoArea(poly) > 2 * Math.PI ? [...ring].reverse() : [...ring]
}

/** The zone's outline as a GeoJSON polygon (a circle as a ring of 1° steps), the smaller side inside. */
export function zoneOutline(shape: ZoneShape): Feature<Polygon> {
  if (shape.type === 'circle') return geodesicRing(shape.centre, shape.radiusKm, 1)
  const ring = smallSide(shape.ring)
  return { type: 'Feature', properties: {}, geometry: { type: 'Polygon', coordinates: [[...ring, ring[0]!]] } }
}

/** The zone's area, km². */
export function zoneAreaKm2(shape: ZoneShape): number {
  if (shape.type === 'circle') {
    // Area of a spherical cap of angular radius a: 2πR²(1 − cos a).
    const a = shape.radiusKm / EARTH_RADIUS_KM
    return 2 * Math.PI * EARTH_RADIUS_KM ** 2 * (1 - Math.cos(a))
  }
  return geoArea(zoneOutline(shape).geometry) * EARTH_RADIUS_KM ** 2
}

/**
 * A zone made ready for many points: the outline is worked out once. A polygon's edges are great-circle arcs; the
 * distance to them is measured in the gnomonic projection centred on the zone (where great circles are straight
 * lines, so inside and outside are exact), which overstates distances by at most 1/cos²c at c from the centre:
 * under 0.5 % within 450 km (common practice, no source: the gnomonic scale factors).
 */
export function prepareZone(shape: ZoneShape): { contains: (p: LonLat) => boolean; depthKm: (p: LonLat) => number } {
  if (shape.type === 'circle') {
    return {
      contains: p => distanceKm(shape.centre, p) <= shape.radiusKm,
      depthKm: p => shape.radiusKm - distanceKm(shape.centre, p),
    }
  }
  const outline = zoneOutline(shape)
  const [l0, p0] = geoCentroid(outline).map(v => v * DEG) as [number, number]
  const sin0 = Math.sin(p0), cos0 = Math.cos(p0)
  /** Gnomonic x, y (km at the centre) of a point, or null on the far hemisphere. */
  const plane = ([lon, lat]: LonLat): [number, number] | null => {
    const l = lon * DEG - l0, f = lat * DEG
    const cosc = sin0 * Math.sin(f) + cos0 * Math.cos(f) * Math.cos(l)
    if (cosc <= 1e-6) return null
    const x = Math.cos(f) * Math.sin(l), y = cos0 * Math.sin(f) - sin0 * Math.cos(f) * Math.cos(l)
    return [EARTH_RADIUS_KM * x / cosc, EARTH_RADIUS_KM * y / cosc]
  }
  const corners = shape.ring.map(plane)
  const ok = corners.every(c => c !== null)
  const pts = corners as Array<[number, number]>
  const inside = (x: number, y: number) => {
    let odd = false
    for (let i = 0, j = pts.length - 1; i < pts.length; j = i++) {
      const [xi, yi] = pts[i]!, [xj, yj] = pts[j]!
      if ((yi > y) !== (yj > y) && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) odd = !odd
    }
    return odd
  }
  const edgeDistance = (x: number, y: number) => {
    let best = Infinity
    for (let i = 0, j = pts.length - 1; i < pts.length; j = i++) {
      const [ax, ay] = pts[j]!, [bx, by] = pts[i]!
      const dx = bx - ax, dy = by - ay
      const t = Math.max(0, Math.min(1, ((x - ax) * dx + (y - ay) * dy) / (dx * dx + dy * dy || 1)))
      best = Math.min(best, Math.hypot(x - ax - t * dx, y - ay - t * dy))
    }
    return best
  }
  // A polygon too large for one hemisphere's projection (refused as input anyway) falls back to the spherical tests.
  if (!ok) {
    return {
      contains: p => geoContains(outline, p),
      depthKm: (p) => {
        if (!geoContains(outline, p)) return 0
        let best = Infinity
        const ring = shape.ring
        for (let i = 0; i < ring.length; i++) best = Math.min(best, distanceToArcKm(p, ring[i]!, ring[(i + 1) % ring.length]!))
        return best
      },
    }
  }
  return {
    contains: (p) => {
      const xy = plane(p)
      return !!xy && inside(xy[0], xy[1])
    },
    depthKm: (p) => {
      const xy = plane(p)
      return xy && inside(xy[0], xy[1]) ? edgeDistance(xy[0], xy[1]) : 0
    },
  }
}

/** Whether a point lies in the zone (on the boundary counts as inside for a circle). */
export function zoneContains(shape: ZoneShape, p: LonLat): boolean {
  return prepareZone(shape).contains(p)
}

/** Distance from a point inside the zone to its edge, km (0 or less outside). */
export function depthInsideKm(shape: ZoneShape, p: LonLat): number {
  return prepareZone(shape).depthKm(p)
}

export interface ZoneSite { id: string; name: string; lon: number; lat: number; population: number }

/** The sites inside the zone and their people. */
export function sitesInZone<S extends ZoneSite>(shape: ZoneShape, sites: readonly S[]): { sites: S[]; population: number } {
  const zone = prepareZone(shape)
  const inside = sites.filter(s => zone.contains([s.lon, s.lat]))
  return { sites: inside, population: inside.reduce((n, s) => n + s.population, 0) }
}

/** Per threshold, the chance (conditional on impact, 0..1) that its area reaches beyond the zone; null without reach data. */
export type ZoneExposure = Partial<Record<ThresholdKey, number>>

/**
 * What the zone leaves exposed: for each threshold of the assessment's reach data, the share of its realisations
 * whose disc of exceedance is not wholly inside the zone. Realisations that exceed it nowhere (radius 0) leave
 * nothing exposed. Null when the assessment carries no reach data (assessments of earlier hazard models).
 */
export function zoneExposure(shape: ZoneShape, a: Pick<Assessment, 'impactPoints' | 'reach'>): ZoneExposure | null {
  const reach = a.reach
  if (!reach || reach.radiiKm.length === 0 || reach.radiiKm.length !== a.impactPoints.length) return null
  const n = reach.radiiKm.length
  const out = new Array<number>(reach.keys.length).fill(0)
  const zone = prepareZone(shape)
  for (let i = 0; i < n; i++) {
    const [lon, lat] = a.impactPoints[i]!
    const radii = reach.radiiKm[i]!
    const depth = zone.depthKm([lon, lat])
    for (let j = 0; j < reach.keys.length; j++) {
      const r = radii[j] ?? 0
      if (r > 0 && depth < r) out[j]!++
    }
  }
  return Object.fromEntries(reach.keys.map((k, j) => [k, out[j]! / n])) as ZoneExposure
}

/** The figures of a zone against one assessment: the people inside and what it leaves exposed. */
export interface ZoneFigures {
  /** The solution they were worked out against. */
  solutionKey: string
  siteIds: string[]
  population: number
  /** Per threshold: the chance, if it strikes, that it is exceeded somewhere outside the zone; null without reach data. */
  exposedOutside: ZoneExposure | null
  /** How many sampled impacts the chances come from. */
  samples: number
  /**
   * Per threshold of the sites' figures (blast, heat, tsunami run-up), the people at the sites outside the zone
   * expected to meet it if it strikes: the sum of population × the site's chance of exceeding it. Absent from zones
   * recorded before it was kept.
   */
  peopleOutside?: Partial<Record<ThresholdKey, number>>
}

/** Thresholds whose people outside a zone are counted: the ground-damage ones the map shades, and the tsunami's. */
export const ZONE_PEOPLE_KEYS: readonly ThresholdKey[] = ['windows', 'houseCollapse', 'multistoreyCollapse', 'burn2', 'runUp1m', 'runUp3m']

/** The people at sites outside the zone expected to meet each threshold if it strikes (see ZoneFigures.peopleOutside). */
export function peopleOutside(
  shape: ZoneShape,
  assessed: ReadonlyArray<Pick<SiteAssessment, 'siteId' | 'exceedance'>>,
  sites: readonly ZoneSite[],
): Partial<Record<ThresholdKey, number>> {
  const zone = prepareZone(shape)
  const outside = sites.filter(s => !zone.contains([s.lon, s.lat]))
  const byId = new Map(assessed.map(a => [a.siteId, a]))
  const expected = (k: ThresholdKey) => outside.reduce((sum, s) => sum + s.population * (byId.get(s.id)?.exceedance[k] ?? 0), 0)
  return Object.fromEntries(ZONE_PEOPLE_KEYS.map(k => [k, Math.round(expected(k))]))
}

export function zoneFigures(
  shape: ZoneShape,
  solutionKey: string,
  assessment: Pick<Assessment, 'impactPoints' | 'reach'> & Partial<Pick<Assessment, 'sites'>> | null,
  sites: readonly ZoneSite[],
): ZoneFigures {
  const inside = sitesInZone(shape, sites)
  return {
    solutionKey,
    siteIds: inside.sites.map(s => s.id),
    population: inside.population,
    exposedOutside: assessment ? zoneExposure(shape, assessment) : null,
    samples: assessment?.reach?.radiiKm.length ?? 0,
    ...(assessment?.sites ? { peopleOutside: peopleOutside(shape, assessment.sites, sites) } : {}),
  }
}

/** The largest zone accepted, km² (a zone is a local decision: a few hundred kilometres across at most). */
export const MAX_ZONE_AREA_KM2 = 500_000
export const MAX_ZONE_RADIUS_KM = 400
export const MAX_ZONE_CORNERS = 60

/** Whether segments p1p2 and p3p4 (planar) cross at a point inside both (touching ends do not count). */
function segmentsCross(p1: LonLat, p2: LonLat, p3: LonLat, p4: LonLat): boolean {
  const d = (a: LonLat, b: LonLat, c: LonLat) => (b[0] - a[0]) * (c[1] - a[1]) - (b[1] - a[1]) * (c[0] - a[0])
  const d1 = d(p3, p4, p1), d2 = d(p3, p4, p2), d3 = d(p1, p2, p3), d4 = d(p1, p2, p4)
  return ((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0))
}

/**
 * What is wrong with a polygon zone's corners, or null: at least 3 distinct corners, edges that do not cross
 * (checked in longitude/latitude, with longitudes taken across the antimeridian from the first corner), and an
 * area of at most MAX_ZONE_AREA_KM2.
 */
export function polygonProblem(ring: readonly LonLat[]): string | null {
  const pts = ring.map(([lon, lat]) => [ring[0]![0] + ((lon - ring[0]![0] + 540) % 360) - 180, lat] as LonLat)
  if (new Set(pts.map(p => `${p[0].toFixed(6)},${p[1].toFixed(6)}`)).size < 3) return 'A zone needs at least three different corners.'
  const n = pts.length
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      if (j === i + 1 || (i === 0 && j === n - 1)) continue
      if (segmentsCross(pts[i]!, pts[(i + 1) % n]!, pts[j]!, pts[(j + 1) % n]!)) return 'The zone\'s edges cross each other: draw its corners in order around it.'
    }
  }
  const area = zoneAreaKm2({ type: 'polygon', ring: [...ring] })
  if (!(area > 0.01)) return 'The zone has no area.'
  if (area > MAX_ZONE_AREA_KM2) return `The zone is larger than ${MAX_ZONE_AREA_KM2.toLocaleString('en-GB')} km².`
  return null
}

const fmtInt = (n: number) => Math.round(n).toLocaleString('en-GB')
const pct = (p: number) => (p > 0 && p < 0.005 ? '<1 %' : p > 0.995 && p < 1 ? '>99 %' : `${Math.round(p * 100)} %`)
const coord = ([lon, lat]: LonLat) => `${Math.abs(lat).toFixed(2)}° ${lat < 0 ? 'S' : 'N'}, ${Math.abs(lon).toFixed(2)}° ${lon < 0 ? 'W' : 'E'}`

/** A zone's shape in words: "circle of 25 km around 38.50° N, 9.12° W" or "5-corner area"; with its area. */
export function zoneShapeText(shape: ZoneShape): string {
  const area = `${fmtInt(zoneAreaKm2(shape))} km²`
  return shape.type === 'circle'
    ? `circle of ${shape.radiusKm.toLocaleString('en-GB', { maximumFractionDigits: 1 })} km around ${coord(shape.centre)} (${area})`
    : `${shape.ring.length}-corner area (${area})`
}

/** A chance in words for the zone figures: "34 %", "<1 %", "none". */
export const zoneChanceText = (p: number) => (p === 0 ? 'none' : pct(p))

/**
 * A zone's figures in one line: "2 sites inside (45 000 people). If it strikes, chance the damage reaches beyond
 * the zone: Windows shatter 34 %, …" (labels given per threshold key).
 */
export function zoneFiguresText(f: ZoneFigures, labelOf: (k: ThresholdKey) => string): string {
  const inside = f.siteIds.length === 0
    ? 'No site inside'
    : `${f.siteIds.length} site${f.siteIds.length === 1 ? '' : 's'} inside (${fmtInt(f.population)} people)`
  const out = [`${inside}.`]
  if (f.exposedOutside) {
    const parts = Object.entries(f.exposedOutside).map(([k, p]) => `${labelOf(k as ThresholdKey)} ${zoneChanceText(p ?? 0)}`)
    out.push(`If it strikes, chance the damage reaches beyond the zone (solution ${f.solutionKey}): ${parts.join(', ')}.`)
  }
  if (f.peopleOutside) {
    const parts = Object.entries(f.peopleOutside).map(([k, n]) => `${labelOf(k as ThresholdKey)} ${fmtInt(n ?? 0)}`)
    out.push(`People at sites outside it expected to meet each threshold if it strikes: ${parts.join(', ')}.`)
  }
  return out.join(' ')
}
