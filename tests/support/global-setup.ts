// Starts the built server (.output) on free ports with a fresh SQLite file, the demo seed and the
// fake SMTP catcher, for the integration tests. `npm test` builds before it runs vitest.
import { spawn, type ChildProcess } from 'node:child_process'
import { existsSync, mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import type { TestProject } from 'vitest/node'
import { freePort } from './ports'

declare module 'vitest' {
  export interface ProvidedContext { baseUrl: string }
}

let server: ChildProcess | undefined
let dir: string | undefined

export async function setup(project: TestProject) {
  const entry = resolve(import.meta.dirname, '../..', process.env.BW_OUTPUT_DIR || '.output', 'server/index.mjs')
  if (!existsSync(entry)) throw new Error('No build found: run `npm run build` before the integration tests (npm test does).')
  dir = mkdtempSync(join(tmpdir(), 'brinkwater-it-'))
  const [port, smtpPort] = [await freePort(), await freePort()]
  const baseUrl = `http://127.0.0.1:${port}`
  server = spawn(process.execPath, [entry], {
    env: {
      ...process.env,
      PORT: String(port),
      HOST: '127.0.0.1',
      NUXT_DB_PATH: join(dir, 'test.sqlite'),
      NUXT_SEED_DEMO: '1',
      NUXT_SESSION_PASSWORD: 'integration-tests-session-password-0123456789',
      NUXT_FAKE_SMTP_PORT: String(smtpPort),
      NUXT_SMTP_HOST: '',
      NUXT_APP_URL: baseUrl,
      DEMO_PASSWORD: '',
      // The shared server takes thousands of writes a minute from one test account (bad-input sweeps, the
      // authorisation matrix); the per-person limit itself is tested on its own server (write-limits.test.ts).
      NUXT_WRITE_LIMIT_PER_MINUTE: '100000',
      // The tests follow invitation and reset links from the local mailbox (mail-links.test.ts checks the default).
      NUXT_MAILBOX_LINKS: '1',
    },
    stdio: ['ignore', 'inherit', 'inherit'],
  })
  const deadline = Date.now() + 60_000
  for (;;) {
    try {
      const res = await fetch(`${baseUrl}/api/health`)
      if (res.ok) break
    }
    catch { /* not up yet */ }
    if (server.exitCode !== null) throw new Error(`The server exited with code ${server.exitCode}`)
    if (Date.now() > deadline) throw new Error('The server did not answer /api/health within 60 s')
    await new Promise(r => setTimeout(r, 200))
  }
  project.provide('baseUrl', baseUrl)
}

export async function teardown() {
  if (server && server.exitCode === null) {
    server.kill('SIGTERM')
    await new Promise(r => server!.once('exit', r))
  }
  if (dir) rmSync(dir, { recursive: true, force: true })
}
