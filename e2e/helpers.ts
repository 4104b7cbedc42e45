import { expect, type Page } from '@playwright/test'

export const PASSWORD = 'brinkwater-demo'

/** Signs in through the sign-in form. */
export async function signIn(page: Page, email: string, password = PASSWORD) {
  await page.goto('/signin')
  // A form filled before the page has hydrated can be cleared by it: fill again until the sign-in goes through.
  await expect(async () => {
    if (!/\/signin/.test(page.url())) return
    await page.getByLabel('E-mail').fill(email)
    await page.getByLabel('Password').fill(password)
    await page.getByRole('button', { name: 'Sign in' }).click()
    await expect(page).not.toHaveURL(/\/signin/, { timeout: 4000 })
  }).toPass({ timeout: 20_000 })
}

/** Screenshots go to test-results/screens for people to look at (not compared). */
export async function shot(page: Page, name: string) {
  await page.screenshot({ path: `test-results/screens/${name}.png`, fullPage: false })
}
