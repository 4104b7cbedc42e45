/**
 * Text for the PDF exports, which embed only the Latin subset of IBM Plex: characters outside it
 * (superscript digits, Greek letters, arrows, some maths) are written out in plain Latin.
 */
const SUPERSCRIPTS: Record<string, string> = {
  '⁰': '0',
  '¹': '1',
  '²': '2',
  '³': '3',
  '⁴': '4',
  '⁵': '5',
  '⁶': '6',
  '⁷': '7',
  '⁸': '8',
  '⁹': '9',
  '⁻': '-',
}
const REPLACE: Record<string, string> = {
  'κ': 'kappa', 'σ': 'sigma', 'μ': 'micro', 'Δ': 'delta', '→': '->', '←': '<-', '≥': '>=', '≤': '<=', '≈': '~', '≠': '!=',
  '∞': 'infinity', '✓': 'yes', '✗': 'no', '☐': '[ ]', '\u00a0': ' ', '⟨': '[', '⟩': ']',
}

/** Superscript runs become `^n` ("8.2 × 10⁹" → "8.2 × 10^9"); other characters outside the subset are replaced. */
export function pdfSafe(text: string): string {
  return text
    .replace(/[⁰¹²³⁴⁵⁶⁷⁸⁹⁻]+/g, run => `^${[...run].map(c => SUPERSCRIPTS[c]).join('')}`)
    .replace(/[κσμΔ→←≥≤≈≠∞✓✗☐\u00a0⟨⟩]/g, c => REPLACE[c] ?? c)
}

/** Longest run of characters without a break opportunity that the PDFs lay out as it is. */
export const PDF_WORD_MAX = 40

/**
 * Offers a line break (U+200B, zero width) after every PDF_WORD_MAX characters of a longer word: a pasted
 * link or a 20 000-character string would otherwise be split letter by letter by the layout, which takes
 * seconds. The text reads and copies the same.
 */
export function breakLongWords(text: string, max = PDF_WORD_MAX): string {
  // By code point (flag u), so that a pair of UTF-16 halves is never split.
  const long = new RegExp(`[^\\s\\u200b]{${max + 1},}`, 'gu')
  const chunk = new RegExp(`[^]{${max}}(?=[^])`, 'gu')
  return text.replace(long, word => word.replace(chunk, '$&\u200b'))
}
