import { describe, expect, it } from 'vitest'
import { geoDistance } from 'd3-geo'
import { overpressureRadiusM, severeDamageRadiusKmHillsGoda } from '../../../shared/hazard/blast'
import { blastRings, medianBlastCase } from '../../../shared/geo/overlays'
import { geodesicRing } from '../../../shared/geo/rings'
import { EARTH_RADIUS_KM } from '../../../shared/geo/sphere'
import { KPA_PER_PSI } from '../../../shared/geo/figures'
import { surfaceAssessment } from './fixtures'

const centre: [number, number] = [-9.55, 39.95]

function radiiKm(ring: ReturnType<typeof geodesicRing>): number[] {
  return ring.geometry.coordinates[0]!.map(p => geoDistance(centre, p as [number, number]) * EARTH_RADIUS_KM)
}

describe('geodesic rings', () => {
  for (const km of [0.5, 20, 59, 700, 3000]) {
    it(`puts every vertex of a ${km} km ring at ${km} km within 1 %`, () => {
      for (const r of radiiKm(geodesicRing(centre, km))) expect(Math.abs(r / km - 1)).toBeLessThan(0.01)
    })
  }

  // Thresholds of the hazard model (THRESHOLDS): 1 psi (6.9 kPa, windows shatter) and 4 psi (severe damage).
  const cases = [
    { name: '1 psi (6.9 kPa), 130 Mt surface burst', energyMt: 130, altM: 0, pa: 6900 },
    { name: '4 psi, 130 Mt surface burst', energyMt: 130, altM: 0, pa: 4 * KPA_PER_PSI * 1000 },
    { name: '1 psi, 10 Mt airburst at 8 km', energyMt: 10, altM: 8000, pa: 6900 },
    { name: '4 psi, 10 Mt airburst at 8 km', energyMt: 10, altM: 8000, pa: 4 * KPA_PER_PSI * 1000 },
  ]
  for (const c of cases) {
    it(`draws the ${c.name} ring at the engine's overpressureRadiusM within 1 %`, () => {
      const km = overpressureRadiusM(c.energyMt, c.altM, c.pa) / 1000
      expect(km).toBeGreaterThan(1)
      for (const r of radiiKm(geodesicRing(centre, km))) expect(Math.abs(r / km - 1)).toBeLessThan(0.01)
    })
  }

  it('gives a 4 psi ring of the same order as Hills & Goda 1993 (AJ 105, 1114–1144) for a 10 Mt burst at 8 km', () => {
    const ours = overpressureRadiusM(10, 8000, 4 * KPA_PER_PSI * 1000) / 1000
    const theirs = severeDamageRadiusKmHillsGoda(10, 8)
    expect(ours / theirs).toBeGreaterThan(0.5)
    expect(ours / theirs).toBeLessThan(2)
  })
})

describe('blast rings of an assessment', () => {
  it('uses a surface burst of the entry energy (air plus surface, as the engine) when most realisations reach the surface', () => {
    const a = surfaceAssessment()
    const b = medianBlastCase(a)
    expect(b.regime).toBe('surface')
    expect(b.burstAltitudeM).toBe(0)
    expect(b.energyMt).toBeCloseTo(193, 6)
  })

  it('uses the median burst altitude when most realisations burst in the air', () => {
    const a = { ...surfaceAssessment(), airburstProbability: 0.8, burstAltitudeKm: { p5: 2, p50: 5, p95: 12 } }
    expect(medianBlastCase(a)).toEqual({ energyMt: 193, burstAltitudeM: 5000, regime: 'airburst' })
  })

  it('gives one ring per overpressure threshold, largest for the lowest pressure, matching the engine', () => {
    const { basis, rings } = blastRings(surfaceAssessment())
    expect(rings.map(r => r.key)).toEqual(['windows', 'houseCollapse', 'multistoreyCollapse'])
    expect(rings[0]!.radiusKm).toBeGreaterThan(rings[1]!.radiusKm)
    expect(rings[1]!.radiusKm).toBeGreaterThan(rings[2]!.radiusKm)
    expect(rings[0]!.radiusKm).toBeCloseTo(overpressureRadiusM(basis.energyMt, 0, 6900) / 1000, 6)
    // Ignores thresholds that are not overpressures.
    expect(blastRings(surfaceAssessment(), ['runUp1m', 'windows']).rings.map(r => r.key)).toEqual(['windows'])
  })
})
