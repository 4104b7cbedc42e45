// An aborted backup download leaves no copy of the database behind in the temporary folder (before, each one left a
// full copy). Own server with its own TMPDIR, so that only its copies are counted.
import { mkdtempSync, readdirSync, rmSync } from 'node:fs'
import { request } from 'node:http'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { until } from '../support/live'
import { Http, TestServer } from '../support/test-server'

let server: TestServer
let tmp: string

beforeAll(async () => {
  tmp = mkdtempSync(join(tmpdir(), 'brinkwater-tmp-'))
  server = await new TestServer({ stderr: 'ignore', env: { TMPDIR: tmp } }).init()
  await server.start()
}, 90_000)
afterAll(async () => {
  await server?.dispose()
  rmSync(tmp, { recursive: true, force: true })
})

const copies = () => readdirSync(tmp).filter(n => n.startsWith('brinkwater-backup-'))

describe('backup downloads', () => {
  it('removes the temporary copy when the client aborts the download after the first bytes', async () => {
    const admin = await Http.signIn(server.base, 'admin@brinkwater.test')
    for (let k = 0; k < 5; k++) {
      await new Promise<void>((resolve, reject) => {
        const req = request(new URL('/api/admin/backup', server.base), { headers: { cookie: admin.cookie } })
        req.on('response', (res) => {
          expect(res.statusCode).toBe(200)
          res.once('data', () => { req.destroy(); resolve() })
        })
        req.on('error', (e) => { if (!req.destroyed) reject(e) })
        req.end()
      })
    }
    await until(() => copies().length === 0, 5000, 'no backup copies left')
    // A complete download cleans up too.
    const full = await admin.call('GET', '/api/admin/backup')
    expect(full.status).toBe(200)
    await until(() => copies().length === 0, 5000, 'no backup copies left after a full download')
  }, 60_000)
})
