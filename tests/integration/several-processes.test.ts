// More than one process: two servers on one SQLite file (WAL) with the Socket.IO Redis adapter
// between them (Debian's redis-server on a free port). A member connected to process A receives
// an inject released through process B; exactly one process runs the scheduler (the lease): while
// the holder is frozen (SIGSTOP) nothing is released until its lease expires, then the other
// process takes over, and the frozen one, woken, stays out. No release happens twice.
import { spawn, type ChildProcess } from 'node:child_process'
import { createConnection } from 'node:net'
import Database from 'better-sqlite3'
import { io, type Socket } from 'socket.io-client'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { freePort } from '../support/ports'
import { DEMO } from '../support/client'
import { until } from '../support/live'
import { demoScenario, drillScenario, Http, importScenario, sleep, TestServer } from '../support/test-server'
import type { Scenario } from '../../shared/scenario'

interface Ev { seq: number; type: string; data: any } // eslint-disable-line @typescript-eslint/no-explicit-any -- payloads of every type

const LEASE_MS = 3000
let redis: ChildProcess | undefined
let a: TestServer
let b: TestServer
let exerciseId = ''
let scenario: Scenario
const sockets: Socket[] = []

function lease(file: string): { holder: string; expiresAt: number } | undefined {
  const db = new Database(file, { readonly: true })
  try {
    return db.prepare('select holder, expires_at as expiresAt from scheduler_leases where name = ?').get('scheduler') as {
      holder: string
      expiresAt: number
    } | undefined
  }
  finally { db.close() }
}
function releases(file: string): string[] {
  const db = new Database(file, { readonly: true })
  try {
    return (db.prepare(`select json_extract(payload, '$.key') as key from exercise_events where exercise_id = ? and type = 'inject.released' order by seq`).all(exerciseId) as Array<{ key: string }>).map(r => r.key)
  }
  finally { db.close() }
}

/** Whether no process is inside a write transaction on the file now. */
function writeLockFree(file: string): boolean {
  const db = new Database(file)
  try {
    db.pragma('busy_timeout = 0')
    db.exec('BEGIN IMMEDIATE')
    db.exec('ROLLBACK')
    return true
  }
  catch { return false }
  finally { db.close() }
}

function follow(server: TestServer, cookie: string) {
  const s = io(
    server.base,
    {
      path: '/socket.io/',
      transports: ['websocket'],
      forceNew: true,
      reconnection: false,
      extraHeaders: { cookie },
      auth: { exerciseId, lastSeq: 0 },
    },
  )
  sockets.push(s)
  const seen: Array<Ev & { at: number }> = []
  s.on('event', (e: Ev) => seen.push({ ...e, at: Date.now() }))
  return { seen, ready: new Promise<void>((ok, fail) => { s.once('live:ready', () => ok()); s.once('connect_error', fail) }) }
}

beforeAll(async () => {
  const port = await freePort()
  redis = spawn(
    '/usr/bin/redis-server',
    ['--port', String(port), '--bind', '127.0.0.1', '--save', '', '--appendonly', 'no'],
    { stdio: 'ignore' },
  )
  await until(() => new Promise<boolean>((ok) => {
    const c = createConnection(port, '127.0.0.1', () => { c.end(); ok(true) })
    c.on('error', () => ok(false))
  }), 10_000, 'redis-server')
  const env = { NUXT_REDIS_URL: `redis://127.0.0.1:${port}`, NUXT_SCHEDULER_INTERVAL_MS: '100', NUXT_SCHEDULER_LEASE_MS: String(LEASE_MS) }
  // The first process migrates and seeds; the second opens the same file.
  a = await new TestServer({ env, stderr: 'capture' }).init()
  await a.start()
  b = await new TestServer({ env, dbPath: a.dbPath, seed: false, stderr: 'capture' }).init()
  await b.start()
}, 120_000)

afterAll(async () => {
  for (const s of sockets) s.close()
  for (const s of [b, a]) if (s?.pid) process.kill(s.pid, 'SIGCONT')
  await b?.dispose()
  await a?.dispose()
  if (redis && redis.exitCode === null) {
    redis.kill('SIGTERM')
    await new Promise(r => redis!.once('exit', r))
  }
})

describe('two processes behind one address', () => {
  it('a member on process A receives what is released through process B, and only the lease holder schedules', async () => {
    const facilitatorB = await Http.signIn(b.base, DEMO.facilitator)
    const science = await Http.signIn(a.base, DEMO.science)
    scenario = drillScenario((await demoScenario(facilitatorB)).document, 'cluster-drill', 16)
    const id = await importScenario(facilitatorB, scenario)
    exerciseId = (await facilitatorB.post(`/api/scenarios/${id}/exercises`, { title: 'Cluster drill' })).json.id
    expect((await facilitatorB.post(
      `/api/exercises/${exerciseId}/members`,
      { email: DEMO.science, role: 'player', teamKey: 'science' },
    )).status).toBe(201)

    const onA = follow(a, science.cookie)
    const onB = follow(b, science.cookie)
    await Promise.all([onA.ready, onB.ready])

    // A release by hand through B reaches the science player connected to A.
    const manual = scenario.injects.find(i => i.contingency && i.teams.includes('science'))!
    const sent = Date.now()
    const res = await facilitatorB.post(`/api/exercises/${exerciseId}/injects/${manual.key}/release`, { force: true })
    expect(res.status).toBe(201)
    const got = await until(
      () => onA.seen.find(e => e.type === 'inject.released' && e.data.key === manual.key),
      5000,
      'the release on process A',
    )
    expect(got.seq).toBe(res.json.event.seq)

    // The scheduler: one holder of the lease among the two processes.
    const scheduled = scenario.injects.filter(i => !i.contingency)
    const span = Math.max(...scheduled.map(i => Date.parse(i.at))) - Date.parse(scenario.clock.scenarioStart)
    expect((await facilitatorB.post(
      `/api/exercises/${exerciseId}/clock`,
      { action: 'start', factor: Math.round(span / 15_000) },
    )).status).toBe(200)
    await until(() => releases(a.dbPath).length >= 6, 15_000, 'the first scheduled releases')
    const first = lease(a.dbPath)!
    const pids = [a.pid, b.pid].map(String)
    const holderPid = first.holder.split('/')[1]!
    expect(pids).toContain(holderPid)
    const [holder, other] = holderPid === String(a.pid) ? [a, b] : [b, a]

    // Freeze the holder (between two writes: a process frozen inside a transaction would hold SQLite's
    // write lock); alive, it keeps the lease, and the other process leaves it alone until it expires.
    for (;;) {
      process.kill(holder.pid!, 'SIGSTOP')
      if (writeLockFree(a.dbPath)) break
      process.kill(holder.pid!, 'SIGCONT')
      await sleep(37)
    }
    const frozenAt = Date.now()
    const atFreeze = releases(a.dbPath).length
    const expiry = lease(a.dbPath)!.expiresAt
    await until(() => releases(a.dbPath).length > atFreeze, 20_000, 'a release by the other process')
    const resumedAt = Date.now()
    const taken = lease(a.dbPath)!
    expect(taken.holder.split('/')[1]).toBe(String(other.pid))
    // Nothing went out before the frozen holder's lease ran out.
    expect(resumedAt).toBeGreaterThanOrEqual(expiry - 150)
    process.kill(holder.pid!, 'SIGCONT')

    // The woken process finds the lease held by a live process and stays out; the drill plays to the end.
    const all = await until(() => {
      const keys = releases(a.dbPath)
      return keys.filter(k => k !== manual.key).length >= scheduled.length ? keys : null
    }, 40_000, 'the whole schedule')
    await sleep(LEASE_MS)
    expect(lease(a.dbPath)!.holder).toBe(taken.holder)
    expect(new Set(all).size).toBe(all.length)
    expect(new Set(all)).toEqual(new Set([manual.key, ...scheduled.map(i => i.key)]))

    // Both processes' sockets saw the whole record, each event once. Across processes the order of
    // arrival may differ from seq order (the client keeps events by seq); count how often it did.
    const record = (await science.get(`/api/exercises/${exerciseId}/events?limit=1000`)).json.events.map((e: Ev) => e.seq)
    await until(() => onA.seen.length >= record.length && onB.seen.length >= record.length, 10_000, 'every event on both sockets')
    const late = [onA, onB].map(s => s.seen.filter((e, i) => i > 0 && e.seq < s.seen[i - 1]!.seq).length)
    for (const s of [onA, onB]) {
      expect(s.seen.length).toBe(record.length)
      expect([...s.seen.map(e => e.seq)].sort((x, y) => x - y)).toEqual(record)
    }
    // A client that reconnects with the highest seq it saw is replayed the reorder window before it.
    const resumed = io(
      b.base,
      {
        path: '/socket.io/',
        transports: ['websocket'],
        forceNew: true,
        reconnection: false,
        extraHeaders: { cookie: science.cookie },
        auth: { exerciseId, lastSeq: record.at(-1) },
      },
    )
    sockets.push(resumed)
    const replayed: number[] = []
    resumed.on('event', (e: Ev) => replayed.push(e.seq))
    await new Promise(r => resumed.once('live:ready', r))
    expect(replayed.length).toBeGreaterThan(0)
    expect(replayed).toEqual(record.filter((q: number) => q >= replayed[0]!))
    for (const s of [a, b]) expect(s.log).not.toMatch(/SQLITE_BUSY|\[request error\]|\[scheduler\] exercise/)
    expect(holder.log + other.log).toMatch(/the scheduler lease went to another process/)
    console.info(`[several-processes] release through B → socket on A in ${got.at - sent} ms; holder pid ${holderPid} frozen, pid ${other.pid} took over after ${resumedAt - frozenAt} ms (lease ${LEASE_MS} ms); ${all.length} releases, none twice; events out of seq order on the sockets of A/B: ${late.join('/')}`)
  }, 120_000)
})
