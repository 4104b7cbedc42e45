import { describe, it, expect } from 'vitest'
import {
  arrivalTimeS, captureRadiusKm, encounterFrame, entryFromBPlane, groundLonLat, lineTrack, bPlaneAxes,
  EARTH_RADIUS_KM, MU_EARTH_KM3S2,
} from '../../../shared/encounter/index'

const T0 = '2031-05-04T12:00:00Z'

/** Time for a body starting at distance D upstream with impact parameter b to reach r = R⊕ (RK4, two-body). */
function integratedArrivalS(v: number, b: number, D: number): number {
  let x = [D, b, 0], u = [-Math.sqrt(v * v + 2 * MU_EARTH_KM3S2 / Math.hypot(D, b)), 0, 0], t = 0
  const acc = (p: number[]) => {
    const r = Math.hypot(p[0]!, p[1]!, p[2]!)
    return p.map(c => -MU_EARTH_KM3S2 * c / (r * r * r))
  }
  const add = (a: number[], c: number[], h: number) => a.map((y, i) => y + h * c[i]!)
  for (;;) {
    const r = Math.hypot(x[0]!, x[1]!, x[2]!)
    const dt = Math.min(5e-4 * r / Math.hypot(u[0]!, u[1]!, u[2]!), 20_000)
    const k1v = acc(x), k1x = u
    const k2v = acc(add(x, k1x, dt / 2)), k2x = add(u, k1v, dt / 2)
    const k3v = acc(add(x, k2x, dt / 2)), k3x = add(u, k2v, dt / 2)
    const k4v = acc(add(x, k3x, dt)), k4x = add(u, k3v, dt)
    const nx = x.map((c, i) => c + dt / 6 * (k1x[i]! + 2 * k2x[i]! + 2 * k3x[i]! + k4x[i]!))
    u = u.map((c, i) => c + dt / 6 * (k1v[i]! + 2 * k2v[i]! + 2 * k3v[i]! + k4v[i]!))
    const nr = Math.hypot(nx[0]!, nx[1]!, nx[2]!)
    if (nr <= EARTH_RADIUS_KM) return t + dt * (r - EARTH_RADIUS_KM) / (r - nr)
    x = nx; t += dt
  }
}

describe('arrival times of the samples (bodies that cross the b-plane together)', () => {
  it('tends to the straight-line -sqrt(R⊕² - b²)/v∞ when gravity is negligible (v∞ = 2000 km/s)', () => {
    const v = 2000, R = EARTH_RADIUS_KM
    for (const b of [1000, 3000, 6000]) {
      const straight = -(Math.sqrt(R * R - b * b) - R) / v
      expect(arrivalTimeS(b, v) - arrivalTimeS(0, v)).toBeCloseTo(straight, 3)
    }
  })

  it('agrees with a numerical two-body integration of two bodies started abreast far upstream (within 0.2 s)', () => {
    for (const v of [6, 20]) {
      const bc = captureRadiusKm(v), D = 4e8
      const [b1, b2] = [0.1 * bc, 0.9 * bc]
      const integrated = integratedArrivalS(v, b2, D) - integratedArrivalS(v, b1, D)
      const analytic = arrivalTimeS(b2, v) - arrivalTimeS(b1, v)
      expect(Math.abs(analytic)).toBeGreaterThan(60)
      expect(Math.abs(integrated - analytic)).toBeLessThan(0.2) // the finite start distance costs ~ b²/(2D v∞)
    }
  })

  it('places each corridor node where entryFromBPlane puts that b-plane point at its own arrival time', () => {
    const input = { vInfKmS: 9, radiant: { raDeg: 250, decDeg: 15 }, timeUtc: T0 }
    const f = encounterFrame(input), bc = captureRadiusKm(9)
    const nominal = { xiKm: 0.3 * bc, zetaKm: -0.2 * bc }
    const tauNom = arrivalTimeS(Math.hypot(nominal.xiKm, nominal.zetaKm), 9)
    const psi = 0.7, t = lineTrack(f, nominal, psi, -0.5 * bc, 0.5 * bc, 31, tauNom)
    const ax = bPlaneAxes(input.radiant)
    expect(ax.xi[2]).toBe(0)
    for (let j = 0; j < t.n; j += 5) {
      const xi = nominal.xiKm + t.s[j]! * Math.cos(psi), zeta = nominal.zetaKm + t.s[j]! * Math.sin(psi)
      const dt = arrivalTimeS(Math.hypot(xi, zeta), 9) - tauNom
      const e = entryFromBPlane({ ...input, timeUtc: Date.parse(T0) + dt * 1000, xiKm: xi, zetaKm: zeta })
      const [lon, lat] = groundLonLat(t.u[3 * j]!, t.u[3 * j + 1]!, t.u[3 * j + 2]!, 0)
      expect(lat).toBeCloseTo(e.lat!, 6)
      expect(lon).toBeCloseTo(e.lon!, 6)
    }
  })
})
