import type { Percentiles } from './types'

const QS = [0.05, 0.5, 0.95] as const
const BITS = 12
const BUCKETS = 1 << BITS
/** Index of the high 32-bit word of a double in a Uint32Array view (1 on little-endian machines). */
const HI = new Int32Array(new Float64Array([1]).buffer)[1] === 0x3ff00000 ? 1 : 0

/** Working memory of the radix selection, reused (the engine is single-threaded and synchronous). */
const hist = new Int32Array(BUCKETS)
const scratch: Float64Array[] = []
/** Below this many values a bucket is simply sorted. */
const SMALL = 256

/** Order-preserving signed 32-bit key of a double from the (signed) high word of its IEEE 754 pattern. */
function key(hw: number): number {
  return hw >= 0 ? hw : ~(hw & 0x7fffffff)
}

const one = new Float64Array(1)
const oneWords = new Int32Array(one.buffer)
function keyOf(v: number): number {
  one[0] = v
  return key(oneWords[HI]!)
}

function scratchAt(depth: number, size: number): Float64Array {
  let s = scratch[depth]
  if (!s || s.length < size) { s = new Float64Array(Math.max(size, 2 * (s?.length ?? 2048))); scratch[depth] = s }
  return s
}

/**
 * Values of x[0..n-1] at the given ascending ranks (0-based order statistics), written to vals[at..].
 * Radix selection: the order-preserving key of each double (its high 32 bits) is bucketed on the 12
 * most significant bits that vary in the data; only the buckets that hold wanted ranks are gathered,
 * then sorted when small or selected again in the same way. Exact: the same values as a full sort.
 */
function selectRanks(
  x: Float64Array, n: number, ranks: readonly number[], vals: number[], at: number, depth: number, lo = NaN, hi = NaN,
): void {
  const words = new Int32Array(x.buffer, x.byteOffset, 2 * n)
  let kMin = 0x7fffffff, kMax = -0x80000000
  if (lo === lo && hi === hi) {
    // Bounds known to the caller: their keys bound every key (the key is monotone), no pass needed.
    kMin = keyOf(lo)
    kMax = keyOf(hi)
  }
  else {
    for (let i = 0; i < n; i++) {
      const k = key(words[2 * i + HI]!)
      if (k < kMin) kMin = k
      if (k > kMax) kMax = k
    }
  }
  if (n <= SMALL || kMin === kMax) {
    const part = scratchAt(depth, n).subarray(0, n)
    part.set(x.subarray(0, n))
    let same = true
    for (let i = 1; i < n && same; i++) same = part[i] === part[0]
    if (!same) part.sort()
    for (let j = 0; j < ranks.length; j++) vals[at + j] = part[ranks[j]!]!
    return
  }
  const shift = Math.max(0, 32 - Math.clz32(kMax - kMin) - BITS)
  const nb = ((kMax - kMin) >>> shift) + 1
  const h = hist
  h.fill(0, 0, nb)
  for (let i = 0; i < n; i++) h[(key(words[2 * i + HI]!) - kMin) >>> shift]!++
  // Wanted buckets in order, each with its slot in scratch and the ranks it holds (local to it).
  const slotStart: number[] = [], slotSize: number[] = [], slotRanks: number[][] = []
  let cum = 0, r = 0, next = 0
  for (let b = 0; b < nb && r < ranks.length; b++) {
    const c = h[b]!
    if (c === 0) continue
    if (ranks[r]! < cum + c) {
      const local: number[] = []
      while (r < ranks.length && ranks[r]! < cum + c) local.push(ranks[r++]! - cum)
      slotStart.push(next)
      slotSize.push(c)
      slotRanks.push(local)
      h[b] = -1 - next
      next += c
    }
    cum += c
  }
  const sc = scratchAt(depth, next)
  // Gather: a negative count holds -1 - the bucket's next write position.
  for (let i = 0; i < n; i++) {
    const b = (key(words[2 * i + HI]!) - kMin) >>> shift
    const v = h[b]!
    if (v < 0) { sc[-1 - v] = x[i]!; h[b] = v - 1 }
  }
  let o = at
  for (let s = 0; s < slotStart.length; s++) {
    const part = sc.subarray(slotStart[s]!, slotStart[s]! + slotSize[s]!)
    const local = slotRanks[s]!
    if (part.length > SMALL) selectRanks(part, part.length, local, vals, o, depth + 1)
    else {
      part.sort()
      for (let j = 0; j < local.length; j++) vals[o + j] = part[local[j]!]!
    }
    o += local.length
  }
}

/**
 * Order statistics for the 5th, 50th and 95th percentiles of x[0..n-1], for linear interpolation
 * between order statistics ("type 7"; Hyndman & Fan 1996, Am. Stat. 50, 361–365), by exact radix
 * selection (see selectRanks). x is unchanged. `zeros` adds that many implicit zeros to the data
 * (then every value of x must be >= 0): callers store only the non-zero values of sparse columns.
 * `lo` and `hi`, when given, must bound x[0..n-1] (lo <= every value <= hi; tightest as its least and
 * greatest); they save a pass.
 * Writes [value at rank k, value at rank k+1, fraction] per percentile into out (9 numbers); NaN if n = 0.
 */
export function orderStats(x: Float64Array, n: number, out: Float64Array, zeros = 0, lo = NaN, hi = NaN): void {
  const N = n + zeros
  if (N === 0) { for (let q = 0; q < 3; q++) { out[3 * q] = NaN; out[3 * q + 1] = NaN; out[3 * q + 2] = 0 } return }
  const ranks: number[] = []
  for (const q of QS) { const k = Math.floor(q * (N - 1)); ranks.push(k, Math.min(N - 1, k + 1)) }
  // With `zeros` implicit zeros before x (all of x >= 0), the lowest ranks are 0.
  const vals: number[] = [0, 0, 0, 0, 0, 0]
  let j = 0
  while (j < 6 && ranks[j]! < zeros) j++
  if (j < 6) selectRanks(x, n, ranks.slice(j).map(r => r - zeros), vals, j, 0, lo, hi)
  for (let q = 0; q < 3; q++) {
    out[3 * q] = vals[2 * q]!
    out[3 * q + 1] = vals[2 * q + 1]!
    out[3 * q + 2] = QS[q]! * (N - 1) - ranks[2 * q]!
  }
}

/** Percentiles from order statistics, through a monotone non-decreasing map f (identity by default). */
export function toPercentiles(o: Float64Array, f: (v: number) => number = v => v): Percentiles {
  const at = (q: number) => {
    const a = f(o[3 * q]!), fr = o[3 * q + 2]!
    return fr === 0 ? a : a + fr * (f(o[3 * q + 1]!) - a)
  }
  return { p5: at(0), p50: at(1), p95: at(2) }
}

/** Percentiles 5/50/95 of the first n values of x, optionally scaled (x is unchanged). */
export function percentiles(x: Float64Array, n: number = x.length, scale = 1): Percentiles {
  const o = new Float64Array(9)
  orderStats(x, n, o)
  return toPercentiles(o, scale === 1 ? undefined : v => v * scale)
}
