import { expect, type Browser, type Page } from '@playwright/test'

export const DEMO_PASSWORD = 'tributary-demo'

/** The sign-in screen. */
export class SignInPage {
  constructor(private readonly page: Page) {}

  async goto() {
    await this.page.goto('/sign-in')
  }

  async signIn(email: string, password = DEMO_PASSWORD) {
    await this.page.getByTestId('sign-in-email').fill(email)
    await this.page.getByTestId('sign-in-password').fill(password)
    await this.page.getByTestId('sign-in-submit').click()
  }

  async expectError(text: string | RegExp) {
    await expect(this.page.getByTestId('sign-in-error')).toContainText(text)
  }
}

/** A fresh browser context signed in as `email`, on the project list. */
export async function signedInPage(browser: Browser, email: string): Promise<Page> {
  const context = await browser.newContext({ viewport: { width: 1440, height: 900 } })
  const page = await context.newPage()
  await new SignInPage(page).goto()
  await new SignInPage(page).signIn(email)
  await expect(page.getByTestId('project-list')).toBeVisible()
  return page
}
