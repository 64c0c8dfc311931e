import { expect, type Browser, type Page } from '@playwright/test'
import { EditorPage } from './editor.page'
import { signedInPage } from './sign-in.page'

/** One person reviewing a diagram: comments side tab, pins on the canvas, the review bar. */
export class ReviewPage extends EditorPage {
  static async signedIn(browser: Browser, email: string): Promise<ReviewPage> {
    return new ReviewPage(await signedInPage(browser, email))
  }

  constructor(page: Page) {
    super(page)
  }

  async open(path: string) {
    await this.openAt(path)
    await expect(this.status()).not.toHaveText('Review status loading')
  }

  status() {
    return this.page.getByTestId('review-status')
  }

  pin(targetId: string) {
    return this.page.getByTestId(`comment-pin-${targetId}`)
  }

  async selectPipe(id: string) {
    await this.pipeLabel(id).click()
  }

  async openComments() {
    await this.page.getByTestId('comments-tab').click()
    await expect(this.page.getByTestId('comments-panel')).toBeVisible()
  }

  /** Types a comment, picking the person to mention from the suggestions, and sends it. */
  async comment(text: string, mention?: { typed: string; userId: string }) {
    const input = this.page
      .getByTestId('comments-panel')
      .getByTestId('comment-input')
      .locator('textarea')
    await input.fill(text)
    if (mention) {
      await input.pressSequentially(` @${mention.typed}`)
      await this.page.getByTestId(`mention-${mention.userId}`).click()
    }
    await this.page.getByTestId('comment-send').click()
  }

  thread() {
    return this.page.getByTestId('comment-thread')
  }

  async close() {
    await this.page.context().close()
  }
}
