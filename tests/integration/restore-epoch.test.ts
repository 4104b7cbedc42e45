// After a restore from backup the event record starts again from the backup's sequence numbers; pages that followed
// the live record must notice and replay (before, they silently dropped new events whose numbers they had seen). The
// record carries an epoch in live:ready; every backup copy gets a new one.
import { rmSync, writeFileSync } from 'node:fs'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { demoScenario, Http, TestServer } from '../support/test-server'
import { liveSocket, ready, closeSockets } from '../support/live'

let server: TestServer
let facilitator: Http
let exerciseId: string

beforeAll(async () => {
  server = await new TestServer({ stderr: 'ignore' }).init()
  await server.start()
  facilitator = await Http.signIn(server.base, 'facilitator@brinkwater.test')
  const demo = await demoScenario(facilitator)
  exerciseId = (await facilitator.post(`/api/scenarios/${demo.id}/exercises`, { title: 'Restore drill' })).json.id
}, 90_000)
afterAll(async () => {
  closeSockets()
  await server?.dispose()
})

describe('a restore from backup', () => {
  it('gives the record a new epoch, so that open pages replay from scratch', async () => {
    const first = liveSocket(facilitator.cookie, { exerciseId, lastSeq: 0 }, server.base)
    const before = await ready(first)
    expect(before.epoch).toMatch(/^[0-9a-f-]{36}$/)
    // Another process on the same file sees the same epoch (it belongs to the database, not the process).
    const again = liveSocket(facilitator.cookie, { exerciseId, lastSeq: 0 }, server.base)
    expect((await ready(again)).epoch).toBe(before.epoch)
    closeSockets()

    const admin = await Http.signIn(server.base, 'admin@brinkwater.test')
    const res = await fetch(`${server.base}/api/admin/backup`, { headers: { cookie: admin.cookie } })
    expect(res.status).toBe(200)
    const bytes = Buffer.from(await res.arrayBuffer())
    // The documented restore: stop, put the copy in place of the file (without the old WAL), start.
    await server.stop()
    for (const ext of ['-wal', '-shm']) rmSync(`${server.dbPath}${ext}`, { force: true })
    writeFileSync(server.dbPath, bytes)
    await server.start()

    const facilitator2 = await Http.signIn(server.base, 'facilitator@brinkwater.test')
    const after = await ready(liveSocket(facilitator2.cookie, { exerciseId, lastSeq: before.lastSeq }, server.base))
    expect(after.epoch).toMatch(/^[0-9a-f-]{36}$/)
    expect(after.epoch).not.toBe(before.epoch)
  }, 90_000)
})
