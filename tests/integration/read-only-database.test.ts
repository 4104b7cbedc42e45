// A database that cannot be written: health says so (it said ok), writes answer 503 with a clear message (they were
// bare 500s), and the scheduler's failing loop is logged once a minute (it logged every 250 ms). The read-only state
// comes from the maintenance switch NUXT_DB_READ_ONLY=1 (SQLite query_only: the same SQLITE_READONLY a read-only file
// gives; a file's mode cannot be used here, as tests may run as root).
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { demoScenario, Http, TestServer } from '../support/test-server'

let server: TestServer
let readOnly: TestServer

beforeAll(async () => {
  server = await new TestServer({ stderr: 'ignore' }).init()
  await server.start()
  // A running drill, so that the scheduler has work (and fails at it) once the database is read-only.
  const facilitator = await Http.signIn(server.base, 'facilitator@brinkwater.test')
  const demo = await demoScenario(facilitator)
  const id = (await facilitator.post(`/api/scenarios/${demo.id}/exercises`, { title: 'Read-only drill' })).json.id
  expect((await facilitator.post(`/api/exercises/${id}/clock`, { action: 'start', factor: 60 })).status).toBe(200)
  await server.stop()
  readOnly = await new TestServer({ stderr: 'capture', dbPath: server.dbPath, seed: false, env: { NUXT_DB_READ_ONLY: '1' } }).init()
  await readOnly.start({ degradedOk: true })
}, 120_000)
afterAll(async () => {
  await readOnly?.kill()
  await server?.dispose()
})

describe('a database that cannot be written', () => {
  it('is reported by /api/health as degraded (503), promptly', async () => {
    const t0 = performance.now()
    const res = await fetch(`${readOnly.base}/api/health`)
    expect(performance.now() - t0).toBeLessThan(1000)
    expect(res.status).toBe(503)
    const body = await res.json()
    expect(body.status).toBe('degraded')
    expect(body.database).toMatch(/SQLITE_READONLY/)
  })

  it('answers writes with 503 and a clear message; reads still work', async () => {
    const facilitator = await Http.signIn(readOnly.base, 'facilitator@brinkwater.test')
    expect((await facilitator.get('/api/scenarios')).status).toBe(200)
    const res = await facilitator.post('/api/scenarios', { title: 'Cannot be saved' })
    expect(res.status).toBe(503)
    expect(res.json.message).toMatch(/cannot be written/)
  })

  it('logs the scheduler\'s failures once a minute, not on every tick', async () => {
    await new Promise(r => setTimeout(r, 2000))
    const lines = readOnly.log.split('\n').filter(l => l.includes('[scheduler]') || l.includes('[db]'))
    expect(lines.length).toBeGreaterThan(0)
    expect(lines.filter(l => l.includes('[scheduler]')).length).toBeLessThanOrEqual(2)
  })
})
