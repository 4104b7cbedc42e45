import { readFile } from 'node:fs/promises'
import { expect, test, type Page } from '@playwright/test'
import { shot, signIn } from './helpers'

const FACILITATOR = 'facilitator@brinkwater.test'

async function openFromLibrary(page: Page, key: string) {
  await page.goto('/scenarios')
  await page.getByTestId(`scenario-${key}`).getByRole('link', { name: /^Open / }).click()
  await expect(page.getByTestId('editor-header')).toBeVisible()
}

test('a facilitator edits an inject, sees its live figures, saves and exports the file', async ({ page }) => {
  await signIn(page, FACILITATOR)
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Scenarios' }).click()
  await expect(page.getByRole('heading', { name: 'Scenario library' })).toBeVisible()
  const list = page.getByTestId('scenario-list')
  await expect(list.getByTestId('scenario-demo-ocean-impact')).toContainText('Gannet')
  await expect(list.getByTestId('scenario-demo-coastal-airburst')).toContainText('Dunlin')
  await shot(page, 'scenario-library')

  await list.getByTestId('scenario-demo-ocean-impact').getByRole('link', { name: /^Open / }).click()
  const revision = Number(await page.getByTestId('revision').textContent())
  await page.getByRole('tab', { name: /^Injects/ }).click()
  await page.getByLabel('Team', { exact: true }).selectOption('comms')
  const table = page.getByTestId('inject-table')
  await expect(table.getByText('survey-candidate')).toHaveCount(0)
  await table.getByRole('button', { name: /reporters are calling/ }).click()

  const form = page.getByTestId('inject-form')
  await form.getByLabel('Title', { exact: true }).fill('Reporters call about the public risk listing')
  await expect(page.getByTestId('unsaved')).toBeVisible()
  // The body's {{ impactProbability }} fields are filled from the solution current at the inject.
  const preview = page.getByTestId('inject-preview')
  await expect(preview).toContainText(/impact probability [<\d][\d.,\s]*%/)
  await expect(preview).not.toContainText('{{')
  await expect(preview).toContainText('EXERCISE')
  await shot(page, 'scenario-editor-injects')

  await page.getByRole('button', { name: 'Save', exact: true }).click()
  await expect(page.getByTestId('save-notice')).toContainText(`Saved as revision ${revision + 1}`)
  await expect(page.getByTestId('unsaved')).toHaveCount(0)

  const download = page.waitForEvent('download')
  await page.getByRole('link', { name: 'Export YAML' }).click()
  const file = await download
  expect(file.suggestedFilename()).toBe('demo-ocean-impact.yaml')
  const yaml = await readFile(await file.path(), 'utf8')
  expect(yaml).toContain('Reporters call about the public risk listing')
})

test('the orbit solution tab shows live headline figures that follow the edits', async ({ page }) => {
  await signIn(page, FACILITATOR)
  await openFromLibrary(page, 'demo-ocean-impact')
  await page.getByRole('tab', { name: /^Orbit solutions/ }).click()
  await page.getByTestId('solution-list').getByRole('button', { name: /Solution 7/ }).click()
  const preview = page.getByTestId('solution-preview')
  await expect(preview.getByTestId('drill-banner')).toBeVisible()
  await expect(preview.getByTestId('figure-impact')).toHaveText('100 % (certain)')
  const energy = preview.getByTestId('figure-energyMt')
  await expect(energy).toContainText(/\d.* Mt/)
  await expect(preview.getByTestId('figure-diameterM')).toContainText(/\d.* m/)
  await expect(preview).toContainText(/Makes a tsunami, given impact\s*[<\d]/)
  await expect(preview.getByTestId('preview-sites')).toContainText('Porto Salgado')
  // The map shows this solution's corridor over the six earlier ones.
  await expect(preview.locator('[data-corridor="current"]')).toHaveAttribute('d', /^M[\d.]+/)
  await expect(preview.locator('[data-corridor="earlier"]')).toHaveCount(6)
  await shot(page, 'scenario-editor-solutions')

  const before = await energy.textContent()
  await page.getByLabel('Absolute magnitude H').fill('19.5')
  await expect(energy).not.toHaveText(before ?? '')
  await expect(page.getByTestId('unsaved')).toBeVisible()
})

test('a solution computed from its encounter may draw its impacts from the approach geometry', async ({ page }) => {
  await signIn(page, FACILITATOR)
  await openFromLibrary(page, 'demo-ocean-impact')
  await page.getByRole('tab', { name: /^Orbit solutions/ }).click()
  await page.getByTestId('solution-list').getByRole('button', { name: /Solution 7/ }).click()
  const select = page.getByLabel('Draw impacts from')
  await expect(select).toHaveValue('corridor')
  await select.selectOption('encounter')
  await expect(page.getByTestId('unsaved')).toBeVisible()
  const preview = page.getByTestId('solution-preview')
  await expect(preview.getByTestId('figure-impact')).toHaveText('100 % (certain)')
  await expect(preview.getByTestId('figure-energyMt')).toContainText(/\d.* Mt/)
  await expect(preview.locator('[data-corridor="current"]')).toHaveAttribute('d', /^M[\d.]+/)
})

test('the server\'s verdicts show beside the field, and a save over someone else\'s asks for a reload', async ({ page, context }) => {
  await signIn(page, FACILITATOR)
  await openFromLibrary(page, 'demo-ocean-impact')
  const other = await context.newPage()
  await other.goto(page.url())
  await expect(other.getByTestId('editor-header')).toBeVisible()
  const mine = page.getByRole('region', { name: 'Identity' })
  const theirs = other.getByRole('region', { name: 'Identity' })

  // A key another scenario holds passes the file schema but not the library: the server says so.
  await mine.getByLabel('Key', { exact: true }).fill('demo-coastal-airburst')
  await page.getByRole('button', { name: 'Save', exact: true }).click()
  await expect(page.getByTestId('save-notice')).toContainText('nothing was saved')
  await expect(page.locator('#f-key-error')).toHaveText(/already has the key "demo-coastal-airburst"/)
  await expect(page.getByRole('tab', { name: /^Overview/ })).toContainText('1')
  await mine.getByLabel('Key', { exact: true }).fill('demo-ocean-impact')

  // Meanwhile the second tab saves first.
  await theirs.getByLabel('Title', { exact: true }).fill('Gannet: an ocean impact off the Western Shore (edited elsewhere)')
  await other.getByRole('button', { name: 'Save', exact: true }).click()
  await expect(other.getByTestId('save-notice')).toContainText('Saved as revision')
  await mine.getByLabel('Title', { exact: true }).fill('Gannet: my own title')
  await page.getByRole('button', { name: 'Save', exact: true }).click()
  await expect(page.getByTestId('save-notice')).toContainText('Someone saved this scenario')
  await page.getByRole('button', { name: 'Reload the saved version' }).click()
  await expect(mine.getByLabel('Title', { exact: true })).toHaveValue(/edited elsewhere/)
  await expect(page.getByTestId('unsaved')).toHaveCount(0)
})

test('a player is told the scenario library is not for their account', async ({ page }) => {
  await signIn(page, 'science@brinkwater.test')
  await expect(page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Scenarios' })).toHaveCount(0)
  await page.goto('/scenarios')
  await expect(page.getByTestId('not-allowed')).toContainText('not for your account')
  await expect(page.getByTestId('scenario-list')).toHaveCount(0)
})

test('importing a broken file lists each problem with line, column and path; a known key offers a copy', async ({ page }) => {
  const original = await readFile('scenarios/demo-coastal-airburst.yaml', 'utf8')
  const broken = original.replace('key: demo-coastal-airburst', 'key: broken-airburst').replace('teams: [comms]', 'teams: [ops]')
  await signIn(page, FACILITATOR)
  await page.goto('/scenarios')
  await page.getByRole('button', { name: 'Import file' }).click()
  const dialog = page.getByRole('dialog')
  await dialog.getByLabel('Scenario file').setInputFiles({ name: 'broken.yaml', mimeType: 'application/yaml', buffer: Buffer.from(broken) })
  await dialog.getByRole('button', { name: 'Import', exact: true }).click()
  const error = dialog.getByTestId('import-error')
  await expect(error).toContainText(/\d+:\d+ injects\[\d+\]\.teams\[0\]: unknown team "ops"/)
  await shot(page, 'scenario-import-errors')

  await dialog.getByLabel('Scenario file').setInputFiles({
    name: 'airburst.yaml',
    mimeType: 'application/yaml',
    buffer: Buffer.from(original),
  })
  await dialog.getByRole('button', { name: 'Import', exact: true }).click()
  await expect(error).toContainText('already has a scenario')
  await dialog.getByRole('button', { name: 'Import as a copy' }).click()
  await expect(page.getByTestId('library-notice')).toContainText('Imported')
  await expect(page.locator('[data-testid^="scenario-demo-coastal-airburst-"]').first()).toContainText('Dunlin')
})

test('starting an exercise makes the author its facilitator, who then adds a player to a team', async ({ page }) => {
  await signIn(page, FACILITATOR)
  await page.goto('/scenarios')
  await page.getByTestId('scenario-demo-coastal-airburst').getByRole('button', { name: /Start an exercise/ }).click()
  const dialog = page.getByRole('dialog')
  await dialog.getByLabel('Exercise title').fill('Dunlin table-top, evening session')
  await dialog.getByRole('button', { name: 'Start exercise' }).click()
  await expect(page).toHaveURL(/\/exercises\/[0-9a-f-]{36}$/)
  await expect(page.getByRole('heading', { name: 'Dunlin table-top, evening session' })).toBeVisible()
  await expect(page.getByTestId('exercise-scenario')).toContainText('Dunlin: an airburst off Porto Salgado')
  await expect(page.getByTestId(`member-${FACILITATOR}`).getByLabel(/^Role of/)).toHaveValue('facilitator')

  await page.getByLabel('E-mail').fill('civil@brinkwater.test')
  await page.getByLabel('Role in this exercise').selectOption('player')
  await page.getByLabel('Team', { exact: true }).selectOption('civil')
  await page.getByRole('button', { name: 'Add member' }).click()
  await expect(page.getByTestId('member-added')).toContainText('added as player')
  const row = page.getByTestId('member-civil@brinkwater.test')
  await expect(row.getByLabel(/^Role of/)).toHaveValue('player')
  await expect(row.getByLabel(/^Team of/)).toHaveValue('civil')
  await shot(page, 'exercise-members')
})

test('the editor at projector size in the dark theme', async ({ page, context }) => {
  await page.setViewportSize({ width: 1920, height: 1080 })
  await context.addCookies([{ name: 'bw-theme', value: 'dark', url: test.info().project.use.baseURL! }])
  await signIn(page, FACILITATOR)
  await openFromLibrary(page, 'demo-ocean-impact')
  // A page rendered on the server opens clean (no phantom unsaved changes after hydration).
  await page.reload()
  await expect(page.getByTestId('editor-header')).toBeVisible()
  await expect(page.getByRole('button', { name: 'Save', exact: true })).toBeDisabled()
  await expect(page.getByTestId('unsaved')).toHaveCount(0)
  await page.getByRole('tab', { name: /^Orbit solutions/ }).click()
  await page.getByTestId('solution-list').getByRole('button', { name: /Solution 4/ }).click()
  await expect(page.getByTestId('figure-energyMt')).toContainText(/\d.* Mt/)
  await shot(page, 'scenario-editor-solutions-projector-dark')
  await page.getByRole('tab', { name: /^Injects/ }).click()
  await page.getByTestId('inject-table').getByRole('button', { name: /Twelve-day arc/ }).click()
  await expect(page.getByTestId('inject-preview')).not.toContainText('{{')
  await shot(page, 'scenario-editor-injects-projector-dark')
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)
  expect(overflow).toBeLessThanOrEqual(0)
})
