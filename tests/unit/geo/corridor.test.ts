import { describe, expect, it } from 'vitest'
import { geoArea, geoContains, geoDistance } from 'd3-geo'
import type { Polygon } from 'geojson'
import { corridorBand, corridorEdges, densifyPath, pathLengthKm } from '../../../shared/geo/corridor'
import { bearingDeg, destination, distanceKm, distanceToPathKm, EARTH_RADIUS_KM } from '../../../shared/geo/sphere'
import { NARROW, WIDE } from './fixtures'

const CASES = [
  { name: 'the Atlantic-wide band of solution 1 (700 km)', c: WIDE },
  { name: 'the 2 km band of solution 7', c: NARROW },
  {
    name: 'a 55 km band (solution 4)',
    c: { path: [[-16.19, 37.64], [-10.74, 39.57], [-5, 41.24]] as Array<[number, number]>, halfWidthKm: 55 },
  },
]

describe('spherical helpers (great-circle formulas, common practice)', () => {
  it('puts a destination point at the asked distance and bearing', () => {
    const from: [number, number] = [-9.55, 39.95]
    for (const [bearing, km] of [[0, 10], [90, 250], [217, 1800], [300, 5000]] as const) {
      const to = destination(from, bearing, km)
      expect(geoDistance(from, to) * EARTH_RADIUS_KM).toBeCloseTo(km, 6)
      expect(((bearingDeg(from, to) - bearing + 540) % 360) - 180).toBeCloseTo(0, 6)
    }
  })
})

describe('corridor band', () => {
  for (const { name, c } of CASES) {
    it(`is 2 × halfWidthKm wide across the track within 1 % for ${name}`, () => {
      const { left, right } = corridorEdges(c.path, c.halfWidthKm)
      expect(left.length).toBe(right.length)
      for (let i = 0; i < left.length; i++) {
        const width = geoDistance(left[i]!, right[i]!) * EARTH_RADIUS_KM
        // At a bend the mitre lengthens the offset; the width across the track itself stays 2h.
        expect(width).toBeGreaterThanOrEqual(2 * c.halfWidthKm * 0.99)
        expect(Math.min(distanceToPathKm(left[i]!, c.path), distanceToPathKm(right[i]!, c.path)) / c.halfWidthKm).toBeGreaterThan(0.99)
        expect(Math.max(distanceToPathKm(left[i]!, c.path), distanceToPathKm(right[i]!, c.path)) / c.halfWidthKm).toBeLessThan(1.01)
      }
    })

    it(`encloses the track and not the rest of the globe for ${name}`, () => {
      const band = corridorBand(c.path, c.halfWidthKm)
      expect(geoArea(band)).toBeLessThan(2 * Math.PI)
      // Interior track points (the ends lie on the flat end caps).
      for (const p of densifyPath(c.path, pathLengthKm(c.path) / 10).slice(1, -1)) expect(geoContains(band, p)).toBe(true)
      // Area ≈ length × width (a band on the sphere), within 3 %.
      const areaKm2 = geoArea(band) * EARTH_RADIUS_KM ** 2
      expect(areaKm2 / (pathLengthKm(c.path) * 2 * c.halfWidthKm)).toBeCloseTo(1, 1)
    })
  }

  it('leaves points beyond the half-width outside the band', () => {
    const band = corridorBand(WIDE.path, WIDE.halfWidthKm)
    const mid = WIDE.nominal
    const b = bearingDeg(mid, WIDE.path[5]!)
    expect(geoContains(band, destination(mid, b + 90, 650))).toBe(true)
    expect(geoContains(band, destination(mid, b + 90, 760))).toBe(false)
    expect(geoContains(band, destination(mid, b - 90, 760))).toBe(false)
  })

  it('densifies along great circles without moving the ends', () => {
    const d = densifyPath(NARROW.path, 1)
    expect(d[0]).toEqual(NARROW.path[0])
    expect(d.at(-1)).toEqual(NARROW.path.at(-1))
    for (let i = 1; i < d.length; i++) expect(distanceKm(d[i - 1]!, d[i]!)).toBeLessThanOrEqual(1.0001)
    expect(pathLengthKm(d)).toBeCloseTo(pathLengthKm(NARROW.path), 6)
  })

  it('refuses a path without two distinct points', () => {
    expect(() => corridorBand([[1, 1], [1, 1]], 10)).toThrow(/two distinct/)
  })

  it('gives a polygon ring that closes on itself', () => {
    const ring = (corridorBand(NARROW.path, 2).geometry as Polygon).coordinates[0]!
    expect(ring[0]).toEqual(ring.at(-1))
  })
})
