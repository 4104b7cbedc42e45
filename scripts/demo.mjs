#!/usr/bin/env node
// `npm run demo`: builds Brinkwater, then serves it with the demo accounts, scenarios and exercise
// seeded into the SQLite file (migrations run when the server starts; seeding twice adds nothing).
// Mail goes to the built-in fake SMTP server unless NUXT_SMTP_HOST is set.
import { spawnSync, spawn } from 'node:child_process'
import { existsSync, mkdirSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs'
import { randomBytes } from 'node:crypto'
import { join, resolve } from 'node:path'

const root = resolve(import.meta.dirname, '..')
const dataDir = resolve(root, '.data')
mkdirSync(dataDir, { recursive: true })

/** The newest modification time (ms) of the files a build is made from. */
function newestSource() {
  let newest = 0
  const visit = (path) => {
    if (!existsSync(path)) return
    const st = statSync(path)
    if (st.isDirectory()) {
      for (const name of readdirSync(path)) if (name !== 'node_modules' && !name.startsWith('.')) visit(join(path, name))
    }
    else newest = Math.max(newest, st.mtimeMs)
  }
  for (const p of ['app', 'server', 'shared', 'public', 'drizzle', 'nuxt.config.ts', 'tailwind.config.ts', 'package.json', 'package-lock.json']) {
    visit(resolve(root, p))
  }
  return newest
}

// The first run builds (a few minutes); later runs reuse the build while no source file is newer than it.
const stamp = resolve(root, '.output/.demo-build')
const current = existsSync(stamp) && existsSync(resolve(root, '.output/server/index.mjs')) && statSync(stamp).mtimeMs >= newestSource()
if (process.argv.includes('--no-build')) console.log('[demo] --no-build: serving the existing build')
else if (current && !process.argv.includes('--build')) console.log('[demo] the build is current (no source file is newer): skipping it; `npm run demo -- --build` forces one')
else {
  console.log('[demo] building Brinkwater (the first build takes a few minutes) …')
  const build = spawnSync('npx', ['nuxt', 'build'], { cwd: root, stdio: 'inherit' })
  if (build.status !== 0) process.exit(build.status ?? 1)
  writeFileSync(stamp, new Date().toISOString())
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
console.log('[demo] Ctrl-C stops the server (and its worker threads).')
// Ctrl-C (or a SIGTERM from a process manager) goes on to the server; if it has not stopped within 5 s, it is killed.
for (const sig of ['SIGINT', 'SIGTERM', 'SIGHUP']) {
  process.on(sig, () => {
    server.kill(sig)
    setTimeout(() => server.kill('SIGKILL'), 5000).unref()
  })
}
server.on('exit', (code, signal) => process.exit(code ?? (signal ? 0 : 1)))
// Stopped through npm with a signal to npm alone (not the whole process group), npm exits without passing it on:
// once the process that started this one is gone, stop the server too, so that nothing is left serving.
const parent = process.ppid
setInterval(() => {
  try { process.kill(parent, 0) }
  catch { process.emit('SIGTERM', 'SIGTERM') }
}, 1000).unref()
