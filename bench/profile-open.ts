/**
 * Profiling aid for the editor: opens a generated diagram of N nodes (env N, default 2000) in
 * Chromium with the CPU profiler on and prints where the time went (inclusive and self), plus
 * `T ...` timing lines the page logs. Needs a built client, PostgreSQL and a migrated DB
 * (env DATABASE_URL, default the bench DB).
 */
import { chromium } from '@playwright/test'
import { startAppServer } from './app-server.ts'
import { editorBenchDiagram } from './editor-diagram.ts'
import { CHROMIUM_ARGS, CHROMIUM_EXECUTABLE } from '../e2e/chromium.ts'

/** The parts of a CDP CPU profile read here. */
interface CallFrame {
  functionName: string
  url: string
  lineNumber: number
  columnNumber: number
}
interface ProfileNode {
  id: number
  callFrame: CallFrame
  children?: number[]
}
interface CpuProfile {
  nodes: ProfileNode[]
  samples: number[]
  timeDeltas: number[]
}

const PORT = 3212
const DATABASE_URL =
  process.env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/tributary_bench'

const app = await startAppServer(PORT, DATABASE_URL)
const BASE = app.base

const key = (cf: CallFrame, withColumn: boolean) =>
  `${cf.functionName || '(anon)'} ${cf.url.split('/').pop()}:${cf.lineNumber}` +
  (withColumn ? `:${cf.columnNumber}` : '')
const table = (times: Map<string, number>, count: number) =>
  [...times]
    .sort((a, b) => b[1] - a[1])
    .slice(0, count)
    .map(([k, t]) => `${(t / 1000).toFixed(0).padStart(7)} ms  ${k}`)
    .join('\n')

/** Self time per function and inclusive time (recursion counted once) per function. */
function summarise(profile: CpuProfile) {
  const byId = new Map(profile.nodes.map((node) => [node.id, node]))
  const selfById = new Map<number, number>()
  profile.samples.forEach((id, i) =>
    selfById.set(id, (selfById.get(id) ?? 0) + (profile.timeDeltas[i] ?? 0)),
  )
  const self = new Map<string, number>()
  for (const [id, t] of selfById) {
    const k = key(byId.get(id)!.callFrame, true)
    self.set(k, (self.get(k) ?? 0) + t)
  }
  const inclusive = new Map<string, number>()
  const walk = (id: number, stack: Set<string>): number => {
    const node = byId.get(id)!
    const k = key(node.callFrame, false)
    const inner = new Set([...stack, k])
    let t = selfById.get(id) ?? 0
    for (const child of node.children ?? []) t += walk(child, inner)
    if (!stack.has(k)) inclusive.set(k, (inclusive.get(k) ?? 0) + t)
    return t
  }
  walk(profile.nodes[0]!.id, new Set())
  return { self, inclusive }
}

const browser = await chromium.launch({
  executablePath: CHROMIUM_EXECUTABLE,
  args: CHROMIUM_ARGS,
})
try {
  const { cookie, projectId } = await app.ownerWithProject('Profile')
  const doc = editorBenchDiagram(Number(process.env.N ?? 2000))
  const path = `/projects/${projectId}/diagrams`
  const diagramId = (await (await app.api(path, cookie, { name: 'P', document: doc })).json())
    .diagram.id

  // Polling a string predicate needs eval, which the app's CSP forbids; profiling bypasses it.
  const context = await browser.newContext({
    viewport: { width: 1600, height: 1000 },
    bypassCSP: true,
  })
  const [name, value] = cookie.split('=') as [string, string]
  await context.addCookies([{ name, value, url: BASE }])
  const page = await context.newPage()
  page.on('console', (m) => {
    if (m.text().startsWith('T ') || m.type() === 'error') console.log(m.text())
  })
  page.on('pageerror', (e) => console.log('page error', e.message))
  const cdp = await context.newCDPSession(page)
  await cdp.send('Profiler.enable')
  await cdp.send('Profiler.setSamplingInterval', { interval: 1000 })
  await page.goto(`${BASE}/projects`)
  await cdp.send('Profiler.start')
  const t0 = Date.now()
  await page.goto(`${BASE}/projects/${projectId}/diagrams/${diagramId}`)
  await page
    .getByTestId(`pipe-label-${doc.pipes[0]!.id}`)
    .waitFor({ timeout: 120_000 })
    .catch(async (error: unknown) => {
      // Say what the page shows instead (an error, a sign-in form), not only that it timed out.
      console.log('page shows:', (await page.locator('body').innerText()).slice(0, 500))
      throw error
    })
  console.log('open ms', Date.now() - t0, 'page now', await page.evaluate('performance.now()'))
  const counts = `JSON.stringify(['.vue-flow__node', '.vue-flow__edge', '*', '.vue-flow__minimap-node']
    .map((s) => document.querySelectorAll(s).length))`
  console.log('nodes, edges, elements, minimap nodes', await page.evaluate(counts))
  let { profile } = (await cdp.send('Profiler.stop')) as { profile: CpuProfile }
  if (process.env.EDIT) {
    // Profile the bench's edit instead: the default pipe material, until the first label changes.
    const probe = `[data-testid="pipe-label-${doc.pipes[0]!.id}"]`
    const before = await page.locator(probe).innerText()
    await page.getByTestId('open-settings').click()
    await page.getByTestId('settings-material').click()
    await page.waitForTimeout(500)
    await cdp.send('Profiler.start')
    const t1 = Date.now()
    await page.locator('.n-base-select-option', { hasText: 'Type L' }).first().click()
    await page.waitForFunction(
      `document.querySelector('${probe}').innerText !== ${JSON.stringify(before)}`,
      undefined,
      { polling: 'raf' },
    )
    console.log('edit ms', Date.now() - t1)
    profile = ((await cdp.send('Profiler.stop')) as { profile: CpuProfile }).profile
  }
  const { self, inclusive } = summarise(profile)
  console.log('INCLUSIVE')
  console.log(table(inclusive, Number(process.env.TOP ?? 120)))
  console.log('SELF')
  console.log(table(self, 25))
} finally {
  await browser.close()
  app.process.kill()
}
