import { describe, it, expect } from 'vitest'
import {
  assessSolution, atmosphericEntry, orbitSolutionSchema, siteSchema, shoreProfile, tsunamiAtSite, HazardRng, OCEAN,
  type OrbitSolutionInput, type Site,
} from '../../../shared/hazard/index'
import { drawSamples, FLAG_AIRBURST, FLAG_SEA } from '../../../shared/hazard/sample'
import { entryInto, newEntryScratch, type EntryScratch } from '../../../shared/hazard/entry'
import { cavityDiameterSI } from '../../../shared/hazard/ocean'
import { parseScenarioYaml } from '../../../shared/scenario/index'
import { MINI_YAML } from '../scenario/fixtures'

/** One fixed body (no spread) striking the open Atlantic south-west of the Azores at a chosen point. */
function fixedSolution(over: Partial<OrbitSolutionInput> = {}) {
  return orbitSolutionSchema.parse({
    epoch: '2031-05-01T00:00:00Z', impactTime: '2031-09-14T03:12:00Z', impactProbability: 0.5,
    magnitude: { H: 20, sigma: 0 }, albedo: { min: 0.2, max: 0.2 }, taxonomicClass: 'S',
    densityKgM3: { mean: 3000, sigma: 0 }, entrySpeedKmS: { mean: 20, sigma: 0 }, entryAngleDeg: { mean: 45, sigma: 0 },
    corridor: { path: [[-31, 35], [-29, 35]], halfWidthKm: 0, nominal: [-30, 35], alongTrackSigmaKm: 0 },
    waterDepthM: 4000,
    ...over,
  })
}
/** A coastal site due north of the impact point. */
const siteNorth = (km: number, extra: Partial<Site> = {}): Site => siteSchema.parse({
  id: `n${km}`, name: `North ${km}`, lon: -30, lat: 35 + km / 6371 * 180 / Math.PI, population: 1000,
  offshoreDepthM: 50, shelfWidthKm: 10, beachSlopeDeg: 2, ...extra,
})

describe('a site with no shore (an offshore installation)', () => {
  it('keeps the wave at its depth, and has no run-up and no run-up exceedance', () => {
    const s = fixedSolution()
    const [beach, platform] = assessSolution(s, [siteNorth(300), siteNorth(300, { id: 'platform', shore: false })], { samples: 4000, seed: 7 }).sites
    expect(beach!.runUpM.p50).toBeGreaterThan(0)
    expect(platform!.shore).toBe(false)
    // The same wave at the same depth (common practice, no source: a platform feels the passing wave, not a run-up).
    expect(platform!.tsunamiAmplitudeM).toEqual(beach!.tsunamiAmplitudeM)
    expect(platform!.runUpM).toEqual({ p5: 0, p50: 0, p95: 0 })
    expect(platform!.exceedance.runUp1m).toBe(0)
    expect(beach!.exceedance.runUp1m).toBeGreaterThan(0)
    expect(beach!.shore).toBeUndefined()
  })
})

describe('the tsunami in the assessment', () => {
  it('runs the same chain as tsunamiAtSite, reports each source law as a band, and mixes them log-uniformly', () => {
    const s = fixedSolution()
    const site = siteNorth(300)
    const a = assessSolution(s, [site], { samples: 4000, seed: 7 })
    const D = a.diameterM.p50
    const e = atmosphericEntry({ diameterM: D, densityKgM3: 3000, speedKmS: 20, angleDeg: 45 })
    expect(e.burstAltitudeM).toBeNull()
    const profile = shoreProfile({ openDepthM: 4000, offshoreDepthM: 50, shelfWidthKm: 10, beachSlopeDeg: 2 })
    const at = (lawWeight: number) => tsunamiAtSite({
      diameterM: D, densityKgM3: 3000, surfaceSpeedMS: e.surfaceSpeedKmS * 1000, surfaceDiameterM: e.surfaceDiameterM, angleDeg: 45,
      distanceM: a.sites[0]!.distanceKm.p50 * 1000, lawWeight, profile,
    })
    const band = a.sites[0]!.tsunamiBand!
    expect(band.low.amplitudeM.p50 / at(0).offshoreAmplitudeM).toBeCloseTo(1, 6)
    expect(band.high.amplitudeM.p50 / at(1).offshoreAmplitudeM).toBeCloseTo(1, 6)
    expect(band.low.runUpM.p50 / at(0).runUpM).toBeCloseTo(1, 6)
    expect(band.high.runUpM.p50 / at(1).runUpM).toBeCloseTo(1, 6)
    // The only spread left is the law: mixed figures lie inside the band, the median at the median weight 1/2.
    const mixed = a.sites[0]!.tsunamiAmplitudeM
    expect(mixed.p5).toBeGreaterThanOrEqual(band.low.amplitudeM.p50)
    expect(mixed.p95).toBeLessThanOrEqual(band.high.amplitudeM.p50)
    expect(mixed.p50 / at(0.5).offshoreAmplitudeM).toBeCloseTo(1, 1)
    expect(a.sites[0]!.runUpM.p50 / at(0.5).runUpM).toBeCloseTo(1, 1)
    expect(mixed.p5 / at(0.05).offshoreAmplitudeM).toBeCloseTo(1, 1)
    // Main-wave arrival at the group speed of lambda = 2 D_tcw, after the long-wave arrival.
    expect(a.sites[0]!.tsunamiMainArrivalMin.p50 / (a.sites[0]!.distanceKm.p50 * 1000 / at(0).mainWaveSpeedMS / 60)).toBeCloseTo(1, 4)
    expect(a.sites[0]!.tsunamiMainArrivalMin.p5).toBeGreaterThanOrEqual(a.sites[0]!.tsunamiArrivalMin.p95)
    expect(a.tsunamiSourceLaws?.map(l => l.key)).toEqual(['low', 'high'])
    expect(a.warnings.find(w => w.code === 'tsunami-indicative')?.message).toMatch(/Ward & Asphaug 2000.*band/)
  })

  it('keeps the band ordered (low <= high) at every site of an uncertain solution', () => {
    const s = fixedSolution({ magnitude: { H: 20.5, sigma: 0.5 }, entrySpeedKmS: { mean: 20, sigma: 4 }, entryAngleDeg: undefined,
      corridor: { path: [[-31, 35], [-29, 35]], halfWidthKm: 30, nominal: [-30, 35], alongTrackSigmaKm: 60 } })
    const sites = [10, 100, 1000, 4000].map(km => siteNorth(km))
    const a = assessSolution(s, sites, { samples: 3000, seed: 3 })
    for (const site of a.sites) {
      const b = site.tsunamiBand!
      for (const q of ['p5', 'p50', 'p95'] as const) {
        expect(b.low.amplitudeM[q]).toBeLessThanOrEqual(b.high.amplitudeM[q])
        expect(b.low.runUpM[q]).toBeLessThanOrEqual(b.high.runUpM[q])
        expect(site.runUpM[q]).toBeLessThanOrEqual(b.high.runUpM[q])
        expect(site.runUpM[q]).toBeGreaterThanOrEqual(b.low.runUpM[q])
      }
    }
  })
})

describe('seeds', () => {
  const s = fixedSolution({ magnitude: { H: 21, sigma: 0.4 }, entrySpeedKmS: { mean: 19, sigma: 3 } })
  const sites = [siteNorth(50), siteNorth(500)]
  it('gives the same assessment for the same seed', () => {
    expect(assessSolution(s, sites, { samples: 2000, seed: 42 })).toEqual(assessSolution(s, sites, { samples: 2000, seed: 42 }))
  })
  it('uses the whole seed: 1 and 2^32 + 1 differ, as do 5 and 5 + 2^40', () => {
    const one = assessSolution(s, sites, { samples: 2000, seed: 1 }), wrap = assessSolution(s, sites, { samples: 2000, seed: 2 ** 32 + 1 })
    expect(wrap.diameterM).not.toEqual(one.diameterM)
    expect(new HazardRng(5).uniform()).not.toBe(new HazardRng(5 + 2 ** 40).uniform())
  })
  it('refuses seeds that are not safe integers', () => {
    expect(() => assessSolution(s, sites, { samples: 10, seed: 2 ** 53 })).toThrow(RangeError)
    expect(() => assessSolution(s, sites, { samples: 10, seed: 1.5 })).toThrow(RangeError)
  })
})

describe('an airburst over the sea against a surface impact (Berger & Goodman 2018, PAGEOPH 175, 1525–1543)', () => {
  // A 78 m stony body at 20 km/s, 45°, with strength log-uniform over 0.1–10 MPa (Mathias et al. 2017): weak
  // realisations burst low in the air, strong ones reach the water.
  const s = fixedSolution({ magnitude: { H: 22.9, sigma: 0 } })
  const S = drawSamples(s, 3000, 11, 'log-uniform')
  const air: number[] = [], impact: number[] = [], lowAir: number[] = []
  for (let i = 0; i < S.n; i++) {
    if (!(S.flags[i]! & FLAG_SEA)) continue
    if (S.flags[i]! & FLAG_AIRBURST) { air.push(i); if (S.burstAltM[i]! < 1000) lowAir.push(i) }
    else impact.push(i)
  }
  const mean = (ix: number[], x: Float64Array) => ix.reduce((t, i) => t + x[i]!, 0) / Math.max(1, ix.length)

  it('puts much less energy into the water from an airburst than from a surface impact of the same body', () => {
    // The same 78 m body, weak (bursts about 1 km up) and strong enough to stay intact: the burst's debris brings a few
    // per cent of the intact body's energy to the sea and opens a cavity under half as wide (a much smaller wave, not none).
    const weak = newEntryScratch(), strong = newEntryScratch()
    entryInto(weak, 78, 3000, 20_000, Math.PI / 4, 1e5)
    entryInto(strong, 78, 3000, 20_000, Math.PI / 4, 1e10)
    expect(weak.airburst).toBe(true)
    expect(strong.airburst).toBe(false)
    expect(weak.energySurfaceJ).toBeGreaterThan(0)
    expect(weak.energySurfaceJ).toBeLessThan(0.1 * strong.energySurfaceJ)
    const cavity = (e: EntryScratch) => {
      const q = 78 / e.surfaceDiameterM
      return cavityDiameterSI(e.surfaceDiameterM, 3000 * q * q * q, e.surfaceSpeedMS, Math.SQRT1_2)
    }
    expect(cavity(weak)).toBeGreaterThan(0)
    expect(cavity(weak)).toBeLessThan(0.5 * cavity(strong))
    // Over the realisations the bursts open smaller cavities than the bodies that reach the water.
    expect(air.length).toBeGreaterThan(100)
    expect(impact.length).toBeGreaterThan(100)
    expect(mean(air, S.cavityM)).toBeLessThan(mean(impact, S.cavityM))
  })

  const scr = newEntryScratch()
  entryInto(scr, 78, 3000, 20_000, Math.PI / 4, 2e5)
  it('puts some energy into the water from a low burst (not none)', () => {
    expect(lowAir.length).toBeGreaterThan(0)
    for (const i of lowAir) {
      expect(S.surfaceEnergyMt[i]!).toBeGreaterThan(0)
      expect(S.cavityM[i]!).toBeGreaterThan(0)
    }
  })
})

describe('water depth', () => {
  it('names the 100 m it assumes when the solution gives 0 m and points fall in the sea', () => {
    const a = assessSolution(fixedSolution({ waterDepthM: 0 }), [siteNorth(100)], { samples: 500, seed: 1 })
    const w = a.warnings.find(x => x.code === 'depth-assumed')
    expect(w?.fraction).toBe(1)
    expect(w?.message).toMatch(/100 m/)
    expect(OCEAN.tsunamiMinAmplitudeM).toBeGreaterThan(0)
  })

  it('refuses a scenario whose nominal impact point is at sea with a water depth of 0 m', () => {
    const atSea = MINI_YAML.replace('waterDepthM: 1000', 'waterDepthM: 0')
    const r = parseScenarioYaml(atSea)
    expect(r.ok).toBe(false)
    if (!r.ok) expect(r.errors.some(e => e.path === 'solutions[0].solution.waterDepthM' && /at sea/.test(e.message))).toBe(true)
    const onLand = atSea.replace('nominal: [-9.5, 39.5]', 'nominal: [-8, 40]')
    expect(parseScenarioYaml(onLand).ok).toBe(true)
  })

  it('refuses shore-profile fields on an inland site', () => {
    const r = parseScenarioYaml(MINI_YAML.replace('offshoreDepthM: 30, beachSlopeDeg: 2', 'shelfWidthKm: 12'))
    expect(r.ok).toBe(false)
    if (!r.ok) expect(r.errors.some(e => e.path === 'sites[0].shelfWidthKm')).toBe(true)
  })
})
