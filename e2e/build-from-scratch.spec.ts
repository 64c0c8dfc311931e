import { expect, test } from '@playwright/test'
import { CanvasGestures, EditorPage } from './pages/editor.page'
import { SignInPage } from './pages/sign-in.page'

test('a newcomer builds a small riser from scratch with the palette, handle drags and the properties panel', async ({
  page,
}) => {
  await new SignInPage(page).goto()
  await new SignInPage(page).signIn('blake@example.test')
  await page.getByTestId('project-list').getByText('Fernhollow Community Hall').click()

  // A new, empty diagram.
  const name = `Scratch riser ${Date.now()}`
  await page.getByTestId('new-diagram').click()
  await page.getByTestId('diagram-name-input').fill(name)
  await page.getByTestId('diagram-name-submit').click()
  await expect(page.getByTestId('diagram-name')).toHaveText(name)
  await page.getByTestId('units-si').click()
  const editor = new EditorPage(page)
  const canvas = new CanvasGestures(page)

  // Service → junction by palette clicks: a selected node feeds the next one added.
  await page.getByTestId('palette-item-supply').click()
  await expect(editor.node('S1')).toBeVisible()
  await canvas.setField('prop-supply-pressure', '420')
  await page.getByTestId('palette-item-junction').click()
  await expect(editor.pipeLabel('P1')).toBeVisible()
  await canvas.drag('J1', 200, 0)

  // Two fixtures placed with nothing selected, dragged into place, then piped by dragging
  // handle to handle.
  await page.keyboard.press('Escape')
  await page.getByTestId('palette-item-water-closet-flush-valve').click()
  await canvas.drag('F1', 0, -220)
  await page.keyboard.press('Escape')
  await page.getByTestId('palette-item-urinal-flush-valve').click()
  await canvas.drag('F2', 250, -220)
  await page.getByTestId('fit-view').click()
  await canvas.connect('J1', 'F1', 'cold')
  await canvas.connect('J1', 'F2', 'cold')
  await expect(editor.pipeLabel('P2')).toBeVisible()
  await expect(editor.pipeLabel('P3')).toBeVisible()

  // A battery: three water closets on that one connection.
  await editor.selectNode('F1')
  await canvas.setField('prop-count', '3')
  // A new diagram uses the per-fixture basis with public occupancy (IPC Table E103.3(2)): water
  // closet, flush valve 10 WSFU each, urinal on a 3/4 in flush valve 5 → 3 × 10 + 5 = 35 FU.
  await expect(editor.pipeLabel('P1')).toContainText('35 FU')

  // A real length for the main, set on the pipe.
  await editor.pipeLabel('P1').click()
  await canvas.setField('prop-length', '18')
  await expect(page.getByTestId('pipe-result')).toContainText('FU')

  // A pipe that would give F2 a second cold inlet is refused with the reason.
  await canvas.connect('S1', 'F2', 'cold')
  await expect(page.locator('.n-message')).toContainText('already has a cold inlet')

  // Undo and redo from the keyboard.
  await page.locator('.vue-flow__pane').click({ position: { x: 20, y: 20 } })
  await page.keyboard.press('Control+z') // the length
  await expect(editor.pipeLabel('P1')).toContainText('35 FU')
  await page.keyboard.press('Control+z') // the count
  await expect(editor.pipeLabel('P1')).toContainText('15 FU')
  await page.keyboard.press('Control+Shift+z')
  await expect(editor.pipeLabel('P1')).toContainText('35 FU')

  await editor.expectSaved()
  await page.screenshot({ path: 'test-results/screens/editor-from-scratch.png' })

  // Everything survives a reload.
  await page.reload()
  await expect(editor.pipeLabel('P1')).toContainText('35 FU')
  await expect(editor.pipeLabel('P3')).toBeVisible()
})
