import { expect, type Browser, type Page } from '@playwright/test'
import { EditorPage } from './editor.page'
import { signedInPage } from './sign-in.page'

/** One person in a co-editing session: their own browser context on the editor. */
export class CoeditingPage extends EditorPage {
  static async signedIn(browser: Browser, email: string): Promise<CoeditingPage> {
    return new CoeditingPage(await signedInPage(browser, email))
  }

  constructor(page: Page) {
    super(page)
  }

  /** Opens the editor at its URL and waits until the live link is up. */
  async open(path: string) {
    await this.openAt(path)
  }

  avatar(name: string) {
    return this.page.locator(`[data-testid="presence-avatar"][data-name="${name}"]`)
  }

  /** The name tag another person's selection puts on a node. */
  selectedBy(nodeId: string) {
    return this.page.getByTestId(`node-selected-by-${nodeId}`)
  }

  /** Who another person's pipe selection names (the title of its coloured band). */
  pipeSelectedBy(pipeId: string) {
    return this.page.getByTestId(`pipe-remote-${pipeId}`).locator('title')
  }

  cursorOf(name: string) {
    return this.page.locator(`[data-testid="remote-cursor"][data-name="${name}"]`)
  }

  banner() {
    return this.page.getByTestId('connection-banner')
  }

  async expectSaveState(state: 'saved' | 'saving' | 'offline' | 'failed') {
    await expect(this.page.getByTestId('save-state')).toHaveAttribute('data-state', state, {
      timeout: 15_000,
    })
  }

  /** Moves the pointer over the canvas, a little at a time, as a person does. */
  async hoverCanvas(x: number, y: number) {
    const box = (await this.page.getByTestId('riser-canvas').boundingBox())!
    await this.page.mouse.move(box.x + x - 30, box.y + y - 20)
    await this.page.mouse.move(box.x + x, box.y + y, { steps: 6 })
  }

  async openHistory() {
    await this.page.getByTestId('open-history').click()
    await expect(this.page.getByTestId('history-panel')).toBeVisible()
  }

  revision(revision: number) {
    return this.page.locator(`[data-testid="revision-entry"][data-revision="${revision}"]`)
  }

  async close() {
    await this.page.context().close()
  }
}
