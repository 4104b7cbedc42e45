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
 * Least share of an encounter's b-plane points that must hit for impacts to be drawn from it: 0.1 % (our choice). Below
 * it a solution's impact probability is a few in ten thousand and its hits a thin tail of the cloud: the scenario check
 * refuses `sampling: 'encounter'` there (from solutionFromEncounter's probability), and the engine refuses it when the
 * cloud's mass over the capture disk's bounding box alone is below it.
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
 * Complementary error function, fractional error below 1.2e-7 everywhere: the Chebyshev fit `erfcc` of Press et al.
 * (1992), Numerical Recipes in C, 2nd ed., sect. 6.2 (coefficients from memory; checked against table values in tests).
 */
export function erfc(x: number): number {
  const z = Math.abs(x), t = 1 / (1 + 0.5 * z)
  const r = t * Math.exp(-z * z - 1.26551223 + t * (1.00002368 + t * (0.37409196 + t * (0.09678418 + t * (-0.18628806
    + t * (0.27886807 + t * (-1.13520398 + t * (1.48851587 + t * (-0.82215223 + t * 0.17087277)))))))))
  return x >= 0 ? r : 2 - r
}

/** Standard normal mass between a and b (a <= b), computed on the tail side so that far tails keep their precision. */
export function normalMass(a: number, b: number): number {
  const k = Math.SQRT1_2
  if (a >= 0) return 0.5 * (erfc(a * k) - erfc(b * k))
  if (b <= 0) return 0.5 * (erfc(-b * k) - erfc(-a * k))
  return 1 - 0.5 * erfc(-a * k) - 0.5 * erfc(b * k)
}

/**
 * A standard normal variate truncated to [a, b] (a < b), by the mixed accept–reject algorithm of Robert (1995),
 * Statistics and Computing 5, 121–125 (from memory): normal proposals when the interval holds the mean and is wide,
 * uniform proposals with acceptance exp(-x²/2) (relative to the interval's peak) when it is narrow, and in a tail
 * exponential proposals of rate α = (a + sqrt(a² + 4))/2 with acceptance exp(-(x - α)²/2). Each branch accepts at
 * least about 40 % of its proposals; exact for any interval, however far in the tail.
 */
export function truncatedStandardNormal(rng: HazardRng, a: number, b: number): number {
  if (a <= 0 && b >= 0) {
    if (b - a >= 2.5) {
      for (;;) {
        const x = rng.normal()
        if (x >= a && x <= b) return x
      }
    }
    for (;;) {
      const x = a + (b - a) * rng.uniform()
      if (rng.uniform() <= Math.exp(-0.5 * x * x)) return x
    }
  }
  if (b < 0) return -truncatedStandardNormal(rng, -b, -a)
  const w = b - a
  if (w < 1 && w * a < 1) {
    for (;;) {
      const x = a + w * rng.uniform()
      if (rng.uniform() <= Math.exp(0.5 * (a * a - x * x))) return x
    }
  }
  const alpha = 0.5 * (a + Math.sqrt(a * a + 4))
  for (;;) {
    const x = a - Math.log(rng.uniform()) / alpha
    if (x > b) continue
    const d = x - alpha
    if (rng.uniform() <= Math.exp(-0.5 * d * d)) return x
  }
}

/**
 * A sampler of the hits of an encounter, for the hazard engine's Monte Carlo (`sampling: 'encounter'`). The b-plane
 * point is `nominal + s û + c v̂` (û along the line of variations, v̂ across it) with s ~ N(0, σ along) and
 * c ~ N(0, σ across), the Gaussian of solutionFromEncounter. Each call of `drawInto` returns one hit, drawn exactly from
 * that Gaussian conditional on hitting: s and c are drawn from their normals truncated to the capture disk's bounding
 * box in (s, c) (which holds every hit, so the truncation changes nothing once the disk is imposed), then a point
 * outside the disk (or exactly on its rim, entry angle 0) is drawn again. Its Earth-fixed ground point is taken at the
 * body's own arrival time, as in solutionFromEncounter. The entry speed is the same for every hit,
 * `sqrt(v∞² + 2 GM⊕ / r)` (energy conservation; Valsecchi et al. 2003, A&A 408, 1179–1196).
 * Refused with a RangeError: a cloud whose mass over the bounding box is below MIN_ENCOUNTER_HIT_SHARE, and a run that
 * would need more than `realisations / MIN_ENCOUNTER_HIT_SHARE` tries in all.
 */
export class EncounterSampler {
  /** Entry speed of every hit, km/s. */
  readonly speedKmS: number
  /** Capture radius, km. */
  readonly captureRadiusKm: number
  /** The cloud's mass over the disk's bounding box: an upper bound of the share of b-plane points that hit. */
  readonly boxMass: number
  /** Points tried (inside the box) and hits drawn so far: hits / tries × boxMass estimates the hit share. */
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
  /** Standardised box: s / σ along in [sa, sb], c / σ across in [ca, cb] (a zero sigma: the coordinate is 0). */
  private readonly sa: number
  private readonly sb: number
  private readonly ca: number
  private readonly cb: number

  constructor(encounter: DrawEncounter, realisations: number) {
    const e = encounter
    if (!(e.sigmaAlongKm >= 0) || !(e.sigmaAcrossKm >= 0)) throw new RangeError('sigmas must be >= 0')
    this.e = e
    this.f = encounterFrame(e)
    this.speedKmS = this.f.vEntryKmS
    const R = this.captureRadiusKm = this.f.bCapKm
    const cp = this.cp = Math.cos(e.lineAngleDeg * DEG)
    const sp = this.sp = Math.sin(e.lineAngleDeg * DEG)
    const bNom = Math.hypot(e.nominal.xiKm, e.nominal.zetaKm)
    this.tauNominal = arrivalTimeS(bNom, this.f.vInfKmS, this.f.rKm)
    this.maxTries = Math.ceil(Math.max(1, realisations) / MIN_ENCOUNTER_HIT_SHARE)
    // The nominal in (s, c): its offsets along and across the line; the disk spans s in -nu ± R and c in -nv ± R.
    const nu = e.nominal.xiKm * cp + e.nominal.zetaKm * sp, nv = -e.nominal.xiKm * sp + e.nominal.zetaKm * cp
    const box = (lo: number, hi: number, sigma: number): [number, number, number] => {
      if (sigma > 0) return [lo / sigma, hi / sigma, normalMass(lo / sigma, hi / sigma)]
      return [0, 0, lo <= 0 && hi >= 0 ? 1 : 0]
    }
    const [sa, sb, ms] = box(-nu - R, -nu + R, e.sigmaAlongKm)
    const [ca, cb, mc] = box(-nv - R, -nv + R, e.sigmaAcrossKm)
    this.sa = sa; this.sb = sb; this.ca = ca; this.cb = cb
    this.boxMass = ms * mc
    if (!(this.boxMass >= MIN_ENCOUNTER_HIT_SHARE)) throw this.tooFew()
  }

  private tooFew(): RangeError {
    return new RangeError(`Too few of the encounter's b-plane points hit the Earth (under ${MIN_ENCOUNTER_HIT_SHARE * 100} %) `
      + 'to draw impacts from the approach geometry: draw them from the risk corridor band.')
  }

  /**
   * Draws one hit from rng; writes the Earth-fixed unit vector of its ground point into out[o..o+2]; the angle and
   * b-plane point are in `hit`. @returns the entry angle, rad
   */
  drawInto(rng: HazardRng, out: Float64Array, o: number): number {
    const e = this.e, f = this.f, tmp = this.tmp, cp = this.cp, sp = this.sp
    const nx = e.nominal.xiKm, nz = e.nominal.zetaKm, sa = e.sigmaAlongKm, sc = e.sigmaAcrossKm
    for (;;) {
      if (++this.tries > this.maxTries) throw this.tooFew()
      const s = sa > 0 ? sa * truncatedStandardNormal(rng, this.sa, this.sb) : 0
      const c = sc > 0 ? sc * truncatedStandardNormal(rng, this.ca, this.cb) : 0
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
