// CSV formula injection (OWASP "CSV Injection"; common practice, no source): a cell that a
// spreadsheet would run as a formula starts with = + - @, a tab or a carriage return. guardCsvCell
// turns every such cell into text with a leading quote and leaves every other cell as it was.
import fc from 'fast-check'
import Papa from 'papaparse'
import { describe, expect, it } from 'vitest'
import { guardCsvCell } from '../../../shared/review/csv'

const TRIGGERS = ['=', '+', '-', '@', '\t', '\r']
const formula = fc.tuple(fc.constantFrom(...TRIGGERS, '=cmd|\' /C calc\'!A0', '=HYPERLINK("http://x.example","y")', '@SUM(1+1)*cmd|', '+1+1', '-2+3'), fc.string())
  .map(([a, b]) => a + b)

describe('guardCsvCell', () => {
  it('quotes every cell that starts like a formula', () => {
    fc.assert(fc.property(formula, (text) => {
      expect(guardCsvCell(text)).toBe(`'${text}`)
    }), { numRuns: 500 })
  })

  it('leaves every other text as it is', () => {
    fc.assert(fc.property(fc.string().filter(s => !TRIGGERS.some(t => s.startsWith(t))), (text) => {
      expect(guardCsvCell(text)).toBe(text)
    }), { numRuns: 500 })
  })

  it('guards numbers, objects and arrays by their text too, and empties nothing else', () => {
    expect(guardCsvCell(-5)).toBe('\'-5')
    expect(guardCsvCell(12)).toBe('12')
    expect(guardCsvCell(null)).toBe('')
    expect(guardCsvCell(undefined)).toBe('')
    expect(guardCsvCell({ a: '=1' })).toBe('{"a":"=1"}')
    fc.assert(fc.property(fc.jsonValue(), (v) => {
      const out = guardCsvCell(v)
      expect(/^[=+\-@\t\r]/.test(out)).toBe(false)
    }), { numRuns: 500 })
  })

  it('no cell of a CSV made of guarded cells starts a formula once a spreadsheet parses it back', () => {
    fc.assert(fc.property(fc.array(
      fc.array(fc.oneof(formula, fc.string(), fc.integer()), { minLength: 1, maxLength: 6 }),
      { minLength: 1, maxLength: 6 },
    ), (rows) => {
      const csv = Papa.unparse(rows.map(r => r.map(guardCsvCell)), { newline: '\r\n' })
      // One empty cell makes an empty file, which reads back as no rows at all: nothing to check.
      fc.pre(csv !== '')
      const back = Papa.parse<string[]>(csv, { newline: '\r\n', delimiter: ',' }).data
      for (const cell of back.flat()) expect(/^[=+\-@\t\r]/.test(cell)).toBe(false)
      expect(back.flat()).toEqual(rows.flat().map(guardCsvCell))
    }), { numRuns: 300 })
  })
})
