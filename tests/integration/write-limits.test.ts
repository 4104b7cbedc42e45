// One person cannot bloat a drill's record or tie up the server: writes are limited per person and minute (429 with
// Retry-After), written text per exercise is capped (413, nothing stored), snapshots carry the recent window of answers,
// the replay comes a page at a time, and live connections are capped per person. Before, 4 000 answers of 10 000
// characters went in within 14 s and every snapshot then weighed 42 MB.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { closeSockets, ikey, liveSocket, ready, refused, type LiveSocket } from '../support/live'
import { demoScenario, Http, TestServer } from '../support/test-server'
import type { Scenario } from '../../shared/scenario/schema'

const RECORD_LIMIT_MB = 0.25
let server: TestServer
let facilitator: Http
let science: Http
let evaluator: Http
let id: string
let scenario: Scenario
let injectKey: string

beforeAll(async () => {
  server = await new TestServer({ stderr: 'ignore', env: { NUXT_RECORD_LIMIT_MB: String(RECORD_LIMIT_MB), NUXT_WRITE_LIMIT_PER_MINUTE: '' } }).init()
  await server.start()
  facilitator = await Http.signIn(server.base, 'facilitator@brinkwater.test')
  science = await Http.signIn(server.base, 'science@brinkwater.test')
  evaluator = await Http.signIn(server.base, 'evaluator@brinkwater.test')
  const demo = await demoScenario(facilitator)
  scenario = demo.document
  id = (await facilitator.post(`/api/scenarios/${demo.id}/exercises`, { title: 'Limits drill' })).json.id
  for (const [email, role, teamKey] of [['science@brinkwater.test', 'player', 'science'], ['evaluator@brinkwater.test', 'evaluator', null]]) {
    expect((await facilitator.post(`/api/exercises/${id}/members`, { email, role, teamKey })).status).toBe(201)
  }
  const inject = scenario.injects.find(i => i.decision && i.teams.includes('science') && !i.contingency)!
  injectKey = inject.key
  for (const s of scenario.solutions.filter(s => Date.parse(s.releaseAt) <= Date.parse(inject.at))) {
    expect((await facilitator.post(`/api/exercises/${id}/solutions/${s.key}/publish`, {})).status).toBe(201)
  }
  expect((await facilitator.post(`/api/exercises/${id}/injects/${injectKey}/release`, {})).status).toBeLessThan(300)
}, 120_000)
afterAll(async () => {
  closeSockets()
  await server?.dispose()
})

describe('write limits', () => {
  it('takes 120 writes a minute from one person, then answers 429 with Retry-After; nothing of the refused is stored', async () => {
    const answer = () => science.post(`/api/exercises/${id}/responses`, { injectKey, text: `Shelter the harbour. ${'x'.repeat(900)}`, idempotencyKey: ikey() })
    const statuses: number[] = []
    let refusedOne: Awaited<ReturnType<typeof answer>> | null = null
    for (let i = 0; i < 130; i++) {
      const r = await answer()
      statuses.push(r.status)
      if (r.status === 429) refusedOne ??= r
    }
    expect(statuses.filter(s => s === 201)).toHaveLength(120)
    expect(statuses.slice(120).every(s => s === 429)).toBe(true)
    expect(Number(refusedOne!.headers.get('retry-after'))).toBeGreaterThan(0)
    expect(refusedOne!.json.message).toMatch(/Too many changes in a minute \(120 per person\)\. Nothing was saved/)
    const events = (await facilitator.get(`/api/exercises/${id}/events?limit=1000`)).json.events as Array<{ type: string }>
    expect(events.filter(e => e.type === 'response.submitted')).toHaveLength(120)
    // Another person is not held back by it.
    expect((await evaluator.post(`/api/exercises/${id}/observations`, { text: 'Science answered fast.', idempotencyKey: ikey() })).status)
      .toBe(201)
  }, 60_000)

  it('refuses written text past the record\'s cap with 413 (record-full), and stores nothing more', async () => {
    const before = (await facilitator.get(`/api/exercises/${id}/events?limit=1000`)).json.events.length as number
    let full: Awaited<ReturnType<Http['post']>> | null = null
    let stored = 0
    for (let i = 0; i < 40 && !full; i++) {
      const r = await evaluator.post(`/api/exercises/${id}/observations`, { text: `Note ${i}: ${'y'.repeat(9_900)}`, idempotencyKey: ikey() })
      if (r.status === 413) full = r
      else {
        expect(r.status).toBe(201)
        stored++
      }
    }
    expect(full).not.toBeNull()
    expect(full!.json.data.code).toBe('record-full')
    expect(full!.json.message).toMatch(/record is full/)
    // 0.25 MB holds the 120 answers of about 1 kB and some 12 notes of 10 kB, not 40.
    expect(stored).toBeGreaterThan(5)
    expect(stored).toBeLessThan(25)
    const after = (await facilitator.get(`/api/exercises/${id}/events?limit=1000`)).json.events.length as number
    expect(after).toBe(before + stored)
    // The drill goes on: the facilitator's clock is not written text.
    expect((await facilitator.post(`/api/exercises/${id}/clock`, { action: 'start', factor: 1 })).status).toBe(200)
  }, 60_000)
})

describe('windows and pages', () => {
  it('sends the latest 30 answers of an inject in a snapshot and says how many it left out', async () => {
    const room = (await science.get(`/api/exercises/${id}/live`)).json
    const inject = room.injects.find((i: { key: string }) => i.key === injectKey)
    expect(inject.responses).toHaveLength(30)
    expect(inject.earlierResponses).toBe(90)
    const desk = (await facilitator.get(`/api/exercises/${id}/live`)).json
    expect(desk.observations.length + desk.earlierObservations).toBeGreaterThan(5)
  })

  it('gives the replay a page at a time; the pages put together are the whole record', async () => {
    const whole = (await facilitator.get(`/api/exercises/${id}/events?limit=1000`)).json.events.map((e: { seq: number }) => e.seq)
    const seqs: number[] = []
    let after = 0
    for (let pages = 0; ; pages++) {
      expect(pages).toBeLessThan(10)
      const page = (await facilitator.get(`/api/exercises/${id}/review/replay?after=${after}&limit=50`)).json
      expect(page.events.length).toBeLessThanOrEqual(50)
      seqs.push(...page.events.map((e: { seq: number }) => e.seq))
      if (!page.more) break
      after = seqs.at(-1)!
    }
    expect(seqs).toEqual(whole)
  })
})

describe('live connections per person', () => {
  it('accepts 12 of one person, refuses the 13th, and accepts again once one closes; the replay comes whole', async () => {
    const sockets: LiveSocket[] = []
    for (let i = 0; i < 12; i++) sockets.push(liveSocket(science.cookie, { exerciseId: id, lastSeq: 0 }, server.base))
    await Promise.all(sockets.map(s => ready(s)))
    const visible = (await science.get(`/api/exercises/${id}/events?limit=1000`)).json.events.length
    expect(sockets[0]!.events).toHaveLength(visible)
    expect(await refused(liveSocket(science.cookie, { exerciseId: id, lastSeq: 0 }, server.base))).toBe('too-many-connections')
    // Someone else is not affected.
    await ready(liveSocket(evaluator.cookie, { exerciseId: id, lastSeq: 0 }, server.base))
    sockets[0]!.socket.close()
    await new Promise(r => setTimeout(r, 300))
    await ready(liveSocket(science.cookie, { exerciseId: id, lastSeq: 0 }, server.base))
  }, 60_000)
})
