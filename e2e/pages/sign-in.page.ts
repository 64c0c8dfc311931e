import { expect, type Page } from '@playwright/test'

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
