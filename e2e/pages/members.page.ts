import { expect, type Page } from '@playwright/test'

/** A project's Members tab. */
export class MembersPage {
  constructor(private readonly page: Page) {}

  async open(projectName: string) {
    await this.page.goto('/projects')
    await this.page.getByTestId('project-list').getByText(projectName).click()
    await this.page.getByTestId('tab-members').click()
    await expect(this.page.getByTestId('member-table')).toBeVisible()
  }

  async invite(email: string, role: 'owner' | 'editor' | 'reviewer' | 'viewer') {
    await this.page.getByTestId('invite-email').fill(email)
    await this.page.getByTestId('invite-role').click()
    await this.page
      .locator('.n-base-select-option', { hasText: new RegExp(`^${role}$`, 'i') })
      .click()
    await this.page.getByTestId('invite-submit').click()
    await expect(this.page.getByTestId('pending-invitations')).toContainText(email)
  }

  row(email: string) {
    return this.page.getByTestId('member-table').locator('tr', { hasText: email })
  }
}
