// Heavy work runs on worker threads: while the after-action report renders (with a 20 000-character word in a
// hotwash note, which held the event loop for 19 s) and a 20 000-sample preview runs, /api/health answers within
// 100 ms. The long word is still in the PDF, whole.
import { execFileSync } from 'node:child_process'
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { demoScenario, Http, TestServer } from '../support/test-server'
import type { Scenario } from '../../shared/scenario/schema'

let server: TestServer
let facilitator: Http
let exerciseId: string
let scenario: Scenario
let dir: string
const WORD = `N${'o'.repeat(19_998)}!`

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'bw-off-main-'))
  server = await new TestServer({ stderr: 'ignore' }).init()
  await server.start()
  facilitator = await Http.signIn(server.base, 'facilitator@brinkwater.test')
  const demo = await demoScenario(facilitator)
  scenario = demo.document
  exerciseId = (await facilitator.post(`/api/scenarios/${demo.id}/exercises`, { title: 'Worker thread drill' })).json.id
  const first = scenario.solutions[0]!.key
  expect((await facilitator.post(`/api/exercises/${exerciseId}/solutions/${first}/publish`, {})).status).toBe(201)
  expect((await facilitator.put(`/api/exercises/${exerciseId}/hotwash/strengths`, { body: WORD, revision: 0 })).status)
    .toBe(200)
}, 120_000)
afterAll(async () => {
  await server?.dispose()
  rmSync(dir, { recursive: true, force: true })
})

async function timedHealth(): Promise<number> {
  const t0 = performance.now()
  const res = await fetch(`${server.base}/api/health`)
  await res.arrayBuffer()
  expect(res.status).toBe(200)
  return performance.now() - t0
}

/** Asks for the report PDF and a 20 000-sample preview at once, and asks /api/health every 10 ms until both are done. */
async function renderWhilePolling() {
  await timedHealth()
  let busy = true
  const report = fetch(`${server.base}/api/exercises/${exerciseId}/report.pdf`, { headers: { cookie: facilitator.cookie } })
    .then(async r => ({ status: r.status, bytes: Buffer.from(await r.arrayBuffer()) }))
  const preview = facilitator.post('/api/scenarios/preview', {
    solution: scenario.solutions.at(-1)!.solution, sites: scenario.sites, samples: 20_000, seed: 7,
  })
  const both = Promise.all([report, preview]).finally(() => { busy = false })
  const latencies: number[] = []
  while (busy) {
    latencies.push(await timedHealth())
    await new Promise(r => setTimeout(r, 10))
  }
  const [pdf, assessed] = await both
  return { latencies, worst: Math.max(...latencies), pdf, assessed }
}

describe('work off the main thread', () => {
  it('keeps /api/health under 100 ms while a report PDF and a 20 000-sample preview render', async () => {
    // The first round loads and compiles the routes' code once (one answer of about 150 ms on a two-processor
    // machine); the second is the one measured.
    const warm = await renderWhilePolling()
    const { latencies, worst, pdf, assessed } = await renderWhilePolling()
    console.info(`health during the renders: warm-up worst ${warm.worst.toFixed(1)} ms; ${latencies.length} answers, worst ${worst.toFixed(1)} ms`)
    expect(pdf.status).toBe(200)
    expect(assessed.status).toBe(200)
    expect(assessed.json.options.samples).toBe(20_000)
    // The renders took a while, and health was asked throughout.
    expect(latencies.length).toBeGreaterThan(5)
    expect(worst).toBeLessThan(100)

    const file = join(dir, 'report.pdf')
    writeFileSync(file, pdf.bytes)
    const text = execFileSync('/usr/bin/pdftotext', ['-enc', 'UTF-8', file, '-'], { encoding: 'utf8' })
    // The word runs over several pages (their headers and footers fall inside it), with no character lost.
    const flat = text.replace(/[\s\u200b]/g, '')
    expect(flat.includes(WORD.slice(0, 60))).toBe(true)
    expect(flat.includes(WORD.slice(-60))).toBe(true)
    expect(flat.match(/o{40,}/g)!.join('').length).toBe(19_998)
  }, 120_000)
})
