import { execFileSync } from 'node:child_process'
import { readFile } from 'node:fs/promises'
import { expect, test } from '@playwright/test'
import { fernhollowHallDiagram } from '../shared/demo/fernhollow-hall'
import { formatFlow, formatLoad, formatVelocity } from '../shared/units/format'
import { formatNominal } from '../shared/units/nominal'
import { EditorPage } from './pages/editor.page'
import { SignInPage } from './pages/sign-in.page'

/** Pipe ids from the supply down to `nodeId`, following inlets upstream (cold side). */
function pathToSupply(nodeId: string): string[] {
  const path: string[] = []
  let at = nodeId
  for (;;) {
    const inlet = fernhollowHallDiagram.pipes.find((p) => p.to === at && p.system === 'cold')
    if (!inlet) return path
    path.push(inlet.id)
    at = inlet.from
  }
}

test('a designer grows a branch, sees every pipe up to the supply change, undoes, switches units and exports the schedule', async ({
  page,
}) => {
  await new SignInPage(page).goto()
  await new SignInPage(page).signIn('blake@example.test')
  const editor = new EditorPage(page)
  await editor.openFromProject('Fernhollow Community Hall', 'Domestic water')
  await expect(page.getByTestId('design-aid-notice')).toBeVisible()
  await page.getByTestId('units-si').click()

  const before = await editor.pipeLabels()
  expect(Object.keys(before)).toHaveLength(fernhollowHallDiagram.pipes.length)

  // Every label shows what the command-line calculation prints for the same document.
  const cli = JSON.parse(
    execFileSync(
      'node',
      [
        '--import',
        'tsx',
        'scripts/calc.ts',
        'tests/fixtures/diagrams/fernhollow-hall.json',
        '--json',
      ],
      {
        encoding: 'utf8',
      },
    ),
  ) as {
    pipes: { id: string; load: number; flowLps: number; nominal: string; velocityMps: number }[]
  }
  expect(cli.pipes).toHaveLength(fernhollowHallDiagram.pipes.length)
  for (const p of cli.pipes) {
    const expected = [
      formatLoad(p.load),
      formatFlow(p.flowLps, 'si'),
      formatNominal(p.nominal, 'si'),
      formatVelocity(p.velocityMps, 'si'),
    ]
    expect(before[p.id], p.id).toBe(expected.join(' · '))
  }
  await page.screenshot({ path: 'test-results/screens/editor-demo.png' })

  // Add a lavatory to the upper men's washroom branch.
  const branch = 'j-u-men'
  await editor.selectNode(branch)
  await page.getByTestId('palette-item-lavatory').click()
  const upstream = pathToSupply(branch)
  expect(upstream.length).toBeGreaterThan(3)
  await expect(async () => {
    const after = await editor.pipeLabels()
    for (const id of upstream) expect(after[id], `label of ${id}`).not.toBe(before[id])
    expect(Object.keys(after).length).toBe(Object.keys(before).length + 1)
  }).toPass({ timeout: 5_000 })
  const grown = await editor.pipeLabels()
  // Pipes off the path keep their labels.
  expect(grown['c-hb-north']).toBe(before['c-hb-north'])
  await editor.expectSaved()

  // Undo puts every label back.
  await page.getByTestId('undo').click()
  await expect.poll(() => editor.pipeLabels()).toEqual(before)

  // US units change only the display.
  await page.getByTestId('units-us').click()
  await expect(editor.pipeLabel('c-service')).toContainText('gpm')
  await expect(editor.pipeLabel('c-service')).toContainText('FU')

  // The schedule lists every pipe and exports CSV in the display units.
  await page.getByTestId('view-schedule').click()
  await expect(page.getByTestId('pipe-schedule')).toContainText('c-service')
  const [download] = await Promise.all([
    page.waitForEvent('download'),
    page.getByTestId('export-csv').click(),
  ])
  const csv = await readFile((await download.path())!, 'utf8')
  expect(csv.split('\n')[0]).toMatch(/gpm/)
  for (const pipe of fernhollowHallDiagram.pipes) expect(csv).toContain(pipe.id)
  await page.screenshot({ path: 'test-results/screens/editor-schedule.png' })
})
