import { expect, test, type Page } from '@playwright/test'
import { PASSWORD, shot, signIn } from './helpers'

const FACILITATOR = 'facilitator@brinkwater.test'

/**
 * Signs in as the facilitator (through the form, or straight through the API where the form is not
 * what the test is about) and returns the library id of the demo scenario.
 */
async function demoScenarioId(page: Page, viaForm = true): Promise<string> {
  if (viaForm) await signIn(page, FACILITATOR)
  else expect((await page.request.post('/api/auth/login', { data: { email: FACILITATOR, password: PASSWORD } })).ok()).toBe(true)
  const res = await page.request.get('/api/scenarios')
  expect(res.ok()).toBe(true)
  const list = await res.json() as Array<{ id: string; key: string }>
  const demo = list.find(s => s.key === 'demo-ocean-impact')
  expect(demo).toBeTruthy()
  return demo!.id
}

async function useTheme(page: Page, theme: 'light' | 'dark') {
  await page.context().addCookies([{ name: 'bw-theme', value: theme, url: test.info().project.use.baseURL! }])
}

async function briefReady(page: Page) {
  await expect(page.getByTestId('hazard-brief')).toBeVisible({ timeout: 30_000 })
  await expect(page.getByTestId('drill-banner').first()).toContainText('EXERCISE — EXERCISE — EXERCISE')
  await expect(page.getByTestId('map-land')).toHaveAttribute('d', /^M/, { timeout: 20_000 })
}

test('a facilitator reads the threat brief, moves through the solutions and zooms the map', async ({ page }) => {
  const id = await demoScenarioId(page)
  await page.goto(`/brief/${id}`)
  await expect(page.getByRole('heading', { name: 'Threat brief' })).toBeVisible()
  await briefReady(page)

  // The first solution: an Atlantic-wide corridor, drawn in the ocean view.
  await page.getByTestId('solution-picker').selectOption({ index: 0 })
  await expect(page).toHaveURL(/solution=s1-discovery/)
  await expect(page.getByTestId('map-view-ocean')).toHaveAttribute('aria-checked', 'true')
  const map = page.getByTestId('hazard-map-svg')
  await expect(map.locator('[data-corridor="current"]')).toHaveAttribute('d', /^M[\d.]+/)
  await expect(page.getByTestId('points-sea')).toHaveAttribute('d', /^M/)
  await expect(page.getByTestId('figure-torino')).toContainText(/Torino scale\s*1(?!\d)/)
  await page.getByTestId('hazard-map').scrollIntoViewIfNeeded()
  await shot(page, 'brief-laptop-light-ocean')

  // The evolution chart is drawn (SVG renderer) and has its table behind it.
  const evolution = page.getByTestId('evolution-chart')
  await expect(evolution.getByTestId('chart-canvas').locator('svg').first()).toBeVisible({ timeout: 20_000 })
  await expect(evolution.getByTestId('chart-table')).toContainText('Solution 7')
  await evolution.getByRole('button', { name: 'Show as table' }).click()
  await expect(evolution.getByTestId('chart-table').getByRole('table')).toBeVisible()
  await evolution.getByRole('button', { name: 'Show as chart' }).click()

  // The last solution: impact certain, a point off the coast, regional view with the sites by name.
  await page.getByTestId('solution-picker').selectOption({ index: 6 })
  await expect(page).toHaveURL(/solution=s7-certain/)
  await expect(page.getByTestId('map-view-regional')).toHaveAttribute('aria-checked', 'true')
  await expect(page.getByTestId('map-land')).toHaveAttribute('d', /^M/, { timeout: 20_000 })
  await expect(map.locator('[data-corridor="current"]')).toHaveAttribute('d', /^M[\d.]+/)
  await expect(map.locator('[data-corridor="earlier"]')).toHaveCount(6)
  // The footprint of the default threshold with its median-case line (labelled rings only for older assessments).
  await expect(map.locator('[data-nominal="windows"]')).toHaveCount(1)
  await expect(map.locator('[data-footprint="windows"][data-probability="0.5"]')).toHaveAttribute('d', /^M/)
  const labels = map.getByTestId('site-label')
  expect(await labels.count()).toBeGreaterThanOrEqual(8)
  await expect(labels.filter({ hasText: 'Porto Salgado' })).toHaveCount(1)

  const headline = page.getByTestId('hazard-headline')
  await expect(headline.getByTestId('figure-torino')).toContainText(/Torino scale\s*9/)
  await expect(headline.getByTestId('figure-energy')).toContainText(/\d+ Mt TNT/)
  await expect(headline.getByTestId('figure-energy')).toContainText(/5–95 %: \d+–\d+ Mt TNT/)
  await expect(headline.getByTestId('figure-probability')).toContainText('100 %')
  await expect(page.getByTestId('hazard-warnings')).toContainText('indicative')
  await expect(page.getByTestId('map-legend')).toContainText('Windows shatter: chance 1 in 2 or more')
  await expect(page.getByTestId('legend-footprint')).toContainText(/the median entry energy \d+ Mt TNT as a surface burst/)
  await expect(page.getByTestId('hazard-caution')).toContainText('for training only')
  await page.evaluate(() => window.scrollTo(0, 0))
  await shot(page, 'brief-laptop-light')

  // Zoom with the keyboard and the buttons; reset returns to the fitted view.
  const group = page.getByTestId('hazard-map-svg').locator('g').first()
  const before = await group.getAttribute('transform')
  await page.getByTestId('map-viewport').focus()
  await page.keyboard.press('+')
  await page.keyboard.press('ArrowLeft')
  await expect(group).not.toHaveAttribute('transform', before!)
  await page.getByTestId('map-reset').click()
  await expect(group).toHaveAttribute('transform', before!)
  await page.mouse.move(400, 400)

  // Charts in tabs: blast, tsunami, and the sortable site table.
  await page.getByTestId('tab-blast').click()
  await expect(page.getByTestId('chart-overpressure').getByTestId('chart-canvas').locator('svg').first()).toBeVisible()
  await page.getByTestId('tab-tsunami').click()
  await expect(page.getByTestId('chart-tsunami').getByTestId('chart-canvas').locator('svg').first()).toBeVisible()
  await page.getByTestId('tab-sites').click()
  const table = page.getByTestId('sites-table')
  const people = table.getByRole('columnheader', { name: /People/ })
  await people.getByRole('button').click()
  await expect(people).toHaveAttribute('aria-sort', 'ascending')
  await expect(table.locator('tbody tr').first()).toContainText('Vento Largo')
  await people.getByRole('button').click()
  await expect(table.locator('tbody tr').first()).toContainText('Montalvor')
  await expect(page.getByTestId('chart-exceedance').getByTestId('chart-canvas').locator('svg').first()).toBeVisible()
  await page.getByTestId('hazard-charts').scrollIntoViewIfNeeded()
  await shot(page, 'brief-laptop-light-charts')
})

test('the brief shows each coastal site\'s tsunami band under both published source laws, named with their sources', async ({ page }) => {
  const id = await demoScenarioId(page, false)
  // Solution 7: a 160 m stony body strikes the sea some 50 km off the coast.
  await page.goto(`/brief/${id}?solution=s7-certain`)
  await briefReady(page)
  await expect(page.getByTestId('figure-runup')).toContainText(/low law [\d.]+ m, high law [\d.]+ m/)

  // The tsunami tab: the caveat, both laws named with their sources (opened from the keyboard), and the band per site.
  await page.getByTestId('tab-tsunami').click()
  const laws = page.getByTestId('tsunami-laws')
  await expect(laws).toContainText('The spread between the published tsunami source laws is wide')
  await laws.getByText('The two published source laws and their sources').focus()
  await page.keyboard.press('Enter')
  await expect(laws.getByTestId('law-low')).toBeVisible()
  await expect(laws.getByTestId('law-low')).toContainText('Collins')
  await expect(laws.getByTestId('law-high')).toContainText('Ward & Asphaug 2000')
  const band = page.getByTestId('tsunami-band')
  // Ten coastal towns; the offshore wind array has no shore to run up (wave height only, in the sites table).
  await expect(band.locator('tbody tr')).toHaveCount(10)
  const cells = (await band.getByTestId('band-porto-salgado').locator('td').allInnerTexts()).map(t => Number.parseFloat(t.replace(',', '')))
  expect(cells).toHaveLength(4)
  const [runLow, runHigh, ampLow, ampHigh] = cells as [number, number, number, number]
  expect(runLow).toBeGreaterThan(0)
  expect(runHigh).toBeGreaterThanOrEqual(runLow)
  expect(ampHigh).toBeGreaterThanOrEqual(ampLow)
  await page.getByTestId('hazard-charts').scrollIntoViewIfNeeded()
  await shot(page, 'brief-laptop-tsunami-band')

  await page.getByTestId('tab-sites').click()
  const table = page.getByTestId('sites-table')
  await expect(table.getByRole('columnheader', { name: /Run-up by law/ })).toBeVisible()
  await expect(table.locator('tbody tr').filter({ hasText: 'Porto Salgado' })).toContainText(/low … high law/)
  await expect(page.getByTestId('hazard-caution')).toContainText('for training only')
})

test('the brief labels the energy in the air and at the surface, and shows the heat at the nearest sites', async ({ page }) => {
  const id = await demoScenarioId(page, false)
  await page.goto(`/brief/${id}?solution=s7-certain`)
  await briefReady(page)
  await expect(page.getByTestId('figure-energy')).toContainText('Energy at entry')
  await expect(page.getByTestId('range-energy-entry')).toContainText(/Energy at entry.*\d+ Mt TNT/)
  await expect(page.getByTestId('range-energy-air')).toContainText(/Deposited in the air.*\d.* Mt TNT/)
  await expect(page.getByTestId('range-energy-surface')).toContainText(/Reaching the surface.*\d.* Mt TNT/)

  // A fireball this size (no speed gate since hazard model 2) heats the nearest site, about 30 km away.
  await page.getByTestId('tab-heat').click()
  const heat = page.getByTestId('hazard-heat')
  await expect(heat.getByTestId('heat-note')).toContainText(/Heat from the fireball/)
  await expect(heat.getByTestId('heat-vento-largo')).toContainText(/[\d.]+ MJ\/m² \(5–95 %: /)
  await expect(page.getByTestId('figure-heat')).toContainText(/MJ\/m²/)
  await page.getByTestId('hazard-charts').scrollIntoViewIfNeeded()
  await shot(page, 'brief-laptop-heat')
  await page.getByTestId('tab-sites').click()
  await expect(page.getByTestId('sites-table').getByRole('columnheader', { name: /Heat/ })).toBeVisible()
  await expect(page.getByTestId('drill-banner').first()).toContainText('EXERCISE')
})

test('the sites editor gives each coastal site a shelf width beside its offshore depth and beach slope', async ({ page }) => {
  const id = await demoScenarioId(page, false)
  await page.goto(`/scenarios/${id}`)
  await page.getByRole('tab', { name: /^Sites/ }).click()
  const shelf = page.getByLabel('Shelf width (km, coastal only) of Porto Salgado')
  await expect(shelf).toHaveValue('8')
  await expect(shelf).toHaveAccessibleDescription(/Width of the continental shelf.*Empty: 10 km/)
  await expect(page.getByLabel('Shelf width (km, coastal only) of Montalvor')).toHaveValue('')
  await expect(page.getByTestId('sites-shore-help')).toContainText('Beach slope')
  await shelf.fill('30')
  await expect(page.getByTestId('unsaved')).toBeVisible()
  await shot(page, 'scenario-editor-sites')
})

test('the brief on a projector in the dark theme', async ({ page }) => {
  await page.setViewportSize({ width: 1920, height: 1080 })
  await useTheme(page, 'dark')
  const id = await demoScenarioId(page, false)
  await page.goto(`/brief/${id}?solution=s5-more-likely-than-not`)
  await briefReady(page)
  await expect(page.locator('html')).toHaveClass(/dark/)
  await expect(page.getByTestId('figure-probability')).toContainText('63 %')
  await shot(page, 'brief-projector-dark')
  await page.getByTestId('evolution-chart').scrollIntoViewIfNeeded()
  await page.waitForTimeout(300)
  await shot(page, 'brief-projector-dark-evolution')
  for (const tab of ['blast', 'tsunami'] as const) {
    await page.getByTestId(`tab-${tab}`).click()
    await expect(page.getByTestId(`chart-${tab === 'blast' ? 'overpressure' : 'tsunami'}`).getByTestId('chart-canvas').locator('svg').first()).toBeVisible()
    await page.getByTestId('hazard-charts').scrollIntoViewIfNeeded()
    await shot(page, `brief-projector-dark-${tab}`)
  }
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)
  expect(overflow).toBeLessThanOrEqual(0)
})

for (const theme of ['dark', 'light'] as const) {
  test(`the wall variant is readable from the back of the room (${theme})`, async ({ page }) => {
    await page.setViewportSize({ width: 1920, height: 1080 })
    await useTheme(page, theme)
    const id = await demoScenarioId(page, false)
    await page.goto(`/brief/${id}?variant=wall&solution=s7-certain`)
    await expect(page.getByTestId('brief-wall')).toBeVisible()
    await briefReady(page)
    await expect(page.getByTestId('hazard-brief')).toHaveAttribute('data-variant', 'wall')
    const value = page.getByTestId('figure-energy').locator('dd').first()
    const px = await value.evaluate(el => Number.parseFloat(getComputedStyle(el).fontSize))
    expect(px).toBeGreaterThanOrEqual(28)
    // Minimal chrome: no site navigation, no chart tabs; nothing scrolls.
    await expect(page.getByRole('navigation', { name: 'Main' })).toHaveCount(0)
    await expect(page.getByTestId('hazard-charts')).toHaveCount(0)
    const scroll = await page.evaluate(() => {
      const d = document.documentElement
      return [d.scrollWidth - innerWidth, d.scrollHeight - innerHeight]
    })
    expect(scroll[0]).toBeLessThanOrEqual(0)
    expect(scroll[1]).toBeLessThanOrEqual(0)
    await shot(page, `brief-wall-${theme}`)
  })
}

test('the team-room and editor-preview variants', async ({ page }) => {
  const id = await demoScenarioId(page, false)
  await page.goto(`/brief/${id}?variant=room&solution=s6-near-certain`)
  await briefReady(page)
  await expect(page.getByTestId('hazard-brief')).toHaveAttribute('data-variant', 'room')
  await expect(page.getByRole('button', { name: 'Download map (SVG)' })).toHaveCount(0)
  await expect(page.getByTestId('hazard-charts')).toBeVisible()
  await page.getByRole('link', { name: 'Editor preview' }).click()
  await expect(page.getByTestId('hazard-brief')).toHaveAttribute('data-variant', 'preview')
  await expect(page.getByTestId('hazard-headline')).toHaveAttribute('data-size', 'compact')
  await expect(page.getByTestId('hazard-charts')).toHaveCount(0)
  await expect(page.getByTestId('hazard-map-svg').locator('[data-corridor="current"]')).toHaveAttribute('d', /^M/)
  await shot(page, 'brief-preview-light')
})

test('a player is told that library briefs are for facilitators', async ({ page }) => {
  await signIn(page, 'science@brinkwater.test')
  await page.goto('/brief/00000000-0000-4000-8000-000000000000')
  await expect(page.getByTestId('brief-not-allowed')).toContainText('for facilitators')
})
