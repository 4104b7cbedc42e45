/** Hazard figures as text for maps and briefs: always a range, always units. */
import type { Percentiles } from '../hazard/types'
import { formatOdds, formatPercent, formatSignificant } from '../scenario/format'
import { KM_PER_NMI } from './sphere'

/** Kilopascals per pound-force per square inch (common practice, no source). */
export const KPA_PER_PSI = 6.894757

/** A figure to two significant figures ("1,200", "0.75", "8.2 × 10⁹"). */
export const sig = (x: number, digits = 2) => formatSignificant(x, digits)

/** "150–260 Mt TNT": the 5–95 % range with its unit once. */
export function rangeText(p: Percentiles, unit: string, digits = 2): string {
  const lo = sig(p.p5, digits), hi = sig(p.p95, digits)
  return `${lo === hi ? lo : `${lo}–${hi}`}${unit ? ` ${unit}` : ''}`
}

/** "190 Mt TNT (5–95 %: 150–260)": the median with its range. */
export function medianRangeText(p: Percentiles, unit: string, digits = 2): string {
  return `${sig(p.p50, digits)}${unit ? ` ${unit}` : ''} (5–95 %: ${rangeText(p, '', digits)})`
}

/** "58 km (31 nmi)": a distance with nautical miles for maritime readers. */
export function kmText(km: number): string {
  return `${sig(km)} km (${sig(km / KM_PER_NMI)} nmi)`
}

/** "52–57 km (28–31 nmi)". */
export function kmRangeText(p: Percentiles): string {
  return `${rangeText(p, 'km')} (${rangeText({ p5: p.p5 / KM_PER_NMI, p50: p.p50 / KM_PER_NMI, p95: p.p95 / KM_PER_NMI }, 'nmi')})`
}

/** "6.9 kPa (1.0 psi)": overpressure with psi beside it. */
export function kPaText(kPa: number): string {
  const psi = kPa / KPA_PER_PSI
  return `${sig(kPa)} kPa (${psi < 10 ? psi.toFixed(1) : sig(psi)} psi)`
}

/** "5.4–6.2 kPa (0.78–0.9 psi)". */
export function kPaRangeText(p: Percentiles): string {
  return `${rangeText(p, 'kPa')} (${rangeText({ p5: p.p5 / KPA_PER_PSI, p50: p.p50 / KPA_PER_PSI, p95: p.p95 / KPA_PER_PSI }, 'psi')})`
}

/** "2.7 % (1 in 37)"; odds only below one in two, where they help. */
export function probabilityText(p: number): string {
  return p <= 0 || p >= 0.5 ? formatPercent(p) : `${formatPercent(p)} (${formatOdds(p)})`
}

export { formatPercent, formatOdds }
