// The inject list as a spreadsheet: export as XLSX and CSV, import each back to the same injects; a broken row is
// reported by row and column and changes nothing; only those who may edit the scenario may export or import.
import ExcelJS from 'exceljs'
import Papa from 'papaparse'
import { beforeAll, describe, expect, it } from 'vitest'
import { as, baseUrl, Client } from '../support/client'
import type { Scenario } from '../../shared/scenario'

let fac: Client
let id: string
let original: Scenario

async function download(c: Client, path: string) {
  const res = await fetch(`${baseUrl()}${path}`, { headers: { cookie: c.cookieHeader } })
  return { status: res.status, headers: res.headers, bytes: new Uint8Array(await res.arrayBuffer()) }
}

function upload(c: Client, bytes: Uint8Array | string, filename: string, query = '') {
  const form = new FormData()
  form.append('file', new Blob([bytes]), filename)
  return c.request('POST', `/api/scenarios/${id}/msel${query}`, form)
}

async function current() {
  const res = await fac.get(`/api/scenarios/${id}`)
  return { revision: res.json.revision as number, document: res.json.document as Scenario }
}

beforeAll(async () => {
  fac = await as('facilitator')
  const demo = (await fac.get('/api/scenarios')).json.find((s: { key: string }) => s.key === 'demo-ocean-impact')
  const copy = await fac.post(`/api/scenarios/${demo.id}/duplicate`)
  expect(copy.status).toBeLessThan(300)
  id = copy.json.id
  // Text a spreadsheet would run as a formula, to see it defused on the way out and back exactly on the way in.
  const { revision, document } = await current()
  document.injects[0]!.title = '=HYPERLINK("http://attacker.example","click")'
  document.injects[1]!.body = `-1 is where the count starts.\n${document.injects[1]!.body}`
  const put = await fac.put(`/api/scenarios/${id}`, { revision, document })
  expect(put.status, put.text.slice(0, 300)).toBe(200)
  original = put.json.document
}, 60_000)

describe('export and import back', () => {
  it('XLSX: one row per inject, formulas defused; importing it gives the same injects', async () => {
    const file = await download(fac, `/api/scenarios/${id}/msel.xlsx`)
    expect(file.status).toBe(200)
    expect(file.headers.get('content-type')).toMatch(/spreadsheetml/)
    expect(file.headers.get('content-disposition')).toMatch(/-injects\.xlsx"/)
    const wb = new ExcelJS.Workbook()
    await wb.xlsx.load(Buffer.from(file.bytes) as unknown as ExcelJS.Buffer)
    const ws = wb.getWorksheet('Injects')!
    expect(ws.getRow(5).getCell(1).value).toBe('Key')
    expect(ws.rowCount).toBe(5 + original.injects.length)
    expect(ws.getRow(6).getCell(6).value).toBe(`'${original.injects[0]!.title}`)

    const before = await current()
    const res = await upload(fac, file.bytes, 'list.xlsx', `?revision=${before.revision}`)
    expect(res.status, res.text.slice(0, 500)).toBe(200)
    expect(res.json.revision).toBe(before.revision + 1)
    const after = await current()
    expect(after.document.injects).toEqual(original.injects)
    expect(after.document).toEqual(original)
  })

  it('CSV: the same, with the separator a spreadsheet chose', async () => {
    const file = await download(fac, `/api/scenarios/${id}/msel.csv`)
    expect(file.status).toBe(200)
    expect(file.headers.get('content-type')).toMatch(/text\/csv/)
    const text = new TextDecoder().decode(file.bytes)
    expect(text).toContain('"\'=HYPERLINK(""http://attacker.example"",""click"")"')
    const res = await upload(fac, file.bytes, 'list.csv')
    expect(res.status, res.text.slice(0, 500)).toBe(200)
    expect((await current()).document.injects).toEqual(original.injects)

    const rows = Papa.parse<string[]>(text.replace(/^\uFEFF/, '')).data
    const semicolons = Papa.unparse(rows, { delimiter: ';', newline: '\r\n' })
    const again = await upload(fac, semicolons, 'list.csv')
    expect(again.status, again.text.slice(0, 500)).toBe(200)
    expect((await current()).document.injects).toEqual(original.injects)
  })
})

describe('a broken file', () => {
  it('CSV: reports row and column and stores nothing', async () => {
    const before = await current()
    const text = new TextDecoder().decode((await download(fac, `/api/scenarios/${id}/msel.csv`)).bytes).replace(/^\uFEFF/, '')
    const rows = Papa.parse<string[]>(text).data
    rows[6]![3] = 'science; nobody'
    rows[7]![1] = 'soon'
    const res = await upload(fac, Papa.unparse(rows), 'broken.csv')
    expect(res.status).toBe(400)
    expect(res.json.message).toMatch(/nothing was saved/)
    expect(res.json.data.errors).toEqual(expect.arrayContaining([
      expect.objectContaining({ row: 7, column: 'Teams', cell: 'D7', message: expect.stringMatching(/nobody/) }),
      expect.objectContaining({ row: 8, column: 'Time', cell: 'B8' }),
    ]))
    expect(await current()).toEqual(before)
  })

  it('XLSX: a formula, an unknown attachment and a stale revision', async () => {
    const before = await current()
    const wb = new ExcelJS.Workbook()
    await wb.xlsx.load(Buffer.from((await download(fac, `/api/scenarios/${id}/msel.xlsx`)).bytes) as unknown as ExcelJS.Buffer)
    const ws = wb.getWorksheet('Injects')!
    ws.getCell('O6').value = '* No such file.pdf'
    const bad = await upload(fac, new Uint8Array(await wb.xlsx.writeBuffer()), 'broken.xlsx')
    expect(bad.status).toBe(400)
    expect(bad.json.data.errors).toEqual([expect.objectContaining({ row: 6, column: 'Attachments', message: expect.stringMatching(/No such file/) })])
    ws.getCell('O6').value = ''
    ws.getCell('F7').value = { formula: '1+1', result: 2 }
    const formula = await upload(fac, new Uint8Array(await wb.xlsx.writeBuffer()), 'broken.xlsx')
    expect(formula.status).toBe(400)
    expect(formula.json.data.errors).toEqual([expect.objectContaining({ row: 7, cell: 'F7', message: expect.stringMatching(/formula/) })])
    expect(await current()).toEqual(before)

    const good = await download(fac, `/api/scenarios/${id}/msel.xlsx`)
    const stale = await upload(fac, good.bytes, 'list.xlsx', `?revision=${before.revision - 1}`)
    expect(stale.status).toBe(409)
    expect(await current()).toEqual(before)
  })

  it('neither a workbook nor text, or no file at all: 400', async () => {
    const junk = await upload(fac, new Uint8Array([0xd0, 0xcf, 0x11, 0xe0, 0, 0, 0xff, 0xfe]), 'old.xls')
    expect(junk.status).toBe(400)
    expect(junk.json.data.errors[0]).toMatchObject({ row: null, column: null })
    const noHeader = await upload(fac, 'just,some\ntext,here\n', 'x.csv')
    expect(noHeader.status).toBe(400)
    expect(noHeader.json.data.errors[0].message).toMatch(/header/)
    // A workbook whose parts claim to unpack to gigabytes is refused before it is opened.
    const xlsx = Buffer.from((await download(fac, `/api/scenarios/${id}/msel.xlsx`)).bytes)
    const central = xlsx.indexOf(Buffer.from([0x50, 0x4b, 0x01, 0x02]))
    xlsx.writeUInt32LE(0x7fff_0000, central + 24)
    const bomb = await upload(fac, new Uint8Array(xlsx), 'bomb.xlsx')
    expect(bomb.status).toBe(400)
    expect(bomb.json.message).toMatch(/unpacks/)
    const empty = await fac.request('POST', `/api/scenarios/${id}/msel`, new FormData())
    expect(empty.status).toBe(400)
  })
})

describe('who may', () => {
  it('players and evaluators get 403 on export and import; the scenario is unchanged', async () => {
    const before = await current()
    const file = await download(fac, `/api/scenarios/${id}/msel.csv`)
    for (const who of ['science', 'evaluator'] as const) {
      const c = await as(who)
      expect((await download(c, `/api/scenarios/${id}/msel.xlsx`)).status).toBe(403)
      expect((await download(c, `/api/scenarios/${id}/msel.csv`)).status).toBe(403)
      expect((await upload(c, file.bytes, 'list.csv')).status).toBe(403)
    }
    expect((await upload(new Client(), file.bytes, 'list.csv')).status).toBe(401)
    expect(await current()).toEqual(before)
  })
})
