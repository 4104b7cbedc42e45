/**
 * A key not in `taken`: `base` itself, else its stem (without a trailing `-<n>`, at most 56 characters)
 * with the first free `-2`, `-3`, …
 */
export function nextFreeKey(base: string, taken: Iterable<string>, fallbackStem = 'item'): string {
  const used = new Set(taken)
  const stem = base.replace(/-\d+$/, '').slice(0, 56) || fallbackStem
  if (!used.has(base)) return base
  for (let n = 2; ; n++) if (!used.has(`${stem}-${n}`)) return `${stem}-${n}`
}
