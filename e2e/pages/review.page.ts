import { expect, type Browser, type Page } from '@playwright/test'
import { EditorPage } from './editor.page'
import { SignInPage } from './sign-in.page'

/** One person reviewing a diagram: comments side tab, pins on the canvas, the review bar. */
export class ReviewPage extends EditorPage {
  static async signedIn(browser: Browser, email: string): Promise<ReviewPage> {
    const context = await browser.newContext({ viewport: { width: 1440, height: 900 } })
    const page = await context.newPage()
    await new SignInPage(page).goto()
    await new SignInPage(page).signIn(email)
    await expect(page.getByTestId('project-list')).toBeVisible()
    return new ReviewPage(page)
  }

  constructor(page: Page) {
    super(page)
  }

  async open(path: string) {
    await this.page.goto(path)
    await expect(this.page.getByTestId('riser-canvas')).toBeVisible()
    await expect(this.page.locator('.vue-flow__edge').first()).toBeAttached()
    await this.page.getByTestId('fit-view').click()
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
