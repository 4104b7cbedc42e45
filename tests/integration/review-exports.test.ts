import { execFileSync } from 'node:child_process'
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { as, baseUrl, Client } from '../support/client'
import { closeSockets } from '../support/live'
import { playReviewDrill, type ReviewDrill } from '../support/review-drill'
import { rangeText } from '../../shared/geo/figures'
import { compactText } from '../../shared/geo/threat'
import type { Assessment } from '../../shared/hazard/types'

let d: ReviewDrill
let dir: string
const url = (p = '') => `/api/exercises/${d.id}${p}`
const flat = (s: string) => s.replace(/\s+/g, ' ').trim()
const ITEM = {
  objectiveKey: 'public-warning',
  capability: 'Public Information and Warning',
  action: 'Pre-clear a holding statement template for impact threats',
  element: 'planning',
  owner: 'Joint Information Centre lead',
  startDate: '2031-10-01',
  dueDate: '2031-12-15',
}

async function download(c: Client, path: string) {
  const res = await fetch(`${baseUrl()}${path}`, { headers: { cookie: c.cookieHeader } })
  return { status: res.status, headers: res.headers, bytes: Buffer.from(await res.arrayBuffer()) }
}

/** The text of a PDF, page by page (pdftotext from Debian's poppler-utils). */
function pdfPages(bytes: Buffer, name: string): string[] {
  const file = join(dir, name)
  writeFileSync(file, bytes)
  // REVIEW_PDF_DIR=… keeps a copy for people to look at (pdftoppm -png -r 60).
  if (process.env.REVIEW_PDF_DIR) writeFileSync(join(process.env.REVIEW_PDF_DIR, name), bytes)
  return execFileSync('/usr/bin/pdftotext', ['-enc', 'UTF-8', file, '-'], { encoding: 'utf8' }).split('\f').slice(0, -1)
}

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'bw-review-pdf-'))
  d = await playReviewDrill('Report check drill')
  const a = d.analyst.client
  const area = await a.post(
    url('/findings'),
    {
      kind: 'improvement',
      objectiveKey: 'public-warning',
      capability: 'Public Information and Warning',
      title: 'The holding statement came late',
      detail: 'No template had been cleared in advance.',
    },
  )
  expect(area.status).toBe(201)
  expect((await a.post(
    url('/findings'),
    { kind: 'strength', objectiveKey: 'shared-picture', capability: 'Operational Coordination', title: 'Notification on the first day' },
  )).status).toBe(201)
  const made = await a.post(url('/improvements'), { ...ITEM, findingId: area.json.id })
  expect(made.status).toBe(201)
  expect((await a.patch(url(`/improvements/${made.json.id}`), { status: 'in-progress' })).status).toBe(200)
  expect((await a.put(
    url('/hotwash/follow-up'),
    { body: 'The press office drafts the template by October.', revision: 0 },
  )).status).toBe(200)
  // Three players of three teams: their comments form one group of players (a team of one would name its writer).
  for (const [player, wentWell] of [[d.civil, 'Clear odds.'], [d.science, 'Good maps.'], [d.comms, 'Fast releases.']] as const) {
    expect((await player.client.post(
      url('/feedback'),
      {
        ratings: { objectives: 4, realism: 4, figures: 5, coordination: 3, pace: 2 },
        wentWell,
        toImprove: player === d.civil ? 'More time per decision.' : '',
      },
    )).status).toBe(200)
  }
}, 180_000)
afterAll(() => {
  closeSockets()
  rmSync(dir, { recursive: true, force: true })
})

describe('the after-action report PDF', () => {
  it('is for the analyst and the facilitator only', async () => {
    for (const who of [d.science, d.evaluator, d.evaluator2]) {
      expect((await who.client.get(url('/report.pdf'))).status).toBe(403)
      expect((await who.client.get(url('/inject-cards.pdf'))).status).toBe(403)
    }
    expect((await new Client().get(url('/report.pdf'))).status).toBe(401)
    expect((await new Client().get(url('/inject-cards.pdf'))).status).toBe(401)
  })

  it('carries every section, the marking and caution on every page, and the figures of the record', async () => {
    const { status, headers, bytes } = await download(d.facilitator.client, url('/report.pdf'))
    expect(status).toBe(200)
    expect(headers.get('content-type')).toBe('application/pdf')
    expect(headers.get('content-disposition')).toMatch(/Report-check-drill-after-action-report\.pdf/)
    expect(bytes.subarray(0, 5).toString()).toBe('%PDF-')
    const pages = pdfPages(bytes, 'report.pdf')
    expect(pages.length).toBeGreaterThan(6)
    pages.forEach((p, i) => {
      expect(p, `page ${i + 1}`).toContain('EXERCISE — EXERCISE — EXERCISE')
      expect(flat(p), `page ${i + 1}`).toContain('for training only')
      expect(p, `page ${i + 1}`).toContain(`Page ${i + 1} of ${pages.length}`)
    })
    const text = flat(pages.join(' '))
    for (const title of [
      'After-action report',
      'Overview',
      'Objectives',
      'Scenario summary',
      'How the threat evolved',
      'Timeline (condensed)',
      'Decisions and response times',
      'Scores by objective and capability',
      'Agreement between evaluators',
      'Disagreements for the hotwash',
      'Observations',
      'Hotwash and participant feedback',
      'Findings',
      'Improvement plan',
    ]) {
      expect(text).toContain(title)
    }
    expect(text).toContain('Report check drill')
    expect(text).toContain('Build and keep one shared picture of the threat')
    // The final published solution and its impact probability as the desks showed it.
    const s7 = (await d.analyst.client.get(url('/review/solutions/s7-certain'))).json
    expect(text).toContain(`impact probability of ${s7.headline.text.impactProbability}`)
    expect(text).toContain('Solution 7 — impact certain')
    expect(text).toContain('Solution 1 — discovery orbit, 3-night arc')
    // The last solution's energies by where they go, the tsunami band under both published laws, and the heat.
    for (const words of ['Energy at entry', 'Reaching the surface', 'Tsunami at the coastal sites', 'Run-up, low law', 'Run-up, high law',
      'spread between the published tsunami source laws is wide', 'Ward & Asphaug 2000', 'Heat at the sites']) expect(text).toContain(words)
    const porto = (s7.assessment as Assessment).sites.find(s => s.siteId === 'porto-salgado')!
    expect(text).toContain(`Porto Salgado ${rangeText(porto.distanceKm, 'km')} ${compactText(porto.tsunamiBand!.low.runUpM, 'm')} `
      + `${compactText(porto.tsunamiBand!.high.runUpM, 'm')}`)
    // Inject titles, decisions and their timing.
    expect(text).toContain('Do we tell civil protection now?')
    expect(text).toContain('Formal notification under the hazard plan')
    expect(text).toMatch(/late/)
    // Ratings, kappa and the disagreements.
    expect(text).toContain('0.56')
    expect(text).toContain('moderate')
    expect(text).toContain('M by Second evaluator: B on compare-observations')
    expect(text).toContain('Science cell phoned the duty officer within the hour.')
    // Review content.
    expect(text).toContain('The holding statement came late')
    expect(text).toContain('Notification on the first day')
    expect(text).toContain(ITEM.action)
    expect(text).toContain('Joint Information Centre lead')
    expect(text).toContain('In progress')
    expect(text).toContain('The press office drafts the template by October.')
    expect(text).toContain('More time per decision.')
    // Feedback comments go in groups of at least three, sorted, without names, teams of one or times.
    expect(text).toContain('Players, several teams (3) Went well')
    expect(text).toMatch(/Clear odds\. .*Fast releases\. .*Good maps\./)
    expect(text).not.toContain('Coastal Protection Directorate Went well')
  })
})

describe('the inject cards PDF', () => {
  it('has one card per inject of the scenario, titles on them and no expected actions', async () => {
    const overview = (await d.analyst.client.get(url('/review'))).json
    const { status, headers, bytes } = await download(d.analyst.client, url('/inject-cards.pdf'))
    expect(status).toBe(200)
    expect(headers.get('content-disposition')).toMatch(/inject-cards\.pdf/)
    const pages = pdfPages(bytes, 'cards.pdf').map(flat)
    const injects = overview.scenario.injects as Array<{ key: string; title: string }>
    expect(pages).toHaveLength(injects.length)
    injects.forEach((inj, i) => {
      expect(pages[i]).toContain(`Inject card ${i + 1} of ${injects.length}`)
      expect(pages[i]).toContain(flat(inj.title))
      expect(pages[i]).toContain('EXERCISE — EXERCISE — EXERCISE')
    })
    const all = pages.join(' ')
    for (const hidden of [
      'Give at least an informal heads-up the same day',
      'Issue a short holding statement the same day, cleared with the science cell',
      'Propose explicit escalation thresholds',
    ]) {
      expect(all).not.toContain(hidden)
    }
    const notify = pages.find(p => p.includes('Do we tell civil protection now?'))!
    expect(notify).toContain('As released')
    expect(notify).toContain('Informal heads-up to the Directorate\'s duty officer today')
    // Local time on the scenario's coast (Lisbon, UTC+0 in March), UTC beside it.
    expect(notify).toContain('Answer by 4 Mar 2031 18:00 (UTC+0) · 18:00 UTC')
    const later = pages.find(p => p.includes('Define the evacuation zone'))!
    expect(later).toContain('Not released yet')
    expect(later).toContain('[exposedPopulation.windows]')
  })
})

describe('the report by e-mail', () => {
  it('goes to the chosen members with the PDF attached', async () => {
    expect((await d.evaluator.client.post(url('/report/send'), { userIds: [d.science.id] })).status).toBe(403)
    expect((await d.analyst.client.post(url('/report/send'), { userIds: [] })).status).toBe(400)
    const outsider = await d.analyst.client.post(url('/report/send'), { userIds: [d.science.id, crypto.randomUUID()] })
    expect(outsider.status).toBe(400)
    expect(outsider.json.data.issues).toEqual([{ path: 'userIds[1]', message: 'not a member of this exercise' }])
    const sent = await d.analyst.client.post(
      url('/report/send'),
      { userIds: [d.science.id, d.civil.id], message: 'Our report, for the next planning meeting.' },
    )
    expect(sent.status).toBe(200)
    expect(sent.json.sent).toBe(2)
    const admin = await as('admin')
    const box = (await admin.get('/api/dev/mailbox')).json as Array<{
      to: string
      subject: string
      text: string
      attachments: Array<{ filename: string; contentType: string; size: number }>
    }>
    for (const who of [d.science, d.civil]) {
      const mail = box.find(m => m.to.includes(who.email) && /After-action report/.test(m.subject))
      expect(mail, who.email).toBeTruthy()
      expect(mail!.text).toContain('Our report, for the next planning meeting.')
      expect(mail!.attachments).toEqual([{
        filename: 'Report-check-drill-after-action-report.pdf',
        contentType: 'application/pdf',
        size: sent.json.bytes,
      }])
      expect(mail!.attachments[0]!.size).toBeGreaterThan(20_000)
    }
  })
})
