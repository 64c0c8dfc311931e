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

  /** Opens the editor at its URL and fits the whole diagram in view. */
  async openAt(path: string) {
    await this.page.goto(path)
    await expect(this.page.getByTestId('riser-canvas')).toBeVisible()
    await expect(this.page.locator('.vue-flow__edge').first()).toBeAttached()
    await this.page.getByTestId('fit-view').click()
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
        out[el.dataset.testid!.slice('pipe-label-'.length)] = el.innerText
          .replace(/\s+/g, ' ')
          .trim()
      }
      return out
    })
  }

  async selectNode(id: string) {
    await this.node(id).click()
  }

  async expectSaved() {
    await expect(this.page.getByTestId('save-state')).toHaveAttribute('data-state', 'saved', {
      timeout: 15_000,
    })
  }
}

/** Canvas gestures used when building a diagram from scratch. */
export class CanvasGestures {
  constructor(readonly page: Page) {}

  private handle(nodeId: string, handleId: string): Locator {
    return this.page.locator(
      `.vue-flow__node[data-id="${nodeId}"] .vue-flow__handle[data-handleid="${handleId}"]`,
    )
  }

  /** Draws a pipe by dragging from one handle to another, as a user does. */
  async connect(from: string, to: string, targetHandle = 'in') {
    const a = await this.handle(from, 'out').boundingBox()
    const b = await this.handle(to, targetHandle).boundingBox()
    if (!a || !b) throw new Error(`handles of ${from} → ${to} are not on screen`)
    await this.page.mouse.move(a.x + a.width / 2, a.y + a.height / 2)
    await this.page.mouse.down()
    await this.page.mouse.move((a.x + b.x) / 2, (a.y + b.y) / 2, { steps: 5 })
    await this.page.mouse.move(b.x + b.width / 2, b.y + b.height / 2, { steps: 5 })
    await this.page.mouse.up()
  }

  /** Moves a node by dragging its body. */
  async drag(nodeId: string, dx: number, dy: number) {
    const box = await this.page.locator(`.vue-flow__node[data-id="${nodeId}"]`).boundingBox()
    if (!box) throw new Error(`node ${nodeId} is not on screen`)
    const x = box.x + box.width / 2
    const y = box.y + box.height / 2
    await this.page.mouse.move(x, y)
    await this.page.mouse.down()
    await this.page.mouse.move(x + dx, y + dy, { steps: 8 })
    await this.page.mouse.up()
  }

  /** Types into a properties-panel field and commits it with Enter. */
  async setField(testId: string, value: string) {
    const input = this.page.getByTestId(testId)
    await input.fill(value)
    await input.press('Enter')
  }
}
