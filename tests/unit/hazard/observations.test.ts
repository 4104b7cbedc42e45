import { describe, it, expect } from 'vitest'
import {
  assessSolution, atmosphericEntry, orbitSolutionSchema, siteSchema, overpressurePa, overpressureRadiusM, peakWindMS,
  thermalExposureJM2, burnThresholdJM2, diameterFromMagnitude,
} from '../../../shared/hazard/index'

// Observed airbursts against the whole chain. Each check names where its value comes from.

/**
 * Window breakage (Clancey 1972, "Diagnostic features of explosion damage", 6th Int. Meeting of Forensic Sciences,
 * Edinburgh; his damage table as reproduced in explosion-safety references, read in a secondary copy): occasional
 * breakage of large windows from about 0.2 kPa, typical glass breakage about 1 kPa, windows usually shattered at
 * 3.4–6.9 kPa. Beyond 6.9 kPa houses are damaged, which Chelyabinsk did not see on a wide scale.
 */
const WINDOW_BREAKING_PA = [200, 6900] as const

/** Overpressure at which the peak wind reaches 40 m/s, where about 30 % of trees fall (Collins 2005 after Glasstone & Dolan 1977). */
function treeFallPa(): number {
  let a = 0, b = 1e6
  for (let k = 0; k < 80; k++) { const m = 0.5 * (a + b); if (peakWindMS(m) < 40) a = m; else b = m }
  return b
}

describe('Chelyabinsk, 15 February 2013 (Popova et al. 2013, Science 342, 1069–1073; Brown et al. 2013, Nature 503, 238–241)', () => {
  // 19 m, 3300 kg/m³, 19.16 km/s, 18.3° from the horizontal (Popova et al. 2013).
  const e = atmosphericEntry({ diameterM: 19, densityKgM3: 3300, speedKmS: 19.16, angleDeg: 18.3 })

  it('bursts at about 30 km with about 0.5 Mt, all of it deposited in the air', () => {
    // Peak brightness at 29.7 km (Popova et al. 2013); 500 ± 100 kt (Brown et al. 2013).
    expect(e.burstAltitudeM! / 1000).toBeGreaterThan(25)
    expect(e.burstAltitudeM! / 1000).toBeLessThan(37)
    expect(e.energyMt).toBeGreaterThan(0.4)
    expect(e.energyMt).toBeLessThan(0.6)
    expect(e.energyAirMt / e.energyMt).toBeGreaterThan(0.999)
  })

  it('puts the ground overpressure in the window-breaking range from below the burst to tens of km away', () => {
    // Windows broke across the region, in Chelyabinsk about 40 km from the track and beyond (Popova et al. 2013).
    for (const km of [0, 20, 40, 60, 90]) {
      const p = overpressurePa({ energyMt: e.energyMt, groundRangeM: km * 1000, burstAltitudeM: e.sourceAltitudeM })
      expect(p).toBeGreaterThan(WINDOW_BREAKING_PA[0])
      expect(p).toBeLessThan(WINDOW_BREAKING_PA[1])
    }
  })

  it('gives the same through the Monte Carlo, at a town 40 km from the burst point', () => {
    // The same body as an orbit solution: H for 19 m at albedo 0.25 (Bowell et al. 1989 size law), no spread.
    const H = 5 * Math.log10(1329e3 / (Math.sqrt(0.25) * 19))
    expect(diameterFromMagnitude(H, 0.25)).toBeCloseTo(19, 6)
    const solution = orbitSolutionSchema.parse({
      epoch: '2013-02-01T00:00:00Z', impactTime: '2013-02-15T03:20:00Z', impactProbability: 1,
      magnitude: { H, sigma: 0 }, albedo: { min: 0.25, max: 0.25 }, taxonomicClass: 'S',
      densityKgM3: { mean: 3300, sigma: 0 }, entrySpeedKmS: { mean: 19.16, sigma: 0 }, entryAngleDeg: { mean: 18.3, sigma: 0 },
      corridor: { path: [[61.0, 54.5], [61.2, 54.5]], halfWidthKm: 0, nominal: [61.1, 54.5], alongTrackSigmaKm: 0 },
      waterDepthM: 0,
    })
    const town = siteSchema.parse({ id: 'town40', name: 'Town 40 km north', lon: 61.1, lat: 54.5 + 40 / 6371 * 180 / Math.PI, population: 1000 })
    const a = assessSolution(solution, [town], { samples: 200, seed: 1 })
    expect(a.airburstProbability).toBe(1)
    const kPa = a.sites[0]!.overpressureKPa.p50
    expect(kPa * 1000).toBeGreaterThan(WINDOW_BREAKING_PA[0])
    expect(kPa * 1000).toBeLessThan(WINDOW_BREAKING_PA[1])
    expect(kPa).toBeCloseTo(overpressurePa({ energyMt: e.energyMt, groundRangeM: 40_000, burstAltitudeM: e.sourceAltitudeM }) / 1000, 2)
    // Warm, but no burns: witnesses felt heat, burns were not a reported injury (Popova et al. 2013, from memory).
    const heat = a.sites[0]!.thermalMJM2.p50
    expect(heat).toBeGreaterThan(0)
    expect(heat * 1e6).toBeLessThan(burnThresholdJM2(0.13e6, e.energyMt))
    expect(a.airEnergyMt!.p50).toBeCloseTo(a.energyMt.p50, 6)
  })
})

describe('Tunguska, 30 June 1908', () => {
  // 12.5 Mt at 8.5 km from the seismic and barometric records (Ben-Menahem 1975, Phys. Earth Planet. Inter. 11,
  // 1–35 — from memory); published estimates span about 3–15 Mt and 5–10 km.
  const E = 12.5, zM = 8500

  it('flattens forest over an area within a factor of 2 of the observed 2 150 km²', () => {
    // About 2 150 km² of felled forest (Fast's survey, widely cited; read in Vasilyev 1998, Planet. Space Sci. 46,
    // 129–150 — from memory). The edge of the fall is taken where about 30 % of trees fall (40 m/s wind).
    const r = overpressureRadiusM(E, zM, treeFallPa())
    const areaKm2 = Math.PI * r * r / 1e6
    expect(areaKm2).toBeGreaterThan(2150 / 2)
    expect(areaKm2).toBeLessThan(2150 * 2)
  })

  it('heats the ground below the burst past the third-degree burn level (the forest was scorched near the centre)', () => {
    // Scorched trees and a fire near the epicentre (Vasilyev 1998, from memory); burn levels of Collins 2005
    // (after Glasstone & Dolan 1977), scaled by E^(1/6).
    const below = thermalExposureJM2({ energyMt: E, groundRangeM: 0, burstAltitudeM: zM })
    expect(below).toBeGreaterThan(burnThresholdJM2(0.42e6, E))
    // and it fades with range: at 100 km it is below the first-degree level.
    expect(thermalExposureJM2({ energyMt: E, groundRangeM: 100_000, burstAltitudeM: zM })).toBeLessThan(burnThresholdJM2(0.13e6, E))
  })

  it('gives a Tunguska-like stony body of the entry model a burst of a few km and heat below it', () => {
    // 55 m, 3000 kg/m³, 15 km/s, 45° (Chyba, Thomas & Zahnle 1993, Nature 361, 40–44 — parameters from memory).
    const t = atmosphericEntry({ diameterM: 55, densityKgM3: 3000, speedKmS: 15, angleDeg: 45 })
    expect(t.burstAltitudeM! / 1000).toBeGreaterThan(3)
    expect(t.burstAltitudeM! / 1000).toBeLessThan(12)
    const below = thermalExposureJM2({
      energyMt: t.energyMt, airEnergyMt: t.energyAirMt, groundRangeM: 0, burstAltitudeM: t.sourceAltitudeM,
    })
    expect(below).toBeGreaterThan(burnThresholdJM2(0.42e6, t.energyMt))
    const r = overpressureRadiusM(t.energyMt, t.sourceAltitudeM, treeFallPa())
    // The model body (7 Mt at 5.9 km) flattens within a factor of 2.5 of the observed area (it is a less energetic body).
    expect(Math.PI * r * r / 1e6).toBeGreaterThan(2150 / 2.5)
  })
})
