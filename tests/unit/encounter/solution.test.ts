import { describe, it, expect } from 'vitest'
import {
  solutionFromEncounter, findBPlanePoint, lineOfVariationsTrack, arrivalTimeS, entryFromBPlane, captureRadiusKm,
  EARTH_RADIUS_KM, MU_EARTH_KM3S2, DEG,
  type EncounterInput,
} from '../../../shared/encounter/index'
import { orbitSolutionSchema, assessSolution } from '../../../shared/hazard/index'

const base: EncounterInput = {
  vInfKmS: 15, radiant: { raDeg: 120, decDeg: -20 }, timeUtc: '2031-05-04T12:00:00Z',
  nominal: { xiKm: 2000, zetaKm: 1000 }, sigmaAlongKm: 3000, sigmaAcrossKm: 40, lineAngleDeg: 30,
}
const unit = (lon: number, lat: number) =>
  [Math.cos(lat * DEG) * Math.cos(lon * DEG), Math.cos(lat * DEG) * Math.sin(lon * DEG), Math.sin(lat * DEG)]
const groundKm = (a: readonly number[], b: readonly number[]) => {
  const u = unit(a[0]!, a[1]!), v = unit(b[0]!, b[1]!)
  return 2 * EARTH_RADIUS_KM * Math.asin(Math.min(1, Math.hypot(u[0]! - v[0]!, u[1]! - v[1]!, u[2]! - v[2]!) / 2))
}

describe('solutionFromEncounter', () => {
  it('gives the encounter part of an orbit solution that the hazard schema accepts and the hazard engine assesses', () => {
    const s = solutionFromEncounter(base, { samples: 20_000, seed: 3 })
    expect(s.corridor).not.toBeNull()
    const full = orbitSolutionSchema.parse({
      epoch: '2031-05-01T00:00:00Z', impactTime: s.impactTime, impactProbability: s.impactProbability,
      magnitude: { H: 24, sigma: 0.3 }, entrySpeedKmS: s.entrySpeedKmS, entryAngleDeg: s.entryAngleDeg,
      corridor: s.corridor, waterDepthM: 0,
    })
    expect(full.corridor.path.length).toBeGreaterThanOrEqual(2)
    expect(full.corridor.path.length).toBeLessThanOrEqual(2000)
    const a = assessSolution(full, [], { samples: 2000, seed: 1 })
    expect(a.energyMt.p50).toBeGreaterThan(0)
    expect(s.impactTime).toBe('2031-05-04T12:00:00.000Z')
    expect(s.encounter.nominalEntry.hit).toBe(true)
    expect(s.corridor!.nominal).toEqual([s.encounter.nominalEntry.lon, s.encounter.nominalEntry.lat])
    expect(s.warnings).toEqual([])
  })

  it('is deterministic for a seed and changes with it (the project\'s seeded xoroshiro128+)', () => {
    const a = solutionFromEncounter(base, { samples: 5000, seed: 9 })
    expect(solutionFromEncounter(base, { samples: 5000, seed: 9 })).toEqual(a)
    expect(solutionFromEncounter(base, { samples: 5000, seed: 10 }).impactProbability).not.toBe(a.impactProbability)
  })

  it('spreads the corridor by the local ground scale of the b-plane: vertical entry, ground σ = r σ_b (sqrt(1 + 2A/r) − 1)/A', () => {
    // Linearising the turn angle φ(b) at b = 0 (bplane.ts): dφ/db = (sqrt(1 + 2A/r) - 1)/A, A = GM⊕/v∞².
    const sigma = 20, v = 15, A = MU_EARTH_KM3S2 / v / v, r = EARTH_RADIUS_KM
    const scale = r * (Math.sqrt(1 + 2 * A / r) - 1) / A
    const s = solutionFromEncounter({ ...base, vInfKmS: v, nominal: { xiKm: 0, zetaKm: 0 }, sigmaAlongKm: sigma, sigmaAcrossKm: sigma / 4 },
      { samples: 40_000, seed: 4 })
    expect(s.impactProbability).toBe(1)
    expect(s.corridor!.alongTrackSigmaKm / (scale * sigma)).toBeCloseTo(1, 1)
    expect(Math.abs(s.corridor!.alongTrackSigmaKm / (scale * sigma) - 1)).toBeLessThan(0.03)
    // Uniform ± half-width with the same variance as a Gaussian of σ: half-width = sqrt(3) σ.
    expect(Math.abs(s.corridor!.halfWidthKm / (Math.sqrt(3) * scale * sigma / 4) - 1)).toBeLessThan(0.03)
    // Mean entry angle of a small cloud at the centre: close to vertical.
    expect(s.entryAngleDeg.mean).toBeGreaterThan(88)
  })

  it('puts the corridor path through the hits: every hit within the half-width band scale of the path, nominal on it', () => {
    const s = solutionFromEncounter(base, { samples: 4000, seed: 2 })
    const c = s.corridor!
    const nearest = (p: readonly number[]) => Math.min(...c.path.map(q => groundKm(p, q)))
    expect(nearest(c.nominal)).toBeLessThan(2 * c.halfWidthKm + 10)
    expect(c.alongTrackSigmaKm).toBeGreaterThan(100)
    expect(c.halfWidthKm).toBeGreaterThan(0)
    expect(c.halfWidthKm).toBeLessThan(c.alongTrackSigmaKm)
  })

  it('the editor\'s "true impact point": a b-plane point found for a target makes the nominal corridor point land on it', () => {
    const target = [-9.3, 38.6] as const
    const p = findBPlanePoint({ vInfKmS: 18, radiant: { raDeg: 300, decDeg: 35 }, timeUtc: '2034-09-14T03:12:00Z', target })
    expect(p).not.toBeNull()
    const s = solutionFromEncounter({
      vInfKmS: 18, radiant: { raDeg: 300, decDeg: 35 }, timeUtc: '2034-09-14T03:12:00Z', nominal: p!,
      sigmaAlongKm: 500, sigmaAcrossKm: 5, lineAngleDeg: 70,
    }, { samples: 2000, seed: 1 })
    expect(groundKm(s.corridor!.nominal, target)).toBeLessThan(1)
  })

  it('warns of few hits and of none, and gives no corridor when nothing hits', () => {
    const bc = captureRadiusKm(15)
    const few = solutionFromEncounter({ ...base, nominal: { xiKm: bc + 3000, zetaKm: 0 }, sigmaAlongKm: 1200, sigmaAcrossKm: 1200 },
      { samples: 20_000, seed: 1 })
    expect(few.encounter.hits).toBeGreaterThan(0)
    expect(few.encounter.hits).toBeLessThan(100)
    expect(few.warnings.map(w => w.code)).toContain('few-hits')
    expect(few.corridor!.path.length).toBeGreaterThanOrEqual(2)
    const none = solutionFromEncounter({ ...base, nominal: { xiKm: 5 * bc, zetaKm: 0 }, sigmaAlongKm: 10, sigmaAcrossKm: 10 })
    expect(none.impactProbability).toBe(0)
    expect(none.corridor).toBeNull()
    expect(none.warnings.map(w => w.code)).toContain('no-hits')
  })

  it('warns of a low v∞ and a long approach, and clamps the entry speed to the schema\'s 11.2 km/s', () => {
    const slow = solutionFromEncounter({ ...base, vInfKmS: 0.4, nominal: { xiKm: 0, zetaKm: 0 } }, { samples: 2000 })
    const codes = slow.warnings.map(w => w.code)
    expect(codes).toContain('low-v-inf')
    expect(codes).toContain('long-approach')
    expect(codes).toContain('speed-clamped')
    expect(slow.entrySpeedKmS.mean).toBe(11.2)
    expect(slow.encounter.approachDays).toBeGreaterThan(7)
    for (const w of slow.warnings) expect(w.message.length).toBeGreaterThan(20)
    const medium = solutionFromEncounter({ ...base, vInfKmS: 1.5, nominal: { xiKm: 0, zetaKm: 0 } }, { samples: 500 })
    expect(medium.warnings.map(w => w.code)).toEqual(['long-approach'])
    // The 7-day threshold falls near v∞ = 2.1 km/s (constants.ts).
    expect(solutionFromEncounter({ ...base, vInfKmS: 2.0 }, { samples: 10 }).encounter.approachDays).toBeGreaterThan(7)
    expect(solutionFromEncounter({ ...base, vInfKmS: 2.2 }, { samples: 10 }).encounter.approachDays).toBeLessThan(7)
    const fast = solutionFromEncounter({ ...base, vInfKmS: 5 }, { samples: 500 })
    expect(fast.warnings).toEqual([])
  })

  it('keeps the nominal entry consistent with entryFromBPlane and the time given', () => {
    const s = solutionFromEncounter(base, { samples: 100 })
    expect(s.encounter.nominalEntry).toEqual(entryFromBPlane({ ...base, xiKm: 2000, zetaKm: 1000 }))
  })

  it('copes with a point cloud (no spread): a 2-km stub of track at the nominal point, zero widths', () => {
    const s = solutionFromEncounter({ ...base, sigmaAlongKm: 0, sigmaAcrossKm: 0 }, { samples: 200 })
    expect(s.impactProbability).toBe(1)
    expect(s.corridor!.alongTrackSigmaKm).toBeLessThan(1e-6)
    expect(s.corridor!.halfWidthKm).toBeLessThan(1e-6)
    expect(groundKm(s.corridor!.nominal, s.corridor!.path[120]!)).toBeLessThan(5)
    expect(s.entryAngleDeg.sigma).toBeLessThan(1e-6)
  })
})

describe('lineOfVariationsTrack', () => {
  it('runs from grazing end to grazing end through the nominal ground point, as one continuous track', () => {
    const track = lineOfVariationsTrack({ ...base, nominal: { xiKm: 1500, zetaKm: -700 } }, 400)!
    expect(track.length).toBe(400)
    const nominal = entryFromBPlane({ ...base, xiKm: 1500, zetaKm: -700 })
    const steps = track.slice(1).map((p, k) => groundKm(track[k]!, p))
    const total = steps.reduce((a, b) => a + b, 0)
    expect(Math.max(...steps)).toBeLessThan(0.05 * total)
    expect(Math.min(...track.map(p => groundKm(p, [nominal.lon!, nominal.lat!])))).toBeLessThan(total / 100)
    // The ends graze: the chord of the line with the capture disk, each end at its own arrival time.
    const bc = captureRadiusKm(15), psi = base.lineAngleDeg * DEG, o = { xiKm: 1500, zetaKm: -700 }
    const od = o.xiKm * Math.cos(psi) + o.zetaKm * Math.sin(psi)
    const half = Math.sqrt(od * od - (o.xiKm ** 2 + o.zetaKm ** 2) + bc * bc)
    const tauNom = arrivalTimeS(Math.hypot(o.xiKm, o.zetaKm), 15)
    for (const [s, end] of [[-od - half, track[0]!], [-od + half, track.at(-1)!]] as const) {
      const xi = (o.xiKm + s * Math.cos(psi)) * (1 - 1e-12), zeta = (o.zetaKm + s * Math.sin(psi)) * (1 - 1e-12)
      const dt = arrivalTimeS(Math.hypot(xi, zeta), 15) - tauNom
      const e = entryFromBPlane({ ...base, timeUtc: Date.parse(base.timeUtc as string) + 1000 * dt, xiKm: xi, zetaKm: zeta })
      expect(e.entryAngleDeg!).toBeLessThan(0.01)
      expect(groundKm(end, [e.lon!, e.lat!])).toBeLessThan(1)
    }
    expect(lineOfVariationsTrack({ ...base, nominal: { xiKm: 2 * bc, zetaKm: 0 }, lineAngleDeg: 90 })).toBeNull()
  })
})
