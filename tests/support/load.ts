/**
 * Load benchmark of a whole drill: starts the built server (.output, or BW_OUTPUT_DIR) with a fresh
 * SQLite file and the demo seed; creates BENCH_LOAD_SOCKETS (500) real accounts and signs each in;
 * builds a 50-inject drill from the demo scenario (GET it, add injects, import the YAML made by the
 * shared stringifyScenario) and starts an exercise from it; connects one Socket.IO member per
 * account across the three team rooms plus control and evaluators; runs the drill on a compressed
 * clock (BENCH_LOAD_SECONDS of wall time) with the scheduler releasing; every player answers every
 * request for decision sent to their team (a few send the same answer twice, as a flaky network
 * would). Reports release-to-delivery delay (event write on the server → socket, median and p99),
 * response latency, server memory and CPU, errors, lost and duplicated deliveries and duplicate
 * responses. Shared by the load bench (scripts/bench/load.ts, `npm run bench`) and the integration test
 * drill-under-load.test.ts. Build first (npm run build).
 */
import { fork, spawn } from 'node:child_process'
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import { fileURLToPath } from 'node:url'
import Database from 'better-sqlite3'
import { io, type Socket } from 'socket.io-client'
import { stringifyScenario, type Scenario } from '../../shared/scenario/index'
import { freePort } from './ports'

const PASSWORD = 'brinkwater-demo'

export interface LoadOptions {
  /** Socket.IO members (players, evaluators and control desks together). */
  sockets: number
  /** Injects added to the demo's scheduled ones (34 + 16 = 50). */
  extraInjects: number
  /** Wall seconds in which the schedule plays. */
  wallSeconds: number
  /** Build folder (default BW_OUTPUT_DIR or .output). */
  outputDir?: string
  /** Share of answers sent twice with the same idempotency key. */
  retryShare?: number
  /** Client processes the load sockets are spread over (0: all in this one). */
  clientProcesses?: number
  /**
   * Probe members: sockets in this process, which does little else, whose delivery delays and
   * response latencies are the ones reported (the load sockets' own figures include their queueing).
   */
  probes?: number
  log?: (line: string) => void
}

export interface Stats { samples: number; medianMs: number; p99Ms: number; maxMs: number }
const stats = (xs: number[]): Stats => ({
  samples: xs.length,
  medianMs: pct(xs, 0.5),
  p99Ms: pct(xs, 0.99),
  maxMs: xs.length ? Math.max(...xs) : Number.NaN,
})

export interface LoadReport {
  sockets: { players: number; perTeam: Record<string, number>; evaluators: number; control: number; probes: number; connectMs: number }
  injects: { scheduled: number; decisions: number }
  /** Measured at the probe members. */
  delivery: Stats
  responses: Stats & { sent: number; retried: number; errors: number }
  /** Measured at every member, probes and load sockets, queueing in the load processes included. */
  deliveryAll: Stats
  responsesAll: Stats
  /** RSS at the start, peak, end and after 5 s idle; the live heap after a full GC before and after the drill. */
  memory: { startMiB: number; peakMiB: number; endMiB: number; idleMiB: number; heapStartMiB: number; heapEndMiB: number }
  cpu: { drillSeconds: number; cpuSeconds: number; averagePercent: number; peakPercent: number }
  events: number
  lost: number
  duplicateDeliveries: number
  duplicateResponses: number
  errors: string[]
}

const sleep = (ms: number) => new Promise(r => setTimeout(r, ms))
const pct = (xs: number[], p: number) => {
  const s = [...xs].sort((a, b) => a - b)
  return s[Math.min(s.length - 1, Math.floor(p * s.length))] ?? Number.NaN
}

/**
 * A drill from the demo scenario with `extra` more scheduled injects, evenly spread between the first
 * and the last scheduled demo inject; every third one is a request for decision to one team.
 * Attachments are left out (an imported copy has no files).
 */
export function drillScenario(demo: Scenario, key: string, extra: number): Scenario {
  const scheduled = demo.injects.filter(i => !i.contingency).map(i => Date.parse(i.at))
  const [first, last] = [Math.min(...scheduled), Math.max(...scheduled)]
  const teams = demo.teams.map(t => t.key)
  const iso = (t: number) => new Date(t).toISOString().replace('.000Z', 'Z')
  const end = Date.parse(demo.clock.impactTime) + 9 * 86400_000
  const added = Array.from({ length: extra }, (_, i) => {
    const at = Math.round(first + ((i + 0.5) / extra) * (last - first))
    const phase = demo.injects.filter(x => Date.parse(x.at) <= at).at(-1)?.phase ?? demo.phases[0]!.key
    const decide = i % 3 === 0
    return {
      key: `drill-${String(i + 1).padStart(3, '0')}`, at: iso(at), phase, kind: decide ? 'decision-request' : 'briefing',
      teams: decide ? [teams[i % teams.length]!] : teams, title: `Drill inject ${i + 1}`,
      body: `Situation update ${i + 1} for the drill.\n\n- **Status**: unchanged\n- Check the team log.`,
      expectedActions: ['Acknowledge in the team log.'],
      ...(decide
        ? { decision: {
            prompt: 'Confirm the next step.',
            choices: ['Proceed', 'Hold'],
            freeText: true,
            deadline: iso(Math.min(at + 86400_000, end)),
          } }
        : {}),
    }
  })
  const injects = demo.injects.map((i) => {
    const copy = { ...i }
    delete copy.attachments
    return copy
  })
  return { ...structuredClone(demo), key, title: `Drill ${key}`, injects: [...injects, ...added] }
}

/** One HTTP request with a session cookie; JSON in and out. */
async function request(base: string, cookie: string, method: string, path: string, body?: unknown) {
  const headers: Record<string, string> = {}
  if (cookie) headers.cookie = cookie
  let payload: BodyInit | undefined
  if (typeof body === 'string' || body instanceof FormData) payload = body
  else if (body !== undefined) {
    payload = JSON.stringify(body)
    headers['content-type'] = 'application/json'
  }
  const res = await fetch(`${base}${path}`, { method, headers, body: payload })
  const text = await res.text()
  let json = null
  try { json = text ? JSON.parse(text) : null }
  catch { json = null }
  return { status: res.status, json, text, setCookie: res.headers.getSetCookie().find(c => c.startsWith('brinkwater-session=')) }
}

interface ClientInput {
  base: string
  exerciseId: string
  retryShare: number
  /** Requests for decision by inject key, with their choices (null: free text only). */
  decisions: Record<string, string[] | null>
  members: Array<{ email: string; role: string; teamKey: string | null; cookie: string }>
}
interface ClientResult {
  delays: number[]
  responseMs: number[]
  sent: number
  retried: number
  responseErrors: number
  errors: string[]
  seqs: Array<{ email: string; seqs: number[] }>
}
interface ClientHandle { ready: Promise<number>; finish: () => Promise<ClientResult> }

/**
 * The members' side: one socket each; the delay of every inject delivery (server write → here);
 * players answer each request for decision of their team after a think time, some twice with the same key.
 */
function startClients(input: ClientInput) {
  const result: ClientResult = { delays: [], responseMs: [], sent: 0, retried: 0, responseErrors: 0, errors: [], seqs: [] }
  const answering: Array<Promise<void>> = []
  const sockets: Socket[] = []
  async function answer(cookie: string, injectKey: string) {
    await sleep(200 + Math.random() * 3000)
    const choices = input.decisions[injectKey]
    const body = {
      injectKey,
      choice: choices ? choices[Math.floor(Math.random() * choices.length)] : null,
      text: 'Answered under load.',
      idempotencyKey: `load-${crypto.randomUUID()}`,
    }
    const times = Math.random() < input.retryShare ? 2 : 1
    for (let k = 0; k < times; k++) {
      const start = performance.now()
      const res = await request(
        input.base,
        cookie,
        'POST',
        `/api/exercises/${input.exerciseId}/responses`,
        body,
      ).catch((err: Error) => ({ status: 0, text: err.message }))
      result.responseMs.push(performance.now() - start)
      result.sent++
      if (k > 0) result.retried++
      if (res.status !== (k === 0 ? 201 : 200)) {
        result.responseErrors++
        result.errors.push(`response ${injectKey} → ${res.status} ${res.text.slice(0, 120)}`)
      }
    }
  }
  const t0 = performance.now()
  let next = 0
  const ready = Promise.all(Array.from({ length: 25 }, async () => {
    while (next < input.members.length) {
      const m = input.members[next++]!
      const seqs: number[] = []
      result.seqs.push({ email: m.email, seqs })
      await new Promise<void>((ok, fail) => {
        const s = io(
          input.base,
          {
            path: '/socket.io/',
            transports: ['websocket'],
            forceNew: true,
            reconnection: false,
            extraHeaders: { cookie: m.cookie },
            auth: { exerciseId: input.exerciseId, lastSeq: 0 },
          },
        )
        sockets.push(s)
        s.on('event', (e: { seq: number; type: string; wallTime: string; data: { key?: string } }) => {
          seqs.push(e.seq)
          if (e.type !== 'inject.released') return
          result.delays.push(Date.now() - Date.parse(e.wallTime))
          if (m.role === 'player' && e.data.key! in input.decisions) answering.push(answer(m.cookie, e.data.key!))
        })
        s.on(
          'disconnect',
          (reason: string) => { if (reason !== 'io client disconnect') result.errors.push(`socket ${m.email} disconnected: ${reason}`) },
        )
        s.once('live:ready', () => ok())
        s.once('connect_error', fail)
      })
    }
  })).then(() => performance.now() - t0)
  async function finish() {
    for (let n = -1; n !== answering.length;) {
      n = answering.length
      await Promise.all(answering)
    }
    for (const s of sockets) s.close()
    return result
  }
  return { ready, finish }
}

function inlineClients(input: ClientInput): ClientHandle {
  return startClients(input)
}

/** The clients in a child process of their own (this file again, with tsx), talking over IPC. */
function processClients(input: ClientInput): ClientHandle {
  const child = fork(
    fileURLToPath(import.meta.url),
    [CLIENT_FLAG],
    { execArgv: ['--import', 'tsx'], serialization: 'advanced', stdio: ['ignore', 'inherit', 'inherit', 'ipc'] },
  )
  const message = <T>(type: string) => new Promise<T>((ok, fail) => {
    const on = (m: { type: string; value: T }) => {
      if (m.type !== type) return
      child.off('message', on)
      ok(m.value)
    }
    child.on('message', on)
    child.once('error', fail)
    child.once('exit', code => fail(new Error(`client process exited with ${code}`)))
  })
  const ready = message<number>('ready')
  child.send({ type: 'start', value: input })
  return {
    ready,
    async finish() {
      const result = message<ClientResult>('result')
      child.send({ type: 'finish' })
      const value = await result
      child.kill()
      return value
    },
  }
}

const CLIENT_FLAG = '--load-clients'
if (process.argv.includes(CLIENT_FLAG) && process.send) {
  let clients: ReturnType<typeof startClients> | undefined
  process.on('message', (m: { type: string; value?: ClientInput }) => {
    if (m.type === 'start') {
      clients = startClients(m.value!)
      void clients.ready.then(ms => process.send!({ type: 'ready', value: ms }))
    }
    if (m.type === 'finish') void clients!.finish().then(value => process.send!({ type: 'result', value }))
  })
}

/** The live heap of a process after a full garbage collection (MiB), through its inspector; null when unavailable. */
async function heapProbe(inspectPort: number): Promise<{ measure: () => Promise<number>; close: () => void } | null> {
  try {
    const targets = await (await fetch(`http://127.0.0.1:${inspectPort}/json/list`)).json() as Array<{ webSocketDebuggerUrl: string }>
    const { WebSocket } = await import('ws')
    const ws = new WebSocket(targets[0]!.webSocketDebuggerUrl)
    await new Promise((ok, fail) => { ws.once('open', ok); ws.once('error', fail) })
    let id = 0
    const send = (method: string) => new Promise<{ usedSize?: number }>((ok) => {
      const n = ++id
      const on = (data: Buffer) => {
        const m = JSON.parse(data.toString()) as { id?: number; result?: { usedSize?: number } }
        if (m.id !== n) return
        ws.off('message', on)
        ok(m.result ?? {})
      }
      ws.on('message', on)
      ws.send(JSON.stringify({ id: n, method }))
    })
    return {
      async measure() {
        await send('HeapProfiler.collectGarbage')
        return ((await send('Runtime.getHeapUsage')).usedSize ?? Number.NaN) / 1024 / 1024
      },
      close: () => ws.close(),
    }
  }
  catch { return null }
}

/** Resident memory (MiB) and CPU time (s) of a process, from /proc. */
function usage(pid: number): { rssMiB: number; cpuSeconds: number } {
  const status = readFileSync(`/proc/${pid}/status`, 'utf8')
  const rss = Number(/VmRSS:\s+(\d+)/.exec(status)?.[1] ?? 0) / 1024
  const stat = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1]!.split(' ')
  const ticks = Number(stat[11]) + Number(stat[12])
  return { rssMiB: rss, cpuSeconds: ticks / 100 }
}

interface Member { email: string; role: 'player' | 'evaluator' | 'facilitator'; teamKey: string | null; cookie?: string }

export async function runLoad(opts: LoadOptions): Promise<LoadReport> {
  const log = opts.log ?? (() => {})
  const root = resolve(import.meta.dirname, '../..')
  const entry = join(root, opts.outputDir ?? process.env.BW_OUTPUT_DIR ?? '.output', 'server/index.mjs')
  if (!existsSync(entry)) throw new Error('No build found: run `npm run build` first.')
  const dir = mkdtempSync(join(tmpdir(), 'brinkwater-load-'))
  const dbPath = join(dir, 'load.sqlite')
  const [port, smtp, inspectPort] = [await freePort(), await freePort(), await freePort()]
  const base = `http://127.0.0.1:${port}`
  const errors: string[] = []
  // The inspector (local only) lets the bench collect garbage and read the heap: memory growth that a GC does not undo.
  const server = spawn(process.execPath, [`--inspect=127.0.0.1:${inspectPort}`, entry], {
    env: {
      ...process.env, PORT: String(port), HOST: '127.0.0.1', NUXT_DB_PATH: dbPath, NUXT_SEED_DEMO: '1',
      NUXT_SESSION_PASSWORD: 'load-bench-session-password-0123456789abcdef', NUXT_FAKE_SMTP_PORT: String(smtp), NUXT_SMTP_HOST: '',
      NUXT_APP_URL: base, DEMO_PASSWORD: '',
    },
    stdio: ['ignore', 'ignore', 'pipe'],
  })
  server.stderr!.on('data', (chunk: Buffer) => {
    for (const line of chunk.toString().split('\n')) if (/error/i.test(line) && !/VUE_ROUTER|Debugger/.test(line)) errors.push(`server: ${line.slice(0, 200)}`)
  })
  const members: Member[] = []
  const interrupted = () => {
    server.kill('SIGKILL')
    rmSync(dir, { recursive: true, force: true })
    process.exit(130)
  }
  process.once('SIGINT', interrupted)
  process.once('SIGTERM', interrupted)
  const stop = async () => {
    process.off('SIGINT', interrupted)
    process.off('SIGTERM', interrupted)
    if (server.exitCode === null) {
      server.kill('SIGTERM')
      await new Promise(r => server.once('exit', r))
    }
    rmSync(dir, { recursive: true, force: true })
  }

  try {
    const call = (cookie: string, method: string, path: string, body?: unknown) => request(base, cookie, method, path, body)
    async function signIn(email: string) {
      for (const deadline = Date.now() + 30_000; ;) {
        const res = await call('', 'POST', '/api/auth/login', { email, password: PASSWORD })
        if (res.status === 200) return res.setCookie!.split(';')[0]!
        if (Date.now() > deadline) throw new Error(`login ${email} → ${res.status} ${res.text}`)
        await sleep(200)
      }
    }
    async function parallel<T>(items: T[], width: number, work: (item: T) => Promise<void>) {
      let next = 0
      await Promise.all(Array.from({ length: width }, async () => {
        while (next < items.length) await work(items[next++]!)
      }))
    }

    for (const deadline = Date.now() + 60_000; ;) {
      try { if ((await fetch(`${base}/api/health`)).ok) break }
      catch { /* starting */ }
      if (Date.now() > deadline || server.exitCode !== null) throw new Error('the server did not start')
      await sleep(100)
    }
    const author = await signIn('facilitator@brinkwater.test')

    // The drill: the demo scenario from the library, 16 injects more, imported as a YAML file.
    const list = (await call(author, 'GET', '/api/scenarios')).json as Array<{ id: string; key: string }>
    const demo = (await call(
      author,
      'GET',
      `/api/scenarios/${list.find(s => s.key === 'demo-ocean-impact')!.id}`,
    )).json.document as Scenario
    const scenario = drillScenario(demo, 'load-drill', opts.extraInjects)
    const form = new FormData()
    form.append('file', new Blob([stringifyScenario(scenario)], { type: 'application/yaml' }), 'load-drill.yaml')
    const imported = await call(author, 'POST', '/api/scenarios/import?onConflict=copy', form)
    if (imported.status !== 201) throw new Error(`import → ${imported.status} ${imported.text}`)
    const exerciseId = (await call(
      author,
      'POST',
      `/api/scenarios/${imported.json.id}/exercises`,
      { title: 'Load drill' },
    )).json.id as string
    const x = (p: string) => `/api/exercises/${exerciseId}${p}`
    const scheduled = scenario.injects.filter(i => !i.contingency)
    const decisions = new Map(scheduled.filter(i => i.decision).map(i => [i.key, i]))

    // The accounts: real users rows (the demo password's hash), each signed in through the API.
    const control = Math.max(1, Math.round(opts.sockets / 100))
    const evaluators = Math.max(1, Math.round(opts.sockets * 0.03))
    const players = opts.sockets - control - evaluators
    const teams = scenario.teams.map(t => t.key)
    for (let i = 0; i < opts.sockets; i++) {
      const role = i < control ? 'facilitator' : i < control + evaluators ? 'evaluator' : 'player'
      const teamKey = role === 'player' ? teams[(i - control - evaluators) % teams.length]! : null
      members.push({ email: `load-${i}@example.test`, role, teamKey })
    }
    const db = new Database(dbPath)
    db.pragma('busy_timeout = 5000')
    const hash = (db.prepare('select password_hash as h from users where email = ?').get('facilitator@brinkwater.test') as { h: string }).h
    const insert = db.prepare(`insert into users (id, email, name, password_hash, system_role) values (?, ?, ?, ?, 'member')`)
    db.transaction(() => { for (const [i, m] of members.entries()) insert.run(crypto.randomUUID(), m.email, `Load member ${i}`, hash) })()
    db.close()
    const t0 = performance.now()
    await parallel(members, 8, async (m) => {
      const add = await call(author, 'POST', x('/members'), { email: m.email, role: m.role, teamKey: m.teamKey })
      if (add.status !== 201) throw new Error(`member → ${add.status} ${add.text}`)
      m.cookie = await signIn(m.email)
    })
    log(`${members.length} accounts added and signed in: ${((performance.now() - t0) / 1000).toFixed(1)} s`)

    // Every member's socket, spread over client threads; every inject delivery and response is recorded there.
    const input = (slice: Member[]): ClientInput => ({
      base, exerciseId, retryShare: opts.retryShare ?? 0.05,
      decisions: Object.fromEntries([...decisions].map(([k, i]) => [k, i.decision!.choices ?? null])),
      members: slice.map(m => ({ email: m.email, role: m.role, teamKey: m.teamKey, cookie: m.cookie! })),
    })
    // Probes: evenly taken from every view (players of each team, evaluators, control), kept in this process.
    const processes = Math.max(0, opts.clientProcesses ?? 0)
    const probeEvery = Math.max(1, Math.floor(members.length / Math.max(1, opts.probes ?? 0)))
    const isProbe = (i: number) => processes > 0 && (opts.probes ?? 0) > 0 && i % probeEvery === 0
    const probes = members.filter((_, i) => isProbe(i))
    const load = members.filter((_, i) => !isProbe(i))
    const groups: Member[][] = processes ? Array.from({ length: processes }, (_, t) => load.filter((_, i) => i % processes === t)) : [load]
    const probeClients = probes.length ? inlineClients(input(probes)) : null
    const clients: ClientHandle[] = groups.map(g => (processes ? processClients(input(g)) : inlineClients(input(g))))
    const connectMs = Math.max(...await Promise.all([...clients, ...(probeClients ? [probeClients] : [])].map(c => c.ready)))
    log(`${members.length} sockets connected, replayed and ready (${probes.length} probes here, ${processes ? `${load.length} in ${processes} client processes` : 'all in this process'}): ${connectMs.toFixed(0)} ms`)

    // The drill: the schedule plays in wallSeconds; memory and CPU sampled every 500 ms.
    const pid = server.pid!
    await sleep(1000)
    const heap = await heapProbe(inspectPort)
    const heapStart = await heap?.measure() ?? Number.NaN
    const start = usage(pid)
    const samples: Array<{ t: number; rssMiB: number; cpuSeconds: number }> = [{ t: performance.now(), ...start }]
    const sampler = setInterval(() => samples.push({ t: performance.now(), ...usage(pid) }), 500)
    const span = Math.max(...scheduled.map(i => Date.parse(i.at))) - Date.parse(scenario.clock.scenarioStart)
    const clock = await call(author, 'POST', x('/clock'), { action: 'start', factor: Math.round(span / (opts.wallSeconds * 1000)) })
    if (clock.status !== 200) throw new Error(`clock → ${clock.status} ${clock.text}`)
    const drillStart = performance.now()
    const reader = new Database(dbPath, { readonly: true })
    const releasedCount = () => (reader.prepare(`select count(*) as n from exercise_events where exercise_id = ? and type = 'inject.released'`).get(exerciseId) as { n: number }).n
    let lastLog = Date.now()
    for (const deadline = Date.now() + opts.wallSeconds * 3000 + 30_000; ;) {
      const count = releasedCount()
      if (count >= scheduled.length) break
      if (Date.now() > deadline) throw new Error(`the schedule did not finish: ${count} of ${scheduled.length} released`)
      if (Date.now() - lastLog > 5000) {
        const u = usage(pid)
        log(`${((performance.now() - drillStart) / 1000).toFixed(0)} s: ${count} of ${scheduled.length} injects released, server ${u.rssMiB.toFixed(0)} MiB`)
        lastLog = Date.now()
      }
      await sleep(500)
    }
    await sleep(4000)
    const loadResults = await Promise.all(clients.map(c => c.finish()))
    const probeResult = probeClients ? await probeClients.finish() : null
    const results = [...loadResults, ...(probeResult ? [probeResult] : [])]
    const measured = probeResult ?? loadResults[0]!
    const sum = (f: (r: ClientResult) => number) => results.reduce((n, r) => n + f(r), 0)
    const [sent, retried, responseErrors] = [sum(r => r.sent), sum(r => r.retried), sum(r => r.responseErrors)]
    errors.push(...results.flatMap(r => r.errors))
    const seqsOf = new Map(results.flatMap(r => r.seqs.map(x => [x.email, x.seqs] as const)))
    const drillSeconds = (performance.now() - drillStart) / 1000
    clearInterval(sampler)
    const end = usage(pid)
    samples.push({ t: performance.now(), ...end })
    reader.close()
    await call(author, 'POST', x('/clock'), { action: 'pause' })
    await sleep(5000)
    const idle = usage(pid)
    const heapEnd = await heap?.measure() ?? Number.NaN
    heap?.close()

    // What each member should have: the record as a member of the same view reads it.
    const viewOf = (m: Member) => (m.role === 'player' ? `team:${m.teamKey}` : m.role)
    const expected = new Map<string, number[]>()
    for (const m of members) {
      const v = viewOf(m)
      if (expected.has(v)) continue
      const seqs: number[] = []
      for (let since = 0; ;) {
        const page = (await call(m.cookie!, 'GET', x(`/events?since=${since}&limit=1000`))).json
        seqs.push(...page.events.map((e: { seq: number }) => e.seq))
        if (!page.more) break
        since = seqs.at(-1)!
      }
      expected.set(v, seqs)
    }
    let lost = 0
    let duplicateDeliveries = 0
    for (const m of members) {
      const seqs = seqsOf.get(m.email) ?? []
      const got = new Set(seqs)
      duplicateDeliveries += seqs.length - got.size
      lost += expected.get(viewOf(m))!.filter(s => !got.has(s)).length
    }
    const check = new Database(dbPath, { readonly: true })
    const dupes = check.prepare(`select count(*) as n from (select actor_id, json_extract(payload, '$.injectKey') as k, count(*) as c from exercise_events where exercise_id = ? and type = 'response.submitted' group by actor_id, k having c > 1)`).get(exerciseId) as { n: number }
    const events = (check.prepare('select count(*) as n from exercise_events where exercise_id = ?').get(exerciseId) as { n: number }).n
    check.close()

    const cpuPercents = samples.slice(1).map((s, i) => (100 * (s.cpuSeconds - samples[i]!.cpuSeconds)) / ((s.t - samples[i]!.t) / 1000))
    const perTeam = Object.fromEntries(teams.map(t => [t, members.filter(m => m.teamKey === t).length]))
    return {
      sockets: { players, perTeam, evaluators, control, probes: probes.length, connectMs },
      injects: { scheduled: scheduled.length, decisions: decisions.size },
      delivery: stats(measured.delays),
      responses: { ...stats(measured.responseMs), sent, retried, errors: responseErrors },
      deliveryAll: stats(results.flatMap(r => r.delays)),
      responsesAll: stats(results.flatMap(r => r.responseMs)),
      memory: {
        startMiB: start.rssMiB,
        peakMiB: Math.max(...samples.map(s => s.rssMiB)),
        endMiB: end.rssMiB,
        idleMiB: idle.rssMiB,
        heapStartMiB: heapStart,
        heapEndMiB: heapEnd,
      },
      cpu: {
        drillSeconds,
        cpuSeconds: end.cpuSeconds - start.cpuSeconds,
        averagePercent: (100 * (end.cpuSeconds - start.cpuSeconds)) / drillSeconds,
        peakPercent: Math.max(...cpuPercents),
      },
      events, lost, duplicateDeliveries, duplicateResponses: dupes.n, errors,
    }
  }
  finally {
    await stop()
  }
}

export function formatLoadReport(r: LoadReport): string {
  const f = (n: number) => n.toFixed(1)
  return [
    `load bench: node ${process.version}, ${r.sockets.players + r.sockets.evaluators + r.sockets.control} sockets (${Object.entries(r.sockets.perTeam).map(([t, n]) => `${t} ${n}`).join(', ')}, evaluators ${r.sockets.evaluators}, control ${r.sockets.control}), ${r.injects.scheduled} scheduled injects (${r.injects.decisions} requests for decision)`,
    `connect + replay + ready of all sockets: ${r.sockets.connectMs.toFixed(0)} ms`,
    `release → delivery (server write → socket) at ${r.sockets.probes ? `the ${r.sockets.probes} probes` : 'every socket'}: median ${f(r.delivery.medianMs)} ms, p99 ${f(r.delivery.p99Ms)} ms, max ${f(r.delivery.maxMs)} ms over ${r.delivery.samples} deliveries`,
    `  at every socket (load processes' own queueing included): median ${f(r.deliveryAll.medianMs)} ms, p99 ${f(r.deliveryAll.p99Ms)} ms over ${r.deliveryAll.samples} deliveries`,
    `responses: ${r.responses.sent} sent (${r.responses.retried} sent twice with the same key), errors ${r.responses.errors}; latency at ${r.sockets.probes ? 'the probes' : 'every member'} median ${f(r.responses.medianMs)} ms, p99 ${f(r.responses.p99Ms)} ms, max ${f(r.responses.maxMs)} ms over ${r.responses.samples}`,
    `  at every member: median ${f(r.responsesAll.medianMs)} ms, p99 ${f(r.responsesAll.p99Ms)} ms`,
    `server memory: RSS ${f(r.memory.startMiB)} MiB at the start, peak ${f(r.memory.peakMiB)}, ${f(r.memory.endMiB)} at the end, ${f(r.memory.idleMiB)} after 5 s idle; live heap after a full GC ${f(r.memory.heapStartMiB)} MiB before the drill, ${f(r.memory.heapEndMiB)} MiB after`,
    `server CPU: ${f(r.cpu.cpuSeconds)} s in ${f(r.cpu.drillSeconds)} s of drill (average ${f(r.cpu.averagePercent)} % of a core, peak ${f(r.cpu.peakPercent)} %)`,
    `record: ${r.events} events; lost deliveries ${r.lost}, duplicate deliveries ${r.duplicateDeliveries}, duplicate responses ${r.duplicateResponses}, errors ${r.errors.length}${r.errors.length ? `: ${r.errors.slice(0, 5).join(' | ')}` : ''}`,
  ].join('\n')
}
