import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import Papa from 'papaparse'
import ExcelJS from 'exceljs'
import { Client } from '../support/client'
import { closeSockets, newLiveExercise, type LiveCast } from '../support/live'

let cast: LiveCast
const FORMULA = '=HYPERLINK("http://attacker.example","click")'

beforeAll(async () => {
  cast = await newLiveExercise('Export check drill')
  const f = cast.facilitator.client
  expect((await f.post(`/api/exercises/${cast.id}/clock`, { action: 'start' })).status).toBeLessThan(300)
  expect((await f.post(`/api/exercises/${cast.id}/solutions/s1-discovery/publish`)).status).toBeLessThan(300)
  expect((await f.post(`/api/exercises/${cast.id}/injects/notify-civil-protection/release`)).status).toBeLessThan(300)
  const answer = await cast.science.client.post(`/api/exercises/${cast.id}/responses`, {
    injectKey: 'notify-civil-protection', choice: 'Formal notification under the hazard plan', text: FORMULA, idempotencyKey: 'export-check-1',
  })
  expect(answer.status).toBeLessThan(300)
  const score = await cast.evaluator.client.post(`/api/exercises/${cast.id}/scores`, {
    criterionKey: 'figures-of-record', taskKey: 'interpret-each-solution', rating: 'S', note: '+ plain figures, late by an hour', idempotencyKey: 'export-check-2',
  })
  expect(score.status).toBeLessThan(300)
}, 120_000)

afterAll(() => closeSockets())

async function download(c: Client, path: string) {
  const res = await fetch(`${(await import('../support/client')).baseUrl()}${path}`, { headers: { cookie: c.cookieHeader } })
  return { status: res.status, headers: res.headers, bytes: new Uint8Array(await res.arrayBuffer()) }
}

describe('timeline exports', () => {
  it('are for the analyst and the facilitator only', async () => {
    for (const who of [cast.science, cast.civil, cast.evaluator]) {
      for (const ext of ['csv', 'xlsx', 'json']) expect((await who.client.get(`/api/exercises/${cast.id}/timeline.${ext}`)).status).toBe(403)
    }
    expect((await new Client().get(`/api/exercises/${cast.id}/timeline.csv`)).status).toBe(401)
    expect((await cast.analyst.client.get(`/api/exercises/${cast.id}/timeline.csv`)).status).toBe(200)
  })

  it('JSON holds every event of the record, in order, with the marking', async () => {
    const res = await cast.analyst.client.get(`/api/exercises/${cast.id}/timeline.json`)
    expect(res.status).toBe(200)
    expect(res.json.marking).toBe('EXERCISE — EXERCISE — EXERCISE')
    const events = (await cast.facilitator.client.get(`/api/exercises/${cast.id}/events?since=0`)).json
    const seqs = (Array.isArray(events) ? events : events.events).map((e: { seq: number }) => e.seq)
    expect(res.json.events.map((e: { seq: number }) => e.seq)).toEqual(seqs)
    expect(res.json.rows).toHaveLength(seqs.length)
    expect(res.json.events.map((e: { type: string }) => e.type)).toEqual(expect.arrayContaining([
      'clock.changed',
      'solution.published',
      'inject.released',
      'response.submitted',
      'score.recorded',
    ]))
  })

  it('CSV has one row per event after the marking and caution, and formulas are defused', async () => {
    const json = (await cast.analyst.client.get(`/api/exercises/${cast.id}/timeline.json`)).json
    const { bytes, headers } = await download(cast.analyst.client, `/api/exercises/${cast.id}/timeline.csv`)
    expect(headers.get('content-type')).toMatch(/text\/csv/)
    expect(headers.get('content-disposition')).toMatch(/timeline\.csv/)
    const text = new TextDecoder().decode(bytes).replace(/^\uFEFF/, '')
    const rows = Papa.parse<string[]>(text, { skipEmptyLines: true }).data
    expect(rows[0]![0]).toBe('EXERCISE — EXERCISE — EXERCISE')
    expect(rows[1]![0]).toMatch(/training only/i)
    const headerAt = rows.findIndex(r => r[0] === 'Seq')
    const body = rows.slice(headerAt + 1)
    expect(body.map(r => Number(r[0]))).toEqual(json.events.map((e: { seq: number }) => e.seq))
    expect(body.map(r => r[4])).toEqual(json.events.map((e: { type: string }) => e.type))
    const response = body.find(r => r[4] === 'response.submitted')!
    expect(response[10]).toBe(`'${FORMULA}`)
    expect(body.find(r => r[4] === 'score.recorded')![10]).toBe('\'+ plain figures, late by an hour')
    for (const r of body) for (const cell of r) expect(cell).not.toMatch(/^[=+\-@]/)
  })

  it('XLSX opens and holds the same rows as the CSV', async () => {
    const json = (await cast.analyst.client.get(`/api/exercises/${cast.id}/timeline.json`)).json
    const { bytes } = await download(cast.facilitator.client, `/api/exercises/${cast.id}/timeline.xlsx`)
    const wb = new ExcelJS.Workbook()
    await wb.xlsx.load(bytes.buffer as ArrayBuffer)
    const ws = wb.getWorksheet('Timeline')!
    expect(ws.getCell('A1').value).toBe('EXERCISE — EXERCISE — EXERCISE')
    const rows: unknown[][] = []
    ws.eachRow((row, n) => { if (n > 4) rows.push((row.values as unknown[]).slice(1)) })
    expect(rows.map(r => r[0])).toEqual(json.rows.map((r: { seq: number }) => r.seq))
    expect(rows.map(r => r[9])).toEqual(json.rows.map((r: { summary: string }) => r.summary.replace(/^([=+\-@])/, '\'$1')))
    expect(rows.find(r => r[4] === 'response.submitted')![10]).toBe(`'${FORMULA}`)
  })
})
