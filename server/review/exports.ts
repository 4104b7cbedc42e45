import type { LiveView } from '#shared/live/types'
import { eq } from 'drizzle-orm'
import Papa from 'papaparse'
import ExcelJS from 'exceljs'
import { guardCsvCell } from '#shared/review/csv'
import { TIMELINE_COLUMNS, timelineRows } from '#shared/review/timeline'
import type { TimelineRow } from '#shared/review/timeline'
import { DRILL_CAUTION, DRILL_MARKING } from '#shared/utils/drill'
import { getExercise } from '../library'
import { storedEvents } from '../live'

/** The whole timeline of an exercise (every event of its record) as rows. */
export function exerciseTimeline(exerciseId: string, view: LiveView = { kind: 'control' }) {
  const exercise = getExercise(exerciseId)
  const events = storedEvents(exerciseId, view)
  const actors = new Map(useDB().select({ id: schema.users.id, name: schema.users.name }).from(schema.users)
    .innerJoin(schema.memberships, eq(schema.memberships.userId, schema.users.id))
    .where(eq(schema.memberships.exerciseId, exerciseId)).all().map(u => [u.id, u.name]))
  for (const e of events) {
    if (e.actorId && !actors.has(e.actorId)) {
      const u = useDB().select({ name: schema.users.name }).from(schema.users).where(eq(schema.users.id, e.actorId)).get()
      if (u) actors.set(e.actorId, u.name)
    }
  }
  return { exercise, rows: timelineRows(events, actors, exercise.scenario), events }
}

export function fileStem(title: string): string {
  return title.normalize('NFKD').replace(/[^\w-]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 60) || 'exercise'
}

/** CSV with the drill marking and caution on top; every cell guarded against formula injection. */
export function timelineCsv(title: string, rows: TimelineRow[]): string {
  const header = [[DRILL_MARKING], [DRILL_CAUTION], [`Timeline: ${title}`], []]
  const body = [TIMELINE_COLUMNS.map(c => c.label), ...rows.map(r => TIMELINE_COLUMNS.map(c => guardCsvCell(r[c.key])))]
  return Papa.unparse([...header.map(r => r.map(guardCsvCell)), ...body], { newline: '\r\n' })
}

/** An XLSX workbook: a Timeline sheet (marking, caution, then one row per event). */
export async function timelineXlsx(title: string, rows: TimelineRow[]): Promise<Buffer> {
  const wb = new ExcelJS.Workbook()
  wb.creator = 'Brinkwater'
  wb.title = `${DRILL_MARKING} ${title}`
  const ws = wb.addWorksheet('Timeline', { views: [{ state: 'frozen', ySplit: 4 }] })
  ws.addRow([DRILL_MARKING]).font = { bold: true }
  ws.addRow([DRILL_CAUTION])
  ws.addRow([`Timeline: ${title}`])
  ws.addRow(TIMELINE_COLUMNS.map(c => c.label)).font = { bold: true }
  for (const r of rows) ws.addRow(TIMELINE_COLUMNS.map(c => (c.key === 'seq' ? r.seq : guardCsvCell(r[c.key]))))
  ws.columns.forEach((col, i) => { col.width = [6, 24, 24, 20, 22, 24, 14, 22, 48, 60][i] ?? 20 })
  return Buffer.from(await wb.xlsx.writeBuffer())
}
