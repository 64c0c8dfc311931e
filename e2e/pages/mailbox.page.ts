import { expect, type Page } from '@playwright/test'

/** The development mailbox: mail captured by the local fake SMTP server. */
export class MailboxPage {
  constructor(private readonly page: Page) {}

  async open() {
    await this.page.getByTestId('nav-mailbox').click()
    await expect(this.page).toHaveURL(/\/dev\/mailbox$/)
  }

  /** Opens the newest message to `to` and answers the first link in its plain text. */
  async linkInMessageTo(to: string): Promise<string> {
    const item = this.page.getByTestId('mailbox-item').filter({ hasText: to }).first()
    await expect(item).toBeVisible()
    await item.click()
    const message = this.page.getByTestId('mailbox-message')
    await expect(message).toContainText(to)
    const href = await message.getByTestId('mail-link').first().getAttribute('href')
    if (!href) throw new Error('no link in the message')
    return href
  }
}
