#!/usr/bin/env node
// The server the browser tests run against: the built app on E2E_PORT with a fresh SQLite file,
// the demo seed and the fake SMTP catcher. Started by playwright.config.ts.
import { spawn } from 'node:child_process'
import { mkdtempSync, rmSync, existsSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'

const root = resolve(import.meta.dirname, '..')
const entry = resolve(root, process.env.BW_OUTPUT_DIR || '.output', 'server/index.mjs')
if (!existsSync(entry)) {
  console.error('[e2e] No build found: run `npm run build` first (npm test does).')
  process.exit(1)
}
const dir = mkdtempSync(join(tmpdir(), 'brinkwater-e2e-'))
const port = process.env.E2E_PORT || '3737'
const server = spawn(process.execPath, [entry], {
  cwd: root,
  stdio: 'inherit',
  env: {
    ...process.env,
    PORT: port,
    HOST: '127.0.0.1',
    NUXT_DB_PATH: join(dir, 'e2e.sqlite'),
    NUXT_SEED_DEMO: '1',
    NUXT_SESSION_PASSWORD: 'browser-tests-session-password-0123456789abcdef',
    NUXT_FAKE_SMTP_PORT: process.env.E2E_SMTP_PORT || '3738',
    NUXT_SMTP_HOST: '',
    // The browser tests follow invitation links from the local mailbox.
    NUXT_MAILBOX_LINKS: '1',
    NUXT_APP_URL: `http://127.0.0.1:${port}`,
    DEMO_PASSWORD: '',
  },
})
const stop = () => { server.kill('SIGTERM') }
process.on('SIGINT', stop)
process.on('SIGTERM', stop)
server.on('exit', (code) => {
  rmSync(dir, { recursive: true, force: true })
  process.exit(code ?? 0)
})
