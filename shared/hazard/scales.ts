/**
 * Palermo Technical Impact Hazard Scale, `PS = log10(p / (f_B dT))`, `f_B = 0.03 E^(-4/5)` per year.
 * Source: Chesley et al. 2002, Icarus 159, 423–432, eqs. 1–2 (numbers from memory).
 * @param i.probability impact probability, 0..1; i.energyMt impact energy, Mt TNT; i.yearsToImpact
 *   time from the solution epoch to the impact, years (> 0)
 * @returns Palermo scale value (−Infinity when the probability is 0)
 */
export function palermoScale(i: { probability: number; energyMt: number; yearsToImpact: number }): number {
  const fB = 0.03 * Math.pow(i.energyMt, -0.8)
  return Math.log10(i.probability / (fB * i.yearsToImpact))
}

/** `(x - x0)/3 + (y + 2)/2 < 0` in x = log10 E, y = log10 p: below the Torino line through (x0, −2). */
function below(x: number, y: number, x0: number): boolean {
  return (x - x0) / 3 + (y + 2) / 2 < 0
}

/**
 * Torino Impact Hazard Scale, an integer 0–10 from impact probability and kinetic energy, with the
 * zone boundaries of the Torino scale figure. Source: Binzel 2000, Planetary and Space Science 48, 297–303, fig. 1.
 * @param i.probability impact probability, 0..1; i.energyMt kinetic energy, Mt TNT
 * @returns Torino scale value, integer 0..10
 */
export function torinoScale(i: { probability: number; energyMt: number }): number {
  const { probability: p, energyMt: E } = i
  if (!(p > 0) || !(E >= 1)) return 0
  const x = Math.log10(E)
  const y = Math.log10(p)
  if (below(x, y, -1)) return 0
  if (p < 0.01) return below(x, y, 2) ? 1 : below(x, y, 5) ? 2 : 6
  if (p < 0.99) {
    if (E < 100) return 3
    if (below(x, y, 5)) return 4
    return E < 1e5 ? 5 : 7
  }
  return E < 100 ? 8 : E < 1e5 ? 9 : 10
}
