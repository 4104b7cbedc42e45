import { describe, it, expect } from 'vitest'
import { isLand } from '../../../shared/hazard/index'
import { containsLandExact } from '../../../shared/hazard/land'
import { HazardRng } from '../../../shared/hazard/sampling'
import { feature } from 'topojson-client'
import { geoContains } from 'd3-geo'
import land50 from 'world-atlas/land-50m.json'
import type { GeometryCollection, Topology } from 'topojson-specification'

describe('land or sea (Natural Earth 1:50m land, world-atlas 2)', () => {
  it('knows well-known places (geography; common practice, no source)', () => {
    expect(isLand(2.35, 48.86)).toBe(true) // Paris
    expect(isLand(-30, 40)).toBe(false) // mid-Atlantic
    expect(isLand(-9.14, 38.75)).toBe(true) // Lisbon
    expect(isLand(-9.8, 38.7)).toBe(false) // off Cabo da Roca
    expect(isLand(151.21, -33.87)).toBe(true) // Sydney
    expect(isLand(-150, 0)).toBe(false) // central Pacific
    expect(isLand(0, -85)).toBe(true) // Antarctic plateau (polygon around the pole)
    expect(isLand(180, 66)).toBe(true) // Chukotka, on the antimeridian
    expect(isLand(-540, 40)).toBe(false) // longitudes wrap: -540 is 180 (Pacific at 40° N)
  })

  it('agrees with d3-geo geoContains on the whole land feature at random points and near coasts', () => {
    const topo = land50 as unknown as Topology<{ land: GeometryCollection }>
    const land = feature(topo, topo.objects.land)
    const rng = new HazardRng(50)
    const points: Array<[number, number]> = []
    for (let k = 0; k < 300; k++) points.push([-180 + 360 * rng.uniform(), -85 + 165 * rng.uniform()])
    // Near coasts: jitter of up to 0.2° around coastline vertices.
    const g = land.features[0]!.geometry
    const rings = g.type === 'MultiPolygon' ? g.coordinates.flat() : []
    for (let k = 0; k < 300; k++) {
      const ring = rings[Math.floor(rng.uniform() * rings.length) % rings.length]!
      const v = ring[Math.floor(rng.uniform() * ring.length) % ring.length]!
      const lon = Math.max(-180, Math.min(179.999, v[0]! + 0.4 * (rng.uniform() - 0.5)))
      points.push([lon, Math.max(-89.9, Math.min(89.9, v[1]! + 0.4 * (rng.uniform() - 0.5)))])
    }
    let agree = 0
    for (const p of points) if (isLand(p[0], p[1]) === geoContains(land, p)) agree++
    expect(agree).toBe(points.length)
  }, 60_000)

  it('agrees with geoContains (bounding-box pre-filtered) on 2000 points of a rugged Atlantic coast', () => {
    const rng = new HazardRng(51)
    let agree = 0
    const n = 2000
    for (let k = 0; k < n; k++) {
      // A band along the European Atlantic coast, full of capes, islands and estuaries.
      const lon = -10 + 8 * rng.uniform(), lat = 36 + 8 * rng.uniform()
      if (isLand(lon, lat) === containsLandExact(lon, lat)) agree++
    }
    expect(agree).toBe(n)
  }, 60_000)
})
