import { describe, it, expect } from 'vitest'
import {
  captureRadiusKm, entrySpeedKmS, entryFromBPlane, greenwichSiderealDeg, julianDateUtc, solutionFromEncounter, bPlaneAxes,
  EARTH_RADIUS_KM, ESCAPE_SPEED_KMS, MU_EARTH_KM3S2, DEG,
} from '../../../shared/encounter/index'
import { entrySpeedFromVInfKmS, HazardRng } from '../../../shared/hazard/index'

const T0 = '2031-05-04T12:00:00Z'

describe('constants and the two-body laws', () => {
  it('escape speed at the surface is 11.186 km/s (issue value; sqrt(2 GM⊕/R⊕), IERS 2010 GM⊕)', () => {
    expect(ESCAPE_SPEED_KMS).toBeCloseTo(11.186, 3)
  })

  it('capture radius R⊕ sqrt(1 + v_esc²/v∞²) (Öpik 1951; Valsecchi et al. 2003): √2 R⊕ at v∞ = v_esc, → R⊕ when fast', () => {
    expect(captureRadiusKm(ESCAPE_SPEED_KMS)).toBeCloseTo(Math.SQRT2 * 6371, 6)
    expect(captureRadiusKm(20)).toBeCloseTo(6371 * Math.sqrt(1 + 11.186 ** 2 / 400), 0)
    expect(captureRadiusKm(1e6)).toBeCloseTo(6371, 3)
    // Gravitational focusing factor (b⊕/R⊕)² = 1 + v_esc²/v∞²: 2.0 at v∞ = v_esc, 1.3128 at 20 km/s.
    expect((captureRadiusKm(20) / 6371) ** 2).toBeCloseTo(1 + 11.186 ** 2 / 400, 3)
    // At an altitude the sphere is larger and the local escape speed smaller.
    expect(captureRadiusKm(20, 100)).toBeCloseTo(6471 * Math.sqrt(1 + 2 * MU_EARTH_KM3S2 / 6471 / 400), 6)
  })

  it('entry speed sqrt(v∞² + v_esc²) (energy conservation): 11.186 km/s from rest, 22.916 km/s at v∞ = 20, as the hazard engine', () => {
    expect(entrySpeedKmS(1e-9)).toBeCloseTo(11.186, 3)
    expect(entrySpeedKmS(20)).toBeCloseTo(22.916, 3)
    for (const v of [1, 5, 12, 30, 70]) expect(Math.abs(entrySpeedKmS(v) - entrySpeedFromVInfKmS(v))).toBeLessThan(0.01)
    const e = entryFromBPlane({ vInfKmS: 20, radiant: { raDeg: 10, decDeg: 10 }, xiKm: 1000, zetaKm: 2000, timeUtc: T0 })
    expect(e.entrySpeedKmS).toBeCloseTo(22.916, 3)
  })
})

describe('Greenwich mean sidereal time (Meeus 1998, Astronomical Algorithms, ch. 12)', () => {
  it('reproduces example 12.a: 1987 April 10, 0h UT → 13h10m46.3668s = 197.693195°', () => {
    expect(julianDateUtc('1987-04-10T00:00:00Z')).toBe(2446895.5)
    expect(greenwichSiderealDeg('1987-04-10T00:00:00Z')).toBeCloseTo(197.693195, 5)
  })

  it('reproduces example 12.b: 1987 April 10, 19h21m00s UT → 8h34m57.0896s = 128.7378734°', () => {
    expect(greenwichSiderealDeg('1987-04-10T19:21:00Z')).toBeCloseTo(128.7378734, 5)
  })

  it('returns after one sidereal day, 86 164.0905 s (Astronomical Almanac; from memory)', () => {
    const t = Date.parse(T0)
    const d = greenwichSiderealDeg(t + 86_164_090.5) - greenwichSiderealDeg(t)
    expect(Math.abs(((d + 540) % 360) - 180)).toBeLessThan(1e-4)
  })
})

describe('entry geometry', () => {
  it('a centred body enters vertically at latitude = declination, longitude = RA − GMST (issue law)', () => {
    const cases = [
      { raDeg: 200, decDeg: 30, t: '1987-04-10T19:21:00Z' }, // GMST 128.7378734° (Meeus ex. 12.b)
      { raDeg: 15, decDeg: -62, t: '1987-04-10T00:00:00Z' }, // GMST 197.693195° (Meeus ex. 12.a)
    ]
    const expected = [[200 - 128.7378734, 30], [15 - 197.693195 + 360, -62]]
    cases.forEach((c, k) => {
      const e = entryFromBPlane({ vInfKmS: 17, radiant: c, xiKm: 0, zetaKm: 0, timeUtc: c.t })
      expect(e.hit).toBe(true)
      expect(e.entryAngleDeg).toBeCloseTo(90, 9)
      expect(e.lon!).toBeCloseTo(expected[k]![0]!, 5)
      expect(e.lat!).toBeCloseTo(expected[k]![1]!, 9)
      expect(e.periapsisKm).toBe(0)
    })
  })

  it('ζ points to celestial north and ξ to increasing right ascension (project convention, README)', () => {
    const r = { raDeg: 80, decDeg: 0 }, t = '1987-04-10T00:00:00Z'
    const c = entryFromBPlane({ vInfKmS: 20, radiant: r, xiKm: 0, zetaKm: 0, timeUtc: t })
    const n = entryFromBPlane({ vInfKmS: 20, radiant: r, xiKm: 0, zetaKm: 3000, timeUtc: t })
    const e = entryFromBPlane({ vInfKmS: 20, radiant: r, xiKm: 3000, zetaKm: 0, timeUtc: t })
    expect(n.lat!).toBeGreaterThan(10)
    expect(n.lon!).toBeCloseTo(c.lon!, 9)
    expect(e.lon! - c.lon!).toBeGreaterThan(10)
    expect(e.lat!).toBeCloseTo(0, 9)
    const ax = bPlaneAxes(r)
    const cross = [ax.xi[1]! * ax.zeta[2]! - ax.xi[2]! * ax.zeta[1]!, ax.xi[2]! * ax.zeta[0]! - ax.xi[0]! * ax.zeta[2]!,
      ax.xi[0]! * ax.zeta[1]! - ax.xi[1]! * ax.zeta[0]!]
    // (ξ̂, η̂, ζ̂) right-handed with η̂ = -R̂ (the motion) means ζ̂ × ξ̂ = η̂, i.e. ξ̂ × ζ̂ = R̂.
    cross.forEach((v, k) => expect(v).toBeCloseTo(ax.radiant[k]!, 12))
  })

  it('travels on, away from the sub-radiant point: azimuth 90° for ξ > 0 and 0° for ζ > 0 at an equatorial radiant', () => {
    const r = { raDeg: 80, decDeg: 0 }
    const east = entryFromBPlane({ vInfKmS: 20, radiant: r, xiKm: 3000, zetaKm: 0, timeUtc: T0 })
    const north = entryFromBPlane({ vInfKmS: 20, radiant: r, xiKm: 0, zetaKm: 3000, timeUtc: T0 })
    expect(east.azimuthDeg!).toBeCloseTo(90, 9)
    expect(Math.min(north.azimuthDeg!, 360 - north.azimuthDeg!)).toBeCloseTo(0, 9)
    expect(entryFromBPlane({ vInfKmS: 20, radiant: r, xiKm: 0, zetaKm: 0, timeUtc: T0 }).azimuthDeg).toBeNull()
  })

  it('grazes (entry angle → 0) at the capture radius and misses just beyond it', () => {
    const v = 12, b = captureRadiusKm(v)
    const g = entryFromBPlane({ vInfKmS: v, radiant: { raDeg: 0, decDeg: 0 }, xiKm: b * (1 - 1e-12), zetaKm: 0, timeUtc: T0 })
    expect(g.hit).toBe(true)
    expect(g.entryAngleDeg!).toBeLessThan(0.01)
    expect(g.periapsisKm).toBeCloseTo(EARTH_RADIUS_KM, 3)
    const m = entryFromBPlane({ vInfKmS: v, radiant: { raDeg: 0, decDeg: 0 }, xiKm: b * (1 + 1e-9), zetaKm: 0, timeUtc: T0 })
    expect(m.hit).toBe(false)
    expect(m.lon).toBeNull()
    expect(m.periapsisKm).toBeGreaterThan(EARTH_RADIUS_KM)
  })

  it('agrees with a numerical integration of the two-body equations (RK4) to 0.5 km and 0.005°', () => {
    for (const [v, b, ra, dec] of [[20, 4000, 30, 10], [8, 9000, 250, -40], [40, 6000, 100, 70]] as const) {
      const radiant = { raDeg: ra, decDeg: dec }, ax = bPlaneAxes(radiant)
      const xi = b * 0.6, zeta = b * 0.8
      const D = 4e8
      let x = [0, 1, 2].map(k => D * ax.radiant[k]! + xi * ax.xi[k]! + zeta * ax.zeta[k]!)
      const v0 = Math.sqrt(v * v + 2 * MU_EARTH_KM3S2 / Math.hypot(x[0]!, x[1]!, x[2]!))
      let u = ax.radiant.map(c => -v0 * c)
      const acc = (p: number[]) => {
        const r = Math.hypot(p[0]!, p[1]!, p[2]!)
        return p.map(c => -MU_EARTH_KM3S2 * c / (r * r * r))
      }
      const R = EARTH_RADIUS_KM
      for (let k = 0; k < 400_000; k++) {
        const r = Math.hypot(x[0]!, x[1]!, x[2]!)
        const dt = Math.min(1e-3 * r / Math.hypot(u[0]!, u[1]!, u[2]!), 2000)
        const add = (a: number[], b: number[], h: number) => a.map((c, i) => c + h * b[i]!)
        const k1v = acc(x), k1x = u
        const k2v = acc(add(x, k1x, dt / 2)), k2x = add(u, k1v, dt / 2)
        const k3v = acc(add(x, k2x, dt / 2)), k3x = add(u, k2v, dt / 2)
        const k4v = acc(add(x, k3x, dt)), k4x = add(u, k3v, dt)
        const nx = x.map((c, i) => c + dt / 6 * (k1x[i]! + 2 * k2x[i]! + 2 * k3x[i]! + k4x[i]!))
        const nu = u.map((c, i) => c + dt / 6 * (k1v[i]! + 2 * k2v[i]! + 2 * k3v[i]! + k4v[i]!))
        const nr = Math.hypot(nx[0]!, nx[1]!, nx[2]!)
        if (nr <= R) {
          const w = (r - R) / (r - nr)
          x = x.map((c, i) => c + w * (nx[i]! - c))
          u = u.map((c, i) => c + w * (nu[i]! - c))
          break
        }
        x = nx; u = nu
      }
      const r = Math.hypot(x[0]!, x[1]!, x[2]!)
      expect(Math.abs(r - R)).toBeLessThan(0.01) // linear interpolation of the last step
      const speed = Math.hypot(u[0]!, u[1]!, u[2]!)
      const angle = Math.asin(-(x[0]! * u[0]! + x[1]! * u[1]! + x[2]! * u[2]!) / (r * speed)) / DEG
      // The entry at GMST 0: J2000.0 has GMST 280.46°, so use a time where the inertial longitude is simple to compare.
      const e = entryFromBPlane({ vInfKmS: v, radiant, xiKm: xi, zetaKm: zeta, timeUtc: T0 })
      const gmst = greenwichSiderealDeg(T0) * DEG
      const lam = e.lon! * DEG + gmst, la = e.lat! * DEG
      const p = [Math.cos(la) * Math.cos(lam), Math.cos(la) * Math.sin(lam), Math.sin(la)]
      const missKm = Math.hypot(p[0]! * R - x[0]!, p[1]! * R - x[1]!, p[2]! * R - x[2]!)
      expect(missKm).toBeLessThan(0.5) // the start at finite distance D costs ~ (GM⊕/v∞²)/D of the path
      expect(Math.abs(angle - e.entryAngleDeg!)).toBeLessThan(0.005)
      expect(Math.abs(speed - e.entrySpeedKmS!)).toBeLessThan(1e-3)
    }
  })
})

describe('statistical laws', () => {
  it('a b-plane uniformly filled inside the capture disk gives dP = sin 2θ dθ (Shoemaker 1962): P(θ < 30°) = 0.25, median 45°', () => {
    const rng = new HazardRng(11), n = 40_000, v = 17, bc = captureRadiusKm(v)
    const angles: number[] = []
    for (let k = 0; k < n; k++) {
      const b = bc * Math.sqrt(rng.uniform()), a = 2 * Math.PI * rng.uniform()
      const xiKm = b * Math.cos(a), zetaKm = b * Math.sin(a)
      const e = entryFromBPlane({ vInfKmS: v, radiant: { raDeg: 33, decDeg: 12 }, xiKm, zetaKm, timeUtc: T0 })
      if (e.hit) angles.push(e.entryAngleDeg!)
    }
    expect(angles.length).toBeGreaterThan(n * 0.999)
    angles.sort((x, y) => x - y)
    const cdf = (deg: number) => angles.filter(x => x < deg).length / angles.length
    expect(cdf(30)).toBeCloseTo(0.25, 2) // within 0.005: 2.3 standard errors at n = 40 000
    expect(angles[Math.floor(angles.length / 2)]!).toBeGreaterThan(44.5)
    expect(angles[Math.floor(angles.length / 2)]!).toBeLessThan(45.5)
    // Whole CDF sin²θ (Kolmogorov–Smirnov distance; 1.63/sqrt(n) is the 1 % critical value).
    let ks = 0
    angles.forEach((x, i) => { ks = Math.max(ks, Math.abs((i + 1) / angles.length - Math.sin(x * DEG) ** 2)) })
    expect(ks).toBeLessThan(1.63 / Math.sqrt(angles.length))
  })

  it('a circular Gaussian b-plane of σ centred on the Earth hits with probability 1 − exp(−b⊕²/2σ²) (Rayleigh law of |b|)', () => {
    const v = 14, bc = captureRadiusKm(v)
    for (const ratio of [0.5, 1, 2, 5]) {
      const sigma = ratio * bc, n = 100_000
      const s = solutionFromEncounter({
        vInfKmS: v, radiant: { raDeg: 300, decDeg: -5 }, timeUtc: T0, nominal: { xiKm: 0, zetaKm: 0 },
        sigmaAlongKm: sigma, sigmaAcrossKm: sigma, lineAngleDeg: 37,
      }, { samples: n, seed: 5 })
      const P = 1 - Math.exp(-(bc * bc) / (2 * sigma * sigma))
      const se = Math.sqrt(P * (1 - P) / n)
      expect(Math.abs(s.impactProbability - P)).toBeLessThan(4 * se + 1e-9)
    }
  })
})
