import { describe, it, expect } from 'vitest'
import { geoArea } from 'd3-geo'
import type { MultiPolygon, Position } from 'geojson'
import {
  assessSolution, atmosphericEntry, diameterFromMagnitude, orbitSolutionSchema, overpressureRadiusM, severeDamageRadiusKmHillsGoda,
  siteSchema, thermalRadiusM, FOOTPRINT_KEYS, FOOTPRINT_LEVELS, HazardRng, THRESHOLDS, type Assessment, type OrbitSolution, type Site,
} from '../../../shared/hazard/index'
import { demoSolution, demoSites } from './fixtures'

const R_KM = 6371
const DEG = Math.PI / 180

/** Great-circle distance, km, as the site loop measures it (arc cosine of the dot product of unit vectors). */
function distanceKm(a: readonly [number, number], b: readonly [number, number]): number {
  const ca = Math.cos(a[1] * DEG), cb = Math.cos(b[1] * DEG)
  const dot = ca * Math.cos(a[0] * DEG) * cb * Math.cos(b[0] * DEG) + ca * Math.sin(a[0] * DEG) * cb * Math.sin(b[0] * DEG)
    + Math.sin(a[1] * DEG) * Math.sin(b[1] * DEG)
  return Math.acos(Math.max(-1, Math.min(1, dot))) * R_KM
}

/** Even-odd point in a lon/lat MultiPolygon (planar: the footprints are small). */
function inside(g: MultiPolygon, p: Position): boolean {
  let c = false
  for (const poly of g.coordinates) for (const ring of poly) {
    for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
      const [xi, yi] = ring[i]!, [xj, yj] = ring[j]!
      if ((yi! > p[1]!) !== (yj! > p[1]!) && p[0]! < (xj! - xi!) * (p[1]! - yi!) / (yj! - yi!) + xi!) c = !c
    }
  }
  return c
}

const level = (a: Assessment, key: string, p: number) =>
  a.footprints!.find(f => f.key === key)?.levels.find(l => l.probability === p)?.geometry

/** A body without spread: every realisation has the same size, density, speed and angle (only the point varies). */
interface Body { H: number; albedo: number; density: number; speed: number; angle: number; nominal?: [number, number] }
function fixedBody(o: Body): OrbitSolution {
  const nominal = o.nominal ?? [-11.2, 38.2]
  return orbitSolutionSchema.parse({
    epoch: '2031-05-01T00:00:00Z', impactTime: '2034-09-14T03:12:00Z', impactProbability: 0.1,
    magnitude: { H: o.H, sigma: 0 }, albedo: { min: o.albedo, max: o.albedo }, taxonomicClass: 'S',
    densityKgM3: { mean: o.density, sigma: 0 }, entrySpeedKmS: { mean: o.speed, sigma: 0 }, entryAngleDeg: { mean: o.angle, sigma: 0 },
    corridor: {
      path: [[nominal[0] - 4, nominal[1] - 1], [nominal[0] + 4, nominal[1] + 1]], halfWidthKm: 20, nominal, alongTrackSigmaKm: 60,
    },
    waterDepthM: 3000,
  })
}

const entryOf = (b: Body) =>
  atmosphericEntry({ diameterM: diameterFromMagnitude(b.H, b.albedo), densityKgM3: b.density, speedKmS: b.speed, angleDeg: b.angle })

describe('damage reach (per thinned realisation)', () => {
  it('carries the footprint keys, one row per impact point, radii rounded to 0.01 km', () => {
    const a = assessSolution(demoSolution(), demoSites(), { samples: 3000, seed: 5 })
    expect(a.reach!.keys).toEqual([...FOOTPRINT_KEYS])
    expect(a.reach!.radiiKm).toHaveLength(a.impactPoints.length)
    for (const row of a.reach!.radiiKm) {
      expect(row).toHaveLength(FOOTPRINT_KEYS.length)
      for (const r of row) {
        expect(r).toBeGreaterThanOrEqual(0)
        expect(Math.abs(r * 100 - Math.round(r * 100))).toBeLessThan(1e-6)
      }
    }
  })

  it('agrees with every site\'s exceedance: the share of reach discs holding a site is its exceedance (seeded random solutions)', () => {
    // Seeded loop over the input domain (H 17–28 with spread, any class, speed 11.2–40 km/s, angle 10–90° or the
    // sin 2θ law, strength by density or log-uniform) with sites 0–400 km from the nominal point. With at most 2000
    // samples no realisation is thinned out, so the discs are exactly the realisations the site figures count.
    const rng = new HazardRng(77)
    const u = (a: number, b: number) => a + (b - a) * rng.uniform()
    const classes = ['S', 'C', 'M', 'V', 'unknown'] as const
    let checked = 0, nonTrivial = 0
    for (let k = 0; k < 24; k++) {
      const nominal: [number, number] = [u(-30, -12), u(30, 45)]
      const solution = orbitSolutionSchema.parse({
        epoch: '2031-05-01T00:00:00Z', impactTime: '2034-09-14T03:12:00Z', impactProbability: u(0, 1),
        magnitude: { H: u(17, 28), sigma: u(0, 0.5) }, taxonomicClass: classes[Math.floor(u(0, classes.length))],
        entrySpeedKmS: { mean: u(11.5, 40), sigma: u(0, 3) },
        ...(rng.uniform() < 0.5 ? { entryAngleDeg: { mean: u(10, 90), sigma: u(0, 10) } } : {}),
        corridor: {
          path: [[nominal[0] - 6, nominal[1] - 2], [nominal[0] + 6, nominal[1] + 2]], halfWidthKm: u(0, 60), nominal,
          alongTrackSigmaKm: u(0, 300),
        },
        waterDepthM: u(100, 5000),
      })
      const sites: Site[] = Array.from({ length: 8 }, (_, j) => {
        const d = u(0, 400) / R_KM, b = u(0, 2 * Math.PI)
        return siteSchema.parse({
          id: `s${j}`, name: `s${j}`, population: 1000,
          lon: nominal[0] + d * Math.sin(b) / DEG / Math.cos(nominal[1] * DEG), lat: nominal[1] + d * Math.cos(b) / DEG,
        })
      })
      const samples = Math.floor(u(200, 2000))
      const a = assessSolution(solution, sites, { samples, seed: k + 1, strengthModel: rng.uniform() < 0.5 ? 'density' : 'log-uniform' })
      expect(a.impactPoints).toHaveLength(samples)
      for (const s of a.sites) {
        const site = sites.find(x => x.id === s.siteId)!
        const d = a.impactPoints.map(p => distanceKm([p[0], p[1]], [site.lon, site.lat]))
        a.reach!.keys.forEach((key, j) => {
          let inDisc = 0, unsure = 0
          d.forEach((di, i) => {
            const r = a.reach!.radiiKm[i]![j]!
            // Impact points are stored to 1e-4° (up to 8 m) and radii to 0.01 km (5 m): a site that close to the edge is unsure.
            if (Math.abs(di - r) <= 0.015 && r > 0) unsure++
            else if (di < r) inDisc++
          })
          const expected = s.exceedance[key] * samples
          expect(Math.abs(expected - inDisc), `${key} at ${s.siteId} of solution ${k}`).toBeLessThanOrEqual(unsure + 1e-6)
          checked++
          if (s.exceedance[key] > 0 && s.exceedance[key] < 1) nonTrivial++
        })
      }
    }
    // The loop must reach sites that are neither always nor never exceeded, or it checks little.
    expect(checked).toBe(24 * 8 * FOOTPRINT_KEYS.length)
    expect(nonTrivial).toBeGreaterThan(50)
  })

  it('inverts the engine\'s own laws: the reach of a fixed body is the ring radius of its entry energy and source height', () => {
    // A stony 50 m body (airburst), a 150 m body and a 400 m iron body (both reach the surface).
    for (const b of [
      { H: 24.8, albedo: 0.25, density: 3300, speed: 19, angle: 45 },
      { H: 22.2, albedo: 0.25, density: 3000, speed: 17, angle: 60 },
      { H: 20.5, albedo: 0.18, density: 7800, speed: 20, angle: 80 },
    ]) {
      const a = assessSolution(fixedBody(b), [], { samples: 400, seed: 3 })
      const e = entryOf(b)
      const row = a.reach!.radiiKm[0]!
      a.reach!.keys.forEach((key, j) => {
        const t = THRESHOLDS.find(x => x.key === key)!
        const m = t.kind === 'thermal'
          ? thermalRadiusM({ energyMt: e.energyMt, burstAltitudeM: e.sourceAltitudeM, airEnergyMt: e.energyAirMt }, t.value)
          : overpressureRadiusM(e.energyMt, e.sourceAltitudeM, t.value)
        expect(Math.abs(row[j]! - m / 1000), `${key} of H ${b.H}`).toBeLessThanOrEqual(0.006 + 1e-5 * m / 1000)
      })
      // Every realisation of a body without spread has the same reach.
      for (const r of a.reach!.radiiKm) expect(r).toEqual(row)
    }
  })

  it('grows with energy at a fixed source, moves little with size, and is 0 where the threshold is never reached', () => {
    const rng = new HazardRng(11)
    const u = (a: number, b: number) => a + (b - a) * rng.uniform()
    // The reach is the radius of the engine's laws at the realisation's source (test above). At a fixed source height
    // and air share it grows with energy: overpressure ranges scale with E^(1/3); the exposure grows as E against a
    // burn level that grows as E^(1/6) (Collins et al. 2005).
    for (let k = 0; k < 400; k++) {
      const E = Math.exp(u(Math.log(1e-3), Math.log(1e5))), z = k % 4 === 0 ? 0 : u(0, 40_000), air = u(0, 1)
      for (const key of FOOTPRINT_KEYS) {
        const t = THRESHOLDS.find(x => x.key === key)!
        const at = (e: number) => t.kind === 'thermal'
          ? thermalRadiusM({ energyMt: e, burstAltitudeM: z, airEnergyMt: air * e }, t.value)
          : overpressureRadiusM(e, z, t.value)
        const r0 = at(E), r1 = at(E * 1.03)
        if (t.kind === 'thermal' || z === 0) {
          expect(r1, `${key} at ${E} Mt, ${z} m`).toBeGreaterThanOrEqual(r0)
          if (r0 > 0) expect(r1, `${key} at ${E} Mt, ${z} m`).toBeGreaterThan(r0)
        }
        // Far out under a burst the regular-reflection fit (Collins 2005 eq. 57) can fall off faster for a larger
        // energy at the same height (z1 = z / E^(1/3) shrinks): the radius may then shrink by a few metres in 100 km.
        else expect(r1, `${key} at ${E} Mt, ${z} m`).toBeGreaterThanOrEqual(r0 * (1 - 1e-4))
      }
    }
    // Whole bodies: a brighter (larger) body's reach moves continuously. It need not grow: a larger body may burst at
    // another height, and the heat of a low source sinks below a distant horizon (README "Heat").
    let grew = 0, steep = 0, compared = 0
    for (let k = 0; k < 60; k++) {
      const b = { H: u(16, 29), albedo: u(0.05, 0.4), density: u(1500, 8000), speed: u(11.5, 40), angle: u(10, 90) }
      const r0 = assessSolution(fixedBody(b), [], { samples: 20, seed: 9 }).reach!.radiiKm[0]!
      // 0.02 magnitudes brighter: 0.9 % larger diameter, 2.8 % more energy; same impact points.
      const r1 = assessSolution(fixedBody({ ...b, H: b.H - 0.02 }), [], { samples: 20, seed: 9 }).reach!.radiiKm[0]!
      FOOTPRINT_KEYS.forEach((key, j) => {
        // Mostly a small move. Not always: inside the Mach onset of a burst the law holds eq. 54 at its onset value
        // (blast.ts), a plateau, so a threshold met there is met over the whole plateau at once and the radius steps to
        // the onset range, as the site exceedances do.
        if (Math.abs(r1[j]! - r0[j]!) > 0.05 * Math.max(r0[j]!, r1[j]!) + 0.011) steep++
        if (r0[j]! > 0 || r1[j]! > 0) compared++
        if (r1[j]! > r0[j]!) grew++
      })
    }
    expect(steep).toBeLessThanOrEqual(0.1 * compared)
    expect(grew).toBeGreaterThan(60)
    // A Chelyabinsk-like body (19 m, 3300 kg/m³, 19.16 km/s, 18.3°; Popova et al. 2013, Science 342) bursts high: its
    // ground overpressure (0.8 kPa below the burst, README "Checked against") never reaches 6.9 kPa, nor the burn level.
    const chelyabinsk = { H: 26.0, albedo: 0.33, density: 3300, speed: 19.16, angle: 18.3 }
    const chel = assessSolution(fixedBody(chelyabinsk), [], { samples: 50, seed: 2 })
    const e = entryOf(chelyabinsk)
    expect(e.burstAltitudeM!).toBeGreaterThan(20_000)
    for (const row of chel.reach!.radiiKm) expect(row).toEqual([0, 0, 0, 0])
    expect(chel.footprints!.every(f => f.levels.length === 0)).toBe(true)
  })

  it('agrees with the Hills & Goda 1993 (AJ 105, 1114–1144) 4 psi radius, as fitted by Mathias et al. 2017 (Icarus 289), within 20 %', () => {
    // A 400 m iron body at 80° reaches the ground (source a few tens of metres up): Hills & Goda give 5.08 E^(1/3) km for
    // 4 psi (27.6 kPa) at the surface; wood-frame houses collapse at 26.8 kPa (Collins 2005), 3 % lower, so a little farther.
    const b = { H: 20.5, albedo: 0.18, density: 7800, speed: 20, angle: 80 }
    const a = assessSolution(fixedBody(b), [], { samples: 50, seed: 1 })
    const e = entryOf(b)
    expect(e.burstAltitudeM).toBeNull()
    const hg = severeDamageRadiusKmHillsGoda(e.energyMt, e.sourceAltitudeM / 1000)
    const reach = a.reach!.radiiKm[0]![a.reach!.keys.indexOf('houseCollapse')]!
    expect(reach / hg).toBeGreaterThan(0.8)
    expect(reach / hg).toBeLessThan(1.2)
  })
})

describe('probabilistic footprints', () => {
  const sites = demoSites()
  // A 200 m class body whose corridor ends off Lisbon's invented towns, with an along-track spread of 30 km.
  const a = assessSolution(demoSolution({
    magnitude: { H: 21.4, sigma: 0.3 },
    corridor: { path: [[-16, 36.8], [-9.8, 38.6]], halfWidthKm: 15, nominal: [-9.9, 38.57], alongTrackSigmaKm: 30 },
  }), sites, { samples: 20_000, seed: 1 })

  it('has areas for the levels 0.1, 0.5 and 0.9 of each key, wound as d3-geo reads them', () => {
    expect(a.footprints!.map(f => f.key)).toEqual([...FOOTPRINT_KEYS])
    for (const f of a.footprints!) {
      expect(f.label).toBe(THRESHOLDS.find(t => t.key === f.key)!.label)
      // Levels without area are left out: the weakest ones remain (here the spread of the points leaves no place where a
      // house collapses 9 times in 10).
      const ps = f.levels.map(l => l.probability)
      expect(ps).toEqual(FOOTPRINT_LEVELS.slice(0, ps.length))
      expect(ps.length).toBeGreaterThanOrEqual(f.key === 'windows' || f.key === 'burn2' ? 3 : 2)
      for (const l of f.levels) {
        // Small areas, not the rest of the globe (a ring wound the wrong way would cover it).
        const area = geoArea({ type: 'Feature', properties: {}, geometry: l.geometry })
        expect(area).toBeGreaterThan(0)
        expect(area).toBeLessThan(0.01)
        for (const poly of l.geometry.coordinates) for (const ring of poly) for (const [x, y] of ring) {
          expect(Math.abs(x! * 1e4 - Math.round(x! * 1e4))).toBeLessThan(1e-6)
          expect(Math.abs(y! * 1e4 - Math.round(y! * 1e4))).toBeLessThan(1e-6)
        }
      }
    }
  })

  it('nests the levels (0.9 inside 0.5 inside 0.1) and a stronger threshold inside a weaker one', () => {
    const all = a.footprints!.flatMap(f => f.levels.flatMap(l => l.geometry.coordinates.flat(2)))
    const xs = all.map(p => p[0]!), ys = all.map(p => p[1]!)
    const x0 = Math.min(...xs), x1 = Math.max(...xs), y0 = Math.min(...ys), y1 = Math.max(...ys)
    const order = ['windows', 'houseCollapse', 'multistoreyCollapse']
    let inner = 0
    for (let i = 0; i <= 150; i++) for (let j = 0; j <= 150; j++) {
      const p = [x0 + (x1 - x0) * i / 150, y0 + (y1 - y0) * j / 150]
      for (const key of FOOTPRINT_KEYS) {
        const at = FOOTPRINT_LEVELS.map((q) => { const g = level(a, key, q); return !!g && inside(g, p) })
        if (at[2]) { expect(at[1]).toBe(true); inner++ }
        if (at[1]) expect(at[0]).toBe(true)
      }
      for (let k = 1; k < order.length; k++) {
        for (const q of FOOTPRINT_LEVELS) {
          const g = level(a, order[k]!, q)
          if (g && inside(g, p)) expect(inside(level(a, order[k - 1]!, q)!, p)).toBe(true)
        }
      }
    }
    expect(inner).toBeGreaterThan(100)
  })

  it('puts the areas where the realisations put the damage: sites likely hit lie inside the even-odds area, unlikely ones outside', () => {
    let seen = 0
    for (const s of a.sites) {
      const site = sites.find(x => x.id === s.siteId)!
      for (const key of FOOTPRINT_KEYS) {
        const g = level(a, key, 0.5)
        const pe = s.exceedance[key]
        if (pe >= 0.65) { expect(g && inside(g, [site.lon, site.lat]), `${key} at ${s.siteId}: ${pe}`).toBe(true); seen++ }
        if (pe <= 0.35) expect(!!g && inside(g, [site.lon, site.lat]), `${key} at ${s.siteId}: ${pe}`).toBe(false)
      }
    }
    expect(seen).toBeGreaterThan(0)
  })
})
