import { expect, type Page } from '@playwright/test'

/** The page an invitation link opens. */
export class InvitationPage {
  constructor(private readonly page: Page) {}

  async expectFor(email: string, role: string) {
    const summary = this.page.getByTestId('invitation-summary')
    await expect(summary).toContainText(email)
    await expect(summary).toContainText(role)
  }

  async createAccount(name: string, password: string) {
    await this.page.getByTestId('invitation-name').fill(name)
    await this.page.getByTestId('invitation-password').fill(password)
    await this.page.getByTestId('invitation-create-account').click()
  }

  async expectProblem(text: string | RegExp) {
    await expect(this.page.getByTestId('link-problem')).toContainText(text)
  }
}
