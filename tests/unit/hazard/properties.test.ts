import { describe, it, expect } from 'vitest'
import {
  atmosphericEntry, diameterFromMagnitude, kineticEnergyMt, waterCavityDiameterM, seafloorSpeedKmS, overpressurePa, peakWindMS,
  thermalExposureJM2, tsunamiAmplitudeAtM, runUpM, rimWaveAmplitudeM, HazardRng, assessSolution,
} from '../../../shared/hazard/index'
import { demoSolution, demoSites } from './fixtures'

// Seeded property loops over the input domain of the brief: H 15–30, density 1000–8000 kg/m³,
// speed 11.2–72 km/s, angle 5–90°, water depth 0–8000 m (no property-testing package).
const rng = new HazardRng(2024)
const between = (a: number, b: number) => a + (b - a) * rng.uniform()
const domain = () => ({
  H: between(15, 30), albedo: between(0.02, 0.6), densityKgM3: between(1000, 8000),
  speedKmS: between(11.2, 72), angleDeg: between(5, 90), depthM: between(0, 8000),
})

describe('properties over the input domain', () => {
  it('never gives NaN or negative energies, speeds or altitudes, and conserves energy', () => {
    for (let k = 0; k < 4000; k++) {
      const d = domain()
      const diameterM = diameterFromMagnitude(d.H, d.albedo)
      const e = atmosphericEntry({ diameterM, densityKgM3: d.densityKgM3, speedKmS: d.speedKmS, angleDeg: d.angleDeg })
      for (const v of [e.energyMt, e.energyAirMt, e.energySurfaceMt, e.surfaceSpeedKmS, e.strengthPa, e.strengthFactor]) {
        expect(Number.isFinite(v)).toBe(true)
        expect(v).toBeGreaterThanOrEqual(0)
      }
      expect(Math.abs(e.energyAirMt + e.energySurfaceMt - e.energyMt)).toBeLessThanOrEqual(e.energyMt * 1e-9)
      expect(e.surfaceSpeedKmS).toBeLessThanOrEqual(d.speedKmS)
      if (e.burstAltitudeM !== null) {
        expect(e.burstAltitudeM).toBeGreaterThan(0)
        expect(e.breakupAltitudeM!).toBeGreaterThan(e.burstAltitudeM)
        expect(e.surfaceSpeedKmS).toBeLessThanOrEqual(Math.max(e.burstSpeedKmS!, d.speedKmS))
      }
      const cav = waterCavityDiameterM({ diameterM, densityKgM3: d.densityKgM3, speedKmS: e.surfaceSpeedKmS, angleDeg: d.angleDeg })
      expect(Number.isFinite(cav) && cav >= 0).toBe(true)
      const vsf = seafloorSpeedKmS({
        speedKmS: e.surfaceSpeedKmS, diameterM, densityKgM3: d.densityKgM3, angleDeg: d.angleDeg, waterDepthM: d.depthM,
      })
      expect(vsf).toBeGreaterThanOrEqual(0)
      expect(vsf).toBeLessThanOrEqual(e.surfaceSpeedKmS)
      if (cav > 0 && d.depthM > 0) {
        const a = tsunamiAmplitudeAtM({ cavityDiameterM: cav, waterDepthM: d.depthM, distanceM: between(1e3, 5e6) })
        expect(Number.isFinite(a) && a >= 0 && a <= d.depthM).toBe(true)
      }
      const p = overpressurePa({
        energyMt: e.energyAirMt + e.energySurfaceMt, groundRangeM: between(1, 1e6), burstAltitudeM: e.burstAltitudeM ?? 0,
      })
      expect(Number.isFinite(p) && p >= 0).toBe(true)
      expect(Number.isFinite(peakWindMS(p))).toBe(true)
    }
  })

  it('grows energy with size and speed (E = m v^2/2, Collins 2005 eq. 1) and shrinks size with H (Pravec & Harris 2007)', () => {
    for (let k = 0; k < 1000; k++) {
      const d = domain()
      const D = diameterFromMagnitude(d.H, d.albedo)
      expect(diameterFromMagnitude(d.H + 0.1, d.albedo)).toBeLessThan(D)
      const E = kineticEnergyMt({ diameterM: D, densityKgM3: d.densityKgM3, speedKmS: d.speedKmS })
      expect(kineticEnergyMt({ diameterM: D * 1.01, densityKgM3: d.densityKgM3, speedKmS: d.speedKmS })).toBeGreaterThan(E)
      expect(kineticEnergyMt({ diameterM: D, densityKgM3: d.densityKgM3, speedKmS: d.speedKmS * 1.01 })).toBeGreaterThan(E)
    }
  })

  it('grows the water cavity with size, speed and steepness (pi-scaling, Collins 2005)', () => {
    for (let k = 0; k < 1000; k++) {
      const d = domain()
      const i = { diameterM: between(10, 2000), densityKgM3: d.densityKgM3, speedKmS: d.speedKmS, angleDeg: Math.min(89, d.angleDeg) }
      const c = waterCavityDiameterM(i)
      expect(waterCavityDiameterM({ ...i, diameterM: i.diameterM * 1.01 })).toBeGreaterThan(c)
      expect(waterCavityDiameterM({ ...i, speedKmS: i.speedKmS * 1.01 })).toBeGreaterThan(c)
      expect(waterCavityDiameterM({ ...i, angleDeg: i.angleDeg + 1 })).toBeGreaterThan(c)
    }
  })

  it('lowers overpressure and thermal exposure with range, raises them with energy, for surface bursts (Collins 2005)', () => {
    for (let k = 0; k < 1000; k++) {
      const E = Math.exp(between(Math.log(1e-3), Math.log(1e5)))
      const r = Math.exp(between(Math.log(10), Math.log(2e6)))
      const p = overpressurePa({ energyMt: E, groundRangeM: r, burstAltitudeM: 0 })
      expect(overpressurePa({ energyMt: E, groundRangeM: r * 1.01, burstAltitudeM: 0 })).toBeLessThan(p)
      expect(overpressurePa({ energyMt: E * 1.05, groundRangeM: r, burstAltitudeM: 0 })).toBeGreaterThan(p)
      const th = thermalExposureJM2({ energyMt: E, groundRangeM: r, burstAltitudeM: 0 })
      expect(thermalExposureJM2({ energyMt: E, groundRangeM: r * 1.01, burstAltitudeM: 0 })).toBeLessThanOrEqual(th)
      expect(peakWindMS(p * 1.01)).toBeGreaterThan(peakWindMS(p))
    }
  })

  it('raises run-up with wave height on each branch of Synolakis 1987, and the rim wave with the cavity', () => {
    for (let k = 0; k < 1000; k++) {
      const depthM = between(5, 200), beachSlopeDeg = between(0.2, 20), H = between(0.01, 0.78 * depthM)
      const a = runUpM({ waveHeightM: H, depthM, beachSlopeDeg })
      const b = runUpM({ waveHeightM: H * 1.001, depthM, beachSlopeDeg })
      expect(Number.isFinite(a.runUpM) && a.runUpM > 0).toBe(true)
      if (a.breaking === b.breaking) expect(b.runUpM).toBeGreaterThan(a.runUpM)
      expect(rimWaveAmplitudeM(H * 100, depthM)).toBeGreaterThanOrEqual(rimWaveAmplitudeM(H * 99, depthM))
    }
  })

  it('keeps assessments finite and ordered across seeds and solutions', () => {
    const sites = demoSites()
    for (let k = 0; k < 6; k++) {
      const s = demoSolution({
        magnitude: { H: between(18, 28), sigma: between(0, 1) },
        entrySpeedKmS: { mean: between(12, 40), sigma: between(0, 5) },
        waterDepthM: between(0, 8000),
        taxonomicClass: (['S', 'C', 'M', 'Q', 'V', 'unknown'] as const)[k]!,
      })
      const a = assessSolution(s, sites, { samples: 1500, seed: k })
      expect(JSON.parse(JSON.stringify(a))).toEqual(a)
      for (const p of [a.diameterM, a.energyMt, a.surfaceEnergyMt, ...a.sites.map(x => x.overpressureKPa), ...a.sites.map(x => x.runUpM)]) {
        expect(p.p5).toBeLessThanOrEqual(p.p50)
        expect(p.p50).toBeLessThanOrEqual(p.p95)
        expect(p.p5).toBeGreaterThanOrEqual(0)
      }
    }
  })
})
