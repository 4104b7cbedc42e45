import { expect, test, type Page } from '@playwright/test'
import { PASSWORD, shot } from './helpers'

const FACILITATOR = 'facilitator@brinkwater.test'

async function openBrief(page: Page, theme: 'light' | 'dark', solution: string) {
  await page.context().addCookies([{ name: 'bw-theme', value: theme, url: test.info().project.use.baseURL! }])
  expect((await page.request.post('/api/auth/login', { data: { email: FACILITATOR, password: PASSWORD } })).ok()).toBe(true)
  const list = await (await page.request.get('/api/scenarios')).json() as Array<{ id: string; key: string }>
  const demo = list.find(s => s.key === 'demo-ocean-impact')!
  await page.goto(`/brief/${demo.id}?solution=${solution}`)
  await expect(page.getByTestId('hazard-brief')).toBeVisible({ timeout: 30_000 })
  await expect(page.getByTestId('map-land')).toHaveAttribute('d', /^M/, { timeout: 20_000 })
}

test('the map shades the damage footprint by chance and names it in its legend, in our words', async ({ page }) => {
  // Solution 7 of the demo: a 160 m stony body certain to strike off the coast (along-track spread some 50 km).
  await openBrief(page, 'light', 's7-certain')
  const map = page.getByTestId('hazard-map-svg')
  const legend = page.getByTestId('map-legend')

  // By default the windows footprint: shaded areas, light to dark, one thin median-case line, one label; no rings. The
  // 1 in 10 and 1 in 2 areas are drawn; a 9 in 10 area only where the impacts cluster that tightly (here the along-track
  // spread of some 50 km leaves the likeliest point near 8 in 10, so it may be absent).
  const choice = page.getByTestId('footprint-choice')
  await expect(choice.getByRole('radio', { name: 'Windows shatter' })).toHaveAttribute('aria-checked', 'true')
  for (const p of ['0.1', '0.5']) {
    await expect(map.locator(`[data-testid="footprint-area"][data-footprint="windows"][data-probability="${p}"]`)).toHaveAttribute('d', /^M[\d.-]+/)
  }
  await expect(map.getByTestId('footprint-line')).toHaveCount(1)
  await expect(map.getByTestId('footprint-label')).toHaveText('Windows shatter')
  await expect(map.locator('[data-ring]')).toHaveCount(0)
  await expect(legend.getByTestId('legend-footprint-level')).toHaveText([
    'Windows shatter: chance 1 in 10 or more', 'Windows shatter: chance 1 in 2 or more', 'Windows shatter: chance 9 in 10 or more',
  ])
  await expect(legend.getByTestId('legend-footprint')).toContainText(
    /Shading: the chance, if it strikes, that windows shatter there — faintest 1 in 10, then 1 in 2, strongest 9 in 10 \(from 2,000 sampled impacts, conditional on impact\)\./,
  )
  await expect(legend.getByTestId('legend-footprint')).toContainText('Thin line: the same threshold for the middle case')
  // The drill marking and the caution stay with the figures.
  await expect(page.getByTestId('drill-banner').first()).toContainText('EXERCISE — EXERCISE — EXERCISE')
  await expect(page.getByTestId('hazard-caution')).toContainText('for training only')
  await page.getByTestId('hazard-map').scrollIntoViewIfNeeded()
  await shot(page, 'footprint-laptop-light-windows')

  // Another threshold: the burns footprint replaces the windows one.
  await choice.getByRole('radio', { name: 'Second-degree burns' }).click()
  await expect(choice.getByRole('radio', { name: 'Second-degree burns' })).toHaveAttribute('aria-checked', 'true')
  await expect(map.locator('[data-testid="footprint-area"][data-footprint="burn2"]').first()).toHaveAttribute('d', /^M/)
  await expect(map.locator('[data-footprint="windows"]')).toHaveCount(0)
  await expect(map.locator('[data-nominal="burn2"]')).toHaveCount(1)
  await expect(legend.getByTestId('legend-footprint')).toContainText('that exposed skin gets second-degree burns there')
  await shot(page, 'footprint-laptop-light-burns')

  await choice.getByRole('radio', { name: 'Houses collapse' }).click()
  await expect(map.locator('[data-testid="footprint-area"][data-footprint="houseCollapse"]').first()).toHaveAttribute('d', /^M/)
  await shot(page, 'footprint-laptop-light-houses')
})

test('the footprint reads in the dark theme too', async ({ page }) => {
  await openBrief(page, 'dark', 's7-certain')
  const map = page.getByTestId('hazard-map-svg')
  await expect(map.locator('[data-testid="footprint-area"][data-probability="0.5"]')).toHaveCount(1)
  await page.getByTestId('hazard-map').scrollIntoViewIfNeeded()
  await shot(page, 'footprint-laptop-dark-windows')
  await page.getByTestId('footprint-choice').getByRole('radio', { name: 'Second-degree burns' }).click()
  await expect(map.locator('[data-nominal="burn2"]')).toHaveCount(1)
  await shot(page, 'footprint-laptop-dark-burns')
  // An earlier solution with a wide corridor: the footprint may be faint or absent where impacts scatter; the map still draws.
  await page.getByTestId('solution-picker').selectOption({ index: 4 })
  await expect(page).toHaveURL(/solution=s5-more-likely-than-not/)
  await expect(map.locator('[data-corridor="current"]')).toHaveAttribute('d', /^M/)
  await page.getByTestId('hazard-map').scrollIntoViewIfNeeded()
  await shot(page, 'footprint-laptop-dark-s5')
})
