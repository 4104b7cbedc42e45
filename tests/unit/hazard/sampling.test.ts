import { describe, it, expect } from 'vitest'
import { HazardRng, sampleAlbedoWright2016, sampleShoemakerAngleDeg, WRIGHT_2016, sampleSolutionCorridorPoint } from '../../../shared/hazard/index'
import { corridorGeometry } from '../../../shared/hazard/corridor'
import { geoDistance } from 'd3-geo'

describe('sampling', () => {
  it('repeats its sequence for the same seed and changes it for another (reproducibility requirement)', () => {
    const a = new HazardRng(7), b = new HazardRng(7), c = new HazardRng(8)
    const xa = Array.from({ length: 50 }, () => a.normal())
    expect(Array.from({ length: 50 }, () => b.normal())).toEqual(xa)
    expect(Array.from({ length: 50 }, () => c.normal())).not.toEqual(xa)
  })

  it('draws uniforms in (0, 1] and standard normals with mean 0 and variance 1 (Marsaglia & Bray 1964; statistics, common practice)', () => {
    const rng = new HazardRng(1)
    let s = 0, s2 = 0, lo = 1, hi = 0
    const n = 400_000
    for (let k = 0; k < n; k++) {
      const u = rng.uniform()
      lo = Math.min(lo, u)
      hi = Math.max(hi, u)
      const z = rng.normal()
      s += z
      s2 += z * z
    }
    expect(lo).toBeGreaterThan(0)
    expect(hi).toBeLessThanOrEqual(1)
    expect(Math.abs(s / n)).toBeLessThan(0.006)
    expect(Math.abs(s2 / n - 1)).toBeLessThan(0.01)
  })

  it('draws albedos from the Wright et al. 2016 mixture with mean 0.1668 (AJ 152, 79: 25.3 % at 0.030, 74.7 % at 0.168)', () => {
    // Mean of the mixture: sqrt(pi/2) (0.253 * 0.030 + 0.747 * 0.168) = 0.1668.
    const w = WRIGHT_2016
    expect(Math.sqrt(Math.PI / 2) * (w.darkFraction * w.darkSigma + (1 - w.darkFraction) * w.brightSigma)).toBeCloseTo(0.1668, 4)
    const rng = new HazardRng(2016)
    const n = 1_000_000
    let s = 0, dark = 0
    for (let k = 0; k < n; k++) { const p = sampleAlbedoWright2016(rng); s += p; if (p < 0.06) dark++ }
    expect(s / n).toBeCloseTo(0.1668, 3)
    // Share below 0.06: 0.253 (1 - e^-2) + 0.747 (1 - e^(-0.06^2/(2*0.168^2))) = 0.2188 + 0.0459 = 0.265 (arithmetic).
    expect(dark / n).toBeCloseTo(0.265, 2)
  })

  it('draws entry angles by the sin 2θ law: mean 45°, a quarter below 30° (Shoemaker 1961; as sampled by Mathias et al. 2017, Icarus 289)', () => {
    const rng = new HazardRng(3)
    const n = 400_000
    let s = 0, below30 = 0, min = 90
    for (let k = 0; k < n; k++) { const a = sampleShoemakerAngleDeg(rng); s += a; if (a < 30) below30++; min = Math.min(min, a) }
    expect(min).toBeGreaterThanOrEqual(5)
    // Redrawn below 5°: P(< 30° | >= 5°) = (sin²30 - sin²5)/(1 - sin²5) = 0.2443; mean rises to 45.2° (arithmetic).
    expect(below30 / n).toBeCloseTo(0.2443, 2)
    expect(s / n).toBeCloseTo(45.2, 0)
  })
})

describe('risk corridor', () => {
  const corridor = {
    path: [[-22, 35.2], [-14, 37.4], [-6, 39.4]] as Array<[number, number]>, halfWidthKm: 25,
    nominal: [-14, 37.4] as [number, number], alongTrackSigmaKm: 180,
  }

  it('returns the nominal point for zero offsets when the nominal lies on the track (geometry; common practice, no source)', () => {
    const [lon, lat] = sampleSolutionCorridorPoint({ corridor }, 0, 0.5)
    expect(lon).toBeCloseTo(-14, 6)
    expect(lat).toBeCloseTo(37.4, 6)
  })

  it('moves the point by the requested along- and cross-track distances on the sphere (great-circle geometry; d3-geo geoDistance)', () => {
    const R = 6371
    const g = corridorGeometry(corridor.path, corridor.nominal)
    expect(g.totalM / 1000).toBeCloseTo(R * (geoDistance([-22, 35.2], [-14, 37.4]) + geoDistance([-14, 37.4], [-6, 39.4])), 3)
    const a = sampleSolutionCorridorPoint({ corridor }, 0, 0.5)
    const b = sampleSolutionCorridorPoint({ corridor }, 1, 0.5)
    expect(geoDistance(a, b) * R).toBeCloseTo(180, 3)
    const c = sampleSolutionCorridorPoint({ corridor }, 0, 1)
    expect(geoDistance(a, c) * R).toBeCloseTo(25, 3)
  })
})
