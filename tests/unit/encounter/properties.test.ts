import { describe, it, expect } from 'vitest'
import fc from 'fast-check'
import {
  captureRadiusKm, entryFromBPlane, findBPlanePoint, turnAngleRad, greenwichSiderealDeg,
  EARTH_RADIUS_KM, ESCAPE_SPEED_KMS, MU_EARTH_KM3S2, DEG,
} from '../../../shared/encounter/index'

// Property tests over the domain of the issue: v∞ 0.3–72 km/s, any radiant, any time 1950–2150, entry altitude 0–200 km.
const RUNS = { numRuns: 300, seed: 20_261_205 }
const num = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true })
const encounter = fc.record({
  vInfKmS: num(0.3, 72),
  radiant: fc.record({ raDeg: num(0, 360), decDeg: num(-90, 90) }),
  timeUtc: num(Date.UTC(1950, 0, 1), Date.UTC(2150, 0, 1)),
  altitudeKm: fc.oneof(fc.constant(0), num(0, 200)),
})

/** Unit vector of a ground point, for distances that do not care about the antimeridian. */
const unit = (lon: number, lat: number) =>
  [Math.cos(lat * DEG) * Math.cos(lon * DEG), Math.cos(lat * DEG) * Math.sin(lon * DEG), Math.sin(lat * DEG)]
const groundKm = (a: readonly [number, number], b: readonly [number, number]) => {
  const u = unit(a[0], a[1]), v = unit(b[0], b[1])
  return 2 * EARTH_RADIUS_KM * Math.asin(Math.min(1, Math.hypot(u[0]! - v[0]!, u[1]! - v[1]!, u[2]! - v[2]!) / 2))
}

describe('b-plane entry: laws that hold for every encounter', () => {
  it('hits iff b <= capture radius, iff the periapsis q <= r, with b = q sqrt(1 + 2μ/(q v∞²)) (two-body hyperbola)', () => {
    fc.assert(fc.property(encounter, num(0, 2 * Math.PI), num(0, 3), (e, ang, rho) => {
      const bc = captureRadiusKm(e.vInfKmS, e.altitudeKm)
      fc.pre(Math.abs(rho - 1) > 1e-9)
      const b = rho * bc
      const r = entryFromBPlane({ ...e, xiKm: b * Math.cos(ang), zetaKm: b * Math.sin(ang) })
      expect(r.hit).toBe(rho <= 1)
      expect(r.periapsisKm <= EARTH_RADIUS_KM + e.altitudeKm).toBe(rho <= 1)
      const q = r.periapsisKm
      if (q > 1e-3) expect(q * Math.sqrt(1 + 2 * MU_EARTH_KM3S2 / (q * e.vInfKmS ** 2))).toBeCloseTo(b, 6 - Math.ceil(Math.log10(b + 1)))
      expect(r.lon === null).toBe(rho > 1)
    }), RUNS)
  })

  it('enters at sqrt(v∞² + v_esc² R⊕/r), at cos γ = b v∞ / (r v), a turn angle from the orbit equation (arccos form)', () => {
    fc.assert(fc.property(encounter, num(0, 2 * Math.PI), num(0, 1), (e, ang, rho) => {
      const r = EARTH_RADIUS_KM + e.altitudeKm, bc = captureRadiusKm(e.vInfKmS, e.altitudeKm)
      const b = Math.max(1, rho * bc * (1 - 1e-9))
      const out = entryFromBPlane({ ...e, xiKm: b * Math.cos(ang), zetaKm: b * Math.sin(ang) })
      const v = Math.sqrt(e.vInfKmS ** 2 + ESCAPE_SPEED_KMS ** 2 * EARTH_RADIUS_KM / r)
      expect(out.entrySpeedKmS!).toBeCloseTo(v, 9)
      expect(Math.cos(out.entryAngleDeg! * DEG)).toBeCloseTo(b * e.vInfKmS / (r * v), 9)
      // Angle between the sub-radiant ground point and the entry point = arccos((1 - p/r)/e) - arccos(1/e).
      const p = b * b * e.vInfKmS ** 2 / MU_EARTH_KM3S2, ecc = Math.sqrt(1 + (b * e.vInfKmS ** 2 / MU_EARTH_KM3S2) ** 2)
      const phi = Math.acos(Math.max(-1, Math.min(1, (1 - p / r) / ecc))) - Math.acos(1 / ecc)
      const centre = entryFromBPlane({ ...e, xiKm: 0, zetaKm: 0 })
      const d = groundKm([centre.lon!, centre.lat!], [out.lon!, out.lat!]) / EARTH_RADIUS_KM
      expect(Math.abs(d - phi)).toBeLessThan(2e-6)
    }), RUNS)
  })

  it('turns further the larger b is (φ(b) strictly increasing up to the capture radius)', () => {
    fc.assert(fc.property(encounter, (e) => {
      const r = EARTH_RADIUS_KM + e.altitudeKm, A = MU_EARTH_KM3S2 / e.vInfKmS ** 2, bc = captureRadiusKm(e.vInfKmS, e.altitudeKm)
      let last = -1
      for (let k = 0; k <= 400; k++) {
        const phi = turnAngleRad(bc * k / 400, A, r)
        expect(phi).toBeGreaterThan(last)
        last = phi
      }
      expect(last).toBeLessThan(Math.PI)
    }), { ...RUNS, numRuns: 100 })
  })

  it('maps a line of b-plane points to one continuous ground track (steps shrink with the sampling, no jumps)', () => {
    fc.assert(fc.property(encounter, num(-0.97, 0.97), num(0, Math.PI), (e, offset, psi) => {
      const bc = captureRadiusKm(e.vInfKmS, e.altitudeKm)
      // The chord at distance offset·b⊕ from the centre, direction psi, kept 1 % inside the disk.
      const half = 0.99 * bc * Math.sqrt(1 - offset * offset)
      const track = (n: number) => Array.from({ length: n + 1 }, (_, k) => {
        const s = -half + 2 * half * k / n
        const xi = -offset * bc * Math.sin(psi) + s * Math.cos(psi), zeta = offset * bc * Math.cos(psi) + s * Math.sin(psi)
        const r = entryFromBPlane({ ...e, xiKm: xi, zetaKm: zeta })
        expect(r.hit).toBe(true)
        return [r.lon!, r.lat!] as const
      })
      const maxStep = (t: ReturnType<typeof track>) => Math.max(...t.slice(1).map((p, k) => groundKm(t[k]!, p)))
      const length = (t: ReturnType<typeof track>) => t.slice(1).reduce((sum, p, k) => sum + groundKm(t[k]!, p), 0)
      const coarse = track(100), fine = track(200)
      // A jump would keep the largest step when the sampling is halved; a continuous track halves it.
      expect(maxStep(fine)).toBeLessThan(0.6 * maxStep(coarse) + 1e-6)
      // And the length of the polyline converges (a rectifiable, continuous curve).
      expect(Math.abs(length(fine) - length(coarse))).toBeLessThan(0.01 * length(fine) + 1e-6)
    }), { ...RUNS, numRuns: 100 })
  })
})

describe('findBPlanePoint: the b-plane point of a ground target', () => {
  it('round trip: the entry of the point found lands within 1 km of the target (targets drawn from the capture disk)', () => {
    fc.assert(fc.property(encounter, num(0, 2 * Math.PI), num(0, 0.999), (e, ang, rho) => {
      const b = rho * captureRadiusKm(e.vInfKmS, e.altitudeKm)
      const first = entryFromBPlane({ ...e, xiKm: b * Math.cos(ang), zetaKm: b * Math.sin(ang) })
      const target = [first.lon!, first.lat!] as const
      const found = findBPlanePoint({ ...e, target })
      expect(found).not.toBeNull()
      const again = entryFromBPlane({ ...e, ...found! })
      expect(again.hit).toBe(true)
      expect(groundKm(target, [again.lon!, again.lat!])).toBeLessThan(1)
    }), RUNS)
  })

  it('any ground target: null exactly when it lies beyond the largest turn angle, else lands within 1 km', () => {
    fc.assert(fc.property(encounter, num(-180, 180), num(-90, 90), (e, lon, lat) => {
      const found = findBPlanePoint({ ...e, target: [lon, lat] })
      const centre = entryFromBPlane({ ...e, xiKm: 0, zetaKm: 0 })
      const r = EARTH_RADIUS_KM + e.altitudeKm
      const phiMax = turnAngleRad(captureRadiusKm(e.vInfKmS, e.altitudeKm), MU_EARTH_KM3S2 / e.vInfKmS ** 2, r)
      const d = groundKm([centre.lon!, centre.lat!], [lon, lat]) / EARTH_RADIUS_KM
      fc.pre(Math.abs(d - phiMax) > 1e-9)
      expect(found === null).toBe(d > phiMax)
      if (found) {
        const hit = entryFromBPlane({ ...e, ...found })
        expect(groundKm([lon, lat], [hit.lon!, hit.lat!])).toBeLessThan(1)
      }
    }), RUNS)
  })

  it('Earth rotation: the same b-plane point lands 360.9856° of longitude further west per day (Meeus 1998, eq. 12.4)', () => {
    fc.assert(fc.property(encounter, num(-0.9, 0.9), num(-0.9, 0.9), num(0, 1), (e, x, z, dayFraction) => {
      const bc = captureRadiusKm(e.vInfKmS, e.altitudeKm)
      const a = entryFromBPlane({ ...e, xiKm: x * bc * 0.7, zetaKm: z * bc * 0.7 })
      const later = e.timeUtc + dayFraction * 86_400_000
      const b = entryFromBPlane({ ...e, timeUtc: later, xiKm: x * bc * 0.7, zetaKm: z * bc * 0.7 })
      const dGmst = greenwichSiderealDeg(later) - greenwichSiderealDeg(e.timeUtc)
      const wrap = (d: number) => ((d % 360) + 540) % 360 - 180
      expect(b.lat!).toBeCloseTo(a.lat!, 9)
      if (Math.abs(a.lat!) < 89.9) expect(Math.abs(wrap(b.lon! - a.lon! + dGmst))).toBeLessThan(1e-6)
      expect(Math.abs(wrap(dGmst - 360.98564736629 * dayFraction))).toBeLessThan(1e-6)
    }), RUNS)
  })
})
