import { expect, test, type Browser, type Page } from '@playwright/test'
import { shot, signIn } from './helpers'

const LAPTOP = { width: 1366, height: 768 }
const PROJECTOR = { width: 1920, height: 1080 }
const TITLE = `Live desks drill ${Date.now().toString(36)}`

/** A separate browser (own cookies, own socket) signed in as one demo account. */
async function person(browser: Browser, email: string | null, viewport = LAPTOP) {
  const context = await browser.newContext({ baseURL: test.info().project.use.baseURL, viewport })
  const page = await context.newPage()
  if (email) await signIn(page, email)
  return { context, page }
}

/** A fresh exercise of the demo scenario (other specs use the seeded one), with a player per team and an evaluator. */
async function freshExercise(page: Page): Promise<string> {
  const scenarios = await (await page.request.get('/api/scenarios')).json() as Array<{ id: string; key: string }>
  const demo = scenarios.find(s => s.key === 'demo-ocean-impact')!
  const created = await page.request.post(`/api/scenarios/${demo.id}/exercises`, { data: { title: TITLE } })
  expect(created.status()).toBe(201)
  const { id } = await created.json() as { id: string }
  for (const [email, role, teamKey] of [
    ['science', 'player', 'science'],
    ['civil', 'player', 'civil'],
    ['evaluator', 'evaluator', null],
  ] as const) {
    const added = await page.request.post(`/api/exercises/${id}/members`, { data: { email: `${email}@brinkwater.test`, role, teamKey } })
    expect(added.status()).toBe(201)
  }
  return id
}

/** Responses recorded for an inject, as the facilitator reads the event record. */
async function responsesTo(page: Page, exerciseId: string, injectKey: string) {
  const { events } = await (await page.request.get(`/api/exercises/${exerciseId}/events?since=0`)).json() as { events: Array<{
    type: string
    data: { injectKey?: string }
  }> }
  return events.filter(e => e.type === 'response.submitted' && e.data.injectKey === injectKey).length
}

const live = (page: Page) => expect(page.getByTestId('live-status')).toHaveAttribute('data-status', 'live', { timeout: 15_000 })

test('a short drill across the control desk, two team rooms, the evaluator desk and the wall', async ({ browser }) => {
  test.setTimeout(240_000)

  // The facilitator starts a fresh exercise and opens the control desk from the exercise page.
  const fac = await person(browser, 'facilitator@brinkwater.test')
  const id = await freshExercise(fac.page)
  await fac.page.goto(`/exercises/${id}`)
  await fac.page.getByTestId('open-desk').click()
  await expect(fac.page).toHaveURL(new RegExp(`/exercises/${id}/control$`))
  await expect(fac.page.getByTestId('desk-title')).toHaveText('Control desk')
  await expect(fac.page.getByTestId('drill-banner').first()).toContainText('EXERCISE — EXERCISE — EXERCISE')
  await live(fac.page)
  await expect(fac.page.getByTestId('clock-status')).toHaveText('Ready to start')

  // Real time, so that the scheduler releases nothing by itself during the test; then start.
  await fac.page.getByTestId('clock-speed').click()
  await fac.page.getByTestId('speed-real').check()
  await fac.page.getByTestId('speed-apply').click()
  await expect(fac.page.getByTestId('clock-factor')).toContainText('×1 ')
  await fac.page.getByTestId('clock-start').click()
  await fac.page.getByRole('alertdialog').getByRole('button', { name: 'Start the clock' }).click()
  await expect(fac.page.getByTestId('clock-status')).toHaveText('Running')

  // The first orbit solution, published by hand.
  const solutions = fac.page.getByTestId('desk-solutions')
  await solutions.locator('[data-solution="s1-discovery"]').getByTestId('publish').click()
  await fac.page.getByRole('alertdialog').getByRole('button', { name: 'Publish' }).click()
  await expect(solutions.locator('[data-solution="s1-discovery"]')).toContainText('published', { timeout: 30_000 })
  await expect(fac.page.getByTestId('headline-delta')).toContainText('Solution 1')

  // The science room (reached from the exercises list, which opens each role's desk), the civil room and the evaluator.
  const sci = await person(browser, 'science@brinkwater.test')
  await sci.page.getByTestId('exercise-list').locator('li', { hasText: TITLE }).getByRole('link', { name: 'Open' }).click()
  await expect(sci.page).toHaveURL(new RegExp(`/exercises/${id}/room$`))
  await live(sci.page)
  await expect(sci.page.getByTestId('room-empty')).toBeVisible()
  const civ = await person(browser, 'civil@brinkwater.test')
  await civ.page.goto(`/exercises/${id}/room`)
  await live(civ.page)
  const ev = await person(browser, 'evaluator@brinkwater.test')
  await ev.page.goto(`/exercises/${id}/evaluate`)
  await live(ev.page)

  // An early release of a request for decision to science: it appears in the room without a reload.
  const row = fac.page.locator('[data-testid="schedule-row"][data-inject="notify-civil-protection"]')
  await row.getByTestId('release').click()
  await fac.page.getByRole('alertdialog').getByRole('button', { name: 'Release now' }).click()
  await expect(row).toHaveAttribute('data-state', 'released')
  const card = sci.page.locator('[data-testid="room-inject"][data-inject="notify-civil-protection"]')
  await expect(card).toBeVisible()
  await expect(card).toContainText('Do we tell civil protection now?')
  await expect(card.getByTestId('inject-body')).toContainText('impact probability')
  await expect(card.getByTestId('deadline')).toContainText('Answer by 4 Mar 18:00 (UTC+0) · 18:00 UTC')

  // The civil room does not see science's traffic.
  await expect(civ.page.getByTestId('room-empty')).toBeVisible()
  await expect(civ.page.locator('[data-inject="notify-civil-protection"]')).toHaveCount(0)

  // Science answers; a double click records one response.
  await card.getByText('Informal heads-up to the Directorate').click()
  await card.getByLabel(/Reasoning and further actions/).fill('Duty officer called at 10:05; next update after the follow-up nights.')
  await card.getByTestId('decision-submit').dblclick()
  await expect(card.getByTestId('team-answer')).toHaveCount(1)
  await expect(card.getByTestId('team-answer')).toContainText('Informal heads-up')
  await expect(sci.page.getByTestId('log-entry')).toHaveCount(1)
  await expect(row).toHaveAttribute('data-state', 'answered')
  expect(await responsesTo(fac.page, id, 'notify-civil-protection')).toBe(1)
  await sci.page.getByTestId('room-figures').scrollIntoViewIfNeeded()
  await sci.page.evaluate(() => window.scrollTo(0, 0))
  await shot(sci.page, 'team-room')

  // The evaluator sees the inject with its expected actions and the answer, and rates a task.
  const evInject = ev.page.locator('[data-testid="evaluator-inject"][data-inject="notify-civil-protection"]')
  await expect(evInject.getByTestId('expected-actions')).toContainText('informal heads-up the same day')
  await expect(evInject.getByTestId('evaluator-answer')).toContainText('Informal heads-up')
  await evInject.getByRole('button', { name: 'Operational Coordination' }).click()
  const task = ev.page.locator('[data-criterion="notification-and-coordination"] [data-task="notify-early"]')
  await expect(task).toBeVisible()
  await task.getByText('Done as intended: complete, in time, no outside help').click()
  await task.getByLabel('Note').fill('Heads-up given within the hour, figures as odds.')
  await task.getByTestId('score-save').click()
  await expect(task.getByTestId('task-rating')).toHaveText('P')
  await expect(fac.page.getByTestId('desk-traffic')).toContainText('Do we tell civil protection now?')
  await ev.page.evaluate(() => window.scrollTo(0, 0))
  await shot(ev.page, 'evaluator-desk')

  // A later solution: the released inject's figures are revised in the science room, with its history.
  await solutions.locator('[data-solution="s2-twelve-day-arc"]').getByTestId('publish').click()
  await fac.page.getByRole('alertdialog').getByRole('button', { name: 'Publish' }).click()
  await expect(card.getByTestId('revised-mark')).toBeVisible({ timeout: 30_000 })
  await card.getByTestId('revision-history').locator('summary').click()
  await expect(card.getByTestId('revision-history')).toContainText('As released')
  await expect(card.getByTestId('revision-history')).toContainText('Solution 1')
  await expect(fac.page.getByTestId('headline-delta')).toContainText('against Solution 1')

  // A wall link, opened without signing in: clock, phase and headline figures, large enough for the back of the room.
  await fac.page.getByLabel('Label (where it is shown)').fill('Main hall projector')
  await fac.page.getByTestId('wall-create').click()
  const url = await fac.page.getByTestId('wall-url').inputValue()
  expect(url).toMatch(/\/wall\/[\w-]{43}$/)
  const wall = await person(browser, null, PROJECTOR)
  await wall.page.goto(url)
  await expect(wall.page.getByTestId('wall-title')).toHaveText(TITLE)
  await expect(wall.page.getByTestId('drill-banner')).toContainText('EXERCISE')
  await expect(wall.page.getByTestId('clock-time')).toHaveText(/\d\d:\d\d:\d\d/)
  await expect(wall.page.getByTestId('clock-status')).toHaveText('Running')
  await expect(wall.page.getByTestId('wall-solution-label')).toContainText('Solution 2')
  await expect(wall.page.getByTestId('headline-probability')).toBeVisible()
  await expect(wall.page.locator('html')).toHaveClass(/dark/)
  await expect(wall.page.getByRole('button')).toHaveCount(0)
  const figurePx = await wall.page.getByTestId('headline-probability').locator('dd').first().evaluate(el => Number.parseFloat(getComputedStyle(el).fontSize))
  expect(figurePx).toBeGreaterThanOrEqual(28)
  await expect(wall.page.getByTestId('map-land')).toHaveAttribute('d', /^M/, { timeout: 20_000 })
  await shot(wall.page, 'wall-1920')
  await wall.page.setViewportSize(LAPTOP)
  await shot(wall.page, 'wall')

  // A second request for decision, then the science room drops off the network.
  const followUp = fac.page.locator('[data-phase="follow-up"] h3 button')
  if (await followUp.getAttribute('aria-expanded') !== 'true') await followUp.click()
  const second = fac.page.locator('[data-testid="schedule-row"][data-inject="observing-time-request"]')
  await second.getByTestId('release').click()
  await fac.page.getByRole('alertdialog').getByRole('button', { name: 'Release now' }).click()
  const card2 = sci.page.locator('[data-testid="room-inject"][data-inject="observing-time-request"]')
  await expect(card2).toBeVisible()
  await sci.context.setOffline(true)
  await expect(sci.page.getByTestId('connection-banner')).toContainText(/Reconnecting… showing what we had at \d\d:\d\d/)

  // Offline, the answer waits in the outbox; control sends a message meanwhile.
  await card2.getByText('Request one night and review').click()
  await card2.getByTestId('decision-submit').click()
  await expect(card2.getByTestId('answer-waiting')).toBeVisible()
  await fac.page.getByTestId('msg-team-science').check()
  await fac.page.getByLabel('Title', { exact: true }).fill('Keep the cell log current')
  await fac.page.getByLabel(/^Message \(Markdown/).fill('Log **every** call with the time and the figures quoted.')
  await fac.page.getByTestId('msg-send').click()
  await expect(fac.page.getByTestId('msg-sent')).toContainText('Sent to Hazard Science Cell')
  await expect(sci.page.getByText('Keep the cell log current')).toHaveCount(0)

  // Back online: the banner goes, the missed message arrives and the queued answer goes out once.
  await sci.context.setOffline(false)
  await expect(sci.page.getByTestId('connection-banner')).toHaveCount(0, { timeout: 30_000 })
  await expect(sci.page.getByRole('heading', { name: 'Keep the cell log current' })).toBeVisible()
  await expect(card2.getByTestId('answer-waiting')).toHaveCount(0, { timeout: 15_000 })
  await expect(card2.getByTestId('team-answer')).toContainText('Request one night and review')
  await expect.poll(() => responsesTo(fac.page, id, 'observing-time-request')).toBe(1)
  await expect(sci.page.getByTestId('log-entry')).toHaveCount(2)

  // The control desk at laptop and projector sizes.
  await fac.page.evaluate(() => window.scrollTo(0, 0))
  await shot(fac.page, 'control-desk')
  await fac.page.setViewportSize(PROJECTOR)
  await shot(fac.page, 'control-desk-1920')
  for (const p of [fac.page, sci.page, ev.page]) {
    const overflow = await p.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)
    expect(overflow).toBeLessThanOrEqual(0)
  }

  // After a reload (dark theme this time) the room is the same: the record replays from the server.
  await sci.page.getByRole('heading', { name: 'Hazard brief', exact: true }).scrollIntoViewIfNeeded()
  await expect(sci.page.getByTestId('hazard-brief')).toBeVisible()
  await shot(sci.page, 'team-room-brief')
  for (const c of [sci, fac, ev]) {
    await c.context.addCookies([{ name: 'bw-theme', value: 'dark', url: test.info().project.use.baseURL! }])
    await c.page.reload()
    await live(c.page)
  }
  await expect(card.getByTestId('revised-mark')).toBeVisible()
  await expect(sci.page.getByTestId('log-entry')).toHaveCount(2)
  await shot(sci.page, 'team-room-dark')
  await shot(fac.page, 'control-desk-1920-dark')
  await fac.page.setViewportSize(LAPTOP)
  await fac.page.getByTestId('desk-schedule').scrollIntoViewIfNeeded()
  await shot(fac.page, 'control-desk-schedule-dark')
  await shot(ev.page, 'evaluator-desk-dark')

  for (const c of [fac, sci, civ, ev, wall]) await c.context.close()
})

test('each role lands on its own desk, and another desk points back to it', async ({ browser }) => {
  const sci = await person(browser, 'science@brinkwater.test')
  await sci.page.getByTestId('exercise-list').locator('li', { hasText: 'Demo drill — Gannet' }).getByRole('link', { name: 'Open' }).click()
  await expect(sci.page).toHaveURL(/\/room$/)
  const room = sci.page.url()
  await sci.page.goto(room.replace(/\/room$/, '/control'))
  await expect(sci.page.getByTestId('wrong-desk')).toBeVisible()
  await sci.page.getByRole('link', { name: 'Go to your desk' }).click()
  await expect(sci.page).toHaveURL(room)
  const ev = await person(browser, 'analyst@brinkwater.test')
  await ev.page.getByTestId('exercise-list').locator('li', { hasText: 'Demo drill — Gannet' }).getByRole('link', { name: 'Open' }).click()
  await expect(ev.page).toHaveURL(/\/review$/)
  // The after-action lead can still follow the drill on the evaluator desk, read-only.
  await ev.page.goto(ev.page.url().replace(/\/review$/, '/evaluate'))
  await expect(ev.page.getByTestId('scorecards')).toContainText('ratings are recorded by evaluators')
  for (const c of [sci, ev]) await c.context.close()
})
