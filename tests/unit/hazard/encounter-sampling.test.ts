import { describe, it, expect } from 'vitest'
import fc from 'fast-check'
import { assessSolution, orbitSolutionSchema, HazardRng, type OrbitSolution, type SolutionEncounter } from '../../../shared/hazard/index'
import { drawSamples } from '../../../shared/hazard/sample'
import {
  EncounterSampler, arrivalTimeS, captureRadiusKm, erfc, normalMass, truncatedStandardNormal,
  entryFromBPlane, findBPlanePoint, greenwichSiderealDeg, solutionFromEncounter,
  DEG, EARTH_RADIUS_KM, ESCAPE_SPEED_KMS, MIN_ENCOUNTER_HIT_SHARE,
} from '../../../shared/encounter/index'
import { applyEncounter, checkEncounters, engineSolution } from '../../../shared/scenario/encounter'
import { demoSites, demoSolution } from './fixtures'

// The Monte Carlo's `sampling: 'encounter'`: impact point, entry angle and speed drawn jointly from b-plane hits of the
// solution's encounter (shared/hazard/sample.ts, shared/encounter/draw.ts). Invented encounters of a fictional object.

const T = '2034-03-19T22:47:00Z'
const target: [number, number] = [-10.9, 53.3]
const radiant = { raDeg: Number(((greenwichSiderealDeg(T) + target[0] + 35 + 720) % 360).toFixed(2)), decDeg: 43 }
const nominal = findBPlanePoint({ vInfKmS: 12, radiant, timeUtc: T, target })!

/** An orbit solution computed from an encounter (applyEncounter, as a scenario file stores it) that draws from it. */
function fromEncounter(e: SolutionEncounter, seed = 1): OrbitSolution {
  const entry = applyEncounter({
    solution: {
      ...orbitSolutionSchema.parse({
        epoch: '2034-03-10T00:00:00Z', impactTime: T, impactProbability: 0, magnitude: { H: 22.5, sigma: 0.3 }, taxonomicClass: 'S',
        entrySpeedKmS: { mean: 20, sigma: 0 }, corridor: { path: [[0, 0], [1, 1]], halfWidthKm: 0, nominal: [0, 0], alongTrackSigmaKm: 0 },
        waterDepthM: 120,
      }),
      sampling: 'encounter',
    },
    encounter: { ...e, timeUtc: String(e.timeUtc), seed },
  })
  return orbitSolutionSchema.parse(engineSolution(entry))
}

const unit = (lon: number, lat: number) =>
  [Math.cos(lat * DEG) * Math.cos(lon * DEG), Math.cos(lat * DEG) * Math.sin(lon * DEG), Math.sin(lat * DEG)] as const

/** Along-track position (km from the first node) and cross-track distance (km) of a point from a polyline, on the sphere. */
function onTrack(path: ReadonlyArray<readonly [number, number]>, lon: number, lat: number): { along: number; cross: number } {
  const q = unit(lon, lat)
  let best = { along: 0, cross: Infinity }, start = 0
  for (let k = 0; k + 1 < path.length; k++) {
    const a = unit(path[k]![0], path[k]![1]), b = unit(path[k + 1]![0], path[k + 1]![1])
    const d = a[0] * b[0] + a[1] * b[1] + a[2] * b[2]
    const len = Math.acos(Math.min(1, d))
    // Pole of the arc and the tangent at a.
    const p = [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]]
    const pn = Math.hypot(p[0]!, p[1]!, p[2]!) || 1
    const u = [b[0] - d * a[0], b[1] - d * a[1], b[2] - d * a[2]], un = Math.hypot(u[0]!, u[1]!, u[2]!) || 1
    const cross = Math.asin(Math.max(-1, Math.min(1, (q[0] * p[0]! + q[1] * p[1]! + q[2] * p[2]!) / pn)))
    const t = Math.atan2((q[0] * u[0]! + q[1] * u[1]! + q[2] * u[2]!) / un, q[0] * a[0] + q[1] * a[1] + q[2] * a[2])
    const tc = Math.min(len, Math.max(0, t))
    // Distance to the arc: across when the foot is inside it, else to the nearer end.
    const inArc = t >= 0 && t <= len
    const dist = inArc ? Math.abs(cross) : Math.acos(Math.min(1, Math.max(-1, Math.cos(cross) * Math.cos(t - tc))))
    if (dist * EARTH_RADIUS_KM < best.cross) best = { along: (start + tc) * EARTH_RADIUS_KM, cross: dist * EARTH_RADIUS_KM }
    start += len
  }
  return best
}

describe('drawing impacts from the encounter (sampling: encounter)', () => {
  it('puts the impact points inside the solution\'s own corridor band, steep in the middle and grazing at its ends', () => {
    // A line of variations across the whole capture disk: the hits cover the corridor from grazing end to grazing end.
    const e: SolutionEncounter = {
      vInfKmS: 12, radiant, timeUtc: T, nominal, sigmaAlongKm: 60_000, sigmaAcrossKm: 400, lineAngleDeg: 25,
    }
    const sol = fromEncounter(e)
    const S = drawSamples(sol, 20_000, 5, 'density')
    const band = sol.corridor.halfWidthKm
    let inside = 0
    const along: number[] = []
    for (let i = 0; i < S.n; i++) {
      const t = onTrack(sol.corridor.path, S.lon[i]!, S.lat[i]!)
      if (t.cross <= band) inside++
      along.push(t.along)
    }
    // A Gaussian across the line inside ± sqrt(3) σ: 91.7 % (the corridor's half-width is sqrt(3) × the RMS cross distance).
    expect(inside / S.n).toBeGreaterThan(0.88)
    const total = Math.max(...along)
    const mean = (f: (x: number) => boolean) => {
      let s = 0, m = 0
      for (let i = 0; i < S.n; i++) if (f(along[i]! / total)) { s += S.angleDeg[i]!; m++ }
      return s / m
    }
    const middle = mean(x => x > 0.4 && x < 0.6), ends = mean(x => x < 0.05 || x > 0.95)
    expect(middle).toBeGreaterThan(60)
    expect(ends).toBeLessThan(30)
  })

  it('gives entry angles of the sin 2θ law when the b-plane uncertainty is much larger than the capture disk (Shoemaker 1962)', () => {
    // σ = 100 000 km, 12 × the capture radius: the Gaussian is flat over the disk to 0.4 %, so the hits fill it uniformly and
    // dP = sin 2θ dθ (Shoemaker 1962, in Kopal (ed.), Physics and Astronomy of the Moon, Academic Press; from memory):
    // P(θ < 30°) = 0.25, median 45°, CDF sin²θ.
    const e: SolutionEncounter = {
      vInfKmS: 17, radiant: { raDeg: 33, decDeg: 12 }, timeUtc: T, nominal: { xiKm: 0, zetaKm: 0 },
      sigmaAlongKm: 100_000, sigmaAcrossKm: 100_000, lineAngleDeg: 0,
    }
    const sol = { ...demoSolution(), sampling: 'encounter' as const, encounter: e }
    const S = drawSamples(sol, 20_000, 3, 'density')
    const angles = Array.from(S.angleDeg.subarray(0, S.n)).sort((x, y) => x - y)
    expect(angles.filter(x => x < 30).length / angles.length).toBeCloseTo(0.25, 1)
    expect(Math.abs(angles[Math.floor(angles.length / 2)]! - 45)).toBeLessThan(1)
    let ks = 0
    angles.forEach((x, i) => { ks = Math.max(ks, Math.abs((i + 1) / angles.length - Math.sin(x * DEG) ** 2)) })
    expect(ks).toBeLessThan(1.63 / Math.sqrt(angles.length)) // Kolmogorov–Smirnov, 1 % critical value
    // The estimated hit share is the encounter's impact probability: 1 − exp(−b⊕²/2σ²) for a circular Gaussian centred on
    // the Earth (Rayleigh law of |b|), 0.35 % here.
    const expected = 1 - Math.exp(-(captureRadiusKm(17) ** 2) / (2 * 1e10))
    expect(Math.abs(S.encounter!.hitShare / expected - 1)).toBeLessThan(0.03)
  })

  it('draws every realisation from a hit: angle in (0, 90], speed sqrt(v∞² + v_esc²) ≥ 11.186 km/s, at the hit\'s own ground point', () => {
    // Entry speed from energy conservation, v = sqrt(v∞² + 2 GM⊕/r) = sqrt(v∞² + 11.186²) at the ground (Valsecchi et al.
    // 2003, A&A 408, 1179–1196; as tests/unit/encounter/laws.test.ts); cos γ = b v∞ / (r v) (angular momentum).
    const num = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true })
    const arb = fc.record({
      vInfKmS: num(1, 70), raDeg: num(0, 360), decDeg: num(-90, 90), time: num(Date.UTC(1990, 0, 1), Date.UTC(2100, 0, 1)),
      rho: num(0, 0.95), at: num(0, 2 * Math.PI), along: num(0.01, 3), across: num(0.001, 1), lineAngleDeg: num(-180, 180),
      seed: fc.integer({ min: 1, max: 2 ** 31 - 1 }),
    })
    fc.assert(fc.property(arb, (a) => {
      const bc = captureRadiusKm(a.vInfKmS)
      const e: SolutionEncounter = {
        vInfKmS: a.vInfKmS, radiant: { raDeg: a.raDeg, decDeg: a.decDeg }, timeUtc: new Date(a.time).toISOString(),
        nominal: { xiKm: a.rho * bc * Math.cos(a.at), zetaKm: a.rho * bc * Math.sin(a.at) },
        sigmaAlongKm: a.along * bc, sigmaAcrossKm: a.across * bc, lineAngleDeg: a.lineAngleDeg,
      }
      const v = Math.sqrt(a.vInfKmS ** 2 + ESCAPE_SPEED_KMS ** 2)
      // The engine's draw: every realisation a hit, with the encounter's speed and an angle in (0, 90].
      const S = drawSamples({ ...demoSolution(), sampling: 'encounter', encounter: e }, 200, a.seed, 'density')
      expect(S.encounter!.hits).toBe(200)
      expect(S.encounter!.tries).toBeGreaterThanOrEqual(200)
      for (let i = 0; i < S.n; i++) {
        expect(S.angleDeg[i]!).toBeGreaterThan(0)
        expect(S.angleDeg[i]!).toBeLessThanOrEqual(90)
        expect(S.speedKmS[i]!).toBeGreaterThanOrEqual(11.186)
        expect(S.speedKmS[i]!).toBeCloseTo(v, 9)
        expect(Number.isFinite(S.energyMt[i]!)).toBe(true)
      }
      // The sampler itself: each hit inside the capture disk, its angle and ground point those of entryFromBPlane for
      // that b-plane point at its own arrival time.
      const sampler = new EncounterSampler(e, 50), rng = new HazardRng(a.seed), out = new Float64Array(3)
      const tauNom = arrivalTimeS(Math.hypot(e.nominal.xiKm, e.nominal.zetaKm), a.vInfKmS)
      for (let k = 0; k < 50; k++) {
        const g = sampler.drawInto(rng, out, 0)
        const { xiKm, zetaKm } = sampler.hit
        expect(Math.hypot(xiKm, zetaKm)).toBeLessThanOrEqual(bc)
        const at = a.time + 1000 * (arrivalTimeS(Math.hypot(xiKm, zetaKm), a.vInfKmS) - tauNom)
        const r = entryFromBPlane({ vInfKmS: a.vInfKmS, radiant: e.radiant, timeUtc: at, xiKm, zetaKm })
        expect(r.hit).toBe(true)
        expect(g / DEG).toBeCloseTo(r.entryAngleDeg!, 6)
        const u = unit(r.lon!, r.lat!)
        expect(Math.hypot(out[0]! - u[0], out[1]! - u[1], out[2]! - u[2]) * EARTH_RADIUS_KM).toBeLessThan(0.01)
      }
      expect(sampler.speedKmS).toBeCloseTo(v, 9)
    }), { numRuns: 60, seed: 20_261_205 })
  })

  it('is reproducible: the same seed gives the same figures, another seed others', () => {
    const e: SolutionEncounter = { vInfKmS: 12, radiant, timeUtc: T, nominal, sigmaAlongKm: 6000, sigmaAcrossKm: 400, lineAngleDeg: 25 }
    const sol = fromEncounter(e)
    const sites = demoSites()
    const a = assessSolution(sol, sites, { samples: 3000, seed: 7 })
    expect(assessSolution(sol, sites, { samples: 3000, seed: 7 })).toEqual(a)
    expect(assessSolution(sol, sites, { samples: 3000, seed: 8 }).energyMt).not.toEqual(a.energyMt)
    // The joint draw differs from the band's.
    const band = assessSolution({ ...sol, sampling: 'corridor' }, sites, { samples: 3000, seed: 7 })
    expect(band.impactPoints).not.toEqual(a.impactPoints)
  })

  it('refuses to draw from an encounter whose hits are too rare, and without an encounter', () => {
    const base = demoSolution()
    const far: SolutionEncounter = {
      vInfKmS: 12, radiant, timeUtc: T, nominal: { xiKm: 60_000, zetaKm: 0 }, sigmaAlongKm: 5000, sigmaAcrossKm: 100, lineAngleDeg: 0,
    }
    expect(() => drawSamples({ ...base, sampling: 'encounter', encounter: far }, 1000, 1, 'density')).toThrow(/too few/i)
    // About 1 hit in 10 000 (the nominal 3.72 σ beyond the disk, along the line): refused before drawing.
    const rare = { ...far, nominal: { xiKm: captureRadiusKm(12) + 3.72 * 5000, zetaKm: 0 } }
    expect(solutionFromEncounter(rare, { samples: 200_000 }).impactProbability).toBeLessThan(MIN_ENCOUNTER_HIT_SHARE)
    expect(() => drawSamples({ ...base, sampling: 'encounter', encounter: rare }, 2000, 1, 'density')).toThrow(/too few/i)
    expect(() => drawSamples({ ...base, sampling: 'encounter' }, 10, 1, 'density')).toThrow(RangeError)
    expect(orbitSolutionSchema.safeParse({ ...base, sampling: 'encounter' }).success).toBe(false)
    expect(orbitSolutionSchema.safeParse({ ...base, sampling: 'encounter', encounter: far }).success).toBe(true)
    // The scenario check names both before a drill would fail.
    const issues = checkEncounters([
      { solution: { ...base, sampling: 'encounter' } },
      { solution: { ...base, sampling: 'encounter' }, encounter: { ...rare, samples: 20_000 } },
    ])
    expect(issues.map(i => i.path.join('.'))).toEqual(expect.arrayContaining(['solutions.0.solution.sampling', 'solutions.1.solution.sampling']))
  })
})

describe('the truncated normal of the encounter draw (Robert 1995)', () => {
  it('computes the normal mass from erfc as normal tables give it', () => {
    // Standard normal table values (e.g. Abramowitz & Stegun 1964, table 26.1; from memory): Φ(1) = 0.8413447,
    // Φ(2) = 0.9772499, Φ(3) = 0.9986501, and erfc(0.5) = 0.4795001.
    expect(normalMass(-Infinity, 1)).toBeCloseTo(0.8413447, 6)
    expect(normalMass(-Infinity, 2)).toBeCloseTo(0.9772499, 6)
    expect(normalMass(3, Infinity)).toBeCloseTo(1 - 0.9986501, 7)
    expect(erfc(0.5)).toBeCloseTo(0.4795001, 6)
    expect(erfc(-0.5)).toBeCloseTo(2 - 0.4795001, 6)
  })

  it.each([[-1, 2], [-0.3, 0.4], [-1.2, 1.2], [0, 2.4], [2, 2.3], [4, 9], [-9, -5], [0.5, 6], [-40, 40], [30, 30.5]])(
    'draws N(0, 1) truncated to [%d, %d] with the exact distribution (Kolmogorov–Smirnov)', (a, b) => {
      const rng = new HazardRng(17), n = 20_000, xs: number[] = []
      for (let k = 0; k < n; k++) xs.push(truncatedStandardNormal(rng, a, b))
      xs.sort((x, y) => x - y)
      expect(xs[0]!).toBeGreaterThanOrEqual(a)
      expect(xs.at(-1)!).toBeLessThanOrEqual(b)
      // CDF of the truncated law: mass(a, x) / mass(a, b); far in the tail, where erfc underflows, its exponential limit.
      const total = normalMass(a, b)
      const cdf = total > 1e-300 ? (x: number) => normalMass(a, x) / total : (x: number) => 1 - Math.exp(-a * (x - a))
      let ks = 0
      xs.forEach((x, i) => { ks = Math.max(ks, Math.abs((i + 1) / n - cdf(x))) })
      expect(ks).toBeLessThan(1.63 / Math.sqrt(n)) // 1 % critical value
    })
})

describe('the corridor draw is unchanged by the option', () => {
  const sites = demoSites()
  it('gives the figures it gave before the option existed (regression pin, demo fixture, 5 000 samples, seed 42)', () => {
    // Computed with the engine before `sampling` was added (same inputs): any change to the corridor draw shows here.
    const a = assessSolution(demoSolution(), sites, { samples: 5000, seed: 42 })
    expect(a.energyMt).toEqual({ p5: 13.740264456366418, p50: 69.64328371746397, p95: 779.1592566849823 })
    expect([a.oceanImpactProbability, a.tsunamiProbability, a.airburstProbability]).toEqual([0.838, 0.628, 0.3842])
    expect(a.impactPoints.slice(0, 3)).toEqual([[-14.4711, 37.2731, 1], [-11.2474, 37.9444, 1], [-8.9451, 38.5801, 0]])
    expect(a.sites[0]!.runUpM).toEqual({ p5: 0, p50: 1.6172953871728162, p95: 18.009596339358264 })
    expect(a.exposedPopulation.runUp1m).toBe(832322.2)
    expect(a.exposedPopulation.burn1).toBe(238870.4)
  })

  it('gives identical figures with sampling absent, `corridor`, or `corridor` beside an encounter', () => {
    const e: SolutionEncounter = { vInfKmS: 12, radiant, timeUtc: T, nominal, sigmaAlongKm: 6000, sigmaAcrossKm: 400, lineAngleDeg: 25 }
    const a = assessSolution(demoSolution(), sites, { samples: 2000, seed: 9 })
    expect(assessSolution({ ...demoSolution(), sampling: 'corridor' }, sites, { samples: 2000, seed: 9 })).toEqual(a)
    expect(assessSolution({ ...demoSolution(), sampling: 'corridor', encounter: e }, sites, { samples: 2000, seed: 9 })).toEqual(a)
    // A scenario entry hands the engine its solution unchanged unless it draws from the encounter.
    const solution = demoSolution()
    expect(engineSolution({ solution, encounter: { ...e, seed: 1 } })).toBe(solution)
    expect(engineSolution({ solution: { ...solution, sampling: 'encounter' }, encounter: { ...e, seed: 1 } }).encounter).toEqual(e)
  })
})
