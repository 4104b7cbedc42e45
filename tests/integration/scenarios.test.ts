import { readFileSync } from 'node:fs'
import { resolve } from 'node:path'
import { beforeAll, describe, expect, it } from 'vitest'
import { parse } from 'yaml'
import { as, Client, type DemoKey } from '../support/client'

const root = resolve(import.meta.dirname, '../..')
let library: Array<{ id: string; key: string; title: string }> = []
const byKey = (key: string) => library.find(s => s.key === key)!

function fileForm(text: string | Uint8Array, filename = 'scenario.yaml', type = 'application/yaml') {
  const form = new FormData()
  form.append('file', new Blob([text], { type }), filename)
  return form
}

beforeAll(async () => {
  const res = await (await as('facilitator')).get('/api/scenarios')
  expect(res.status).toBe(200)
  library = res.json
})

describe('the library', () => {
  it('holds every file of the scenarios folder after the seed', () => {
    expect(library.map(s => s.key)).toEqual(expect.arrayContaining(['demo-ocean-impact', 'demo-coastal-airburst']))
  })

  const REFUSED: DemoKey[] = ['science', 'civil', 'comms', 'evaluator', 'analyst']
  for (const who of REFUSED) {
    it(`${who} can neither read nor change scenarios (403)`, async () => {
      const c = await as(who)
      const id = byKey('demo-ocean-impact').id
      expect((await c.get('/api/scenarios')).status).toBe(403)
      expect((await c.get(`/api/scenarios/${id}`)).status).toBe(403)
      expect((await c.get(`/api/scenarios/${id}/export`)).status).toBe(403)
      expect((await c.put(`/api/scenarios/${id}`, { revision: 1, document: {} })).status).toBe(403)
      expect((await c.delete(`/api/scenarios/${id}`)).status).toBe(403)
      expect((await c.post('/api/scenarios', { title: 'Mine' })).status).toBe(403)
      expect((await c.request('POST', '/api/scenarios/import', fileForm('format: x'))).status).toBe(403)
      expect((await c.post(`/api/scenarios/${id}/exercises`, { title: 'Mine' })).status).toBe(403)
    })
  }

  it('anonymous callers get 401 before any validation', async () => {
    const c = new Client()
    expect((await c.get('/api/scenarios')).status).toBe(401)
    expect((await c.put('/api/scenarios/not-an-id', {})).status).toBe(401)
    expect((await c.request('POST', '/api/scenarios/import', fileForm('x'))).status).toBe(401)
  })

  it('the admin may use the library', async () => {
    expect((await (await as('admin')).get('/api/scenarios')).status).toBe(200)
  })
})

describe('files', () => {
  for (const key of ['demo-ocean-impact', 'demo-coastal-airburst']) {
    it(`${key}: export then re-import gives an identical document`, async () => {
      const c = await as('facilitator')
      const { id } = byKey(key)
      const before = (await c.get(`/api/scenarios/${id}`)).json
      const exported = await c.get(`/api/scenarios/${id}/export`)
      expect(exported.status).toBe(200)
      expect(exported.headers.get('content-disposition')).toContain(`${key}.yaml`)
      expect(parse(exported.text).key).toBe(key)

      const refused = await c.request('POST', '/api/scenarios/import', fileForm(exported.text))
      expect(refused.status).toBe(409)
      const copy = await c.request('POST', '/api/scenarios/import?onConflict=copy', fileForm(exported.text))
      expect(copy.status).toBe(201)
      expect(copy.json.key).not.toBe(key)
      const copied = (await c.get(`/api/scenarios/${copy.json.id}`)).json
      expect({ ...copied.document, key }).toEqual(before.document)
      expect((await c.delete(`/api/scenarios/${copy.json.id}`)).status).toBe(204)

      const replaced = await c.request('POST', '/api/scenarios/import?onConflict=replace', fileForm(exported.text))
      expect(replaced.status).toBe(201)
      expect(replaced.json.id).toBe(id)
      expect((await c.get(`/api/scenarios/${id}`)).json.document).toEqual(before.document)
    })
  }

  it('the repository file itself imports to the stored document', async () => {
    const c = await as('facilitator')
    const text = readFileSync(resolve(root, 'scenarios/demo-coastal-airburst.yaml'), 'utf8')
    const res = await c.request('POST', '/api/scenarios/import?onConflict=copy', fileForm(text))
    expect(res.status).toBe(201)
    const stored = (await c.get(`/api/scenarios/${byKey('demo-coastal-airburst').id}`)).json.document
    const imported = (await c.get(`/api/scenarios/${res.json.id}`)).json.document
    expect({ ...imported, key: stored.key }).toEqual(stored)
    await c.delete(`/api/scenarios/${res.json.id}`)
  })

  it('a malformed file is refused with line, column and path, and nothing is stored', async () => {
    const c = await as('facilitator')
    const text = readFileSync(resolve(root, 'scenarios/demo-coastal-airburst.yaml'), 'utf8')
      .replace(/^key: .*$/m, 'key: broken-import-check')
      .replace(/teams: \[([a-z-]+)/, 'teams: [ops')
    const res = await c.request('POST', '/api/scenarios/import', fileForm(text))
    expect(res.status).toBe(400)
    const issue = res.json.data.issues.find((i: { message: string }) => /unknown team "ops"/.test(i.message))
    expect(issue).toBeDefined()
    expect(issue.path).toMatch(/^injects\[\d+\]\.teams\[0\]$/)
    expect(issue.line).toBeGreaterThan(1)
    expect(issue.column).toBeGreaterThan(0)
    const after = (await c.get('/api/scenarios')).json.map((s: { key: string }) => s.key)
    expect(after).not.toContain('broken-import-check')
  })

  it('YAML syntax errors and non-UTF-8 files are refused with a position', async () => {
    const c = await as('facilitator')
    const res = await c.request('POST', '/api/scenarios/import', fileForm('format: brinkwater-scenario/1\nkey: [unclosed\n'))
    expect(res.status).toBe(400)
    expect(res.json.data.issues[0].line).toBeGreaterThanOrEqual(2)
    const binary = await c.request('POST', '/api/scenarios/import', fileForm(new Uint8Array([0xff, 0xfe, 0x00, 0x41])))
    expect(binary.status).toBe(400)
  })

  it('a file over 1 MiB is refused with 413', async () => {
    const c = await as('facilitator')
    const big = `# ${'x'.repeat(1024 * 1024 + 10)}\n`
    const res = await c.request('POST', '/api/scenarios/import', fileForm(big))
    expect(res.status).toBe(413)
  })

  it('a request without a file gets a field issue', async () => {
    const c = await as('facilitator')
    const form = new FormData()
    form.append('other', 'value')
    const res = await c.request('POST', '/api/scenarios/import', form)
    expect(res.status).toBe(400)
    expect(res.json.data.issues[0].path).toBe('file')
  })
})

describe('editing', () => {
  it('creates, saves with revision checks, refuses invalid documents whole, duplicates and deletes', async () => {
    const c = await as('facilitator')
    const created = await c.post('/api/scenarios', { title: 'Harbour drill' })
    expect(created.status).toBe(201)
    expect(created.json.key).toBe('harbour-drill')
    const id = created.json.id
    const loaded = (await c.get(`/api/scenarios/${id}`)).json
    expect(loaded.revision).toBe(1)

    const doc = structuredClone(loaded.document)
    doc.summary = 'A harbour town rehearses its warning chain.'
    const saved = await c.put(`/api/scenarios/${id}`, { revision: 1, document: doc })
    expect(saved.status).toBe(200)
    expect(saved.json.revision).toBe(2)

    const stale = await c.put(`/api/scenarios/${id}`, { revision: 1, document: doc })
    expect(stale.status).toBe(409)

    const bad = structuredClone(doc)
    bad.teams[0].colour = 'blue'
    bad.title = 'Changed title that must not be stored'
    const invalid = await c.put(`/api/scenarios/${id}`, { revision: 2, document: bad })
    expect(invalid.status).toBe(400)
    expect(invalid.json.data.issues.map((i: { path: string }) => i.path)).toContain('teams[0].colour')
    expect((await c.get(`/api/scenarios/${id}`)).json.title).toBe('Harbour drill')

    const dup = await c.post(`/api/scenarios/${id}/duplicate`)
    expect(dup.status).toBe(201)
    expect(dup.json.key).toBe('harbour-drill-copy')
    expect(dup.json.title).toBe('Harbour drill (copy)')

    const clash = structuredClone(doc)
    clash.key = 'harbour-drill-copy'
    const taken = await c.put(`/api/scenarios/${id}`, { revision: 2, document: clash })
    expect(taken.status).toBe(400)
    expect(taken.json.data.issues[0].path).toBe('key')

    expect((await c.delete(`/api/scenarios/${dup.json.id}`)).status).toBe(204)
    expect((await c.delete(`/api/scenarios/${id}`)).status).toBe(204)
    expect((await c.get(`/api/scenarios/${id}`)).status).toBe(404)
  })

  it('previews the assessment of an unsaved solution', async () => {
    const c = await as('facilitator')
    const doc = (await c.get(`/api/scenarios/${byKey('demo-ocean-impact').id}`)).json.document
    const last = doc.solutions.at(-1).solution
    const res = await c.post('/api/scenarios/preview', { solution: last, sites: doc.sites, samples: 2000 })
    expect(res.status).toBe(200)
    expect(res.json.sites).toHaveLength(doc.sites.length)
    expect(res.json.energyMt.p5).toBeLessThanOrEqual(res.json.energyMt.p50)
    expect(res.json.energyMt.p50).toBeLessThanOrEqual(res.json.energyMt.p95)
    expect(res.json.options.samples).toBe(2000)
    const again = await c.post('/api/scenarios/preview', { solution: last, sites: doc.sites, samples: 2000 })
    expect(again.json.energyMt).toEqual(res.json.energyMt)
    const bad = await c.post('/api/scenarios/preview', { solution: { ...last, impactProbability: 2 }, sites: [] })
    expect(bad.status).toBe(400)
    expect(bad.json.data.issues[0].path).toBe('solution.impactProbability')
  })
})

describe('attachments', () => {
  const PNG = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 73, 72, 68, 82])

  it('accepts allowed types by their bytes, refuses others and oversized files, and serves only to authors and members', async () => {
    const fac = await as('facilitator')
    const created = (await fac.post('/api/scenarios', { title: 'Attachment check' })).json
    const up = await fac.request('POST', `/api/scenarios/${created.id}/attachments`, fileForm(PNG, 'chart.png', 'image/png'))
    expect(up.status).toBe(201)
    expect(up.json).toMatchObject({ path: 'attachments/attachment-check/chart.png', contentType: 'image/png', size: PNG.length })

    const disguised = await fac.request(
      'POST',
      `/api/scenarios/${created.id}/attachments`,
      fileForm('<script>alert(1)</script>', 'evil.png', 'image/png'),
    )
    expect(disguised.status).toBe(415)
    const html = await fac.request('POST', `/api/scenarios/${created.id}/attachments`, fileForm('<html></html>', 'page.html', 'text/html'))
    expect(html.status).toBe(415)
    const huge = await fac.request(
      'POST',
      `/api/scenarios/${created.id}/attachments`,
      fileForm(new Uint8Array(5 * 1024 * 1024 + 1), 'big.pdf', 'application/pdf'),
    )
    expect(huge.status).toBe(413)
    const note = await fac.request(
      'POST',
      `/api/scenarios/${created.id}/attachments`,
      fileForm('# Notes\nPlain text.', '../../etc/notes.md', 'text/html'),
    )
    expect(note.status).toBe(201)
    expect(note.json.path).toBe('attachments/attachment-check/notes.md')
    expect(note.json.contentType).toBe('text/markdown')

    const file = await fac.get(`/api/scenarios/${created.id}/attachments/${up.json.id}`)
    expect(file.status).toBe(200)
    expect(file.headers.get('content-type')).toBe('image/png')
    expect(file.headers.get('x-content-type-options')).toBe('nosniff')
    expect((await (await as('science')).get(`/api/scenarios/${created.id}/attachments/${up.json.id}`)).status).toBe(403)

    // The frozen exercise copy serves the file to its members, and only to them.
    const started = await fac.post(`/api/scenarios/${created.id}/exercises`, { title: 'Attachment drill' })
    expect(started.status).toBe(201)
    const ex = await fac.get(`/api/exercises/${started.json.id}`)
    expect(ex.json.members).toHaveLength(1)
    const frozen = ex.json.attachments.find((a: { path: string }) => a.path.endsWith('chart.png'))
    await fac.delete(`/api/scenarios/${created.id}`)
    const served = await fac.get(`/api/exercises/${started.json.id}/attachments/${frozen.id}`)
    expect(served.status).toBe(200)
    expect(served.headers.get('content-type')).toBe('image/png')
    expect((await (await as('science')).get(`/api/exercises/${started.json.id}/attachments/${frozen.id}`)).status).toBe(404)
    expect((await new Client().get(`/api/exercises/${started.json.id}/attachments/${frozen.id}`)).status).toBe(401)
  })

  it('accepts any file name: "=" and ";" inside the quotes belong to the name (kept whole for display, sanitised for the path)', async () => {
    const fac = await as('facilitator')
    const created = (await fac.post('/api/scenarios', { title: 'Odd names' })).json
    for (const [name, path] of [['E=mc2 notes.md', 'E-mc2-notes.md'], ['a;b.md', 'a-b.md'], ['Ría Serena; día 2.md', 'Ri-a-Serena-di-a-2.md']]) {
      const up = await fac.request('POST', `/api/scenarios/${created.id}/attachments`, fileForm('# Notes', name!, 'text/markdown'))
      expect(up.status, `${name} → ${up.text}`).toBe(201)
      expect(up.json.name).toBe(name)
      expect(up.json.path).toBe(`attachments/odd-names/${path}`)
    }
  })
})

describe('starting an exercise', () => {
  it('freezes a copy: later edits to the scenario do not reach the exercise', async () => {
    const fac = await as('facilitator')
    const source = (await fac.post(`/api/scenarios/${byKey('demo-coastal-airburst').id}/duplicate`)).json
    const started = await fac.post(`/api/scenarios/${source.id}/exercises`, { title: 'Frozen copy check' })
    expect(started.status).toBe(201)
    const exerciseId = started.json.id

    const loaded = (await fac.get(`/api/scenarios/${source.id}`)).json
    const doc = structuredClone(loaded.document)
    doc.title = 'Edited after start'
    doc.teams[0].name = 'Renamed team'
    expect((await fac.put(`/api/scenarios/${source.id}`, { revision: loaded.revision, document: doc })).status).toBe(200)

    const ex = (await fac.get(`/api/exercises/${exerciseId}`)).json
    expect(ex.scenario.title).toBe(loaded.document.title)
    expect(ex.scenario.teams[0].name).toBe(loaded.document.teams[0].name)
    expect(ex.membership.role).toBe('facilitator')
    expect(ex.canManage).toBe(true)
    // Nothing of the script that players must not see travels with the exercise summary.
    expect(JSON.stringify(ex)).not.toMatch(/expectedActions/)

    expect((await fac.delete(`/api/scenarios/${source.id}`)).status).toBe(204)
    expect((await fac.get(`/api/exercises/${exerciseId}`)).json.scenario.title).toBe(loaded.document.title)
  })

  it('the facilitator adds, changes and removes members by role and team; others may not', async () => {
    const fac = await as('facilitator')
    const started = (await fac.post(`/api/scenarios/${byKey('demo-ocean-impact').id}/exercises`, { title: 'Membership check' })).json
    const id = started.id
    const teams = (await fac.get(`/api/exercises/${id}`)).json.scenario.teams.map((t: { key: string }) => t.key)

    const noTeam = await fac.post(`/api/exercises/${id}/members`, { email: 'civil@brinkwater.test', role: 'player' })
    expect(noTeam.status).toBe(400)
    expect(noTeam.json.data.issues[0].path).toBe('teamKey')
    const badTeam = await fac.post(`/api/exercises/${id}/members`, { email: 'civil@brinkwater.test', role: 'player', teamKey: 'ops' })
    expect(badTeam.status).toBe(400)
    expect(badTeam.json.data.issues[0].message).toMatch(/unknown team "ops"/)
    const nobody = await fac.post(`/api/exercises/${id}/members`, { email: 'nobody@example.test', role: 'evaluator' })
    expect(nobody.status).toBe(404)
    expect(nobody.json.data.issues[0].path).toBe('email')

    const added = await fac.post(`/api/exercises/${id}/members`, { email: 'civil@brinkwater.test', role: 'player', teamKey: teams[1] })
    expect(added.status).toBe(201)
    expect((await fac.post(`/api/exercises/${id}/members`, { email: 'civil@brinkwater.test', role: 'evaluator' })).status).toBe(409)

    const civil = await as('civil')
    expect((await civil.get(`/api/exercises/${id}`)).json.membership).toMatchObject({ role: 'player', teamKey: teams[1] })
    expect((await civil.post(`/api/exercises/${id}/members`, { email: 'comms@brinkwater.test', role: 'evaluator' })).status).toBe(403)
    expect((await civil.get(`/api/exercises/${id}`)).json.members[0].email).toBeUndefined()
    expect((await (await as('comms')).post(
      `/api/exercises/${id}/members`,
      { email: 'comms@brinkwater.test', role: 'evaluator' },
    )).status).toBe(404)

    const changed = await fac.patch(`/api/exercises/${id}/members/${added.json.userId}`, { role: 'evaluator' })
    expect(changed.status).toBe(200)
    expect(changed.json.teamKey).toBeNull()

    const me = (await fac.get('/api/me')).json.user.id
    expect((await fac.delete(`/api/exercises/${id}/members/${me}`)).status).toBe(409)
    expect((await fac.patch(`/api/exercises/${id}/members/${me}`, { role: 'analyst' })).status).toBe(409)
    expect((await fac.delete(`/api/exercises/${id}/members/${added.json.userId}`)).status).toBe(204)
    expect((await civil.get(`/api/exercises/${id}`)).status).toBe(404)
  })
})
