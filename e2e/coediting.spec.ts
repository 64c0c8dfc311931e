import { expect, test } from '@playwright/test'
import { CoeditingPage } from './pages/coediting.page'
import { copyDemoDiagram } from './demo-copy'

const EDITOR = { email: 'blake@example.test', name: 'Blake Okonkwo' }
const REVIEWER = { email: 'casey@example.test', name: 'Casey Marchetti' }

// The copy is deleted even when a step fails: a stray "Domestic water (copy)" would confuse the
// journeys that open the demo by name.
const cleanup: (() => Promise<void>)[] = []
test.afterEach(async () => {
  for (const step of cleanup.splice(0)) await step()
})

test('an editor and a reviewer share one diagram: presence, live edits with new labels, history and offline edits', async ({
  browser,
}) => {
  const blake = await CoeditingPage.signedIn(browser, EDITOR.email)
  const casey = await CoeditingPage.signedIn(browser, REVIEWER.email)

  // A copy of the demo diagram, so the other journeys keep the seeded one as it is.
  const api = blake.page.request
  const { path, remove } = await copyDemoDiagram(api)
  cleanup.push(async () => {
    await remove()
    await blake.close()
    await casey.close()
  })
  await blake.open(path)
  await casey.open(path)
  for (const person of [blake, casey]) await person.page.getByTestId('units-si').click()

  // Both see both avatars; the reviewer gets no editing tools.
  for (const person of [blake, casey]) {
    await expect(person.avatar(EDITOR.name)).toHaveText('BO')
    await expect(person.avatar(REVIEWER.name)).toHaveText('CM')
  }
  await expect(casey.page.getByTestId('palette-item-lavatory')).toHaveCount(0)
  await expect(casey.page.getByTestId('undo')).toHaveCount(0)
  await expect(casey.page.getByTestId('open-transfers')).toBeVisible()

  // Blake's selection is ringed and named on Casey's canvas; his pointer shows there too.
  await blake.selectNode('heater')
  await expect(casey.selectedBy('heater')).toHaveText(EDITOR.name)
  await blake.pipeLabel('c-core').click()
  await expect(casey.pipeSelectedBy('c-core')).toHaveText(`Selected by ${EDITOR.name}`)
  await casey.page.screenshot({ path: 'test-results/screens/coediting-pipe-selection.png' })
  await expect(casey.selectedBy('heater')).toHaveCount(0)
  await blake.hoverCanvas(400, 300)
  await expect(casey.cursorOf(EDITOR.name)).toBeVisible()
  await expect(blake.cursorOf(EDITOR.name)).toHaveCount(0)

  // An edit by Blake reaches Casey's canvas with its new labels.
  const before = await casey.pipeLabels()
  await blake.selectNode('j-u-men')
  await blake.page.getByTestId('palette-item-lavatory').click()
  await blake.expectSaveState('saved')
  const grown = await blake.pipeLabels()
  expect(Object.keys(grown)).toHaveLength(Object.keys(before).length + 1)
  await expect.poll(() => casey.pipeLabels()).toEqual(grown)
  const changed = Object.keys(before).filter((id) => grown[id] !== before[id])
  expect(changed.length).toBeGreaterThan(3)
  await casey.page.screenshot({ path: 'test-results/screens/coediting-reviewer.png' })
  await blake.page.screenshot({ path: 'test-results/screens/coediting-editor.png' })

  // Undo is an op like any other: it reaches Casey too.
  await blake.page.getByTestId('undo').click()
  await blake.expectSaveState('saved')
  await expect.poll(() => casey.pipeLabels()).toEqual(before)

  // History: the reviewer sees who did what, and views the grown revision read-only.
  await casey.openHistory()
  const entries = casey.page.getByTestId('revision-entry')
  await expect(entries.first()).toContainText(EDITOR.name)
  const undoRevision = Number(await entries.first().getAttribute('data-revision'))
  const addRevision = undoRevision - 1
  await expect(casey.revision(addRevision)).toContainText(EDITOR.name)
  await expect(casey.revision(addRevision).getByTestId('revision-restore')).toHaveCount(0)
  await casey.revision(addRevision).getByTestId('revision-view').click()
  await expect(casey.page.getByTestId('revision-preview')).toHaveAttribute(
    'data-revision',
    String(addRevision),
  )
  await casey.page.keyboard.press('Escape')
  await expect.poll(() => casey.pipeLabels()).toEqual(grown)
  await casey.page.getByTestId('preview-close').click()
  await expect.poll(() => casey.pipeLabels()).toEqual(before)

  // Blake restores that revision: a new revision, seen by both.
  await blake.openHistory()
  await blake.revision(addRevision).getByTestId('revision-restore').click()
  await blake.page.locator('.n-popconfirm').getByRole('button', { name: 'Confirm' }).click()
  await expect.poll(() => blake.pipeLabels()).toEqual(grown)
  await expect.poll(() => casey.pipeLabels()).toEqual(grown)
  await expect(blake.page.getByTestId('revision-entry').first()).toContainText('restore')
  await blake.page.keyboard.press('Escape')

  // Offline: Blake's edit is kept and shown as waiting, then sent when the link returns.
  await blake.page.context().setOffline(true)
  await expect(blake.banner()).toHaveAttribute('data-state', /offline|reconnecting/)
  await blake.selectNode('j-u-men')
  await blake.page.getByTestId('palette-item-lavatory').click()
  await blake.expectSaveState('offline')
  const offline = await blake.pipeLabels()
  expect(Object.keys(offline)).toHaveLength(Object.keys(grown).length + 1)
  expect(await casey.pipeLabels()).toEqual(grown)
  await blake.page.screenshot({ path: 'test-results/screens/coediting-offline.png' })
  await blake.page.context().setOffline(false)
  await blake.page.getByTestId('connection-retry').click()
  await blake.expectSaveState('saved')
  await expect.poll(() => casey.pipeLabels()).toEqual(offline)
})
