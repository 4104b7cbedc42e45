import { describe, it, expect } from 'vitest'
import { diameterFromMagnitude, kineticEnergyMt, massKg, entrySpeedFromVInfKmS } from '../../../shared/hazard/index'

describe('size and energy', () => {
  it('gives about 141 m for H = 22 and albedo 0.14 (Pravec & Harris 2007, Icarus 190, appendix A: D = 1329/sqrt(p) 10^(-H/5) km)', () => {
    // 1329 / sqrt(0.14) * 10^-4.4 km = 0.1414 km (arithmetic on the published law).
    expect(diameterFromMagnitude(22, 0.14)).toBeCloseTo(141.4, 0)
  })

  it('gives 1329 km for H = 0 and albedo 1, the constant of the law (Bowell et al. 1989, Asteroids II; Pravec & Harris 2007)', () => {
    expect(diameterFromMagnitude(0, 1)).toBeCloseTo(1_329_000, -1)
  })

  it('halves the diameter for every 1.505 magnitudes (5 log10 2; Pravec & Harris 2007 law)', () => {
    expect(diameterFromMagnitude(20, 0.2) / diameterFromMagnitude(20 + 5 * Math.log10(2), 0.2)).toBeCloseTo(2, 10)
  })

  it('computes m = (pi/6) rho D^3 and E = m v^2/2 (Collins, Melosh & Marcus 2005, MAPS 40(6), eq. 1)', () => {
    // 50 m, 3000 kg/m³: 1.9635e8 kg; at 20 km/s: 3.927e16 J = 9.386 Mt (1 Mt = 4.184e15 J; arithmetic).
    expect(massKg(50, 3000)).toBeCloseTo(1.9635e8, -4)
    expect(kineticEnergyMt({ diameterM: 50, densityKgM3: 3000, speedKmS: 20 })).toBeCloseTo(9.386, 2)
  })

  it('adds the escape speed 11.19 km/s in quadrature to v_inf (common practice, no source)', () => {
    expect(entrySpeedFromVInfKmS(0)).toBeCloseTo(11.19, 10)
    expect(entrySpeedFromVInfKmS(10)).toBeCloseTo(Math.hypot(10, 11.19), 10)
  })
})
