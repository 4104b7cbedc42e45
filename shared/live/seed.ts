/**
 * The Monte Carlo run of a solution, the same wherever its figures are shown: the library's threat brief, the
 * editor's preview and every drill played from the scenario compute them with these samples and this seed, so
 * that one solution gives one set of numbers.
 */

/** Samples of every published assessment (20 000 keep the 5/50/95 percentiles steady from run to run). */
export const PUBLISH_SAMPLES = 20_000

/**
 * The seed of a solution of a scenario: 31 bits of the FNV-1a hash (32-bit) of "<scenario key>:<solution key>"
 * (Fowler, Noll and Vo; the published offset basis 2166136261 and prime 16777619).
 */
export function solutionSeed(scenarioKey: string, solutionKey: string): number {
  return fnv1a32(`${scenarioKey}:${solutionKey}`) >>> 1
}

/** FNV-1a, 32 bits, of the UTF-8 bytes of a text. */
export function fnv1a32(text: string): number {
  let h = 0x811C9DC5
  for (const byte of new TextEncoder().encode(text)) {
    h ^= byte
    h = Math.imul(h, 0x01000193) >>> 0
  }
  return h
}
