import fc from 'fast-check'
import { geoContains } from 'd3-geo'
import { describe, expect, it } from 'vitest'
import type { LonLat } from '../../../shared/hazard/schema'
import type { Assessment } from '../../../shared/hazard/types'
import { destination, EARTH_RADIUS_KM } from '../../../shared/geo/sphere'
import {
  depthInsideKm, polygonProblem, sitesInZone, zoneAreaKm2, zoneContains, zoneExposure, zoneFigures, zoneOutline, ZONE_PEOPLE_KEYS,
  type ZoneShape,
} from '../../../shared/geo/zones'
import { zoneSchema } from '../../../shared/schemas/live'
import { assessSolution, siteSchema } from '../../../shared/hazard/index'
import { demoLastSolution } from './fixtures'

const DEG = Math.PI / 180
const square = (lon: number, lat: number, half: number): LonLat[] =>
  [[lon - half, lat - half], [lon + half, lat - half], [lon + half, lat + half], [lon - half, lat + half]]

/** Realisations (impact points and their reach radii for one threshold) as an assessment carries them. */
function reachOf(points: Array<{ p: LonLat; r: number }>): Pick<Assessment, 'impactPoints' | 'reach'> {
  return {
    impactPoints: points.map(({ p }) => [p[0], p[1], 1]),
    reach: { keys: ['windows'], radiiKm: points.map(({ r }) => [r]) },
  }
}

/** The brute-force answer: does the disc of radius r around c reach outside the zone? (72 points on its edge, and c.) */
function discLeaves(shape: ZoneShape, c: LonLat, r: number): boolean {
  if (r <= 0) return false
  const outline = zoneOutline(shape)
  if (!geoContains(outline, c)) return true
  for (let b = 0; b < 360; b += 5) if (!geoContains(outline, destination(c, b, r))) return true
  return false
}

describe('zone geometry', () => {
  it('a circle zone has the area of a spherical cap, 2πR²(1 − cos(r/R)), close to πr² when small (geometry, common practice, no source)', () => {
    expect(zoneAreaKm2({ type: 'circle', centre: [-9, 38], radiusKm: 10 })).toBeCloseTo(Math.PI * 100, 1)
    const r = 300
    const cap = 2 * Math.PI * EARTH_RADIUS_KM ** 2 * (1 - Math.cos(r / EARTH_RADIUS_KM))
    expect(zoneAreaKm2({ type: 'circle', centre: [0, 0], radiusKm: r })).toBeCloseTo(cap, 3)
  })

  it('a 1° × 1° square on the equator covers R²·Δλ·(sin φ₂ − sin φ₁) ≈ 12 364 km² (spherical zone area, common practice, no source)', () => {
    const exact = EARTH_RADIUS_KM ** 2 * DEG * Math.sin(1 * DEG)
    const ring: LonLat[] = [[10, 0], [11, 0], [11, 1], [10, 1]]
    // d3-geo joins the corners with great circles, not parallels: the top edge bulges north by a hair.
    expect(zoneAreaKm2({ type: 'polygon', ring })).toBeCloseTo(exact, -1)
    expect(Math.abs(zoneAreaKm2({ type: 'polygon', ring }) - exact) / exact).toBeLessThan(1e-3)
  })

  it('the inside of a polygon does not depend on the order of its corners', () => {
    fc.assert(fc.property(
      fc.double({ min: -170, max: 170, noNaN: true }), fc.double({ min: -70, max: 70, noNaN: true }),
      fc.double({ min: 0.05, max: 3, noNaN: true }),
      fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: -1, max: 1, noNaN: true }),
      (lon, lat, half, u, v) => {
        const ring = square(lon, lat, half)
        const p: LonLat = [lon + u * half * 1.5, lat + v * half * 1.5]
        expect(zoneContains({ type: 'polygon', ring }, p)).toBe(zoneContains({ type: 'polygon', ring: [...ring].reverse() }, p))
        expect(zoneAreaKm2({ type: 'polygon', ring })).toBeCloseTo(zoneAreaKm2({ type: 'polygon', ring: [...ring].reverse() }), 6)
      },
    ), { numRuns: 300 })
  })

  it('finds the sites inside and adds up their people', () => {
    const sites = [
      { id: 'a', name: 'A', lon: 0, lat: 0, population: 1000 },
      { id: 'b', name: 'B', lon: 0.05, lat: 0.05, population: 250 },
      { id: 'c', name: 'C', lon: 2, lat: 0, population: 9999 },
    ]
    const got = sitesInZone({ type: 'circle', centre: [0, 0], radiusKm: 10 }, sites)
    expect(got.sites.map(s => s.id)).toEqual(['a', 'b'])
    expect(got.population).toBe(1250)
    expect(sitesInZone({ type: 'polygon', ring: square(2, 0, 0.1) }, sites).population).toBe(9999)
  })

  it('depth inside a polygon agrees with a brute-force check of whole discs (property over random squares and discs)', () => {
    fc.assert(fc.property(
      fc.double({ min: -170, max: 170, noNaN: true }), fc.double({ min: -60, max: 60, noNaN: true }),
      fc.double({ min: 0.2, max: 2, noNaN: true }),
      fc.double({ min: -1.3, max: 1.3, noNaN: true }), fc.double({ min: -1.3, max: 1.3, noNaN: true }),
      fc.double({ min: 0, max: 120, noNaN: true }),
      (lon, lat, half, u, v, r) => {
        const shape: ZoneShape = { type: 'polygon', ring: square(lon, lat, half) }
        const c: LonLat = [lon + u * half, lat + v * half]
        const depth = depthInsideKm(shape, c)
        // Away from the tie (the brute force samples 72 edge points), both answers agree.
        fc.pre(Math.abs(depth - r) > 0.5)
        expect(r > 0 && depth < r).toBe(discLeaves(shape, c, r))
      },
    ), { numRuns: 400 })
  })
})

describe('what a zone leaves exposed', () => {
  const centre: LonLat = [-9.5, 38.6]
  const cloud = (n: number, spreadKm: number, rKm: number) => Array.from({ length: n }, (_, i) => ({
    p: destination(centre, (i * 137.5) % 360, spreadKm * Math.sqrt((i + 0.5) / n)),
    r: rKm * (0.5 + (i % 7) / 7),
  }))

  it('a zone that holds every disc leaves nothing exposed; a zone far away leaves every realisation that exceeds anywhere', () => {
    const a = reachOf([...cloud(40, 20, 5), { p: centre, r: 0 }])
    expect(zoneExposure({ type: 'circle', centre, radiusKm: 60 }, a)?.windows).toBe(0)
    expect(zoneExposure({ type: 'circle', centre: [0, 0], radiusKm: 5 }, a)?.windows).toBeCloseTo(40 / 41, 12)
  })

  it('a larger zone around the same centre never leaves more exposed (property)', () => {
    fc.assert(fc.property(
      fc.array(fc.record({
        b: fc.double({ min: 0, max: 360, noNaN: true }),
        d: fc.double({ min: 0, max: 80, noNaN: true }),
        r: fc.double({ min: 0, max: 40, noNaN: true }),
      }), { minLength: 1, maxLength: 60 }),
      fc.double({ min: 0.1, max: 150, noNaN: true }), fc.double({ min: 0, max: 150, noNaN: true }),
      (pts, r1, extra) => {
        const a = reachOf(pts.map(x => ({ p: destination(centre, x.b, x.d), r: x.r })))
        const small = zoneExposure({ type: 'circle', centre, radiusKm: r1 }, a)!.windows!
        const big = zoneExposure({ type: 'circle', centre, radiusKm: Math.min(400, r1 + extra) }, a)!.windows!
        expect(big).toBeLessThanOrEqual(small)
        expect(small).toBeGreaterThanOrEqual(0)
        expect(small).toBeLessThanOrEqual(1)
      },
    ), { numRuns: 300 })
  })

  it('a circle zone agrees with the brute-force disc check, realisation by realisation', () => {
    const pts = cloud(120, 40, 12)
    const shape: ZoneShape = { type: 'circle', centre: destination(centre, 45, 5), radiusKm: 35 }
    const expected = pts.filter(({ p, r }) => discLeaves(shape, p, r)).length / pts.length
    expect(zoneExposure(shape, reachOf(pts))!.windows).toBeCloseTo(expected, 1)
  })

  it('gives no chances without reach data (an assessment of an earlier model), but still the sites inside', () => {
    const f = zoneFigures({ type: 'circle', centre, radiusKm: 10 }, 's1', { impactPoints: [[centre[0], centre[1], 1]] }, [
      { id: 'x', name: 'X', lon: centre[0], lat: centre[1], population: 12 },
    ])
    expect(f.exposedOutside).toBeNull()
    expect(f.population).toBe(12)
    expect(f.siteIds).toEqual(['x'])
  })
})

describe('people a zone leaves outside', () => {
  // An engine run near the demo's last solution, with three coastal towns and one inland (invented).
  const solution = demoLastSolution()
  const sites = [
    siteSchema.parse({ id: 'a', name: 'A', lon: -8.83, lat: 40.14, population: 60000, offshoreDepthM: 25, beachSlopeDeg: 1.5, shelfWidthKm: 8 }),
    siteSchema.parse({ id: 'b', name: 'B', lon: -8.93, lat: 39.92, population: 4700, offshoreDepthM: 30, beachSlopeDeg: 2, shelfWidthKm: 8 }),
    siteSchema.parse({ id: 'c', name: 'C', lon: -9.02, lat: 39.76, population: 3100, offshoreDepthM: 35, beachSlopeDeg: 3, shelfWidthKm: 7 }),
    siteSchema.parse({ id: 'd', name: 'D', lon: -8.78, lat: 39.7, population: 126000 }),
  ]
  const a = assessSolution(solution, sites, { samples: 2000, seed: 5 })

  it('a zone far away leaves outside exactly the people the engine counts as exposed; one around every site leaves none', () => {
    const far = zoneFigures({ type: 'circle', centre: [20, 0], radiusKm: 5 }, 's', a, sites).peopleOutside!
    const all = zoneFigures({ type: 'circle', centre: [-8.9, 39.9], radiusKm: 60 }, 's', a, sites).peopleOutside!
    for (const k of ZONE_PEOPLE_KEYS) {
      expect(far[k]).toBe(Math.round(a.exposedPopulation[k]))
      expect(all[k]).toBe(0)
    }
    // The tsunami is counted too: the coast is in its reach in this run.
    expect(far.runUp1m).toBeGreaterThan(0)
  })

  it('splits the exposed people between inside and outside for any zone (property)', () => {
    fc.assert(fc.property(
      fc.double({ min: -9.6, max: -8.5, noNaN: true }), fc.double({ min: 39.5, max: 40.3, noNaN: true }),
      fc.double({ min: 1, max: 60, noNaN: true }),
      (lon, lat, radiusKm) => {
        const shape: ZoneShape = { type: 'circle', centre: [lon, lat], radiusKm }
        const out = zoneFigures(shape, 's', a, sites).peopleOutside!
        const inside = sitesInZone(shape, sites).sites
        for (const k of ZONE_PEOPLE_KEYS) {
          const expectedInside = inside.reduce((n, s) => n + s.population * a.sites.find(x => x.siteId === s.id)!.exceedance[k], 0)
          expect(Math.abs(out[k]! + expectedInside - a.exposedPopulation[k])).toBeLessThanOrEqual(0.5 + 1e-6)
        }
      },
    ), { numRuns: 200 })
  })

  it('tells the reach of the damage from the assessment: a zone that holds the whole footprint leaves no chance of damage beyond it', () => {
    const f = zoneFigures({ type: 'circle', centre: [-9.55, 39.95], radiusKm: 400 }, 's', a, sites)
    expect(Object.values(f.exposedOutside!).every(p => p === 0)).toBe(true)
    const tiny = zoneFigures({ type: 'circle', centre: [-9.55, 39.95], radiusKm: 0.5 }, 's', a, sites)
    // Windows shatter tens of kilometres out in every realisation of a 150 m body: a 0.5 km zone cannot hold it.
    expect(tiny.exposedOutside!.windows).toBe(1)
  })
})

describe('zone input', () => {
  it('refuses crossing edges, too few corners and oversized zones, and accepts a zone across the antimeridian', () => {
    expect(polygonProblem([[0, 0], [1, 1], [1, 0], [0, 1]])).toMatch(/cross/)
    expect(polygonProblem([[0, 0], [0, 0], [1, 1]])).toMatch(/three/)
    expect(polygonProblem(square(0, 0, 5))).toMatch(/larger/)
    expect(polygonProblem([[179.5, 0], [-179.5, 0], [-179.5, 1], [179.5, 1]])).toBeNull()
    expect(polygonProblem(square(-9, 38, 0.2))).toBeNull()
  })

  it('checks the shape in the request body', () => {
    const base = { kind: 'evacuate', name: 'Harbour', idempotencyKey: 'zone-key-0001' }
    expect(zoneSchema.safeParse({ ...base, shape: { type: 'circle', centre: [-9, 38], radiusKm: 12 } }).success).toBe(true)
    expect(zoneSchema.safeParse({ ...base, shape: { type: 'circle', centre: [-9, 38], radiusKm: 0 } }).success).toBe(false)
    expect(zoneSchema.safeParse({ ...base, shape: { type: 'circle', centre: [-200, 38], radiusKm: 5 } }).success).toBe(false)
    const bowTie = zoneSchema.safeParse({ ...base, shape: { type: 'polygon', ring: [[0, 0], [1, 1], [1, 0], [0, 1]] } })
    expect(bowTie.success).toBe(false)
    expect(bowTie.error?.issues[0]?.path).toEqual(['shape', 'ring'])
    expect(zoneSchema.safeParse({ ...base, kind: 'panic', shape: { type: 'circle', centre: [0, 0], radiusKm: 1 } }).success).toBe(false)
  })
})
