import { expect, test, type Browser } from '@playwright/test'
import { shot, signIn } from './helpers'

const LAPTOP = { width: 1366, height: 900 }

async function person(browser: Browser, email: string | null, viewport = LAPTOP) {
  const context = await browser.newContext({ baseURL: test.info().project.use.baseURL, viewport })
  const page = await context.newPage()
  if (email) await signIn(page, email)
  return { context, page }
}

test('civil protection draws a zone on its map; control and the wall see it live', async ({ browser }) => {
  const fac = await person(browser, 'facilitator@brinkwater.test')
  const headers = { origin: new URL(fac.page.url()).origin }
  const list = await (await fac.page.request.get('/api/scenarios')).json() as Array<{ id: string; key: string }>
  const demo = list.find(s => s.key === 'demo-ocean-impact')!
  const doc = (await (await fac.page.request.get(`/api/scenarios/${demo.id}`)).json()).document as { solutions: Array<{ key: string }> }
  const id = (await (await fac.page.request.post(`/api/scenarios/${demo.id}/exercises`, { data: { title: 'Zones drill' }, headers })).json()).id as string
  expect((await fac.page.request.post(`/api/exercises/${id}/members`, { data: { email: 'civil@brinkwater.test', role: 'player', teamKey: 'civil' }, headers })).status()).toBe(201)
  expect((await fac.page.request.post(`/api/exercises/${id}/solutions/${doc.solutions.at(-1)!.key}/publish`, { data: {}, headers })).status()).toBe(201)
  const wallLink = await (await fac.page.request.post(`/api/exercises/${id}/wall-tokens`, { data: { label: 'Hall' }, headers })).json() as { path: string }

  await fac.page.goto(`/exercises/${id}/control`)
  await fac.page.getByTestId('control-tab-zones').click()
  await expect(fac.page.getByTestId('zone-list')).toContainText('No zone has been drawn yet.')

  const civ = await person(browser, 'civil@brinkwater.test')
  await civ.page.goto(`/exercises/${id}/room`)
  await civ.page.getByTestId('room-zones-link').click()
  const panel = civ.page.getByTestId('zone-panel')
  await panel.scrollIntoViewIfNeeded()
  await panel.getByTestId('zone-draw-circle').click()
  await expect(panel.getByTestId('zone-hint')).toContainText('centre')
  const map = panel.getByTestId('map-viewport')
  await expect(panel.getByTestId('hazard-map-svg')).toBeVisible()
  const box = (await map.boundingBox())!
  await civ.page.mouse.click(box.x + box.width * 0.45, box.y + box.height * 0.5)
  await expect(panel.getByTestId('zone-hint')).toContainText('radius')
  await panel.getByTestId('zone-radius').fill('30')
  await expect(panel.getByTestId('map-zone-draft')).toBeVisible()
  // Before saving, the figures of the draft: who is inside, what it leaves exposed.
  await expect(panel.getByTestId('zone-figures')).toBeVisible()
  await expect(panel.getByTestId('zone-exposed').first()).toHaveText(/%|none/)
  await panel.getByTestId('zone-kind-evacuate').check()
  await panel.getByTestId('zone-name').fill('Seafront evacuation')
  await panel.getByTestId('zone-note').fill('Buses from the sports hall.')
  await shot(civ.page, 'zones-room-draft')
  await panel.getByTestId('zone-save').click()
  await expect(panel.getByTestId('zone-draw')).toContainText('shared')
  await expect(panel.getByTestId('zone-item')).toContainText('Evacuate: Seafront evacuation')
  await expect(panel.getByTestId('map-zone')).toHaveCount(1)

  // A polygon too: four clicks around the middle of the map.
  await panel.getByTestId('zone-draw-polygon').click()
  for (const [fx, fy] of [[0.6, 0.3], [0.75, 0.3], [0.75, 0.45], [0.6, 0.45]] as const) {
    await civ.page.mouse.click(box.x + box.width * fx, box.y + box.height * fy)
  }
  await expect(panel.getByTestId('zone-hint')).toContainText('4 corners')
  await panel.getByTestId('zone-kind-shelter').check()
  await panel.getByTestId('zone-name').fill('Inland shelter')
  await panel.getByTestId('zone-save').click()
  await expect(panel.getByTestId('zone-item')).toHaveCount(2)

  // Control sees both live, with their figures, and may withdraw one.
  await expect(fac.page.getByTestId('zone-item')).toHaveCount(2, { timeout: 10_000 })
  await expect(fac.page.getByTestId('control-tab-zones')).toContainText('(2)')
  await expect(fac.page.getByTestId('zone-item').filter({ hasText: 'Seafront evacuation' })).toContainText('Buses from the sports hall.')
  await expect(fac.page.getByTestId('zone-panel').getByTestId('map-zone')).toHaveCount(2)
  await shot(fac.page, 'zones-control')

  // The wall shows them on its map.
  const wall = await person(browser, null, { width: 1920, height: 1080 })
  await wall.page.goto(wallLink.path)
  await expect(wall.page.getByTestId('map-zone')).toHaveCount(2, { timeout: 15_000 })
  await expect(wall.page.getByTestId('map-zones')).toContainText('Evacuate: Seafront evacuation')
  await shot(wall.page, 'zones-wall')

  await fac.page.getByTestId('zone-item').filter({ hasText: 'Inland shelter' }).getByTestId('zone-withdraw').click()
  await expect(wall.page.getByTestId('map-zone')).toHaveCount(1, { timeout: 10_000 })
  await expect(panel.getByTestId('zone-withdrawn')).toHaveCount(1, { timeout: 10_000 })
  for (const p of [fac, civ, wall]) await p.context.close()
})
