import { expect, test, type APIRequestContext } from '@playwright/test'
import { PASSWORD, shot } from './helpers'

/** A running drill of the demo scenario with four published solutions, three injects out and a wall link. */
async function wallLink(request: APIRequestContext): Promise<string> {
  const headers = { origin: test.info().project.use.baseURL! }
  expect((await request.post('/api/auth/login', { data: { email: 'facilitator@brinkwater.test', password: PASSWORD }, headers })).ok()).toBe(true)
  const list = await (await request.get('/api/scenarios')).json() as Array<{ id: string; key: string }>
  const demo = list.find(s => s.key === 'demo-ocean-impact')!
  const doc = (await (await request.get(`/api/scenarios/${demo.id}`)).json()).document
  const ex = (await (await request.post(`/api/scenarios/${demo.id}/exercises`, { data: { title: 'Wall sizes — a drill title long enough to need two lines on a small screen' }, headers })).json()).id
  await request.post(`/api/exercises/${ex}/clock`, { data: { action: 'start', factor: 60 }, headers })
  for (const s of doc.solutions.slice(0, 4)) await request.post(`/api/exercises/${ex}/solutions/${s.key}/publish`, { data: {}, headers })
  const token = await (await request.post(`/api/exercises/${ex}/wall-tokens`, { data: { label: 'Hall' }, headers })).json()
  return token.path as string
}

for (const [width, height, name] of [[1280, 720, '1280x720'], [1920, 1080, '1920x1080'], [820, 1180, 'tablet']] as const) {
  test(`the wall fits a ${name} screen: title, clock, map with scale and every figure in view, nothing overlapping`, async ({ page, request }) => {
    const path = await wallLink(request)
    await page.setViewportSize({ width, height })
    await page.goto(path)
    await expect(page.getByTestId('live-headline')).toBeVisible()
    await expect(page.getByTestId('map-scale')).toBeVisible()
    await expect(page.getByTestId('impact-countdown')).toContainText('Nominal impact in')
    const box = async (id: string) => (await page.getByTestId(id).first().boundingBox())!
    const title = await box('wall-title')
    const clock = await box('live-clock')
    // The title is not cut off (two lines at most) and the clock does not overlap it.
    expect(await page.getByTestId('wall-title').evaluate(el => el.scrollHeight <= el.clientHeight + 1 && el.scrollWidth <= el.clientWidth + 1)).toBe(true)
    const overlap = title.x < clock.x + clock.width && clock.x < title.x + title.width
      && title.y < clock.y + clock.height && clock.y < title.y + title.height
    expect(overlap).toBe(false)
    // The clock and the main figures lie inside the screen.
    for (const b of [clock, await box('live-headline')]) {
      expect(b.x + b.width).toBeLessThanOrEqual(width + 1)
      expect(b.x).toBeGreaterThanOrEqual(0)
    }
    // The current solution is named above its figures, at least one line of it.
    expect((await box('wall-solution-label')).height).toBeGreaterThan(20)
    const probability = page.getByTestId('live-headline').locator('dd').first()
    const p = (await probability.boundingBox())!
    expect(p.y + p.height).toBeLessThanOrEqual(height)
    await shot(page, `wall-${name}`)
  })
}
