#!/usr/bin/env node
// `npm run demo`: builds Brinkwater, then serves it with the demo accounts, scenarios and exercise
// seeded into the SQLite file (migrations run when the server starts; seeding twice adds nothing).
// Mail goes to the built-in fake SMTP server unless NUXT_SMTP_HOST is set.
import { spawnSync, spawn } from 'node:child_process'
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs'
import { randomBytes } from 'node:crypto'
import { resolve } from 'node:path'

const root = resolve(import.meta.dirname, '..')
const dataDir = resolve(root, '.data')
mkdirSync(dataDir, { recursive: true })

if (!process.argv.includes('--no-build')) {
  console.log('[demo] building Brinkwater …')
  const build = spawnSync('npx', ['nuxt', 'build'], { cwd: root, stdio: 'inherit' })
  if (build.status !== 0) process.exit(build.status ?? 1)
}

// A session secret that survives restarts, so signed-in users stay signed in.
const secretFile = resolve(dataDir, 'session-secret')
if (!existsSync(secretFile)) writeFileSync(secretFile, randomBytes(32).toString('hex'), { mode: 0o600 })
const sessionPassword = process.env.NUXT_SESSION_PASSWORD || readFileSync(secretFile, 'utf8').trim()

const port = process.env.PORT || '3000'
const env = {
  ...process.env,
  PORT: port,
  NUXT_SESSION_PASSWORD: sessionPassword,
  NUXT_SEED_DEMO: '1',
  // No mail server in the demo: the local mailbox (/dev/mailbox) stands in for everyone's inbox, links included.
  NUXT_MAILBOX_LINKS: process.env.NUXT_MAILBOX_LINKS ?? '1',
  NUXT_DB_PATH: process.env.NUXT_DB_PATH || resolve(dataDir, 'brinkwater.sqlite'),
  NUXT_APP_URL: process.env.NUXT_APP_URL || `http://localhost:${port}`,
}
console.log(`[demo] serving on http://localhost:${port} — sign in as facilitator@brinkwater.test / ${process.env.DEMO_PASSWORD ? '(DEMO_PASSWORD)' : 'brinkwater-demo'}`)
const server = spawn(process.execPath, [resolve(root, '.output/server/index.mjs')], { cwd: root, env, stdio: 'inherit' })
for (const sig of ['SIGINT', 'SIGTERM']) process.on(sig, () => server.kill(sig))
server.on('exit', code => process.exit(code ?? 0))
