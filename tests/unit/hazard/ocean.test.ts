import { describe, it, expect } from 'vitest'
import {
  atmosphericEntry, waterCavityDiameterM, seafloorSpeedKmS, rimWaveAmplitudeM, tsunamiAmplitudeAtM, shoaledAmplitudeM,
  runUpM, breakingLimit, longWaveSpeedMS, kineticEnergyMt,
} from '../../../shared/hazard/index'

describe('ocean impacts (Collins, Melosh & Marcus 2005, MAPS 40(6); tsunami figures indicative)', () => {
  it('opens a cavity of about 19 km for the Ward & Asphaug 2003 scenario (Geophys. J. Int. 153, F6–F10: 1.1 km, 17.8 km/s, 19 km cavity)', () => {
    // The abstract gives 1.1 km, 17.8 km/s and a 19 km cavity; the density is not in it. The UCSC press
    // release (2 June 2003) quotes a 60,000 Mt blast, which needs about 2300 kg/m³ at that size and speed;
    // we also try 3000 kg/m³ (common practice for stony bodies, no source). Vertical entry assumed (from memory).
    expect(kineticEnergyMt({ diameterM: 1100, densityKgM3: 2300, speedKmS: 17.8 })).toBeCloseTo(60_700, -3)
    for (const rho of [2300, 3000]) {
      const e = atmosphericEntry({ diameterM: 1100, densityKgM3: rho, speedKmS: 17.8, angleDeg: 90 })
      const d = waterCavityDiameterM({ diameterM: 1100, densityKgM3: rho, speedKmS: e.surfaceSpeedKmS, angleDeg: 90 })
      expect(Math.abs(d / 19_000 - 1)).toBeLessThan(0.12)
    }
  })

  it('makes the 1.365 form equal to pi-scaling 1.88 (m/rho_w)^(1/3) (1.61 g L/v^2)^-0.22 sin^(1/3) (Collins 2005; EIEP source)', () => {
    const L = 200, rho = 3000, v = 18_000, g = 9.81, s = Math.sin(Math.PI / 3)
    const m = Math.PI / 6 * rho * L ** 3
    const piForm = 1.88 * Math.cbrt(m / 1000) * Math.pow(1.61 * g * L / (v * v), -0.22) * Math.cbrt(s)
    expect(waterCavityDiameterM({ diameterM: L, densityKgM3: rho, speedKmS: v / 1000, angleDeg: 60 }) / piForm).toBeCloseTo(1, 3)
  })

  it('puts far more energy into the sea from a surface impact than from an airburst (Berger & Goodman 2018, PAGEOPH 175, 1525–1543)', () => {
    // Same size, speed and angle: a 50 m stony body bursts in the air, a 50 m iron one reaches the water.
    const stony = atmosphericEntry({ diameterM: 50, densityKgM3: 3000, speedKmS: 17, angleDeg: 45 })
    const iron = atmosphericEntry({ diameterM: 50, densityKgM3: 7800, speedKmS: 17, angleDeg: 45 })
    expect(stony.burstAltitudeM).not.toBeNull()
    // Its debris keeps decelerating below the burst: almost nothing is left at the water.
    expect(stony.energySurfaceMt).toBeLessThan(0.01 * stony.energyMt)
    expect(iron.burstAltitudeM).toBeNull()
    expect(iron.energySurfaceMt).toBeGreaterThan(0.3 * iron.energyMt)
    // Same object, weak against strong: the strong one delivers several times more energy to the sea.
    const weak = atmosphericEntry({ diameterM: 100, densityKgM3: 3000, speedKmS: 17, angleDeg: 45, strengthPa: 1e5 })
    const strong = atmosphericEntry({ diameterM: 100, densityKgM3: 3000, speedKmS: 17, angleDeg: 45, strengthPa: 1e8 })
    expect(strong.energySurfaceMt / weak.energySurfaceMt).toBeGreaterThan(3)
    const cavity = (e: typeof weak) =>
      waterCavityDiameterM({ diameterM: 100, densityKgM3: 3000, speedKmS: e.surfaceSpeedKmS, angleDeg: 45 })
    expect(cavity(strong)).toBeGreaterThan(cavity(weak))
    // The burst's slow debris cloud (same mass, seven times wider) opens a far smaller cavity than the iron body.
    const q = 50 / stony.surfaceDiameterM
    const cloud = waterCavityDiameterM({
      diameterM: stony.surfaceDiameterM, densityKgM3: 3000 * q ** 3, speedKmS: stony.surfaceSpeedKmS, angleDeg: 45,
    })
    const ironCavity = waterCavityDiameterM({ diameterM: 50, densityKgM3: 7800, speedKmS: iron.surfaceSpeedKmS, angleDeg: 45 })
    expect(cloud).toBeLessThan(0.25 * ironCavity)
  })

  it('slows the body in the water column with C_D = 0.877 (Collins 2005; verified in the EIEP source)', () => {
    // 100 m, 3000 kg/m³, vertical, 4000 m: v exp(-3*1000*0.877*4000/(2*3000*100)) = v * 0.0173 (arithmetic).
    const vsf = seafloorSpeedKmS({ speedKmS: 20, diameterM: 100, densityKgM3: 3000, angleDeg: 90, waterDepthM: 4000 })
    expect(vsf).toBeCloseTo(20 * Math.exp(-17.54), 8)
  })

  it('makes a rim wave of 0.07 D_tcw capped at the depth, decaying as 1/r beyond the cavity radius (EIEP source; Ward & Asphaug 2000, Icarus 145)', () => {
    expect(rimWaveAmplitudeM(10_000, 4000)).toBeCloseTo(700, 8)
    expect(rimWaveAmplitudeM(100_000, 4000)).toBe(4000)
    expect(tsunamiAmplitudeAtM({ cavityDiameterM: 10_000, waterDepthM: 4000, distanceM: 1000 })).toBeCloseTo(700, 8)
    expect(tsunamiAmplitudeAtM({ cavityDiameterM: 10_000, waterDepthM: 4000, distanceM: 10_000 })).toBeCloseTo(350, 8)
    expect(tsunamiAmplitudeAtM({ cavityDiameterM: 10_000, waterDepthM: 4000, distanceM: 500_000 })).toBeCloseTo(7, 8)
  })

  it('shoals by Green\'s law (h1/h2)^(1/4) and stops at breaking, 0.78 of the depth (Green 1838, common practice; McCowan 1894)', () => {
    const s = shoaledAmplitudeM({ amplitudeM: 1, fromDepthM: 4000, toDepthM: 50 })
    expect(s.amplitudeM).toBeCloseTo(Math.pow(80, 0.25), 10)
    expect(s.breaking).toBe(false)
    expect(shoaledAmplitudeM({ amplitudeM: 20, fromDepthM: 4000, toDepthM: 50 })).toEqual({ amplitudeM: 39, breaking: true })
  })

  it('runs up by R/d = 2.831 sqrt(cot b) (H/d)^(5/4) below the breaking limit 0.818 (cot b)^(-10/9) (Synolakis 1987, J. Fluid Mech. 185)', () => {
    // 1:19.85 beach (Synolakis's laboratory slope), H/d = 0.01: R/d = 0.0399 (arithmetic); limit 0.0296.
    const slope = Math.atan(1 / 19.85) * 180 / Math.PI
    expect(breakingLimit(19.85)).toBeCloseTo(0.0296, 4)
    const r = runUpM({ waveHeightM: 0.5, depthM: 50, beachSlopeDeg: slope })
    expect(r.breaking).toBe(false)
    expect(r.runUpM / 50).toBeCloseTo(0.03988, 4)
    // Beyond the limit the continuous breaking branch stays within 10 % of Synolakis's breaking fit
    // R/d = 1.109 (H/d)^0.582 on his own laboratory slope (Synolakis 1987; constants from memory).
    const b = runUpM({ waveHeightM: 5, depthM: 50, beachSlopeDeg: slope })
    expect(b.breaking).toBe(true)
    expect(b.runUpM / 50 / (1.109 * 0.1 ** 0.582)).toBeGreaterThan(1)
    expect(b.runUpM / 50 / (1.109 * 0.1 ** 0.582)).toBeLessThan(1.1)
  })

  it('travels at sqrt(g h): 198 m/s over 4000 m (long-wave speed; common practice, no source)', () => {
    expect(longWaveSpeedMS(4000)).toBeCloseTo(198.1, 1)
  })
})
