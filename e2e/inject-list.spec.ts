import { readFile } from 'node:fs/promises'
import { expect, test } from '@playwright/test'
import { shot, signIn } from './helpers'

test('the inject list goes out as a spreadsheet and comes back; a bad row is listed and changes nothing', async ({ page }) => {
  await signIn(page, 'facilitator@brinkwater.test')
  await page.goto('/scenarios')
  await page.getByTestId('scenario-demo-coastal-airburst').getByRole('link', { name: /^Open / }).click()
  await expect(page.getByTestId('editor-header')).toBeVisible()
  const revision = Number(await page.getByTestId('revision').textContent())
  await page.getByRole('tab', { name: /^Injects/ }).click()
  const box = page.getByTestId('inject-spreadsheet')
  await box.getByText('Inject list as a spreadsheet').click()

  const download = page.waitForEvent('download')
  await box.getByRole('link', { name: 'Download .csv' }).click()
  const file = await download
  expect(file.suggestedFilename()).toBe('demo-coastal-airburst-injects.csv')
  const csv = await readFile(await file.path(), 'utf8')
  const xlsx = page.waitForEvent('download')
  await box.getByRole('link', { name: 'Download .xlsx' }).click()
  expect((await xlsx).suggestedFilename()).toBe('demo-coastal-airburst-injects.xlsx')

  const lines = csv.split('\r\n')
  const first = lines.findIndex(l => l.startsWith('Key,')) + 1
  const [key, time, phase] = lines[first]!.split(',')
  const broken = lines.map((l, i) => (i === first ? l.replace(`${key},${time},${phase},`, `${key},${time},${phase},ops; `) : l)).join('\r\n')
  await box.getByLabel(/Import an inject list/).setInputFiles({ name: 'broken.csv', mimeType: 'text/csv', buffer: Buffer.from(broken) })
  await box.getByRole('button', { name: 'Import', exact: true }).click()
  await expect(box.getByTestId('msel-error')).toContainText(`row ${first + 1}, Teams: unknown team "ops"`)
  await expect(page.getByTestId('revision')).toHaveText(String(revision))
  await shot(page, 'scenario-inject-list-errors')

  await box.getByLabel(/Import an inject list/).setInputFiles({ name: 'list.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) })
  await box.getByRole('button', { name: 'Import', exact: true }).click()
  await expect(box.getByRole('status')).toContainText(`saved as revision ${revision + 1}`)
  await expect(page.getByTestId('revision')).toHaveText(String(revision + 1))
  await expect(page.getByTestId('unsaved')).toHaveCount(0)
  await shot(page, 'scenario-inject-list-imported')
})

test('the inject list box at projector size in the dark theme', async ({ page, context }) => {
  await page.setViewportSize({ width: 1920, height: 1080 })
  await context.addCookies([{ name: 'bw-theme', value: 'dark', url: test.info().project.use.baseURL! }])
  await signIn(page, 'facilitator@brinkwater.test')
  await page.goto('/scenarios')
  await page.getByTestId('scenario-demo-ocean-impact').getByRole('link', { name: /^Open / }).click()
  await page.getByRole('tab', { name: /^Injects/ }).click()
  const box = page.getByTestId('inject-spreadsheet')
  await box.getByText('Inject list as a spreadsheet').click()
  await box.getByLabel(/Import an inject list/).setInputFiles({ name: 'x.csv', mimeType: 'text/csv', buffer: Buffer.from('no,header\n') })
  await box.getByRole('button', { name: 'Import', exact: true }).click()
  await expect(box.getByTestId('msel-error')).toContainText('No header row')
  await shot(page, 'scenario-inject-list-projector-dark')
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)
  expect(overflow).toBeLessThanOrEqual(0)
})
