/**
 * The inject list as a spreadsheet: one row per inject, and back. Pure mapping between a scenario's injects and a
 * table of text cells; the server turns the table into an XLSX or CSV file (server/library/msel.ts).
 *
 * Cells:
 * - Times are written as in the scenario file: ISO 8601 with a zone (`2031-03-04T06:30:00Z`).
 * - Teams are team keys joined with "; " (keys hold no spaces or semicolons; commas and spaces also separate).
 * - Lists of free text (expected actions, decision choices, attachments by name) have one item per line, each
 *   starting with "* ". A line break inside an item is written as a further line indented by two spaces. A line
 *   typed without the "* " begins an item of its own; blank lines are skipped.
 * - "Free-text answer" is "yes" or "no"; a decision exists when its prompt is filled in.
 * - Cells starting with = + - @ (or a tab or carriage return, or a quote before one of those) are written with a
 *   leading quote so that no spreadsheet runs them as a formula; reading takes that quote off again, so a round
 *   trip gives back the exact text.
 * - Above the header row stand the drill marking, the caution and the scenario's title; reading looks for the header
 *   row (first cell "Key"), and row numbers in errors are the file's own (1-based).
 */
import { guardCsvCell } from '../review/csv'
import { DRILL_CAUTION, DRILL_MARKING } from '../utils/drill'
import { validateScenario } from './io'
import type { Inject, Scenario } from './schema'

export const MSEL_COLUMNS = [
  { key: 'key', label: 'Key' },
  { key: 'at', label: 'Time' },
  { key: 'phase', label: 'Phase' },
  { key: 'teams', label: 'Teams' },
  { key: 'kind', label: 'Kind' },
  { key: 'title', label: 'Title' },
  { key: 'body', label: 'Body' },
  { key: 'solution', label: 'Orbit solution' },
  { key: 'expectedActions', label: 'Expected actions' },
  { key: 'decisionPrompt', label: 'Decision prompt' },
  { key: 'decisionChoices', label: 'Decision choices' },
  { key: 'decisionFreeText', label: 'Free-text answer' },
  { key: 'decisionDeadline', label: 'Decision deadline' },
  { key: 'contingency', label: 'Contingency condition' },
  { key: 'attachments', label: 'Attachments' },
] as const

export type MselColumn = typeof MSEL_COLUMNS[number]['key']
export type MselRow = Record<MselColumn, string>

/** A problem in an inject list file: its row (1-based, as the spreadsheet shows it) and column header, when known. */
export interface MselError { row: number | null; column: string | null; cell?: string; message: string }

/** An attachment the scenario holds, which a row may name. */
export interface MselAttachment { name: string; path: string }

const LABEL = Object.fromEntries(MSEL_COLUMNS.map(c => [c.key, c.label])) as Record<MselColumn, string>

/** Defuses a cell for a spreadsheet: the timeline's formula guard, plus a quote before a leading quote (so it can be undone). */
export function defuseCell(text: string): string {
  return /^'[=+\-@\t\r']/.test(text) ? `'${text}` : guardCsvCell(text)
}

/** The text a defused cell stood for. */
export function restoreCell(text: string): string {
  return /^'[=+\-@\t\r']/.test(text) ? text.slice(1) : text
}

/** One item per line, "* " before each, continuation lines indented by two spaces. */
export function joinList(items: readonly string[]): string {
  return items.map(item => `* ${item.split('\n').join('\n  ')}`).join('\n')
}

export function splitList(cell: string): string[] {
  const items: string[] = []
  let open = false
  for (const line of cell.split('\n')) {
    if (line.startsWith('* ')) { items.push(line.slice(2)); open = true }
    else if (open && line.startsWith('  ')) items[items.length - 1] += `\n${line.slice(2)}`
    else if (line.trim()) { items.push(line); open = false }
    else open = false
  }
  return items
}

const splitKeys = (cell: string) => cell.split(/[;,\s]+/).filter(Boolean)

/** The row of one inject (plain text, not yet defused). */
export function injectToRow(inject: Inject): MselRow {
  const d = inject.decision
  return {
    key: inject.key,
    at: inject.at,
    phase: inject.phase,
    teams: inject.teams.join('; '),
    kind: inject.kind,
    title: inject.title,
    body: inject.body,
    solution: inject.solution ?? '',
    expectedActions: joinList(inject.expectedActions),
    decisionPrompt: d?.prompt ?? '',
    decisionChoices: d?.choices ? joinList(d.choices) : '',
    decisionFreeText: d ? (d.freeText ? 'yes' : 'no') : '',
    decisionDeadline: d?.deadline ?? '',
    contingency: inject.contingency?.condition ?? '',
    attachments: inject.attachments?.length ? joinList(inject.attachments.map(a => a.name)) : '',
  }
}

/** The whole sheet: marking, caution, title, a blank row, the header, then one row per inject; every cell defused. */
export function mselTable(scenario: Scenario): string[][] {
  const rows = [
    [DRILL_MARKING],
    [DRILL_CAUTION],
    [`Inject list: ${scenario.title}`],
    [],
    MSEL_COLUMNS.map(c => c.label),
    ...scenario.injects.map((inject) => {
      const row = injectToRow(inject)
      return MSEL_COLUMNS.map(c => row[c.key])
    }),
  ]
  return rows.map(r => r.map(defuseCell))
}

/** A column number (0-based) as spreadsheet letters: 0 → A, 27 → AB. */
export function columnLetter(index: number): string {
  let n = index + 1
  let out = ''
  while (n > 0) {
    const r = (n - 1) % 26
    out = String.fromCharCode(65 + r) + out
    n = Math.floor((n - 1) / 26)
  }
  return out
}

const YES = new Set(['yes', 'y', 'true', '1'])
const NO = new Set(['no', 'n', 'false', '0'])

export type MselReadResult
  = | { ok: true; injects: Inject[]; rows: number[]; columns: Map<MselColumn, number> }
    | { ok: false; errors: MselError[] }

/**
 * Reads the rows of a table (cells as the file holds them, still defused) into injects. Checks the layout and what a
 * row alone can tell (headers, yes/no, attachments by name); the scenario's own rules are checked by `applyMsel`.
 * `current` (the scenario's injects before the import) only settles which of two attachments of one name a row means.
 */
export function readMselTable(cells: string[][], attachments: MselAttachment[], current: Inject[] = []): MselReadResult {
  const table = cells.map(r => r.map(c => restoreCell(c ?? '')))
  const headerAt = table.findIndex(r => r.find(c => c.trim())?.trim().toLowerCase() === 'key')
  if (headerAt < 0) {
    return { ok: false, errors: [{ row: null, column: null, message: 'No header row: the first cell of the header row must say "Key".' }] }
  }
  const errors: MselError[] = []
  const header = table[headerAt]!
  const index = new Map<MselColumn, number>()
  header.forEach((h, i) => {
    const label = h.trim()
    if (!label) return
    const col = MSEL_COLUMNS.find(c => c.label.toLowerCase() === label.toLowerCase())
    const at = { row: headerAt + 1, column: label, cell: `${columnLetter(i)}${headerAt + 1}` }
    if (!col) errors.push({ ...at, message: `unknown column "${label}"; the columns are ${MSEL_COLUMNS.map(c => c.label).join(', ')}` })
    else if (index.has(col.key)) errors.push({ ...at, message: `the column "${col.label}" appears twice` })
    else index.set(col.key, i)
  })
  for (const c of MSEL_COLUMNS) {
    if (!index.has(c.key)) errors.push({ row: headerAt + 1, column: c.label, message: `the column "${c.label}" is missing` })
  }
  if (errors.length) return { ok: false, errors }

  const byName = new Map<string, string[]>()
  for (const a of attachments) {
    const paths = byName.get(a.name) ?? []
    if (!paths.includes(a.path)) paths.push(a.path)
    byName.set(a.name, paths)
  }
  const injects: Inject[] = []
  const rows: number[] = []
  for (let r = headerAt + 1; r < table.length; r++) {
    const line = table[r]!
    if (line.every(c => !c.trim())) continue
    const rowNo = r + 1
    const cell = (k: MselColumn) => line[index.get(k)!] ?? ''
    const fail = (k: MselColumn, message: string) => errors.push({
      row: rowNo, column: LABEL[k], cell: `${columnLetter(index.get(k)!)}${rowNo}`, message,
    })
    const stray = line.findIndex((c, i) => c.trim() && !header[i]?.trim())
    if (stray >= 0) {
      errors.push({ row: rowNo, column: null, cell: `${columnLetter(stray)}${rowNo}`, message: 'a cell outside the named columns' })
    }
    const inject: Inject = {
      key: cell('key').trim(),
      at: cell('at').trim(),
      phase: cell('phase').trim(),
      kind: cell('kind').trim(),
      teams: splitKeys(cell('teams')),
      title: cell('title'),
      body: cell('body'),
      expectedActions: splitList(cell('expectedActions')),
    }
    if (cell('solution').trim()) inject.solution = cell('solution').trim()
    const prompt = cell('decisionPrompt')
    const choices = splitList(cell('decisionChoices'))
    const freeText = cell('decisionFreeText').trim().toLowerCase()
    const deadline = cell('decisionDeadline').trim()
    if (prompt.trim()) {
      let free = !choices.length
      if (YES.has(freeText)) free = true
      else if (NO.has(freeText)) free = false
      else if (freeText) fail('decisionFreeText', `"${cell('decisionFreeText').trim()}" is not yes or no`)
      inject.decision = { prompt, ...(choices.length ? { choices } : {}), freeText: free, deadline }
    }
    else {
      if (choices.length) fail('decisionChoices', 'choices without a decision prompt')
      if (freeText) fail('decisionFreeText', 'a free-text answer without a decision prompt')
      if (deadline) fail('decisionDeadline', 'a deadline without a decision prompt')
    }
    if (cell('contingency').trim()) inject.contingency = { condition: cell('contingency') }
    const names = splitList(cell('attachments'))
    if (names.length) {
      const before = current.find(x => x.key === inject.key)?.attachments ?? []
      inject.attachments = names.map((name) => {
        const paths = byName.get(name) ?? []
        if (!paths.length) fail('attachments', `no attachment called "${name}" in this scenario; upload it in the editor first`)
        const path = paths.length > 1 ? paths.find(p => before.some(b => b.name === name && b.path === p)) : paths[0]
        if (paths.length > 1 && !path) fail('attachments', `several attachments are called "${name}"`)
        return { name, path: path ?? '' }
      })
    }
    injects.push(inject)
    rows.push(rowNo)
  }
  return errors.length ? { ok: false, errors } : { ok: true, injects, rows, columns: index }
}

const FIELD_COLUMN: Record<string, MselColumn> = {
  key: 'key', at: 'at', phase: 'phase', teams: 'teams', kind: 'kind', title: 'title', body: 'body', solution: 'solution',
  expectedActions: 'expectedActions', contingency: 'contingency', attachments: 'attachments', decision: 'decisionPrompt',
}
const DECISION_COLUMN: Record<string, MselColumn> = {
  prompt: 'decisionPrompt', choices: 'decisionChoices', freeText: 'decisionFreeText', deadline: 'decisionDeadline',
}

export type MselApplyResult = { ok: true; scenario: Scenario } | { ok: false; errors: MselError[] }

/**
 * The scenario with its injects replaced by the table's, validated whole with the scenario schema; each problem of
 * an inject is reported at its row and column, others (a criterion naming an inject that is gone) with their path.
 */
export function applyMsel(scenario: Scenario, cells: string[][], attachments: MselAttachment[]): MselApplyResult {
  const read = readMselTable(cells, attachments, scenario.injects)
  if (!read.ok) return read
  const checked = validateScenario({ ...scenario, injects: read.injects })
  if (checked.ok) return { ok: true, scenario: checked.scenario }
  return {
    ok: false,
    errors: checked.errors.map((issue) => {
      const m = /^injects\[(\d+)\](?:\.(\w+))?(?:\[\d+\])?(?:\.(\w+))?/.exec(issue.path)
      const row = m ? read.rows[Number(m[1])] : undefined
      if (!m || row === undefined) return { row: null, column: null, message: issue.path ? `${issue.path}: ${issue.message}` : issue.message }
      const col = m[2] === 'decision' && m[3] ? DECISION_COLUMN[m[3]] : m[2] ? FIELD_COLUMN[m[2]] : undefined
      const cell = col ? `${columnLetter(read.columns.get(col)!)}${row}` : undefined
      return { row, column: col ? LABEL[col] : null, ...(cell ? { cell } : {}), message: issue.message }
    }),
  }
}

/** `row 7, Teams: unknown team "ops"`. */
export function formatMselError(e: MselError): string {
  const where = [e.row !== null ? `row ${e.row}` : '', e.column ?? ''].filter(Boolean).join(', ')
  return where ? `${where}: ${e.message}` : e.message
}
