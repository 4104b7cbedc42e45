import { expect, test } from '@playwright/test'
import { shot, signIn } from './helpers'

test('the approach panel computes the solutions from one encounter and fills them', async ({ page }) => {
  await signIn(page, 'facilitator@brinkwater.test')
  await page.goto('/scenarios')
  await page.getByTestId('scenario-demo-approach').getByRole('link', { name: /^Open / }).click()
  await expect(page.getByTestId('editor-header')).toBeVisible()
  await page.getByRole('tab', { name: /^Orbit solutions/ }).click()

  const panel = page.getByTestId('approach-panel')
  await expect(panel.getByTestId('drill-banner')).toBeVisible()
  await expect(panel.getByTestId('approach-bplane')).toContainText('ξ -2602 km')
  // The file's own encounters: the probability climbs to certainty, as the file says.
  const probabilities = panel.getByTestId('approach-probability')
  await expect(probabilities).toHaveCount(3)
  await expect(probabilities.nth(0)).toHaveText('9.9 %')
  await expect(probabilities.nth(2)).toHaveText('100 %')
  await expect(panel.getByTestId('approach-row-0')).toContainText('9.9 %')
  // The corridors narrow on one map: the last over the two before it.
  const map = panel.getByTestId('approach-map')
  await expect(map.locator('[data-corridor="current"]')).toHaveAttribute('d', /^M[\d.]+/)
  await expect(map.locator('[data-corridor="earlier"]')).toHaveCount(2)
  await panel.scrollIntoViewIfNeeded()
  await shot(page, 'scenario-editor-approach')

  // A narrower first solution: a higher probability, written into the solution by "fill".
  await panel.getByLabel('σ across, p1-discovery').fill('300')
  await panel.getByLabel('σ along, p1-discovery').fill('20000')
  await expect(probabilities.nth(0)).not.toHaveText('9.9 %')
  const p1 = await probabilities.nth(0).textContent()
  await panel.getByTestId('approach-fill').click()
  await expect(panel.getByRole('status').filter({ hasText: 'Wrote the encounter' })).toBeVisible()
  await expect(page.getByTestId('solution-list').getByRole('button').first()).toContainText(p1 ?? '')
  await expect(page.getByTestId('unsaved')).toBeVisible()
  await expect(page.getByTestId('solution-preview').getByTestId('drill-banner')).toBeVisible()

  // A point round the far side of the Earth from the radiant cannot be hit.
  await panel.getByTestId('approach-lon').fill('170')
  await panel.getByTestId('approach-lat').fill('-53')
  await expect(panel.getByText('cannot be reached from this radiant')).toBeVisible()
  await expect(panel.getByTestId('approach-fill')).toBeDisabled()
})
