import { describe, it, expect } from 'vitest'
import { palermoScale, torinoScale } from '../../../shared/hazard/index'

// 99942 Apophis (2004 MN4) on 27 December 2004: impact probability 1 in 37 (2.7 %) for 13 April 2029,
// Torino 4 and Palermo 1.10, "12.6 times the background, 1 in 37 instead of 1 in 472" (public pages
// derived from Wikipedia's Palermo-scale article; Chesley 2006, Proc. IAU Symp. 229, could not be read here).
// The energy is back-solved from that background: f_B dT = 1/472 over 24.3 years gives about 1.5 Gt.
const apophisYears = (Date.parse('2029-04-13T21:46:00Z') - Date.parse('2004-12-27T00:00:00Z')) / (365.25 * 86_400_000)

describe('risk scales', () => {
  it('rates Apophis of December 2004 at Palermo 1.10 (Chesley et al. 2002, Icarus 159: PS = log10(p / (0.03 E^-0.8 dT)))', () => {
    expect(palermoScale({ probability: 1 / 37, energyMt: 1480, yearsToImpact: apophisYears })).toBeCloseTo(1.10, 1)
  })

  it('gives Palermo 0 when the probability equals the background over the interval (definition, Chesley et al. 2002)', () => {
    const E = 100, T = 10
    expect(palermoScale({ probability: 0.03 * E ** -0.8 * T, energyMt: E, yearsToImpact: T })).toBeCloseTo(0, 12)
  })

  it('rates Apophis of December 2004 at Torino 4 for any energy of 500–1500 Mt at p = 2.7 % (Binzel 2000, PSS 48; public record of the rating)', () => {
    for (const E of [500, 900, 1480]) expect(torinoScale({ probability: 0.027, energyMt: E })).toBe(4)
  })

  it('follows the zones of the Binzel 2000 figure', () => {
    expect(torinoScale({ probability: 0.5, energyMt: 0.5 })).toBe(0) // below 1 Mt
    expect(torinoScale({ probability: 1e-8, energyMt: 10 })).toBe(0) // below the (-1, -2) line
    expect(torinoScale({ probability: 1e-4, energyMt: 1000 })).toBe(1)
    expect(torinoScale({ probability: 0.005, energyMt: 1e4 })).toBe(2)
    expect(torinoScale({ probability: 0.005, energyMt: 1e7 })).toBe(6)
    expect(torinoScale({ probability: 0.5, energyMt: 50 })).toBe(3)
    expect(torinoScale({ probability: 0.5, energyMt: 5e4 })).toBe(5)
    expect(torinoScale({ probability: 0.5, energyMt: 1e6 })).toBe(7)
    expect(torinoScale({ probability: 1, energyMt: 50 })).toBe(8)
    expect(torinoScale({ probability: 1, energyMt: 1e4 })).toBe(9)
    expect(torinoScale({ probability: 1, energyMt: 1e6 })).toBe(10)
    expect(torinoScale({ probability: 0, energyMt: 1e6 })).toBe(0)
  })
})
