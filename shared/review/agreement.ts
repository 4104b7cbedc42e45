/**
 * Agreement between two evaluators who rated the same critical tasks.
 *
 * Cohen's kappa: κ = (p_o − p_e) / (1 − p_e), with p_o the observed share of agreement and p_e
 * the agreement expected by chance from each rater's marginal shares.
 * Source: J. Cohen (1960), "A coefficient of agreement for nominal scales", Educational and
 * Psychological Measurement 20(1): 37–46. Standard error under the null as in Fleiss, Cohen &
 * Everitt (1969), Psychological Bulletin 72(5): 323–327 is not used here.
 * Reading of κ in words after Landis & Koch (1977), Biometrics 33(1): 159–174.
 */

export interface KappaResult {
  /** Number of items both raters rated. */
  n: number
  /** Observed agreement, share 0..1. */
  observed: number
  /** Agreement expected by chance, share 0..1. */
  expected: number
  /** Cohen's kappa; null when undefined (no items, or chance agreement is 1). */
  kappa: number | null
  /** Landis & Koch (1977) wording of kappa. */
  strength: string | null
}

/** Cohen's kappa from a square contingency table (rows: rater A's category, columns: rater B's). */
export function kappaFromTable(table: number[][]): KappaResult {
  const k = table.length
  let n = 0
  let agree = 0
  const rows = new Array<number>(k).fill(0)
  const cols = new Array<number>(k).fill(0)
  for (let i = 0; i < k; i++) {
    if (table[i]!.length !== k) throw new Error('kappa needs a square table')
    for (let j = 0; j < k; j++) {
      const v = table[i]![j]!
      if (!(v >= 0)) throw new Error('kappa needs non-negative counts')
      n += v
      rows[i]! += v
      cols[j]! += v
      if (i === j) agree += v
    }
  }
  if (n === 0) return { n, observed: 0, expected: 0, kappa: null, strength: null }
  const observed = agree / n
  const expected = rows.reduce((s, r, i) => s + (r / n) * (cols[i]! / n), 0)
  const kappa = expected >= 1 ? null : (observed - expected) / (1 - expected)
  return { n, observed, expected, kappa, strength: kappa === null ? null : landisKoch(kappa) }
}

/** Cohen's kappa for paired ratings over a fixed set of categories. */
export function cohenKappa<T extends string>(pairs: Array<[T, T]>, categories: readonly T[]): KappaResult {
  const index = new Map(categories.map((c, i) => [c, i]))
  const table = categories.map(() => categories.map(() => 0))
  for (const [a, b] of pairs) {
    const i = index.get(a)
    const j = index.get(b)
    if (i === undefined || j === undefined) throw new Error(`unknown category in pair ${a}/${b}`)
    table[i]![j]! += 1
  }
  return kappaFromTable(table)
}

/** Landis & Koch (1977) benchmarks. */
export function landisKoch(kappa: number): string {
  if (kappa < 0) return 'poor'
  if (kappa <= 0.2) return 'slight'
  if (kappa <= 0.4) return 'fair'
  if (kappa <= 0.6) return 'moderate'
  if (kappa <= 0.8) return 'substantial'
  return 'almost perfect'
}
