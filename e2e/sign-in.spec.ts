import { expect, test } from '@playwright/test'
import { SignInPage } from './pages/sign-in.page'

test('the demo owner signs in and sees the project list', async ({ page }) => {
  const consoleErrors: string[] = []
  page.on('console', (m) => m.type() === 'error' && consoleErrors.push(m.text()))

  await page.goto('/projects')
  await expect(page).toHaveURL(/\/sign-in/)
  const signIn = new SignInPage(page)

  await signIn.signIn('avery@example.test', 'not the password')
  await signIn.expectError('Wrong e-mail or password')

  await signIn.signIn('avery@example.test')
  await expect(page).toHaveURL(/\/projects$/)
  await expect(page.getByTestId('header-user-name')).toHaveText('Avery Lindqvist')
  const list = page.getByTestId('project-list')
  await expect(list).toContainText('Fernhollow Community Hall')
  await expect(list.getByTestId('role-owner')).toBeVisible()
  expect(await page.evaluate(() => document.fonts.check('16px "IBM Plex Sans"'))).toBe(true)
  await page.screenshot({ path: 'test-results/screens/project-list.png' })

  await page.getByTestId('sign-out').click()
  await expect(page).toHaveURL(/\/sign-in/)
  expect(consoleErrors.filter((e) => !e.includes('401'))).toEqual([])
})
