import { xoroshiro128plusFromState } from 'pure-rand/generator/xoroshiro128plus'
import { uniformFloat64 } from 'pure-rand/distribution/uniformFloat64'
import type { RandomGenerator } from 'pure-rand/types/RandomGenerator'
import type { TaxonomicClass } from './schema'

/** next() is a signed 32-bit integer: times 2^-31 plus 2^-32 gives (-1, 1) without 0. */
const TWO_M31 = 2 ** -31
const TWO_M32 = 2 ** -32

/**
 * Seeded random numbers for the Monte Carlo: xoroshiro128+ from pure-rand, 53-bit uniforms (pure-rand
 * uniformFloat64) and, for the normal, 32-bit uniforms in the polar form of the Box–Muller transform
 * (Marsaglia & Bray 1964, SIAM Review 6, 260–264; tails reach about 6.6 sigma). Same seed, same
 * sequence on every machine; no Math.random. The whole seed counts: any safe integer (|seed| <= 2^53 - 1)
 * fills the 128-bit state, so seeds that differ only above bit 32 give different sequences.
 */
export class HazardRng {
  private readonly g: RandomGenerator
  private spare = NaN

  constructor(seed: number) {
    if (!Number.isSafeInteger(seed)) throw new RangeError('seed must be a safe integer (|seed| <= 2^53 - 1)')
    // Low 32 bits as pure-rand's xoroshiro128plus(seed) places them, the high bits in the other half of the
    // state (zero for 32-bit seeds, which keep their former sequences).
    const lo = seed | 0
    const hi = (seed - lo) / 2 ** 32 | 0
    this.g = xoroshiro128plusFromState([~hi, ~lo, lo, hi])
    // xoroshiro128+ seeded from a small integer needs a few rounds to mix (common practice, no source).
    for (let k = 0; k < 32; k++) this.g.next()
  }

  /** Uniform on (0, 1]. */
  uniform(): number {
    return 1 - uniformFloat64(this.g)
  }

  /** Standard normal: polar Box–Muller (Marsaglia & Bray 1964), one value kept for the next call. */
  normal(): number {
    const spare = this.spare
    if (spare === spare) {
      this.spare = NaN
      return spare
    }
    let u: number, v: number, s: number
    do {
      u = this.g.next() * TWO_M31 + TWO_M32
      v = this.g.next() * TWO_M31 + TWO_M32
      s = u * u + v * v
    } while (s >= 1)
    const f = Math.sqrt(-2 * Math.log(s) / s)
    this.spare = v * f
    return u * f
  }

  /** Normal(mean, sigma) truncated to [lo, hi] by rejection (clamped after 100 tries). */
  truncatedNormal(mean: number, sigma: number, lo: number, hi: number): number {
    if (!(sigma > 0)) return Math.min(hi, Math.max(lo, mean))
    for (let k = 0; k < 100; k++) {
      const x = mean + sigma * this.normal()
      if (x >= lo && x <= hi) return x
    }
    return Math.min(hi, Math.max(lo, mean))
  }
}

/** Albedo mixture of Wright et al. 2016 (AJ 152, 79): two Rayleigh laws, 25.3 % sigma 0.030, 74.7 % sigma 0.168. */
export const WRIGHT_2016 = { darkFraction: 0.253, darkSigma: 0.030, brightSigma: 0.168 } as const

/**
 * Geometric albedo from the two-Rayleigh mixture of Wright et al. 2016 (AJ 152, 79, eq. 1),
 * mean 0.1668. A Rayleigh(sigma) variate is `sigma sqrt(-2 ln U)`.
 * @returns albedo, dimensionless
 */
export function sampleAlbedoWright2016(rng: HazardRng): number {
  const sigma = rng.uniform() <= WRIGHT_2016.darkFraction ? WRIGHT_2016.darkSigma : WRIGHT_2016.brightSigma
  return sigma * Math.sqrt(-2 * Math.log(rng.uniform()))
}

/** Lowest albedo the Monte Carlo keeps; darker draws are raised to it (common practice, no source). */
export const MIN_ALBEDO = 0.02

/**
 * Albedo by class: median and the one-sigma log spread of single objects (not of the class mean). Medians
 * S 0.26, Q 0.29, V 0.42, C 0.13: Thomas et al. 2011 (AJ 142, 85), whose ± ranges are uncertainties of the
 * class means. Object-to-object spreads: the standard deviations of the NEOWISE albedos of spectrally
 * classified asteroids, Mainzer et al. 2011 (ApJ 741, 90, table of mean pV and sigma by class; values from
 * memory, about 0.08 on 0.23 for S and Q, 0.12 on 0.35 for V, 0.05 on 0.07–0.10 for C), as log spreads:
 * S and Q 0.35, V 0.33, C 0.55. M 0.15 with 0.4: Tholen M types have moderate albedos of about 0.1–0.3
 * (Tholen 1984, from memory) — indicative.
 */
export const CLASS_ALBEDO: Record<Exclude<TaxonomicClass, 'unknown'>, { median: number; sigmaLn: number }> = {
  S: { median: 0.26, sigmaLn: 0.35 },
  Q: { median: 0.29, sigmaLn: 0.35 },
  V: { median: 0.42, sigmaLn: 0.33 },
  C: { median: 0.13, sigmaLn: 0.55 },
  M: { median: 0.15, sigmaLn: 0.4 },
}

/**
 * Bulk density by class, mean and one-sigma in kg/m³: C 1300 ± 600, S 2700 ± 500, M 3500 ± 1000
 * (Carry 2012, Planet. Space Sci. 73, 98–118, averages by class). Q as S (Q types are fresh S-type
 * surfaces; common practice, no source). V 3000 ± 500: basaltic, denser than ordinary chondrite
 * (indicative, no source).
 */
export const CLASS_DENSITY: Record<Exclude<TaxonomicClass, 'unknown'>, { mean: number; sigma: number }> = {
  S: { mean: 2700, sigma: 500 },
  Q: { mean: 2700, sigma: 500 },
  V: { mean: 3000, sigma: 500 },
  C: { mean: 1300, sigma: 600 },
  M: { mean: 3500, sigma: 1000 },
}

/** Densities the Monte Carlo allows, kg/m³ (the schema's range). */
export const DENSITY_RANGE_KGM3 = [500, 8000] as const

/**
 * Entry angle from the sin 2θ law of isotropic flux, `theta = (90°/pi) arccos(2U - 1)`, redrawn below 5°.
 * Source: Shoemaker 1961 (Int. Geol. Congr. 21, 418–434), as sampled by Mathias et al. 2017 (Icarus 289, 106–119).
 * @returns angle from the horizontal, degrees
 */
export function sampleShoemakerAngleDeg(rng: HazardRng): number {
  for (;;) {
    const a = (90 / Math.PI) * Math.acos(2 * rng.uniform() - 1)
    if (a >= 5) return a
  }
}
