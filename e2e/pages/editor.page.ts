import { expect, type Locator, type Page } from '@playwright/test'

/** The riser-diagram editor. */
export class EditorPage {
  constructor(readonly page: Page) {}

  /** Opens a diagram from the project page by its name. */
  async openFromProject(projectName: string, diagramName: string) {
    await this.page.getByTestId('project-list').getByText(projectName).click()
    await this.page.getByTestId('diagram-table').getByRole('link', { name: diagramName }).click()
    await expect(this.page.getByTestId('riser-canvas')).toBeVisible()
    await expect(this.page.locator('.vue-flow__edge').first()).toBeAttached()
  }

  node(id: string): Locator {
    return this.page.locator(`.vue-flow__node[data-id="${id}"]`)
  }

  pipeLabel(id: string): Locator {
    return this.page.getByTestId(`pipe-label-${id}`)
  }

  /** Text of every pipe label on the canvas, by pipe id. */
  async pipeLabels(): Promise<Record<string, string>> {
    return this.page.evaluate(() => {
      const out: Record<string, string> = {}
      for (const el of document.querySelectorAll<HTMLElement>('[data-testid^="pipe-label-"]')) {
        out[el.dataset.testid!.slice('pipe-label-'.length)] = el.innerText.replace(/\s+/g, ' ').trim()
      }
      return out
    })
  }

  async selectNode(id: string) {
    await this.node(id).click()
  }

  async expectSaved() {
    await expect(this.page.getByTestId('save-state')).toHaveAttribute('data-state', 'saved', { timeout: 15_000 })
  }
}
