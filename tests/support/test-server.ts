// Helpers of the integration tests that run their own servers (own SQLite file and ports, as
// live-restart.test.ts does): spawn, kill, restart, a cookie-keeping client, and a drill scenario
// built from the demo one.
import { spawn, type ChildProcess } from 'node:child_process'
import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import { freePort } from './ports'
import { DEMO_PASSWORD } from './client'
import { stringifyScenario, type Scenario } from '../../shared/scenario'

export { drillScenario } from './load'

export const ENTRY = resolve(import.meta.dirname, '../..', process.env.BW_OUTPUT_DIR || '.output', 'server/index.mjs')

export interface ServerOptions {
  /** Extra environment (NUXT_SCHEDULER_INTERVAL_MS, NUXT_REDIS_URL, …). */
  env?: Record<string, string>
  /** An existing database file (several processes on one file); default: a new one in its own folder. */
  dbPath?: string
  seed?: boolean
  /** Where the server's stderr goes (default: this process's; 'capture' keeps it in `log`). */
  stderr?: 'inherit' | 'ignore' | 'capture'
}

/** A built server of its own on free ports, that a test can SIGKILL and start again on the same file. */
export class TestServer {
  dir = ''
  dbPath = ''
  base = ''
  port = 0
  proc: ChildProcess | undefined
  starts = 0
  /** The server's stderr, with stderr: 'capture'. */
  log = ''
  private env: NodeJS.ProcessEnv = {}

  constructor(private opts: ServerOptions = {}) {}

  async init() {
    this.dir = mkdtempSync(join(tmpdir(), 'brinkwater-hard-'))
    this.dbPath = this.opts.dbPath ?? join(this.dir, 'hard.sqlite')
    const [port, smtp] = [await freePort(), await freePort()]
    this.port = port
    this.base = `http://127.0.0.1:${port}`
    this.env = {
      ...process.env, PORT: String(port), HOST: '127.0.0.1', NUXT_DB_PATH: this.dbPath,
      NUXT_SEED_DEMO: this.opts.seed === false ? '' : '1', NUXT_SESSION_PASSWORD: 'own-server-tests-session-password-0123456789ab',
      NUXT_FAKE_SMTP_PORT: String(smtp), NUXT_SMTP_HOST: '', NUXT_APP_URL: this.base, DEMO_PASSWORD: '',
      // Tests follow links from the local mailbox; mail-links.test.ts turns this off to check the default.
      NUXT_MAILBOX_LINKS: '1',
      // Tests send thousands of writes a minute as one person; write-limits.test.ts restores the default (120).
      NUXT_WRITE_LIMIT_PER_MINUTE: '100000',
      ...this.opts.env,
    }
    return this
  }

  get pid() { return this.proc?.pid }
  get running() { return !!this.proc && this.proc.exitCode === null && this.proc.signalCode === null }

  /** Starts the server and waits until /api/health answers (a degraded 503 counts with `degradedOk`); returns the ms it took. */
  async start(opts: { degradedOk?: boolean } = {}): Promise<number> {
    const t0 = Date.now()
    const mode = this.opts.stderr ?? 'inherit'
    const proc: ChildProcess = spawn(
      process.execPath,
      [ENTRY],
      { env: this.env, stdio: ['ignore', 'ignore', mode === 'capture' ? 'pipe' : mode] },
    )
    if (mode === 'capture') proc.stderr!.on('data', (chunk: Buffer) => { this.log += chunk.toString() })
    this.proc = proc
    this.starts++
    const deadline = Date.now() + 60_000
    for (;;) {
      try {
        const res = await fetch(`${this.base}/api/health`)
        if (res.ok || (opts.degradedOk && res.status === 503)) return Date.now() - t0
      }
      catch { /* not up yet */ }
      if (proc.exitCode !== null) throw new Error(`server exited with ${proc.exitCode}`)
      if (Date.now() > deadline) throw new Error('server did not start')
      await new Promise(r => setTimeout(r, 25))
    }
  }

  /** SIGKILL: no shutdown hook runs, whatever was in flight is cut. */
  kill(): Promise<void> { return this.signal('SIGKILL') }
  /** SIGTERM: a graceful stop. */
  stop(): Promise<void> { return this.signal('SIGTERM') }

  private signal(sig: NodeJS.Signals): Promise<void> {
    const p = this.proc
    if (!p || p.exitCode !== null || p.signalCode !== null) return Promise.resolve()
    return new Promise((ok) => {
      p.once('exit', () => ok())
      p.kill(sig)
    })
  }

  async dispose() {
    await this.kill()
    if (!this.opts.dbPath) rmSync(this.dir, { recursive: true, force: true })
  }
}

export interface Answer {
  status: number
  json: any // eslint-disable-line @typescript-eslint/no-explicit-any -- tests read any shape
  text: string
  headers: Headers
}

/** A cookie-keeping client of one server. */
export class Http {
  cookie = ''
  constructor(public base: string) {}

  async call(method: string, path: string, body?: unknown, headers: Record<string, string> = {}): Promise<Answer> {
    const h: Record<string, string> = { ...headers }
    if (this.cookie) h.cookie = this.cookie
    let payload: BodyInit | undefined
    if (typeof body === 'string' || body instanceof FormData || body instanceof Uint8Array) payload = body as BodyInit
    else if (body !== undefined) {
      payload = JSON.stringify(body)
      h['content-type'] ??= 'application/json'
    }
    const res = await fetch(`${this.base}${path}`, { method, headers: h, body: payload, redirect: 'manual' })
    const set = res.headers.getSetCookie().find(c => c.startsWith('brinkwater-session='))
    if (set) this.cookie = set.split(';')[0]!
    const text = await res.text()
    let json = null
    try { json = text ? JSON.parse(text) : null }
    catch { json = null }
    return { status: res.status, json, text, headers: res.headers }
  }

  get(path: string) { return this.call('GET', path) }
  post(path: string, body: unknown = {}) { return this.call('POST', path, body) }
  put(path: string, body: unknown = {}) { return this.call('PUT', path, body) }

  /** Signs in; retries for a few seconds, as the demo seed finishes just after the server answers. */
  static async signIn(base: string, email: string, password = DEMO_PASSWORD) {
    const c = new Http(base)
    for (const deadline = Date.now() + 15_000; ;) {
      const res = await c.post('/api/auth/login', { email, password })
      if (res.status === 200) return c
      if (res.status !== 401 || Date.now() > deadline) throw new Error(`login ${email} → ${res.status} ${res.text}`)
      await sleep(200)
    }
  }
}

/** Posts a scenario document as a YAML file (the shared stringifyScenario) to the import route; returns the library id. */
export async function importScenario(author: Http, doc: Scenario): Promise<string> {
  const form = new FormData()
  form.append('file', new Blob([stringifyScenario(doc)], { type: 'application/yaml' }), `${doc.key}.yaml`)
  const res = await author.call('POST', '/api/scenarios/import?onConflict=copy', form)
  if (res.status !== 201) throw new Error(`import → ${res.status} ${res.text}`)
  return res.json.id as string
}

/** The demo scenario document from the library, through the API. */
export async function demoScenario(author: Http): Promise<{ id: string; document: Scenario }> {
  const list = await author.get('/api/scenarios')
  const demo = (list.json as Array<{ id: string; key: string }>).find(s => s.key === 'demo-ocean-impact')!
  const one = await author.get(`/api/scenarios/${demo.id}`)
  return { id: demo.id, document: one.json.document as Scenario }
}

export const sleep = (ms: number) => new Promise(r => setTimeout(r, ms))
