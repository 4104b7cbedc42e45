// Every page at a tablet, a laptop and a projector width, in both themes: nothing overflows sideways (a page that
// scrolls sideways on a hotel projector loses its right-hand column). Pages are taken with a drill under way: a
// solution published, an inject released, a zone drawn.
import { expect, test, type Browser, type Page } from '@playwright/test'
import { shot, signIn } from './helpers'

const SIZES = [{ w: 820, h: 1180, name: 'tablet' }, { w: 1366, h: 768, name: 'laptop' }, { w: 1920, h: 1080, name: 'projector' }]
const THEMES = ['light', 'dark'] as const

interface Drill { exerciseId: string; scenarioId: string; wall: string }
let drill: Drill | null = null

/** One drill for all the sizes: a fresh exercise of the demo with a solution, an inject, a zone and a wall link. */
async function prepare(browser: Browser): Promise<Drill> {
  if (drill) return drill
  const context = await browser.newContext({ baseURL: test.info().project.use.baseURL })
  const page = await context.newPage()
  await signIn(page, 'facilitator@brinkwater.test')
  const headers = { origin: new URL(page.url()).origin }
  const list = await (await page.request.get('/api/scenarios')).json() as Array<{ id: string; key: string }>
  const demo = list.find(s => s.key === 'demo-ocean-impact')!
  const doc = (await (await page.request.get(`/api/scenarios/${demo.id}`)).json()).document as {
    solutions: Array<{ key: string }>
    injects: Array<{ key: string; body: string; contingency?: unknown; at: string }>
  }
  const id = (await (await page.request.post(`/api/scenarios/${demo.id}/exercises`, { data: { title: 'Widths drill' }, headers })).json()).id as string
  for (const [email, role, teamKey] of [['civil', 'player', 'civil'], ['evaluator', 'evaluator', null]] as const) {
    expect((await page.request.post(`/api/exercises/${id}/members`, { data: { email: `${email}@brinkwater.test`, role, teamKey }, headers })).status()).toBe(201)
  }
  expect((await page.request.post(`/api/exercises/${id}/solutions/${doc.solutions[0]!.key}/publish`, { data: {}, headers })).status()).toBe(201)
  const inject = doc.injects.filter(i => !i.contingency).sort((a, b) => Date.parse(a.at) - Date.parse(b.at))[0]!
  expect((await page.request.post(`/api/exercises/${id}/injects/${inject.key}/release`, { data: { force: true }, headers })).status()).toBe(201)
  expect((await page.request.post(`/api/exercises/${id}/zones`, {
    data: { kind: 'exclusion', name: 'Sea area closed to shipping', shape: { type: 'circle', centre: [-9.6, 39.5], radiusKm: 40 }, idempotencyKey: 'widths-zone-0001' }, headers,
  })).status()).toBe(201)
  const wall = await (await page.request.post(`/api/exercises/${id}/wall-tokens`, { data: { label: 'Widths' }, headers })).json() as { path: string }
  await context.close()
  drill = { exerciseId: id, scenarioId: demo.id, wall: wall.path }
  return drill
}

async function noSidewaysScroll(page: Page, name: string) {
  await page.waitForLoadState('networkidle')
  const over = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)
  if (over > 0) await shot(page, `overflow-${name}`)
  expect(over, `${name} overflows sideways by ${over} px`).toBeLessThanOrEqual(0)
}

for (const size of SIZES) {
  for (const theme of THEMES) {
    test(`no page overflows sideways: ${size.name} ${theme}`, async ({ browser }) => {
      test.setTimeout(180_000)
      const d = await prepare(browser)
      const open = async (email: string | null) => {
        const context = await browser.newContext({ baseURL: test.info().project.use.baseURL, viewport: { width: size.w, height: size.h } })
        await context.addCookies([{ name: 'bw-theme', value: theme, url: test.info().project.use.baseURL! }])
        const page = await context.newPage()
        if (email) await signIn(page, email)
        return { context, page }
      }
      const tag = `${size.name}-${theme}`
      const fac = await open('facilitator@brinkwater.test')
      const x = `/exercises/${d.exerciseId}`
      for (const [path, name] of [
        ['/', 'exercises'], ['/scenarios', 'library'], [`/scenarios/${d.scenarioId}`, 'editor'], [`/brief/${d.scenarioId}`, 'brief'],
        [x, 'exercise'], [`${x}/control`, 'control'], [`${x}/review`, 'review'], [`${x}/report`, 'report'], [`${x}/feedback`, 'feedback'],
      ] as const) {
        await fac.page.goto(path)
        await noSidewaysScroll(fac.page, `${name}-${tag}`)
      }
      await fac.page.goto(`${x}/control`)
      for (const tab of ['brief', 'zones'] as const) {
        await fac.page.getByTestId(`control-tab-${tab}`).click()
        await noSidewaysScroll(fac.page, `control-${tab}-${tag}`)
      }
      await fac.context.close()

      const civ = await open('civil@brinkwater.test')
      await civ.page.goto(`${x}/room`)
      await noSidewaysScroll(civ.page, `room-${tag}`)
      await civ.page.getByTestId('room-tab-zones').click()
      await expect(civ.page.getByTestId('zone-panel')).toBeVisible()
      await noSidewaysScroll(civ.page, `room-zones-${tag}`)
      await civ.context.close()

      const ev = await open('evaluator@brinkwater.test')
      await ev.page.goto(`${x}/evaluate`)
      await noSidewaysScroll(ev.page, `evaluate-${tag}`)
      await ev.context.close()

      const admin = await open('admin@brinkwater.test')
      for (const [path, name] of [['/admin/users', 'people'], ['/dev/mailbox', 'mailbox']] as const) {
        await admin.page.goto(path)
        await noSidewaysScroll(admin.page, `${name}-${tag}`)
      }
      await admin.context.close()

      const wall = await open(null)
      await wall.page.goto(d.wall)
      await expect(wall.page.getByTestId('map-zone')).toHaveCount(1, { timeout: 15_000 })
      await noSidewaysScroll(wall.page, `wall-${tag}`)
      await wall.context.close()
    })
  }
}
