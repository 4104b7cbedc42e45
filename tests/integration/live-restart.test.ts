// A server killed mid-drill (SIGKILL) and restarted on the same database: no event is lost, no inject
// is released twice, the clock carries on, and what fell due while it was down goes out once.
// This file runs its own server (own SQLite file and ports), not the shared one.
import { spawn, type ChildProcess } from 'node:child_process'
import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { io } from 'socket.io-client'
import { freePort } from '../support/ports'
import { DEMO, DEMO_PASSWORD } from '../support/client'
import { until } from '../support/live'

const dir = mkdtempSync(join(tmpdir(), 'brinkwater-restart-'))
let base = ''
let env: NodeJS.ProcessEnv = {}
let server: ChildProcess | undefined

async function startServer() {
  server = spawn(
    process.execPath,
    [resolve(import.meta.dirname, '../..', process.env.BW_OUTPUT_DIR || '.output', 'server/index.mjs')],
    { env, stdio: ['ignore', 'ignore', 'inherit'] },
  )
  const deadline = Date.now() + 60_000
  for (;;) {
    try {
      if ((await fetch(`${base}/api/health`)).ok) return
    }
    catch { /* not up yet */ }
    if (server.exitCode !== null) throw new Error(`server exited with ${server.exitCode}`)
    if (Date.now() > deadline) throw new Error('server did not start')
    await new Promise(r => setTimeout(r, 100))
  }
}

function kill(): Promise<void> {
  const s = server!
  return new Promise((ok) => {
    s.once('exit', () => ok())
    s.kill('SIGKILL')
  })
}

/** A cookie-keeping client for this file's own server. */
class Http {
  cookie = ''
  async call(method: string, path: string, body?: unknown) {
    const res = await fetch(`${base}${path}`, {
      method, headers: { ...(this.cookie ? { cookie: this.cookie } : {}), ...(body ? { 'content-type': 'application/json' } : {}) },
      body: body ? JSON.stringify(body) : undefined,
    })
    const set = res.headers.getSetCookie()[0]
    if (set) this.cookie = set.split(';')[0]!
    const text = await res.text()
    return { status: res.status, json: text ? JSON.parse(text) : null }
  }

  static async signIn(email: string) {
    const c = new Http()
    const res = await c.call('POST', '/api/auth/login', { email, password: DEMO_PASSWORD })
    if (res.status !== 200) throw new Error(`login ${email} → ${res.status}`)
    return c
  }
}

interface Ev { seq: number; type: string; wallTime: string; scenarioTime: string; data: { key?: string } }

let exerciseId = ''
let facilitator: Http
const url = (p: string) => `/api/exercises/${exerciseId}${p}`
const record = async (): Promise<Ev[]> => (await facilitator.call('GET', url('/events?limit=1000'))).json.events
const releases = (events: Ev[]) => events.filter(e => e.type === 'inject.released').map(e => e.data.key!)

beforeAll(async () => {
  const [port, smtp] = [await freePort(), await freePort()]
  base = `http://127.0.0.1:${port}`
  env = {
    ...process.env, PORT: String(port), HOST: '127.0.0.1', NUXT_DB_PATH: join(dir, 'restart.sqlite'), NUXT_SEED_DEMO: '1',
    NUXT_SESSION_PASSWORD: 'restart-tests-session-password-0123456789abc', NUXT_FAKE_SMTP_PORT: String(smtp), NUXT_SMTP_HOST: '',
    NUXT_APP_URL: base, DEMO_PASSWORD: '',
  }
  await startServer()
  facilitator = await Http.signIn(DEMO.facilitator)
  exerciseId = (await facilitator.call('GET', '/api/exercises')).json[0].exerciseId
}, 120_000)

afterAll(async () => {
  if (server && server.exitCode === null && server.signalCode === null) await kill()
  rmSync(dir, { recursive: true, force: true })
})

describe('a server killed mid-drill', () => {
  it('comes back with its record whole, its clock running, and releases what fell due while down, once', async () => {
    expect((await facilitator.call('POST', url('/clock'), { action: 'start', factor: 1 })).status).toBe(200)
    expect((await facilitator.call('POST', url('/clock'), { action: 'jump', to: '2031-03-24T08:50:00Z' })).status).toBe(200)
    // Ten scenario minutes before the next inject, at ten scenario minutes per wall second.
    const speed = await facilitator.call('POST', url('/clock'), { action: 'speed', factor: 600 })
    const before = await record()
    const killedAt = Date.now()
    await kill()
    const clock = speed.json.clock
    const at = (wall: number) => Date.parse(clock.scenarioAnchor) + (wall - Date.parse(clock.wallAnchor)) * clock.factor
    expect(at(killedAt)).toBeLessThan(Date.parse('2031-03-24T09:00:00Z'))
    expect(releases(before)).not.toContain('precovery-release')

    await new Promise(r => setTimeout(r, 1500))
    expect(at(Date.now())).toBeGreaterThan(Date.parse('2031-03-24T09:00:00Z'))
    await startServer()
    facilitator = await Http.signIn(DEMO.facilitator)
    const after = await until(async () => {
      const events = await record()
      return releases(events).includes('precovery-release') ? events : null
    }, 15_000, 'precovery-release after the restart')

    expect(after.slice(0, before.length)).toEqual(before)
    expect(after.map(e => e.seq)).toEqual(after.map((_, i) => i + 1))
    const keys = releases(after)
    expect(new Set(keys).size).toBe(keys.length)
    const late = after.find(e => e.type === 'inject.released' && e.data.key === 'precovery-release')!
    expect(Date.parse(late.wallTime)).toBeGreaterThan(killedAt)

    const desk = (await facilitator.call('GET', url('/live'))).json
    expect(desk.clock).toEqual(clock)
    const expected = Date.parse(clock.scenarioAnchor) + (desk.serverTime - Date.parse(clock.wallAnchor)) * clock.factor
    expect(Math.abs(Date.parse(desk.scenarioNow) - expected)).toBeLessThan(60_000)
  }, 90_000)

  it('survives a kill in the middle of a long jump: every due solution and inject goes out exactly once', async () => {
    const science = await Http.signIn(DEMO.science)
    const socket = io(
      base,
      {
        path: '/socket.io/',
        transports: ['websocket'],
        forceNew: true,
        reconnection: false,
        extraHeaders: { cookie: science.cookie },
        auth: { exerciseId, lastSeq: 0 },
      },
    )
    const seen: Ev[] = []
    socket.on('event', (e: Ev) => seen.push(e))
    await new Promise(r => socket.once('live:ready', r))

    const jump = facilitator.call('POST', url('/clock'), { action: 'jump', to: '2031-08-12T00:00:00Z' }).catch(() => null)
    // The first publication in a process takes longest (the land tiles are built): kill while the jump's releases run.
    await new Promise(r => setTimeout(r, 900))
    await kill()
    await jump
    socket.close()
    await startServer()
    facilitator = await Http.signIn(DEMO.facilitator)
    await facilitator.call('POST', url('/clock'), { action: 'pause' })

    const events = await until(async () => {
      const all = await record()
      return releases(all).includes('warning-message') && all.some(e => e.type === 'solution.published' && e.data.key === 's6-near-certain') ? all : null
    }, 30_000, 'the jump to complete after the restart')
    expect(events.map(e => e.seq)).toEqual(events.map((_, i) => i + 1))
    const keys = releases(events)
    expect(new Set(keys).size).toBe(keys.length)
    const solutions = events.filter(e => e.type === 'solution.published').map(e => e.data.key)
    expect(solutions).toEqual([
      's1-discovery',
      's2-twelve-day-arc',
      's3-precovery',
      's4-spectrum',
      's5-more-likely-than-not',
      's6-near-certain',
    ])
    expect(keys).not.toContain('contingency-deflection')

    // What the science socket saw before the kill is still the record's.
    const bySeq = new Map(events.map(e => [e.seq, e]))
    for (const e of seen) expect(bySeq.get(e.seq)?.type).toBe(e.type)
    const resumed = io(
      base,
      {
        path: '/socket.io/',
        transports: ['websocket'],
        forceNew: true,
        reconnection: false,
        extraHeaders: { cookie: science.cookie },
        auth: { exerciseId, lastSeq: Math.max(0, ...seen.map(e => e.seq)) },
      },
    )
    const missed: Ev[] = []
    resumed.on('event', (e: Ev) => missed.push(e))
    await new Promise(r => resumed.once('live:ready', r))
    resumed.close()
    const scienceRecord = (await science.call('GET', url('/events?limit=1000'))).json.events.map((e: Ev) => e.seq)
    expect([...seen, ...missed].map(e => e.seq)).toEqual(scienceRecord)
  }, 90_000)
})
