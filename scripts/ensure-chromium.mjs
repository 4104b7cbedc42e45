#!/usr/bin/env node
// Browser tests run in Debian's Chromium at /usr/bin/chromium (never a downloaded browser).
// When it is missing: install it with apt-get if we are root, else stop with a clear message.
import { existsSync } from 'node:fs'
import { execSync } from 'node:child_process'

const CHROMIUM = process.env.CHROMIUM_PATH || '/usr/bin/chromium'
if (existsSync(CHROMIUM)) process.exit(0)

if (typeof process.getuid === 'function' && process.getuid() === 0) {
  console.log(`[e2e] ${CHROMIUM} is missing; installing Debian's chromium with apt-get …`)
  execSync('apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium', { stdio: 'inherit', shell: '/bin/bash' })
  if (existsSync(CHROMIUM)) process.exit(0)
}
console.error(`[e2e] The browser tests need Chromium at ${CHROMIUM}.
Install it with:  sudo apt-get install -y chromium   (or set CHROMIUM_PATH to another Chromium).`)
process.exit(1)
