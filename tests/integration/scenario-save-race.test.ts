// Two processes on one database file, two saves of the same scenario revision at the same moment: exactly one wins,
// the other gets 409 (before, both were accepted in 22 of 30 rounds and one author's edits were silently lost).
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { demoScenario, Http, importScenario, TestServer } from '../support/test-server'
import type { Scenario } from '../../shared/scenario'

let a: TestServer, b: TestServer
let onA: Http, onB: Http
let id: string
let doc: Scenario

beforeAll(async () => {
  a = await new TestServer({ stderr: 'ignore' }).init()
  await a.start()
  b = await new TestServer({ stderr: 'ignore', dbPath: a.dbPath, seed: false }).init()
  await b.start()
  onA = await Http.signIn(a.base, 'facilitator@brinkwater.test')
  onB = await Http.signIn(b.base, 'facilitator@brinkwater.test')
  doc = { ...(await demoScenario(onA)).document, key: 'save-race' }
  id = await importScenario(onA, doc)
}, 120_000)
afterAll(async () => { await b?.kill(); await a?.dispose() })

describe('two saves of one revision from two processes', () => {
  it('accepts exactly one of each pair and answers the other 409; no revision is skipped', async () => {
    let revision = (await onA.get(`/api/scenarios/${id}`)).json.revision as number
    for (let round = 0; round < 30; round++) {
      const put = (c: Http, who: string) => c.call('PUT', `/api/scenarios/${id}`, { revision, document: { ...doc, title: `Save race ${who} ${round}` } })
      const [ra, rb] = await Promise.all([put(onA, 'A'), put(onB, 'B')])
      expect([ra.status, rb.status].sort(), ra.text.slice(0, 300)).toEqual([200, 409])
      const won = ra.status === 200 ? ra : rb
      expect(won.json.revision).toBe(revision + 1)
      revision++
    }
    expect((await onB.get(`/api/scenarios/${id}`)).json.revision).toBe(revision)
  }, 120_000)
})
