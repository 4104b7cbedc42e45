import { expect, test } from '@playwright/test'
import { shot, signIn } from './helpers'

const ACCOUNTS = [
  { email: 'facilitator@brinkwater.test', role: 'Facilitator' },
  { email: 'science@brinkwater.test', role: 'Player' },
  { email: 'civil@brinkwater.test', role: 'Player' },
  { email: 'comms@brinkwater.test', role: 'Player' },
  { email: 'evaluator@brinkwater.test', role: 'Evaluator' },
  { email: 'analyst@brinkwater.test', role: 'After-action lead' },
]

test('an anonymous visitor is sent to sign in', async ({ page }) => {
  await page.goto('/')
  await expect(page).toHaveURL(/\/signin/)
  await expect(page.getByRole('heading', { name: 'Sign in' })).toBeVisible()
})

test('an empty form shows the problem beside each field', async ({ page }) => {
  await page.goto('/signin')
  await page.getByLabel('E-mail').fill('not-an-address')
  await page.getByRole('button', { name: 'Sign in' }).click()
  await expect(page.locator('#email-error')).toContainText(/valid e-mail/i)
  await expect(page.locator('#password-error')).toContainText(/password/i)
})

test('a wrong password shows one vague message and keeps the form', async ({ page }) => {
  await page.goto('/signin')
  await page.getByLabel('E-mail').fill('comms@brinkwater.test')
  await page.getByLabel('Password').fill('not-the-password')
  await page.getByRole('button', { name: 'Sign in' }).click()
  await expect(page.getByTestId('signin-error')).toHaveText(/not recognised/)
  await expect(page.getByLabel('E-mail')).toHaveValue('comms@brinkwater.test')
})

for (const a of ACCOUNTS) {
  test(`${a.email} signs in and sees the demo exercise as ${a.role}`, async ({ page }) => {
    await signIn(page, a.email)
    await expect(page.getByRole('heading', { name: 'Your exercises' })).toBeVisible()
    const list = page.getByTestId('exercise-list')
    await expect(list.getByText('Demo drill — Gannet')).toBeVisible()
    await expect(list.getByTestId('role').first()).toContainText(a.role)
  })
}

test('the admin lands on People and can invite someone', async ({ page }) => {
  await signIn(page, 'admin@brinkwater.test')
  await expect(page).toHaveURL(/\/admin\/users/)
  await expect(page.getByRole('heading', { name: 'People' })).toBeVisible()
  await expect(page.getByText('science@brinkwater.test')).toBeVisible()
})

test('signing out returns to sign-in and protects the pages', async ({ page }) => {
  await signIn(page, 'analyst@brinkwater.test')
  await page.getByRole('button', { name: /sign out/i }).click()
  await expect(page).toHaveURL(/\/signin/)
  await page.goto('/')
  await expect(page).toHaveURL(/\/signin/)
})

test.describe('screens at laptop and projector sizes, light and dark', () => {
  for (const size of [{ w: 1366, h: 768, name: 'laptop' }, { w: 1920, h: 1080, name: 'projector' }, { w: 820, h: 1180, name: 'tablet' }]) {
    for (const theme of ['light', 'dark'] as const) {
      test(`${size.name} ${theme}`, async ({ page, context }) => {
        await page.setViewportSize({ width: size.w, height: size.h })
        await context.addCookies([{ name: 'bw-theme', value: theme, url: test.info().project.use.baseURL! }])
        await page.goto('/signin')
        await expect(page.locator('html')).toHaveClass(theme === 'dark' ? /dark/ : /^(?!.*dark)/)
        await shot(page, `signin-${size.name}-${theme}`)
        await signIn(page, 'facilitator@brinkwater.test')
        await expect(page.getByTestId('exercise-list')).toBeVisible()
        await shot(page, `exercises-${size.name}-${theme}`)
        // Nothing overflows sideways.
        const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)
        expect(overflow).toBeLessThanOrEqual(0)
      })
    }
  }
})
