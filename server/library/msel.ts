// The inject list of a scenario as an XLSX or CSV file, and its import (shared/scenario/msel.ts maps rows and injects).
import { eq } from 'drizzle-orm'
import ExcelJS from 'exceljs'
import Papa from 'papaparse'
import { applyMsel, formatMselError, mselTable, MSEL_COLUMNS } from '#shared/scenario/msel'
import type { MselError } from '#shared/scenario/msel'
import type { ScenarioRow, User } from '#shared/types/db'
import { saveScenario } from './scenarios'

/** Largest inject list file accepted, bytes (a full scenario's list is larger than its 1 MiB YAML; the body limit is 6 MiB). */
export const MAX_MSEL_BYTES = 5 * 1024 * 1024
/** Largest sum of the unpacked parts of an XLSX file, bytes (a small zip can unpack to gigabytes). */
const MAX_XLSX_UNPACKED = 64 * 1024 * 1024
/** Rows read from a file at most (a scenario holds at most 500 injects). */
const MAX_ROWS = 2000

const WIDTHS: Partial<Record<typeof MSEL_COLUMNS[number]['key'], number>> = {
  key: 24, at: 22, phase: 14, teams: 20, kind: 16, title: 40, body: 80, solution: 16, expectedActions: 60,
  decisionPrompt: 40, decisionChoices: 30, decisionFreeText: 10, decisionDeadline: 22, contingency: 40, attachments: 30,
}

export function mselCsv(row: ScenarioRow): string {
  return `\uFEFF${Papa.unparse(mselTable(row.document), { newline: '\r\n' })}`
}

export async function mselXlsx(row: ScenarioRow): Promise<Buffer> {
  const table = mselTable(row.document)
  const headerAt = table.findIndex(r => r[0] === MSEL_COLUMNS[0].label)
  const wb = new ExcelJS.Workbook()
  wb.creator = 'Brinkwater'
  wb.title = `Inject list: ${row.title}`
  const ws = wb.addWorksheet('Injects', { views: [{ state: 'frozen', ySplit: headerAt + 1 }] })
  table.forEach((cells, i) => {
    const added = ws.addRow(cells)
    if (i === 0 || i === headerAt) added.font = { bold: true }
    if (i > headerAt) added.alignment = { vertical: 'top', wrapText: true }
  })
  ws.columns.forEach((col, i) => { col.width = WIDTHS[MSEL_COLUMNS[i]?.key ?? 'key'] ?? 20 })
  return Buffer.from(await wb.xlsx.writeBuffer())
}

/** A 400 whose `data.errors` lists `{ row, column, cell, message }` (and `data.issues` the same as field issues). */
function mselInvalid(errors: MselError[], message?: string): never {
  const shown = errors.slice(0, 200)
  throw new DomainError('invalid', message ?? `The inject list has ${errors.length} problem${errors.length === 1 ? '' : 's'}; nothing was saved.`, {
    errors: shown,
    issues: shown.map(e => ({ path: e.cell ?? (e.row !== null ? `row ${e.row}` : 'file'), message: formatMselError(e) })),
  })
}
const fileProblem = (message: string): never => mselInvalid([{ row: null, column: null, message }], message)

/** Sum of the unpacked sizes the zip's central directory declares; null when it cannot be read. */
function unpackedSize(zip: Buffer): number | null {
  const eocd = zip.lastIndexOf(Buffer.from([0x50, 0x4b, 0x05, 0x06]))
  if (eocd < 0 || eocd + 22 > zip.length) return null
  const count = zip.readUInt16LE(eocd + 10)
  let at = zip.readUInt32LE(eocd + 16)
  let total = 0
  for (let i = 0; i < count; i++) {
    if (at + 46 > zip.length || zip.readUInt32LE(at) !== 0x02014b50) return null
    const size = zip.readUInt32LE(at + 24)
    if (size === 0xffffffff) return null
    total += size
    at += 46 + zip.readUInt16LE(at + 28) + zip.readUInt16LE(at + 30) + zip.readUInt16LE(at + 32)
  }
  return total
}

/** A cell's text as the file holds it; formulas and error values are refused (the list is text). */
function cellText(value: ExcelJS.CellValue): string | { problem: string } {
  if (value === null || value === undefined) return ''
  if (typeof value === 'string') return value
  if (typeof value === 'number') return String(value)
  if (typeof value === 'boolean') return value ? 'yes' : 'no'
  if (value instanceof Date) return value.toISOString().replace('.000Z', 'Z')
  if ('richText' in value) return value.richText.map(r => r.text).join('')
  if ('hyperlink' in value) return typeof value.text === 'string' ? value.text : cellText(value.text)
  if ('formula' in value || 'sharedFormula' in value) return { problem: 'a formula; type the text itself' }
  return { problem: 'a value that is not text' }
}

async function xlsxTable(data: Uint8Array): Promise<string[][]> {
  const buffer = Buffer.from(data)
  const unpacked = unpackedSize(buffer)
  if (unpacked === null) fileProblem('The file is not an XLSX workbook this server can read.')
  if (unpacked! > MAX_XLSX_UNPACKED) fileProblem(`The workbook unpacks to more than ${MAX_XLSX_UNPACKED / 1024 / 1024} MiB.`)
  const wb = new ExcelJS.Workbook()
  try { await wb.xlsx.load(buffer as unknown as ExcelJS.Buffer) }
  catch { fileProblem('The file is not an XLSX workbook this server can read.') }
  const ws = wb.getWorksheet('Injects') ?? wb.worksheets[0]
  if (!ws) fileProblem('The workbook has no sheet.')
  if (ws!.rowCount > MAX_ROWS) fileProblem(`The sheet has more than ${MAX_ROWS} rows.`)
  const table: string[][] = []
  const errors: MselError[] = []
  for (let r = 1; r <= ws!.rowCount; r++) {
    const row = ws!.getRow(r)
    const cells: string[] = []
    for (let c = 1; c <= Math.min(row.cellCount, 64); c++) {
      const cell = row.getCell(c)
      const text = cellText(cell.value)
      if (typeof text === 'string') cells.push(text)
      else {
        errors.push({ row: r, column: null, cell: cell.address, message: text.problem })
        cells.push('')
      }
    }
    table.push(cells)
  }
  if (errors.length) mselInvalid(errors)
  return table
}

function csvTable(data: Uint8Array): string[][] {
  let text: string
  try { text = new TextDecoder('utf-8', { fatal: true }).decode(data) }
  catch { return fileProblem('The file is neither an XLSX workbook nor UTF-8 CSV text.') }
  if (text.includes('\0')) fileProblem('The file is neither an XLSX workbook nor UTF-8 CSV text.')
  text = text.replace(/^\uFEFF/, '')
  // The separator is the one after the header's first cell ("Key", or "Key;…" from a spreadsheet set to semicolons).
  const delimiter = /^"?Key"?([,;\t])/im.exec(text)?.[1] ?? ','
  const parsed = Papa.parse<string[]>(text, { delimiter, skipEmptyLines: false, preview: MAX_ROWS + 1 })
  if (parsed.data.length > MAX_ROWS) fileProblem(`The file has more than ${MAX_ROWS} rows.`)
  const broken = parsed.errors.filter(e => e.type === 'Quotes')
  if (broken.length) mselInvalid(broken.map(e => ({ row: e.row === undefined ? null : e.row + 1, column: null, message: e.message })))
  return parsed.data
}

/** The cells of an uploaded inject list: an XLSX workbook (by its zip signature) or else CSV text. */
export async function readMselFile(data: Uint8Array): Promise<string[][]> {
  const zip = data[0] === 0x50 && data[1] === 0x4b && data[2] === 0x03 && data[3] === 0x04
  return zip ? await xlsxTable(data) : csvTable(data)
}

/**
 * Replaces a scenario's injects with those of an uploaded list through the editor's save (validated whole, conditional
 * on the revision: 409 when `revision` is stale or another save wins). All rows are stored, or none.
 */
export async function importMsel(row: ScenarioRow, data: Uint8Array, revision: number | undefined, user: User): Promise<ScenarioRow> {
  if (revision !== undefined && revision !== row.revision) {
    throw conflict('Someone saved this scenario after you opened it. Reload, then import again.', { revision: row.revision })
  }
  const cells = await readMselFile(data)
  // Attachments by name: the files stored with the scenario, and those its injects already name.
  const attachments = [
    ...useDB().select({ name: schema.scenarioAttachments.name, path: schema.scenarioAttachments.path })
      .from(schema.scenarioAttachments).where(eq(schema.scenarioAttachments.scenarioId, row.id)).all(),
    ...row.document.injects.flatMap(i => i.attachments ?? []),
  ]
  const applied = applyMsel(row.document, cells, attachments)
  if (!applied.ok) mselInvalid(applied.errors)
  const saved = saveScenario(row, applied.scenario, revision ?? row.revision, user)
  audit(user.id, 'scenario.msel.import', row.id, { revision: saved.revision, injects: applied.scenario.injects.length })
  return saved
}
