import { readFileSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import { describe, expect, it } from 'vitest'
import { formatScenarioError, parseScenarioYaml } from '../../../shared/scenario'
import type { Inject, Scenario } from '../../../shared/scenario'
import {
  MSEL_COLUMNS, applyMsel, defuseCell, joinList, mselTable, readMselTable, restoreCell, splitList,
} from '../../../shared/scenario/msel'
import type { MselAttachment } from '../../../shared/scenario/msel'

const scenariosDir = fileURLToPath(new URL('../../../scenarios/', import.meta.url))

function load(name: string): Scenario {
  const result = parseScenarioYaml(readFileSync(`${scenariosDir}${name}`, 'utf8'))
  if (!result.ok) throw new Error(`${name}:\n${result.errors.map(formatScenarioError).join('\n')}`)
  return result.scenario
}

const attachmentsOf = (s: Scenario): MselAttachment[] => s.injects.flatMap(i => i.attachments ?? [])
const HEADER_ROW = 5 // marking, caution, title, blank, header

describe.each(['demo-ocean-impact.yaml', 'demo-coastal-airburst.yaml'])('%s through the inject list', (name) => {
  const scenario = load(name)

  it('gives back deep-equal injects', () => {
    const table = mselTable(scenario)
    expect(table[HEADER_ROW - 1]).toEqual(MSEL_COLUMNS.map(c => c.label))
    expect(table).toHaveLength(HEADER_ROW + scenario.injects.length)
    const result = applyMsel(scenario, table, attachmentsOf(scenario))
    if (!result.ok) throw new Error(JSON.stringify(result.errors.slice(0, 5)))
    expect(result.scenario.injects).toEqual(scenario.injects)
    expect(result.scenario).toEqual(scenario)
  })

  it('finds the header below any lines and skips blank rows', () => {
    const table = mselTable(scenario).slice(HEADER_ROW - 1)
    table.splice(2, 0, ['', '  '])
    const read = readMselTable(table, attachmentsOf(scenario))
    expect(read.ok && read.injects).toEqual(scenario.injects)
    expect(read.ok && read.rows.slice(0, 3)).toEqual([2, 4, 5])
  })
})

describe('awkward text survives the round trip exactly', () => {
  const scenario = load('demo-ocean-impact.yaml')
  const first = scenario.injects[0]!
  const odd: Inject = {
    ...first,
    title: '=HYPERLINK("http://evil.example","x")',
    body: '-1 is a number\n+2 too\n@mention\n\'=quoted already',
    expectedActions: ['+ call the minister', '\'single quote', 'two\nlines\n  indented', '* a star', ' leading space', 'a; b, c'],
    contingency: { condition: '@team decides' },
  }
  const doc = { ...scenario, injects: [odd, ...scenario.injects.slice(1)] }

  it('defuses formula cells on the way out and restores them on the way in', () => {
    const table = mselTable(doc)
    const row = table[HEADER_ROW]!
    expect(row[MSEL_COLUMNS.findIndex(c => c.key === 'title')]).toBe(`'${odd.title}`)
    for (const cell of table.flat()) expect(cell).not.toMatch(/^[=+\-@]/)
    const result = applyMsel(doc, table, attachmentsOf(doc))
    expect(result.ok && result.scenario.injects[0]).toEqual(odd)
  })

  it('undoes each defusing, and leaves other quotes alone', () => {
    for (const t of ['=1', '+1', '-1', '@a', '\t=1', '\'=1', '\'\'', '\'x', 'plain', '']) expect(restoreCell(defuseCell(t))).toBe(t)
    expect(restoreCell('\'hello')).toBe('\'hello')
    expect(splitList(joinList(odd.expectedActions))).toEqual(odd.expectedActions)
    expect(splitList('first\nsecond\n\n* third')).toEqual(['first', 'second', 'third'])
  })
})

describe('bad rows', () => {
  const scenario = load('demo-ocean-impact.yaml')
  const col = (key: string) => MSEL_COLUMNS.findIndex(c => c.key === key)

  it('reports row and column of each problem and stores nothing', () => {
    const table = mselTable(scenario)
    table[HEADER_ROW]![col('teams')] = 'science; nobody'
    table[HEADER_ROW + 1]![col('at')] = 'next Tuesday'
    table[HEADER_ROW + 2]![col('decisionFreeText')] = 'perhaps'
    table[HEADER_ROW + 2]![col('decisionPrompt')] = 'Decide?'
    table[HEADER_ROW + 3]![col('attachments')] = '* Missing file.pdf'
    const read = readMselTable(table, attachmentsOf(scenario))
    expect(read.ok).toBe(false)
    expect(!read.ok && read.errors).toEqual([
      { row: HEADER_ROW + 3, column: 'Free-text answer', cell: 'L8', message: '"perhaps" is not yes or no' },
      expect.objectContaining({ row: HEADER_ROW + 4, column: 'Attachments', message: expect.stringMatching(/Missing file\.pdf/) }),
    ])
    table[HEADER_ROW + 2]![col('decisionFreeText')] = 'yes'
    table[HEADER_ROW + 3]![col('attachments')] = ''
    const applied = applyMsel(scenario, table, attachmentsOf(scenario))
    expect(applied.ok).toBe(false)
    const errors = applied.ok ? [] : applied.errors
    expect(errors).toContainEqual(expect.objectContaining({ row: HEADER_ROW + 1, column: 'Teams', message: expect.stringMatching(/nobody/) }))
    expect(errors).toContainEqual(expect.objectContaining({ row: HEADER_ROW + 2, column: 'Time', cell: `B${HEADER_ROW + 2}` }))
  })

  it('refuses unknown and missing columns', () => {
    const table = mselTable(scenario)
    table[HEADER_ROW - 1]![col('body')] = 'Text'
    const read = readMselTable(table, [])
    expect(!read.ok && read.errors).toEqual([
      expect.objectContaining({ row: HEADER_ROW, column: 'Text', cell: `G${HEADER_ROW}`, message: expect.stringMatching(/unknown column/) }),
      expect.objectContaining({ row: HEADER_ROW, column: 'Body', message: expect.stringMatching(/missing/) }),
    ])
    expect(readMselTable([['a', 'b']], []).ok).toBe(false)
  })

  it('reports a criterion left naming a removed inject without a row', () => {
    const table = mselTable(scenario)
    const named = new Set(scenario.criteria.flatMap(c => c.injects))
    const gone = table.findIndex(r => named.has(r[0]!))
    table.splice(gone, 1)
    const applied = applyMsel(scenario, table, attachmentsOf(scenario))
    expect(!applied.ok && applied.errors[0]).toEqual(expect.objectContaining({ row: null, column: null, message: expect.stringMatching(/^criteria\[/) }))
  })

  it('reports duplicate keys at the second row', () => {
    const table = mselTable(scenario)
    table[HEADER_ROW + 1]![col('key')] = table[HEADER_ROW]![col('key')]!
    const applied = applyMsel(scenario, table, attachmentsOf(scenario))
    expect(!applied.ok && applied.errors).toContainEqual(expect.objectContaining({ row: HEADER_ROW + 2, column: 'Key' }))
  })
})
