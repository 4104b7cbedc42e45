/** Number formatting for hazard figures in inject text: plain, readable, two significant figures. */

const SUPERSCRIPT: Record<string, string> = {
  '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹',
}

function group(integer: string): string {
  return integer.replace(/\B(?=(\d{3})+(?!\d))/g, ',')
}

/** A plain decimal with thousands separators: 1234.5 → "1,234.5". */
function plain(x: number): string {
  const [int = '0', frac] = String(Math.abs(x)).split('.')
  return (x < 0 ? '-' : '') + group(int) + (frac ? `.${frac}` : '')
}

/**
 * A figure to `digits` significant figures: 2.134 → "2.1", 1234 → "1,200", 0.8 → "0.8";
 * below 0.001 or from a million up in scientific form: 8.2e9 → "8.2 × 10⁹".
 */
export function formatSignificant(x: number, digits = 2): string {
  if (!Number.isFinite(x)) return 'n/a'
  if (x === 0) return '0'
  const abs = Math.abs(x)
  if (abs >= 1e6 || abs < 1e-3) {
    const [mantissa = '0', exponent = '0'] = x.toExponential(digits - 1).split('e')
    const sup = String(Number(exponent)).split('').map(c => SUPERSCRIPT[c] ?? c).join('')
    return `${String(Number(mantissa))} × 10${sup}`
  }
  return plain(Number(x.toPrecision(digits)))
}

/** A fixed number of decimals, for logarithmic figures (magnitudes, Palermo). */
export function formatFixed(x: number, decimals: number): string {
  return Number.isFinite(x) ? x.toFixed(decimals) : 'n/a'
}

/**
 * A probability (0..1) as a percentage: 0.0213 → "2.1 %", 0.997 → "99.7 %",
 * tiny values as "< 0.01 %", and exactly 0 and 1 as "0 %" and "100 %".
 */
export function formatPercent(p: number): string {
  if (!Number.isFinite(p)) return 'n/a'
  if (p <= 0) return '0 %'
  if (p >= 1) return '100 %'
  const pct = p * 100
  if (pct < 0.01) return '< 0.01 %'
  // Near certainty, round the complement so that 99.7 % does not show as 100 %.
  if (pct > 99) {
    const rest = 100 - pct
    if (rest < 0.01) return '> 99.99 %'
    return `${String(Number((100 - Number(rest.toPrecision(1))).toFixed(2)))} %`
  }
  return `${formatSignificant(pct, 2)} %`
}

/** A probability as odds: 0.0021 → "1 in 480"; 1 → "certain"; 0 → "none". */
export function formatOdds(p: number): string {
  if (!Number.isFinite(p)) return 'n/a'
  if (p <= 0) return 'none'
  if (p >= 1) return 'certain'
  return `1 in ${formatSignificant(1 / p, 2)}`
}

/** A head count: exact with separators, or rounded to two significant figures when `estimate`. */
export function formatCount(n: number, estimate: boolean): string {
  if (!Number.isFinite(n)) return 'n/a'
  if (n > 0 && n < 1) return '< 1'
  const rounded = Math.round(n)
  return plain(estimate && rounded >= 100 ? Number(rounded.toPrecision(2)) : rounded)
}
