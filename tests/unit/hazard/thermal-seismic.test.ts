import { describe, it, expect } from 'vitest'
import { thermalExposureJM2, visibleFraction, fireballRadiusM, burnThresholdJM2, seismicMagnitude, effectiveMagnitude } from '../../../shared/hazard/index'

describe('thermal radiation (Collins, Melosh & Marcus 2005, MAPS 40(6))', () => {
  it('sizes the fireball as 0.002 E^(1/3) m: 322 m for 1 Mt (arithmetic on the published law)', () => {
    expect(fireballRadiusM(4.184e15)).toBeCloseTo(322.2, 0)
  })

  it('sees all of a fireball above the horizon, none below, and 39 % when half its radius is hidden (Collins 2005 visible-fraction law)', () => {
    expect(visibleFraction(0, 100)).toBe(1)
    expect(visibleFraction(-50, 100)).toBe(1)
    expect(visibleFraction(100, 100)).toBe(0)
    // (2/pi)(acos 0.5 - 0.5 sin(acos 0.5)) = 0.391 (arithmetic).
    expect(visibleFraction(50, 100)).toBeCloseTo(0.391, 3)
  })

  it('gives Phi = f eta E / (2 pi r^2): 1.94e4 J/m² at 10 km from a 1 Mt surface fireball (Collins 2005; arithmetic)', () => {
    expect(thermalExposureJM2({ energyMt: 1, groundRangeM: 10_000, burstAltitudeM: 0 })).toBeCloseTo(19_357, -1)
  })

  it('scales burn thresholds as Z E_Mt^(1/6) (Collins 2005; Mathias et al. 2017, Icarus 289)', () => {
    expect(burnThresholdJM2(0.25e6, 64)).toBeCloseTo(0.5e6, 3)
  })
})

describe('ground shaking (Collins 2005 eqs. 40–41)', () => {
  it('gives M = 0.67 log10 E - 5.87: M 4.60 for 1 Mt (arithmetic on eq. 40)', () => {
    expect(seismicMagnitude(4.184e15)).toBeCloseTo(4.5965, 3)
  })

  it('attenuates with range and joins its branches at 60 km within 0.03 and at 700 km within 0.3 (eq. 41; self-consistency)', () => {
    expect(effectiveMagnitude(7, 10)).toBeCloseTo(7 - 0.238, 6)
    expect(Math.abs(effectiveMagnitude(7, 59.999) - effectiveMagnitude(7, 60))).toBeLessThan(0.03)
    expect(Math.abs(effectiveMagnitude(7, 699.999) - effectiveMagnitude(7, 700))).toBeLessThan(0.3)
    expect(effectiveMagnitude(7, 2000)).toBeLessThan(effectiveMagnitude(7, 700))
  })
})

describe('the tabulated visible fraction of the site loop', () => {
  it('agrees with the exact form within 1e-6 everywhere on 0..1 (self-consistency)', async () => {
    const { visibleFractionOfRatio } = await import('../../../shared/hazard/thermal')
    for (let k = 0; k <= 100_000; k++) {
      const q = k / 100_000
      expect(Math.abs(visibleFractionOfRatio(q) - visibleFraction(q, 1))).toBeLessThan(1e-6)
    }
    expect(visibleFractionOfRatio(-3)).toBe(1)
    expect(visibleFractionOfRatio(2)).toBe(0)
  })
})
