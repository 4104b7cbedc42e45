// Backups taken while a drill runs (clock running, scheduler releasing, players answering) are
// consistent snapshots, and the documented restore (stop the server, replace the file, delete
// -wal/-shm, start) brings back a drill that carries on: its record is the record at backup time,
// and what fell due since goes out again, once. This file runs its own server.
import { copyFileSync, existsSync, rmSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import Database from 'better-sqlite3'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { DEMO } from '../support/client'
import { until } from '../support/live'
import { demoScenario, drillScenario, Http, importScenario, sleep, TestServer } from '../support/test-server'
import type { Scenario } from '../../shared/scenario'

interface Ev { seq: number; type: string; data: any } // eslint-disable-line @typescript-eslint/no-explicit-any -- payloads of every type

const server = new TestServer({ env: { NUXT_SCHEDULER_INTERVAL_MS: '50' } })
let admin: Http, facilitator: Http, science: Http
let exerciseId = ''
let scenario: Scenario

/** The drill's tables read straight from a database file, with the checks a consistent snapshot passes. */
function snapshot(file: string) {
  const db = new Database(file, { readonly: true })
  try {
    expect(db.pragma('integrity_check', { simple: true })).toBe('ok')
    expect(db.pragma('foreign_key_check')).toEqual([])
    const events = (db.prepare('select seq, type, payload from exercise_events where exercise_id = ? order by seq').all(exerciseId) as Array<{ seq: number; type: string; payload: string }>)
      .map(e => ({ seq: e.seq, type: e.type, data: JSON.parse(e.payload) })) as Ev[]
    const injects = db.prepare('select inject_key as key, status, released_seq as seq from exercise_injects where exercise_id = ?').all(exerciseId) as Array<{ key: string; status: string; seq: number | null }>
    const solutions = db.prepare('select solution_key as key, seq from exercise_solutions where exercise_id = ?').all(exerciseId) as Array<{ key: string; seq: number }>
    const clock = db.prepare('select wall_anchor, scenario_anchor, factor, paused from exercise_clocks where exercise_id = ?').get(exerciseId) as { wall_anchor: number; scenario_anchor: number; factor: number; paused: number }
    return { events, injects, solutions, clock }
  }
  finally { db.close() }
}

/** A snapshot is one transaction's view: every release row has its event and every event its row, and the clock row is the last clock
 * event's. */
function expectConsistent(s: ReturnType<typeof snapshot>) {
  expect(s.events.map(e => e.seq)).toEqual(s.events.map((_, i) => i + 1))
  const releasedEvents = new Map(s.events.filter(e => e.type === 'inject.released').map(e => [e.data.key as string, e.seq]))
  const releasedRows = new Map(s.injects.filter(r => r.status === 'released' && !r.key.startsWith('msg-')).map(r => [r.key, r.seq]))
  expect(releasedRows).toEqual(releasedEvents)
  expect(new Map(s.solutions.map(r => [r.key, r.seq]))).toEqual(new Map(s.events.filter(e => e.type === 'solution.published').map(e => [e.data.key as string, e.seq])))
  const last = s.events.filter(e => e.type === 'clock.changed').at(-1)!.data.clock
  expect({
    wallAnchor: new Date(s.clock.wall_anchor).toISOString(),
    scenarioAnchor: new Date(s.clock.scenario_anchor).toISOString(),
    factor: s.clock.factor,
    paused: !!s.clock.paused,
  })
    .toEqual({ wallAnchor: last.wallAnchor, scenarioAnchor: last.scenarioAnchor, factor: last.factor, paused: last.paused })
}

const released = (events: Ev[]) => events.filter(e => e.type === 'inject.released').map(e => e.data.key as string)

beforeAll(async () => {
  await server.init()
  await server.start()
  admin = await Http.signIn(server.base, DEMO.admin)
  facilitator = await Http.signIn(server.base, DEMO.facilitator)
  science = await Http.signIn(server.base, DEMO.science)
  scenario = drillScenario((await demoScenario(facilitator)).document, 'backup-drill', 16)
  const id = await importScenario(facilitator, scenario)
  exerciseId = (await facilitator.post(`/api/scenarios/${id}/exercises`, { title: 'Backup drill' })).json.id
  expect((await facilitator.post(
    `/api/exercises/${exerciseId}/members`,
    { email: DEMO.science, role: 'player', teamKey: 'science' },
  )).status).toBe(201)
}, 120_000)

afterAll(async () => {
  await server.dispose()
})

describe('a backup taken while a drill runs', () => {
  it('is a consistent snapshot, and a restore from it carries the drill on, each due release once', async () => {
    const scheduled = scenario.injects.filter(i => !i.contingency)
    const span = Math.max(...scheduled.map(i => Date.parse(i.at))) - Date.parse(scenario.clock.scenarioStart)
    // The schedule plays in about 12 s: the backups fall in the middle of the releases.
    expect((await facilitator.post(
      `/api/exercises/${exerciseId}/clock`,
      { action: 'start', factor: Math.round(span / 12_000) },
    )).status).toBe(200)
    let answering = true
    const traffic = (async () => {
      for (let n = 0; answering; n++) {
        const events = (await science.get(`/api/exercises/${exerciseId}/events?limit=1000`)).json.events as Ev[]
        const keys = released(events)
        if (keys.length) await science.post(
          `/api/exercises/${exerciseId}/responses`,
          { injectKey: keys[n % keys.length], text: `answer ${n}`, idempotencyKey: `backup-${n}-answer` },
        )
        await sleep(30)
      }
    })()

    const backups: string[] = []
    for (const wait of [2500, 2000, 2000]) {
      await sleep(wait)
      const res = await fetch(`${server.base}/api/admin/backup`, { headers: { cookie: admin.cookie } })
      expect(res.status).toBe(200)
      const file = join(server.dir, `backup-${backups.length}.sqlite`)
      writeFileSync(file, new Uint8Array(await res.arrayBuffer()))
      backups.push(file)
    }
    const shots = backups.map(snapshot)
    for (const s of shots) expectConsistent(s)
    // Taken mid-drill: each later backup holds more of the schedule than the one before, and not all of it.
    const counts = shots.map(s => released(s.events).length)
    expect(counts[0]).toBeGreaterThan(0)
    expect(counts[1]).toBeGreaterThan(counts[0]!)
    expect(counts[2]).toBeGreaterThan(counts[1]!)
    expect(counts[0]).toBeLessThan(scheduled.length)
    expect(shots.every(s => s.events.some(e => e.type === 'response.submitted'))).toBe(true)

    // The drill goes on past the middle backup, then the documented restore: stop, replace the file, delete -wal/-shm, start.
    await sleep(1000)
    answering = false
    await traffic
    const middle = shots[1]!
    const beforeRestore = snapshot(server.dbPath)
    expect(beforeRestore.events.length).toBeGreaterThan(middle.events.length)
    await server.stop()
    copyFileSync(backups[1]!, server.dbPath)
    for (const suffix of ['-wal', '-shm']) rmSync(`${server.dbPath}${suffix}`, { force: true })
    expect(existsSync(`${server.dbPath}-wal`)).toBe(false)
    await server.start()
    facilitator = await Http.signIn(server.base, DEMO.facilitator)

    const restored = (await facilitator.get(`/api/exercises/${exerciseId}/events?limit=1000`)).json.events as Ev[]
    expect(restored.slice(0, middle.events.length).map(e => [e.seq, e.type])).toEqual(middle.events.map(e => [e.seq, e.type]))
    // The clock runs on from the restored anchors, so what fell due after the backup goes out again, once.
    const final = await until(async () => {
      const events = (await facilitator.get(`/api/exercises/${exerciseId}/events?limit=1000`)).json.events as Ev[]
      return released(events).length >= scheduled.length ? events : null
    }, 30_000, 'the rest of the schedule after the restore')
    expect(new Set(released(final))).toEqual(new Set(scheduled.map(i => i.key)))
    expect(released(final).length).toBe(scheduled.length)
    await server.stop()
    expectConsistent(snapshot(server.dbPath))
    console.info(`[backup-during-drill] 3 backups mid-drill (${counts.join(', ')} of ${scheduled.length} injects released), restored from the second (${middle.events.length} events), drill completed once`)
  }, 120_000)
})
