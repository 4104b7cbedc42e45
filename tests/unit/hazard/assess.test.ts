import { describe, it, expect } from 'vitest'
import { assessSolution, siteSchema, THRESHOLDS, MODEL_VERSION, torinoScale, palermoScale, type Assessment, type Percentiles } from '../../../shared/hazard/index'
import { demoSolution, demoSites } from './fixtures'

function ordered(p: Percentiles): boolean {
  return p.p5 <= p.p50 && p.p50 <= p.p95 && [p.p5, p.p50, p.p95].every(Number.isFinite)
}

function allPercentiles(a: Assessment): Percentiles[] {
  const top = [a.diameterM, a.massKg, a.energyMt, a.surfaceEnergyMt, a.burstAltitudeKm, a.waterCavityDiameterM]
    .filter((p): p is Percentiles => p !== null)
  return top.concat(a.sites.flatMap(s => [
    s.distanceKm, s.overpressureKPa, s.windMS, s.thermalMJM2, s.seismicMagnitude, s.tsunamiAmplitudeM, s.tsunamiArrivalMin,
    s.tsunamiMainArrivalMin, s.runUpM,
  ]))
}

describe('assessSolution (Monte Carlo)', () => {
  const solution = demoSolution()
  const sites = demoSites()
  const a = assessSolution(solution, sites, { samples: 5000, seed: 42 })

  it('gives identical figures for the same solution, sites and seed (reproducibility requirement)', () => {
    expect(assessSolution(solution, sites, { samples: 5000, seed: 42 })).toEqual(a)
    expect(JSON.parse(JSON.stringify(a))).toEqual(a)
  })

  it('gives different figures for another seed, and uses seed 1 and 20 000 samples by default', () => {
    const b = assessSolution(solution, sites, { samples: 5000, seed: 43 })
    expect(b.diameterM).not.toEqual(a.diameterM)
    const d = assessSolution(solution, sites.slice(0, 1))
    expect(d.options).toEqual({ samples: 20_000, seed: 1, strengthModel: 'density' })
    expect(d.modelVersion).toBe(MODEL_VERSION)
  })

  it('orders every percentile triple and keeps probabilities in 0..1', () => {
    for (const p of allPercentiles(a)) expect(ordered(p)).toBe(true)
    for (const x of [a.airburstProbability, a.oceanImpactProbability, a.tsunamiProbability]) {
      expect(x).toBeGreaterThanOrEqual(0)
      expect(x).toBeLessThanOrEqual(1)
    }
    for (const s of a.sites) {
      for (const t of THRESHOLDS) {
        expect(s.exceedance[t.key]).toBeGreaterThanOrEqual(0)
        expect(s.exceedance[t.key]).toBeLessThanOrEqual(1)
      }
    }
    expect(a.tsunamiProbability).toBeLessThanOrEqual(a.oceanImpactProbability)
  })

  it('never has a stricter threshold exceeded more often than a milder one of the same kind', () => {
    for (const s of a.sites) {
      const e = s.exceedance
      expect(e.windows).toBeGreaterThanOrEqual(e.houseDamage)
      expect(e.houseDamage).toBeGreaterThanOrEqual(e.houseCollapse)
      expect(e.multistoreyCracked).toBeGreaterThanOrEqual(e.multistoreyCollapse)
      expect(e.bridgeCollapse).toBeGreaterThanOrEqual(e.steelFrameCollapse)
      expect(e.trees30).toBeGreaterThanOrEqual(e.trees90)
      expect(e.burn1).toBeGreaterThanOrEqual(e.burn2)
      expect(e.burn2).toBeGreaterThanOrEqual(e.burn3)
      expect(e.runUp1m).toBeGreaterThanOrEqual(e.runUp3m)
    }
  })

  it('sums exposed population as population × exceedance over sites, conditional on impact', () => {
    for (const t of THRESHOLDS) {
      expect(a.exposedPopulation[t.key]).toBeCloseTo(a.sites.reduce((s, x) => s + x.population * x.exceedance[t.key], 0), 6)
    }
  })

  it('rates Torino and Palermo from the solution probability and the MEDIAN energy (Binzel 2000; Chesley et al. 2002)', () => {
    const years = (Date.parse(solution.impactTime) - Date.parse(solution.epoch)) / (365.25 * 86_400_000)
    expect(a.torino).toBe(torinoScale({ probability: solution.impactProbability, energyMt: a.energyMt.p50 }))
    const ps = palermoScale({ probability: solution.impactProbability, energyMt: a.energyMt.p50, yearsToImpact: years })
    expect(a.palermo).toBeCloseTo(ps, 10)
  })

  it('thins the impact points reproducibly to at most 2000, flagged sea and airburst', () => {
    const big = assessSolution(solution, sites.slice(0, 1), { samples: 30_000, seed: 5 })
    expect(big.impactPoints.length).toBeLessThanOrEqual(2000)
    expect(big.impactPoints.length).toBeGreaterThan(1000)
    const seaShare = big.impactPoints.filter(p => p[2] & 1).length / big.impactPoints.length
    expect(Math.abs(seaShare - big.oceanImpactProbability)).toBeLessThan(0.05)
    for (const [lon, lat, f] of big.impactPoints) {
      expect(Math.abs(lon)).toBeLessThanOrEqual(180)
      expect(Math.abs(lat)).toBeLessThanOrEqual(90)
      expect(f & ~3).toBe(0)
    }
  })

  it('names its limits: tsunami figures are indicative; Chelyabinsk-like bursts are flagged high (Brown et al. 2013, Nature 503)', () => {
    expect(a.warnings.map(w => w.code)).toContain('tsunami-indicative')
    const small = assessSolution(demoSolution({ magnitude: { H: 26.3, sigma: 0.2 }, taxonomicClass: 'S', entrySpeedKmS: { mean: 19, sigma: 0.3 }, entryAngleDeg: { mean: 18, sigma: 2 } }), sites, { samples: 2000, seed: 1 })
    expect(small.airburstProbability).toBeGreaterThan(0.9)
    expect(small.warnings.find(w => w.code === 'high-burst')?.fraction).toBeGreaterThan(0.5)
    const noDepth = assessSolution(demoSolution({ waterDepthM: 0 }), sites, { samples: 2000, seed: 1 })
    expect(noDepth.warnings.map(w => w.code)).toContain('depth-assumed')
    const deep = assessSolution(demoSolution({ waterDepthM: 9000 }), sites, { samples: 2000, seed: 1 })
    expect(deep.warnings.map(w => w.code)).toContain('depth-out-of-range')
  })

  it('makes no tsunami from high airbursts over the sea, only ripples from their debris (Berger & Goodman 2018, PAGEOPH 175; Morrison & Venkatapathy 2017)', () => {
    const small = assessSolution(demoSolution({ magnitude: { H: 27, sigma: 0.1 }, taxonomicClass: 'C', entrySpeedKmS: { mean: 18, sigma: 0.5 } }), sites, { samples: 2000, seed: 3 })
    expect(small.airburstProbability).toBe(1)
    expect(small.tsunamiProbability).toBe(0)
    expect(small.waterCavityDiameterM).toBeNull()
    // The slowed debris still reaches the water (energy is conserved), but its waves are centimetres at the coasts.
    expect(small.surfaceEnergyMt.p95).toBeGreaterThan(0)
    for (const s of small.sites) { expect(s.tsunamiAmplitudeM.p95).toBeLessThan(0.05); expect(s.exceedance.runUp1m).toBe(0) }
  })

  it('gives no tsunami figures for an inland site (no offshore depth) and keeps blast figures for it', () => {
    const inland = siteSchema.parse({ id: 'evora-interior', name: 'Évora Interior', lon: -7.91, lat: 38.57, population: 50_000 })
    const b = assessSolution(solution, [inland, ...sites.slice(0, 1)], { samples: 3000, seed: 2 })
    const [i, c] = b.sites
    expect(i!.coastal).toBe(false)
    expect(i!.tsunamiAmplitudeM).toEqual({ p5: 0, p50: 0, p95: 0 })
    expect(i!.exceedance.runUp1m).toBe(0)
    expect(i!.distanceKm.p50).toBeGreaterThan(0)
    expect(c!.coastal).toBe(true)
    expect(c!.tsunamiAmplitudeM.p95).toBeGreaterThan(0)
  })

  it('records the strength model it used (log-uniform 0.1–10 MPa, Mathias et al. 2017, Icarus 289)', () => {
    const b = assessSolution(solution, sites.slice(0, 1), { samples: 2000, seed: 1, strengthModel: 'log-uniform' })
    expect(b.options.strengthModel).toBe('log-uniform')
    expect(b.airburstProbability).not.toBe(assessSolution(solution, sites.slice(0, 1), { samples: 2000, seed: 1 }).airburstProbability)
  })

  it('rejects a sample count outside 1..2 000 000', () => {
    expect(() => assessSolution(solution, sites, { samples: 0 })).toThrow(RangeError)
    expect(() => assessSolution(solution, sites, { samples: 1.5 })).toThrow(RangeError)
  })
})
