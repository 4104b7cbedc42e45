import { execFileSync } from 'node:child_process'
import { readFile } from 'node:fs/promises'
import { expect, request as api, test, type APIRequestContext, type Page } from '@playwright/test'
import { PASSWORD, shot, signIn } from './helpers'

const FACILITATOR = 'facilitator@brinkwater.test'
const ANALYST = 'analyst@brinkwater.test'
const PLAYER = 'science@brinkwater.test'
const EVALUATOR = 'evaluator@brinkwater.test'

async function ok(res: Awaited<ReturnType<APIRequestContext['post']>>, what: string) {
  expect(res.ok(), `${what}: ${res.status()} ${await res.text()}`).toBe(true)
  return res
}

/** A fresh exercise from the demo scenario, played a little through the API and ended. */
async function playedDrill(page: Page, request: APIRequestContext): Promise<string> {
  const f = page.request
  await ok(await f.post('/api/auth/login', { data: { email: FACILITATOR, password: PASSWORD } }), 'facilitator login')
  const demo = (await (await f.get('/api/scenarios')).json() as Array<{ id: string; key: string }>).find(s => s.key === 'demo-ocean-impact')!
  const ex = (await (await ok(
    await f.post(`/api/scenarios/${demo.id}/exercises`, { data: { title: `Review walk-through ${Date.now()}` } }),
    'start exercise',
  )).json()).id as string
  await ok(await f.post(`/api/exercises/${ex}/members`, { data: { email: ANALYST, role: 'analyst' } }), 'add analyst')
  await ok(await f.post(`/api/exercises/${ex}/members`, { data: { email: PLAYER, role: 'player', teamKey: 'science' } }), 'add player')
  await ok(await f.post(`/api/exercises/${ex}/members`, { data: { email: EVALUATOR, role: 'evaluator' } }), 'add evaluator')
  await ok(await f.post(`/api/exercises/${ex}/clock`, { data: { action: 'start' } }), 'start clock')
  await ok(await f.post(`/api/exercises/${ex}/clock`, { data: { action: 'pause' } }), 'pause clock')
  await ok(await f.post(`/api/exercises/${ex}/solutions/s1-discovery/publish`), 'publish')
  await ok(await f.post(`/api/exercises/${ex}/injects/notify-civil-protection/release`), 'release')
  await ok(await request.post('/api/auth/login', { data: { email: PLAYER, password: PASSWORD } }), 'player login')
  await ok(
    await request.post(
      `/api/exercises/${ex}/responses`,
      { data: {
        injectKey: 'notify-civil-protection',
        choice: 'Formal notification under the hazard plan',
        text: 'Phoned the duty officer.',
        idempotencyKey: `e2e-${Date.now()}`,
      } },
    ),
    'response',
  )
  const evaluator = await api.newContext({ baseURL: test.info().project.use.baseURL })
  await ok(await evaluator.post('/api/auth/login', { data: { email: EVALUATOR, password: PASSWORD } }), 'evaluator login')
  for (const [taskKey, rating] of [['notify-early', 'P'], ['joint-cell', 'M']] as const) {
    await ok(
      await evaluator.post(
        `/api/exercises/${ex}/scores`,
        { data: {
          criterionKey: 'notification-and-coordination',
          taskKey,
          rating,
          note: `Seen at the ${taskKey} step.`,
          idempotencyKey: `e2e-${taskKey}-${Date.now()}`,
        } },
      ),
      'score',
    )
  }
  await ok(
    await evaluator.post(
      `/api/exercises/${ex}/observations`,
      { data: {
        text: 'The cell phoned before writing.',
        injectKey: 'notify-civil-protection',
        teamKey: 'science',
        idempotencyKey: `e2e-obs-${Date.now()}`,
      } },
    ),
    'observation',
  )
  await evaluator.dispose()
  await ok(await f.post(`/api/exercises/${ex}/clock`, { data: { action: 'end' } }), 'end clock')
  await page.context().clearCookies()
  return ex
}

async function download(page: Page, testId: string, name: RegExp) {
  const [file] = await Promise.all([page.waitForEvent('download'), page.getByTestId(testId).click()])
  expect(file.suggestedFilename()).toMatch(name)
  const bytes = await readFile((await file.path())!)
  expect(bytes.length).toBeGreaterThan(100)
  return bytes
}

test('the after-action lead reviews a drill, edits the plan and downloads every export', async ({ page, request }) => {
  test.setTimeout(120_000)
  const ex = await playedDrill(page, request)
  await signIn(page, ANALYST)
  await page.goto(`/exercises/${ex}/review`)
  await expect(page.getByRole('heading', { name: 'Review desk' })).toBeVisible()
  await expect(page.getByTestId('drill-banner').first()).toContainText('EXERCISE — EXERCISE — EXERCISE')
  await expect(page.getByTestId('review-status')).toHaveText('Ended')

  // The timeline, filtered by team, then by event type and phase.
  const count = page.getByTestId('timeline-count')
  const all = Number((await count.textContent())!.match(/of (\d+)/)![1])
  expect(all).toBe(9)
  await page.getByTestId('timeline-team').selectOption('science')
  await expect(count).toHaveText(/^3 of /)
  await page.getByTestId('timeline-team').selectOption('')
  await page.getByTestId('timeline-type').selectOption('response.submitted')
  await expect(page.getByTestId('timeline-row')).toHaveCount(1)
  await expect(page.getByTestId('timeline-row')).toContainText('Formal notification under the hazard plan')
  await page.getByTestId('timeline-phase').selectOption('aftermath')
  await expect(page.getByTestId('timeline-row')).toHaveCount(0)
  await page.getByTestId('timeline-phase').selectOption('')
  await page.getByTestId('timeline-type').selectOption('')
  await expect(count).toHaveText(`${all} of ${all} events`)
  await shot(page, 'review-timeline-laptop')

  // The replay: the science room before and after the release, with the figures current then.
  await page.getByTestId('review-tab-replay').click()
  await page.getByTestId('replay-room-team:science').click()
  const slider = page.getByTestId('replay-slider')
  await slider.fill('2')
  await expect(page.getByTestId('replay-moment')).toContainText('Event 2 of')
  await expect(page.getByTestId('replay-inject')).toHaveCount(0)
  await expect(page.getByTestId('replay-no-solution')).toBeVisible()
  await slider.fill(String(all))
  await expect(page.getByTestId('replay-inject')).toHaveCount(1)
  await expect(page.getByTestId('replay-inject')).toContainText('Phoned the duty officer.')
  await expect(page.getByTestId('replay-headline')).toContainText(/impact probability [\d.<\s]+%/)
  await expect(page.getByTestId('hazard-brief')).toBeVisible({ timeout: 20_000 })
  await page.getByTestId('replay-back').click()
  await expect(page.getByTestId('replay-moment')).toContainText(`Event ${all - 1} of`)
  await page.getByTestId('replay-room-team:civil').click()
  await expect(page.getByTestId('replay-inject')).toHaveCount(0)
  await page.getByTestId('replay-room-team:science').click()
  await shot(page, 'review-replay-laptop')

  // Decisions and scores render from the record.
  await page.getByTestId('review-tab-decisions').click()
  await expect(page.getByTestId('decision-row')).toHaveCount(1)
  await expect(page.getByTestId('decision-row')).toContainText('On time')
  await page.getByTestId('review-tab-scoring').click()
  await expect(page.getByTestId('agreement')).toContainText('No two evaluators rated the same task')
  const picture = page.getByTestId('score-objective').first()
  await expect(picture).toContainText('Jonas Petrel: Seen at the notify-early step.')
  await expect(picture).toContainText('Jonas Petrel: Seen at the joint-cell step.')
  await expect(page.getByTestId('observations').first()).toContainText('The cell phoned before writing.')

  // The improvement plan: add an item, then change its status in place.
  await page.getByTestId('review-tab-plan').click()
  await page.getByTestId('plan-new-action').fill('Agree escalation thresholds for the hazard plan')
  await page.getByTestId('plan-new-owner').fill('Hazard Science Cell lead')
  await page.getByTestId('plan-new-start').fill('2031-10-01')
  await page.getByTestId('plan-new-due').fill('2031-12-31')
  await page.getByTestId('plan-new-submit').click()
  const row = page.getByTestId('plan-row')
  await expect(row).toHaveCount(1)
  await row.getByTestId('plan-status').selectOption('in-progress')
  await expect(row.getByTestId('plan-row-state')).toHaveText('Saved')
  const items = await (await page.request.get(`/api/exercises/${ex}/improvements`)).json() as Array<{
    action: string
    status: string
    dueDate: string
  }>
  expect(items).toEqual([expect.objectContaining({
    action: 'Agree escalation thresholds for the hazard plan',
    status: 'in-progress',
    dueDate: '2031-12-31',
  })])
  await shot(page, 'review-plan-laptop')

  // Every export downloads with its name and content.
  await page.getByTestId('review-tab-exports').click()
  expect((await download(page, 'export-timeline-csv', /-timeline\.csv$/)).toString('utf8')).toContain('EXERCISE — EXERCISE — EXERCISE')
  expect((await download(page, 'export-timeline-xlsx', /-timeline\.xlsx$/)).subarray(0, 2).toString()).toBe('PK')
  expect(JSON.parse((await download(page, 'export-timeline-json', /-timeline\.json$/)).toString('utf8')).events.length).toBe(all)
  expect((await download(page, 'export-report-pdf', /-after-action-report\.pdf$/)).subarray(0, 5).toString()).toBe('%PDF-')
  expect((await download(page, 'export-inject-cards', /-inject-cards\.pdf$/)).subarray(0, 5).toString()).toBe('%PDF-')
  await shot(page, 'review-exports-laptop')

  // The printable report.
  await page.goto(`/exercises/${ex}/report`)
  await expect(page.getByRole('heading', { name: 'After-action report' })).toBeVisible()
  await expect(page.getByTestId('report-map').locator('svg')).toBeVisible()
  await expect(page.getByTestId('report-plan')).toContainText('Agree escalation thresholds for the hazard plan')
  await shot(page, 'review-report-page-laptop')
  // Printed, every page carries the marking, the caution and its number (CSS page margin boxes).
  const printed = 'test-results/screens/review-report-print.pdf'
  await page.pdf({ path: printed, format: 'A4' })
  const pages = execFileSync('/usr/bin/pdftotext', ['-enc', 'UTF-8', printed, '-'], { encoding: 'utf8' }).split('\f').slice(0, -1)
  expect(pages.length).toBeGreaterThan(2)
  pages.forEach((p, i) => {
    // The marking is letter-spaced, so pdftotext gives its words apart.
    expect((p.match(/EXERCISE/g) ?? []).length).toBeGreaterThanOrEqual(3)
    expect(p.replace(/\s+/g, ' ')).toContain('for training only')
    expect(p.replace(/\s+/g, ' ')).toContain(`Page ${i + 1} of ${pages.length}`)
  })

  // On a tablet (820 px), no tab of the review desk runs off the side of the page (it ran 246 px over).
  await page.setViewportSize({ width: 820, height: 1180 })
  for (const tab of ['timeline', 'replay', 'decisions', 'plan']) {
    await page.goto(`/exercises/${ex}/review?tab=${tab}`)
    await expect(page.getByTestId(`review-tab-${tab}`)).toHaveAttribute('data-state', 'active')
    const over = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)
    expect(over, tab).toBeLessThanOrEqual(0)
  }
})

test('a player is told the review desk is not theirs', async ({ page, request }) => {
  const ex = await playedDrill(page, request)
  await signIn(page, PLAYER)
  await page.goto(`/exercises/${ex}/review`)
  await expect(page.getByTestId('review-not-allowed')).toContainText('The review desk is for the after-action team')
})

test('the review desk on a projector in the dark theme', async ({ page, request }) => {
  const ex = await playedDrill(page, request)
  await page.setViewportSize({ width: 1920, height: 1080 })
  await page.context().addCookies([{ name: 'bw-theme', value: 'dark', url: test.info().project.use.baseURL! }])
  await signIn(page, ANALYST)
  await page.goto(`/exercises/${ex}/review`)
  await expect(page.locator('html')).toHaveClass(/dark/)
  await expect(page.getByTestId('timeline-row').first()).toBeVisible()
  await shot(page, 'review-timeline-projector-dark')
  const ready = {
    replay: 'hazard-brief',
    decisions: 'decision-row',
    scoring: 'score-objective',
    hotwash: 'feedback-count',
    plan: 'plan-new',
    exports: 'send-report',
  } as const
  for (const [tab, testId] of Object.entries(ready)) {
    await page.getByTestId(`review-tab-${tab}`).click()
    await expect(page.getByTestId(testId).first()).toBeVisible({ timeout: 20_000 })
    await shot(page, `review-${tab}-projector-dark`)
  }
  await page.goto(`/exercises/${ex}/feedback`)
  await expect(page.getByTestId('feedback-form')).toBeVisible()
  await shot(page, 'review-feedback-form-projector-dark')
})
