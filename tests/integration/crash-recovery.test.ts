// Faults: a scripted drill on a fast compressed clock while the server is killed with SIGKILL at
// random moments (at least 20 times). After each restart the record has no gap or duplicate and
// keeps every event committed before the kill, the clock is where the record says, everything due
// is released once, a reconnecting socket catches up, responses cut off by the kill are sent again
// with the same idempotency key and counted once, and the SQLite file passes an integrity check.
// This file runs its own server (own SQLite file and ports). HARDENING_SEED replays a run.
import Database from 'better-sqlite3'
import { io, type Socket } from 'socket.io-client'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { DEMO } from '../support/client'
import { until } from '../support/live'
import { demoScenario, drillScenario, Http, importScenario, sleep, TestServer } from '../support/test-server'
import type { Scenario } from '../../shared/scenario'

const KILLS = Number(process.env.HARDENING_KILLS) || 22
const SEED = Number(process.env.HARDENING_SEED) || (Date.now() % 2 ** 31)

/** mulberry32: a small seeded generator, so that a failing run can be replayed with HARDENING_SEED. */
function rng(seed: number) {
  let a = seed >>> 0
  return () => {
    a = (a + 0x6D2B79F5) >>> 0
    let t = a
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}
const random = rng(SEED)
const between = (lo: number, hi: number) => lo + Math.floor(random() * (hi - lo))

interface Ev {
  seq: number
  type: string
  wallTime: string
  scenarioTime: string
  actorId?: string | null
  data: any // eslint-disable-line @typescript-eslint/no-explicit-any -- payloads of every type
}

const server = new TestServer({ env: { NUXT_SCHEDULER_INTERVAL_MS: '50' } })
let facilitator: Http
let science: Http
let scenario: Scenario
let exerciseId = ''
const url = (p: string) => `/api/exercises/${exerciseId}${p}`

async function record(who: Http = facilitator): Promise<Ev[]> {
  const all: Ev[] = []
  for (let since = 0; ;) {
    const page = await who.get(url(`/events?since=${since}&limit=1000`))
    if (page.status !== 200) throw new Error(`events → ${page.status}`)
    all.push(...page.json.events)
    if (!page.json.more) return all
    since = all.at(-1)!.seq
  }
}
const keysOf = (events: Ev[], type: string) => events.filter(e => e.type === type).map(e => e.data.key as string)

/** The live socket of the science player: every connection resumes from the last seq it saw. */
class Follower {
  seen: number[] = []
  connections = 0
  private socket: Socket | undefined
  async connect() {
    this.close()
    const lastSeq = this.seen.at(-1) ?? 0
    const s = io(
      server.base,
      {
        path: '/socket.io/',
        transports: ['websocket'],
        forceNew: true,
        reconnection: false,
        extraHeaders: { cookie: science.cookie },
        auth: { exerciseId, lastSeq },
      },
    )
    this.socket = s
    s.on('event', (e: Ev) => this.seen.push(e.seq))
    await new Promise<void>((ok, fail) => {
      s.once('live:ready', () => ok())
      s.once('connect_error', fail)
    })
    this.connections++
  }

  close() { this.socket?.close() }
}

/** Responses the science player sends during the drill; those cut off by a kill are sent again after the restart. */
class Responder {
  acked = new Map<string, number>()
  pending = new Set<string>()
  resent = 0
  private bodies = new Map<string, { injectKey: string; text: string; idempotencyKey: string }>()

  async send(injectKey: string, idempotencyKey = `fault-${crypto.randomUUID()}`) {
    const body = { injectKey, text: `Acknowledged ${injectKey}`, idempotencyKey }
    this.bodies.set(idempotencyKey, body)
    this.pending.add(idempotencyKey)
    const res = await science.post(url('/responses'), body).catch(() => null)
    if (!res) return null
    if (res.status !== 201 && res.status !== 200) throw new Error(`response → ${res.status} ${res.text}`)
    this.pending.delete(idempotencyKey)
    this.acked.set(idempotencyKey, res.json.event.seq)
    return res
  }

  /** Sends again, with the same keys, what the kill cut off (the client's outbox after a reconnect). */
  async flush() {
    for (const key of [...this.pending]) {
      this.resent++
      const body = this.bodies.get(key)!
      await this.send(body.injectKey, key)
    }
  }
}

beforeAll(async () => {
  await server.init()
  await server.start()
  facilitator = await Http.signIn(server.base, DEMO.facilitator)
  science = await Http.signIn(server.base, DEMO.science)
  const demo = await demoScenario(facilitator)
  scenario = drillScenario(demo.document, 'fault-drill', 16)
  const id = await importScenario(facilitator, scenario)
  exerciseId = (await facilitator.post(`/api/scenarios/${id}/exercises`, { title: 'Fault drill' })).json.id
  for (const [email, role, teamKey] of [[DEMO.science, 'player', 'science'], [DEMO.evaluator, 'evaluator', null]] as const) {
    const add = await facilitator.post(url('/members'), { email, role, teamKey })
    expect(add.status).toBe(201)
  }
}, 120_000)

afterAll(async () => {
  await server.dispose()
})

describe('a drill under repeated SIGKILL', () => {
  it(`survives ${KILLS} kills at random moments with a whole record, the right clock, every due release once, and caught-up clients`, async () => {
    console.info(`[crash-recovery] seed ${SEED} (HARDENING_SEED=${SEED} replays this run)`)
    const scheduled = scenario.injects.filter(i => !i.contingency)
    const firstAt = Date.parse(scenario.clock.scenarioStart)
    const lastAt = Math.max(...scheduled.map(i => Date.parse(i.at)))
    // The whole schedule plays in about 40 s of wall time, kills and restarts included.
    const factor = Math.round((lastAt - firstAt) / 40_000)
    expect((await facilitator.post(url('/clock'), { action: 'start', factor })).status).toBe(200)

    const follower = new Follower()
    const responder = new Responder()
    await follower.connect()
    let before: Ev[] = await record()
    let kills = 0
    let clockActions = 0
    let explicitRetry: { key: string; seq: number } | null = null
    const errors: Error[] = []
    const startTimes: number[] = []

    while (kills < KILLS) {
      // Up for a random while: responses go out, the clock is sometimes paused and resumed, the scheduler releases.
      const uptime = between(150, 1400)
      const stopAt = Date.now() + uptime
      const traffic = (async () => {
        while (Date.now() < stopAt && server.running) {
          const released = keysOf(await record(science).catch(() => []), 'inject.released')
          for (let n = between(1, 4); released.length && n > 0; n--) {
            void responder.send(released[between(0, released.length)]!).catch((err: Error) => errors.push(err))
          }
          await sleep(between(10, 80))
        }
      })()
      let clockChain: Promise<unknown> = Promise.resolve()
      if (kills % 6 === 3) {
        clockActions++
        clockChain = facilitator.post(url('/clock'), { action: 'pause' })
          .then(() => sleep(between(50, 250)))
          .then(() => facilitator.post(url('/clock'), { action: 'resume' }))
          .catch(() => null)
      }
      if (kills === 5) {
        // The offline client's case: a response acknowledged, the server killed, the same key sent again.
        const released = keysOf(await record(science), 'inject.released')
        const key = `fault-explicit-${SEED}`
        const first = await responder.send(released[0]!, key)
        explicitRetry = { key, seq: first!.json.event.seq }
      }
      await sleep(between(0, uptime))
      await server.kill()
      kills++
      follower.close()
      await Promise.all([traffic.catch(() => null), clockChain])

      // The file survives the crash mid-write.
      const db = new Database(server.dbPath)
      expect(db.pragma('integrity_check', { simple: true })).toBe('ok')
      expect(db.pragma('journal_mode', { simple: true })).toBe('wal')
      db.close()

      startTimes.push(await server.start())
      const after = await record()

      // No gap, no duplicate, nothing committed before the kill lost or changed.
      expect(after.map(e => e.seq)).toEqual(after.map((_, i) => i + 1))
      expect(after.slice(0, before.length)).toEqual(before)
      for (const type of ['inject.released', 'solution.published']) {
        const keys = keysOf(after, type)
        expect(new Set(keys).size, `${type} twice`).toBe(keys.length)
      }
      for (const [key, seq] of responder.acked) expect(after[seq - 1]?.type, `acknowledged response ${key}`).toBe('response.submitted')

      // The clock is the one the record last set.
      const live = (await facilitator.get(url('/live'))).json
      const lastClock = after.filter(e => e.type === 'clock.changed').at(-1)!.data.clock
      expect(live.clock).toEqual(lastClock)

      // Everything due at the restart goes out, once.
      const now = Date.parse(live.scenarioNow)
      const due = scheduled.filter(i => Date.parse(i.at) <= now).map(i => i.key)
      const dueSolutions = scenario.solutions.filter(s => Date.parse(s.releaseAt) <= now).map(s => s.key)
      const caughtUp = await until(async () => {
        const events = await record()
        const released = new Set(keysOf(events, 'inject.released'))
        const published = new Set(keysOf(events, 'solution.published'))
        return due.every(k => released.has(k)) && dueSolutions.every(k => published.has(k)) ? events : null
      }, 10_000, `the releases due at ${live.scenarioNow}`)
      expect(new Set(keysOf(caughtUp, 'inject.released')).size).toBe(keysOf(caughtUp, 'inject.released').length)

      // A pause cut off before its resume: the facilitator resumes.
      if (live.clock.paused && now < lastAt) expect((await facilitator.post(url('/clock'), { action: 'resume' })).status).toBe(200)

      // The client reconnects from the last seq it saw; its outbox goes out again with the same keys.
      await follower.connect()
      await responder.flush()
      before = await record()
    }

    // The drill plays to the end of its schedule.
    await facilitator.post(url('/clock'), { action: 'speed', factor: factor * 4 })
    const final = await until(async () => {
      const events = await record()
      return keysOf(events, 'inject.released').length >= scheduled.length ? events : null
    }, 30_000, 'the whole schedule')
    expect(new Set(keysOf(final, 'inject.released'))).toEqual(new Set(scheduled.map(i => i.key)))
    expect(keysOf(final, 'solution.published')).toEqual(scenario.solutions.map(s => s.key))

    // Every response once: one event per idempotency key, and the key sent before and after a kill gives the first event.
    await responder.flush()
    expect(responder.pending.size).toBe(0)
    const db = new Database(server.dbPath, { readonly: true })
    const perKey = db.prepare('select idempotency_key as k, count(*) as n from exercise_events where exercise_id = ? and type = ? group by idempotency_key')
      .all(exerciseId, 'response.submitted') as Array<{ k: string; n: number }>
    db.close()
    expect(errors).toEqual([])
    expect(perKey.filter(r => r.n > 1)).toEqual([])
    expect(new Set(perKey.map(r => r.k))).toEqual(new Set(responder.acked.keys()))
    const again = await science.post(url('/responses'), { injectKey: 'x-unused', text: 'again', idempotencyKey: explicitRetry!.key })
    expect(again.status).toBe(200)
    expect(again.json.event.seq).toBe(explicitRetry!.seq)

    // The follower, across all its connections, saw exactly the science player's record: in order, nothing missed, nothing twice.
    await follower.connect()
    await sleep(300)
    follower.close()
    const visible = (await record(science)).map(e => e.seq)
    expect(follower.seen).toEqual(visible)

    const sorted = [...startTimes].sort((a, b) => a - b)
    console.info(`[crash-recovery] ${kills} SIGKILLs survived; ${final.length} events; ${responder.acked.size} responses (${responder.resent} re-sent after a kill, none doubled); ${clockActions} pause/resume pairs; ${follower.connections} socket connections; restart median ${sorted[sorted.length >> 1]} ms`)
  }, 240_000)
})
