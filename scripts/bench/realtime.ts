/**
 * Benchmark of live delivery: starts the built server (.output) with a fresh SQLite file and the demo
 * seed, starts an exercise from the demo scenario, connects 300 members across the rooms (players of
 * the three teams, evaluators, facilitators; demo sessions are shared by many sockets), releases
 * injects by hand and measures the delay from the release request to delivery at each socket, and
 * counts lost deliveries. Build first (npm run build). Run: node --import tsx scripts/bench/realtime.ts
 */
import { spawn } from 'node:child_process'
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import { io, type Socket } from 'socket.io-client'
import { parseScenarioYaml } from '../../shared/scenario/io'
import { freePort } from '../../tests/support/ports'

const SOCKETS = Number(process.env.BENCH_SOCKETS) || 300
const RELEASES = Number(process.env.BENCH_RELEASES) || 24
const PASSWORD = 'brinkwater-demo'

const root = resolve(import.meta.dirname, '../..')
const entry = join(root, process.env.BW_OUTPUT_DIR || '.output', 'server/index.mjs')
if (!existsSync(entry)) throw new Error('No build found: run `npm run build` first.')
const dir = mkdtempSync(join(tmpdir(), 'brinkwater-bench-'))
const [port, smtp] = [await freePort(), await freePort()]
const base = `http://127.0.0.1:${port}`
const server = spawn(process.execPath, [entry], {
  env: {
    ...process.env, PORT: String(port), HOST: '127.0.0.1', NUXT_DB_PATH: join(dir, 'bench.sqlite'), NUXT_SEED_DEMO: '1',
    NUXT_SESSION_PASSWORD: 'realtime-bench-session-password-0123456789', NUXT_FAKE_SMTP_PORT: String(smtp), NUXT_SMTP_HOST: '',
    NUXT_APP_URL: base, DEMO_PASSWORD: '',
  },
  stdio: ['ignore', 'ignore', 'inherit'],
})
const sockets: Socket[] = []
const cleanup = () => {
  for (const s of sockets) s.close()
  if (server.exitCode === null) server.kill('SIGTERM')
  rmSync(dir, { recursive: true, force: true })
}
process.on('exit', cleanup)

async function call(cookie: string, method: string, path: string, body?: unknown) {
  const res = await fetch(
    `${base}${path}`,
    { method, headers: { cookie, ...(body ? { 'content-type': 'application/json' } : {}) }, body: body ? JSON.stringify(body) : undefined },
  )
  const text = await res.text()
  return { status: res.status, json: text ? JSON.parse(text) : null, setCookie: res.headers.getSetCookie()[0] }
}
// The demo seed finishes just after the server first answers: sign-in may need a few tries.
async function signIn(email: string) {
  for (const deadline = Date.now() + 30_000; ;) {
    const res = await call('', 'POST', '/api/auth/login', { email, password: PASSWORD })
    if (res.status === 200) return res.setCookie!.split(';')[0]!
    if (res.status !== 401 || Date.now() > deadline) throw new Error(`login ${email} → ${res.status}`)
    await new Promise(r => setTimeout(r, 200))
  }
}
const pct = (sorted: number[], p: number) => sorted[Math.min(sorted.length - 1, Math.floor(p * sorted.length))] ?? Number.NaN

for (const deadline = Date.now() + 60_000; ;) {
  try { if ((await fetch(`${base}/api/health`)).ok) break }
  catch { /* starting */ }
  if (Date.now() > deadline || server.exitCode !== null) throw new Error('the server did not start')
  await new Promise(r => setTimeout(r, 100))
}

const who = ['facilitator', 'science', 'civil', 'comms', 'evaluator'] as const
const cookies = Object.fromEntries(await Promise.all(who.map(async w => [
  w,
  await signIn(`${w}@brinkwater.test`),
] as const))) as Record<typeof who[number], string>
const scenarioList = await call(cookies.facilitator, 'GET', '/api/scenarios')
const demo = (scenarioList.json as Array<{ id: string; key: string }>).find(s => s.key === 'demo-ocean-impact')!
const exerciseId = (await call(
  cookies.facilitator,
  'POST',
  `/api/scenarios/${demo.id}/exercises`,
  { title: 'Realtime bench' },
)).json.id as string
for (const [w, role, teamKey] of [
  ['science', 'player', 'science'],
  ['civil', 'player', 'civil'],
  ['comms', 'player', 'comms'],
  ['evaluator', 'evaluator', null],
] as const) {
  await call(cookies.facilitator, 'POST', `/api/exercises/${exerciseId}/members`, { email: `${w}@brinkwater.test`, role, teamKey })
}
// Real time: nothing falls due on its own during the bench; every release is by hand.
await call(cookies.facilitator, 'POST', `/api/exercises/${exerciseId}/clock`, { action: 'start', factor: 1 })

// 300 members: 95 per team, 10 evaluators, 5 facilitator desks.
const plan: Array<{ cookie: string; room: string }> = []
for (let i = 0; i < SOCKETS; i++) {
  const slot = i % 60
  const room = slot < 19 ? 'science' : slot < 38 ? 'civil' : slot < 57 ? 'comms' : slot < 59 ? 'evaluator' : 'facilitator'
  plan.push({ cookie: cookies[room], room })
}
const releasedAt = new Map<string, number>()
const delays: number[] = []
const received = new Map<string, number>()
const t0 = performance.now()
await Promise.all(plan.map(({ cookie }) => new Promise<void>((ok, fail) => {
  const s = io(
    base,
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
  s.on('event', (e: { type: string; data: { key: string } }) => {
    if (e.type !== 'inject.released') return
    const sent = releasedAt.get(e.data.key)
    if (sent === undefined) return
    delays.push(performance.now() - sent)
    received.set(e.data.key, (received.get(e.data.key) ?? 0) + 1)
  })
  s.once('live:ready', () => ok())
  s.once('connect_error', fail)
})))
const connectMs = performance.now() - t0

const text = readFileSync(join(root, 'scenarios/demo-ocean-impact.yaml'), 'utf8')
const parsed = parseScenarioYaml(text)
if (!parsed.ok) throw new Error('the demo scenario does not parse')
const injects = parsed.scenario.injects.filter(i => !i.contingency).slice(0, RELEASES)
const countIn = (room: string) => plan.filter(p => p.room === room).length
const staff = countIn('evaluator') + countIn('facilitator')
let expected = 0
const requestMs: number[] = []
for (const inject of injects) {
  expected += staff + inject.teams.reduce((n, t) => n + countIn(t), 0)
  const start = performance.now()
  releasedAt.set(inject.key, start)
  const res = await call(cookies.facilitator, 'POST', `/api/exercises/${exerciseId}/injects/${inject.key}/release`)
  requestMs.push(performance.now() - start)
  if (res.status !== 201) throw new Error(`release ${inject.key} → ${res.status}`)
  await new Promise(r => setTimeout(r, 50))
}
for (const deadline = Date.now() + 5000; delays.length < expected && Date.now() < deadline;) await new Promise(r => setTimeout(r, 20))

const sorted = [...delays].sort((a, b) => a - b)
const reqSorted = [...requestMs].sort((a, b) => a - b)
console.log(`realtime bench: node ${process.version}, ${SOCKETS} sockets (${countIn('science')}/${countIn('civil')}/${countIn('comms')} per team, ${countIn('evaluator')} evaluators, ${countIn('facilitator')} control), ${injects.length} releases by hand`)
console.log(`connect + replay + ready of all sockets: ${connectMs.toFixed(0)} ms`)
console.log(`release request (HTTP round trip): median ${pct(reqSorted, 0.5).toFixed(1)} ms, p99 ${pct(reqSorted, 0.99).toFixed(1)} ms`)
console.log(`delivery delay, release request → socket: median ${pct(sorted, 0.5).toFixed(1)} ms, p99 ${pct(sorted, 0.99).toFixed(1)} ms, max ${(sorted.at(-1) ?? Number.NaN).toFixed(1)} ms`)
console.log(`deliveries: ${delays.length} of ${expected} expected, lost ${expected - delays.length}`)
cleanup()
process.exit(expected === delays.length ? 0 : 1)
