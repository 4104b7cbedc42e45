import type { HazardRng } from '../hazard/sampling'
import { DEG } from './constants'
import { arrivalTimeS, encounterFrame, entryUnitInto, type Radiant } from './bplane'
import { earthFixedInto } from './solution'
import type { TimeInput } from './sidereal'

/** The encounter of an orbit solution as the hazard engine's draw reads it (see EncounterInput in solution.ts). */
export interface DrawEncounter {
  vInfKmS: number
  radiant: Radiant
  timeUtc: TimeInput
  nominal: { xiKm: number; zetaKm: number }
  sigmaAlongKm: number
  sigmaAcrossKm: number
  lineAngleDeg: number
  altitudeKm?: number
}

/**
 * Least share of the b-plane draws that must hit for the hazard engine to draw impacts from an encounter: 0.1 %. Each
 * realisation is conditional on impact, so a miss is drawn again; below this share the draw would take more than a
 * thousand tries per impact (about 30 ms per 1 000 realisations). Our choice.
 */
export const MIN_ENCOUNTER_HIT_SHARE = 0.001

/** One hit of an encounter draw. */
export interface EncounterHit {
  /** Entry angle from the horizontal, rad, in (0, π/2]. */
  angleRad: number
  /** The b-plane point, km. */
  xiKm: number
  zetaKm: number
}

/**
 * A sampler of the hits of an encounter, for the hazard engine's Monte Carlo (`sampling: 'encounter'`): each call of
 * `drawInto` draws b-plane points from the Gaussian of the encounter (σ along the line of variations, σ across it,
 * centred on the nominal point: the draw of solutionFromEncounter) until one hits (b inside the capture disk, entry
 * angle above 0), and writes the Earth-fixed unit vector of its ground point. Each hit is placed on the Earth as it
 * has turned at its own arrival time, as in solutionFromEncounter. The entry speed is the same for every hit,
 * `sqrt(v∞² + 2 GM⊕ / r)` (energy conservation; Valsecchi et al. 2003, A&A 408, 1179–1196).
 * The whole run may try at most `realisations / MIN_ENCOUNTER_HIT_SHARE` points: beyond, it throws a RangeError.
 * Also when the nominal point lies so far from the disk that nothing can hit (more than 8.5 σ beyond it).
 */
export class EncounterSampler {
  /** Entry speed of every hit, km/s. */
  readonly speedKmS: number
  /** Capture radius, km. */
  readonly captureRadiusKm: number
  /** Points tried and hits drawn so far. */
  tries = 0
  hits = 0
  /** The last hit. */
  readonly hit: EncounterHit = { angleRad: 0, xiKm: 0, zetaKm: 0 }
  private readonly f: ReturnType<typeof encounterFrame>
  private readonly tmp = new Float64Array(5)
  private readonly tauNominal: number
  private readonly maxTries: number
  private readonly e: DrawEncounter
  private readonly cp: number
  private readonly sp: number

  constructor(encounter: DrawEncounter, realisations: number) {
    const e = encounter
    if (!(e.sigmaAlongKm >= 0) || !(e.sigmaAcrossKm >= 0)) throw new RangeError('sigmas must be >= 0')
    this.e = e
    this.f = encounterFrame(e)
    this.speedKmS = this.f.vEntryKmS
    this.captureRadiusKm = this.f.bCapKm
    this.cp = Math.cos(e.lineAngleDeg * DEG)
    this.sp = Math.sin(e.lineAngleDeg * DEG)
    const bNom = Math.hypot(e.nominal.xiKm, e.nominal.zetaKm)
    this.tauNominal = arrivalTimeS(bNom, this.f.vInfKmS, this.f.rKm)
    this.maxTries = Math.ceil(Math.max(1, realisations) / MIN_ENCOUNTER_HIT_SHARE)
    // 8.5 σ: the normal of HazardRng reaches about 6.6 σ (see sampling.ts), so no point beyond can hit.
    if (bNom - this.f.bCapKm > 8.5 * Math.max(e.sigmaAlongKm, e.sigmaAcrossKm)) throw this.tooFew()
  }

  private tooFew(): RangeError {
    return new RangeError(`Too few of the encounter's b-plane points hit the Earth (under ${MIN_ENCOUNTER_HIT_SHARE * 100} %) `
      + 'to draw impacts from the approach geometry: draw them from the risk corridor band.')
  }

  /**
   * Draws one hit: two normals per try (along, across) from rng; writes the Earth-fixed unit vector of its ground
   * point into out[o..o+2]; the angle and b-plane point are in `hit`. @returns the entry angle, rad
   */
  drawInto(rng: HazardRng, out: Float64Array, o: number): number {
    const e = this.e, f = this.f, tmp = this.tmp, cp = this.cp, sp = this.sp
    const nx = e.nominal.xiKm, nz = e.nominal.zetaKm, sa = e.sigmaAlongKm, sc = e.sigmaAcrossKm
    for (;;) {
      if (++this.tries > this.maxTries) throw this.tooFew()
      const s = sa * rng.normal(), c = sc * rng.normal()
      const xi = nx + s * cp - c * sp, zeta = nz + s * sp + c * cp
      // A hit; a grazing point exactly on the rim (angle 0) counts as a miss.
      if (!entryUnitInto(f, xi, zeta, tmp) || !(tmp[3]! > 0)) continue
      earthFixedInto(f, tmp, Math.hypot(xi, zeta), this.tauNominal, out, o)
      this.hits++
      const h = this.hit
      h.angleRad = tmp[3]!
      h.xiKm = xi
      h.zetaKm = zeta
      return h.angleRad
    }
  }
}
