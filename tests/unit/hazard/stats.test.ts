import { describe, it, expect } from 'vitest'
import { percentiles, orderStats, toPercentiles } from '../../../shared/hazard/stats'
import { HazardRng } from '../../../shared/hazard/sampling'

/** Reference: full sort and linear interpolation between order statistics (Hyndman & Fan 1996, type 7). */
function reference(x: Float64Array): number[] {
  const s = Float64Array.from(x).sort()
  return [0.05, 0.5, 0.95].map((q) => {
    const pos = q * (s.length - 1), k = Math.floor(pos)
    const a = s[k]!, b = s[Math.min(s.length - 1, k + 1)]!
    return a + (pos - k) * (b - a)
  })
}

describe('percentiles by radix selection', () => {
  it('equals a full sort on heavy tails, narrow spreads, signs, ties and zeros (Hyndman & Fan 1996, Am. Stat. 50, type 7)', () => {
    const rng = new HazardRng(9)
    const makers: Array<(k: number) => number> = [
      () => Math.exp(20 * rng.uniform() - 10),
      () => 200 + 60 * rng.normal(),
      k => (k % 3 === 0 ? 0 : rng.uniform()),
      () => 3.5,
      () => (rng.uniform() < 0.5 ? 39 : 39 * rng.uniform()),
      () => -1e3 * rng.uniform(),
    ]
    for (const n of [1, 2, 5, 257, 20_000]) {
      for (const make of makers) {
        const x = Float64Array.from({ length: n }, (_, k) => make(k))
        const p = percentiles(x, n)
        expect([p.p5, p.p50, p.p95]).toEqual(reference(x))
      }
    }
  })

  it('counts implicit zeros for sparse columns exactly as if they were stored', () => {
    const rng = new HazardRng(10)
    for (const [n, z] of [[100, 900], [5000, 15_000], [0, 10], [10, 0]] as const) {
      const x = Float64Array.from({ length: n }, () => 10 * rng.uniform())
      const full = new Float64Array(n + z)
      full.set(x)
      const o = new Float64Array(9)
      orderStats(x, n, o, z)
      const p = toPercentiles(o)
      expect([p.p5, p.p50, p.p95]).toEqual(reference(full))
    }
  })

  it('gives the same result when the caller passes the least and greatest values (the pass it saves)', () => {
    const rng = new HazardRng(11)
    const x = Float64Array.from({ length: 20_000 }, () => Math.exp(8 * rng.normal()))
    let lo = Infinity, hi = -Infinity
    for (const v of x) { lo = Math.min(lo, v); hi = Math.max(hi, v) }
    const a = new Float64Array(9), b = new Float64Array(9)
    orderStats(x, x.length, a)
    orderStats(x, x.length, b, 0, lo, hi)
    expect(b).toEqual(a)
    expect(toPercentiles(b).p50).toBe(reference(x)[1])
  })

  it('leaves its input unchanged', () => {
    const x = Float64Array.from({ length: 1000 }, (_, k) => (k * 7919) % 1000)
    const copy = x.slice()
    percentiles(x)
    expect(x).toEqual(copy)
  })
})
