#!/usr/bin/env node
// The test tools that come from Debian, not npm: Chromium for the browser tests (never a
// downloaded browser), pdftotext (poppler-utils) for checking the PDF exports, and redis-server
// for the test of several server processes sharing one database.
// When one is missing: install it with apt-get if we are root, else stop with a clear message.
import { existsSync } from 'node:fs'
import { execSync } from 'node:child_process'

const CHROMIUM = process.env.CHROMIUM_PATH || '/usr/bin/chromium'
const TOOLS = [
  { path: CHROMIUM, pkg: 'chromium', why: 'the browser tests' },
  { path: '/usr/bin/pdftotext', pkg: 'poppler-utils', why: 'checking the PDF exports' },
  { path: '/usr/bin/redis-server', pkg: 'redis-server', why: 'the test of several server processes' },
]

const missing = TOOLS.filter(t => !existsSync(t.path))
if (missing.length === 0) process.exit(0)

const isRoot = typeof process.getuid === 'function' && process.getuid() === 0
if (isRoot) {
  const pkgs = missing.map(t => t.pkg).join(' ')
  console.log(`[tests] installing Debian packages: ${pkgs} …`)
  execSync(`apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq ${pkgs}`, { stdio: 'inherit', shell: '/bin/bash' })
}
const still = TOOLS.filter(t => !existsSync(t.path))
if (still.length === 0) process.exit(0)
for (const t of still) console.error(`[tests] ${t.why} need ${t.path}. Install it with:  sudo apt-get install -y ${t.pkg}`)
process.exit(1)
