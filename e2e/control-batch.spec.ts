import { expect, test } from '@playwright/test'
import { shot, signIn } from './helpers'

test('control releases several injects at once, early, without being asked each time; the brief has its own tab', async ({ page }) => {
  await signIn(page, 'facilitator@brinkwater.test')
  const headers = { origin: new URL(page.url()).origin }
  const list = await (await page.request.get('/api/scenarios')).json() as Array<{ id: string; key: string }>
  const demo = list.find(s => s.key === 'demo-ocean-impact')!
  const doc = (await (await page.request.get(`/api/scenarios/${demo.id}`)).json()).document as { injects: Array<{ key: string; at: string; contingency?: unknown; body: string }> }
  const id = (await (await page.request.post(`/api/scenarios/${demo.id}/exercises`, { data: { title: 'Batch release drill' }, headers })).json()).id
  // Two scheduled injects that quote no hazard figures (so no solution has to be published first).
  const plain = doc.injects.filter(i => !i.contingency && !i.body.includes('{{')).sort((a, b) => Date.parse(a.at) - Date.parse(b.at)).slice(0, 2)
  expect(plain).toHaveLength(2)

  await page.goto(`/exercises/${id}/control`)
  await expect(page.getByTestId('desk-schedule')).toBeVisible()
  await page.getByTestId('skip-confirm').check()
  for (const i of plain) {
    const row = page.locator(`[data-testid="schedule-row"][data-inject="${i.key}"]`)
    if (!(await row.isVisible())) await page.locator(`[data-phase]`).filter({ has: row }).locator('h3 button').click()
    await row.getByTestId('schedule-select').check()
  }
  await expect(page.getByTestId('release-selected')).toContainText('(2)')
  await page.getByTestId('release-selected').click()
  for (const i of plain) {
    await expect(page.locator(`[data-testid="schedule-row"][data-inject="${i.key}"]`)).not.toHaveAttribute('data-state', /upcoming|due/, { timeout: 10_000 })
  }
  await expect(page.getByTestId('release-selected')).toContainText('(0)')
  // Released before their planned time: each row says how early (the lag against the plan is shown either way).
  for (const i of plain) {
    await expect(page.locator(`[data-testid="schedule-row"][data-inject="${i.key}"]`).getByTestId('release-lag')).toContainText('early')
  }
  await shot(page, 'control-batch-released')

  // The hazard brief is in its own tab; the desk page stays short.
  await page.getByTestId('control-tab-brief').click()
  await expect(page.getByTestId('control-tab-brief')).toHaveAttribute('data-state', 'active')
  await page.getByTestId('control-tab-desk').click()
  await expect(page.getByTestId('desk-schedule')).toBeVisible()
})
