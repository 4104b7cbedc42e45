import { describe, expect, it } from 'vitest'
import fc from 'fast-check'
import { breakLongWords, PDF_WORD_MAX } from '../../../shared/review/pdftext'

const ZWSP = '\u200b'

describe('breakLongWords', () => {
  it('leaves ordinary prose alone', () => {
    const text = 'Evacuate the harbour front of Vento Largo by 14:00; shelter inland above 20 m.'
    expect(breakLongWords(text)).toBe(text)
  })

  it('offers a break after every 40 characters of a 20 000-character word', () => {
    const out = breakLongWords('x'.repeat(20_000))
    const pieces = out.split(ZWSP)
    expect(pieces).toHaveLength(500)
    expect(pieces.every(p => p.length === PDF_WORD_MAX)).toBe(true)
  })

  it('keeps a 40-character word whole and breaks a 41-character one once', () => {
    expect(breakLongWords('a'.repeat(40))).toBe('a'.repeat(40))
    expect(breakLongWords('a'.repeat(41))).toBe(`${'a'.repeat(40)}${ZWSP}a`)
  })

  it('never splits a character outside the basic plane', () => {
    const out = breakLongWords('🌊'.repeat(100))
    expect(out.replaceAll(ZWSP, '')).toBe('🌊'.repeat(100))
    expect(out.split(ZWSP).every(p => [...p].length <= PDF_WORD_MAX && !/[\ud800-\udbff]$/.test(p))).toBe(true)
  })

  it('reads back as the original text, and no run is longer than the maximum', () => {
    fc.assert(fc.property(fc.string({ unit: 'grapheme', maxLength: 400 }), (s) => {
      const out = breakLongWords(s)
      expect(out.replaceAll(ZWSP, '')).toBe(s.replaceAll(ZWSP, ''))
      for (const run of out.split(/[\s\u200b]/u)) expect([...run].length).toBeLessThanOrEqual(PDF_WORD_MAX)
    }), { numRuns: 500 })
  })
})
