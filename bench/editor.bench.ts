/**
 * Editor benchmark (`npm run bench:editor`): opens generated riser diagrams (~500, ~1,000 and
 * ~2,000 nodes; env BENCH_NODES, comma-separated, picks others) in
 * Debian's Chromium through the real app and API, then makes one property edit that resizes every
 * pipe (the default pipe material). Prints the time until the opening view is drawn, the time from
 * the edit to the labels on screen updated, and frame times measured with requestAnimationFrame.
 * Large diagrams draw only what is on screen, so "open" is measured to the first screenful.
 * Needs the private PostgreSQL (started here) and a built client (built here when missing).
 */
import { execSync } from 'node:child_process'
import { existsSync } from 'node:fs'
import { loadavg } from 'node:os'
import { chromium, type BrowserContext, type Page } from '@playwright/test'
import { startAppServer, type AppServer } from './app-server.ts'
import { editorBenchDiagram } from './editor-diagram.ts'
import { CHROMIUM_ARGS, CHROMIUM_EXECUTABLE } from '../e2e/chromium.ts'

const PORT = 3211
const PGPORT = process.env.PGPORT ?? '54329'
const DATABASE = process.env.BENCH_DATABASE ?? 'tributary_bench'
const DATABASE_URL = `postgres://postgres@127.0.0.1:${PGPORT}/${DATABASE}`
const SIZES = (process.env.BENCH_NODES ?? '500,1000,2000').split(',').map(Number)
const run = (cmd: string, env: Record<string, string> = {}) =>
  execSync(cmd, { stdio: 'inherit', env: { ...process.env, ...env } })

function stats(frames: number[]) {
  const s = [...frames].sort((a, b) => a - b)
  const q = (p: number) => s[Math.min(s.length - 1, Math.floor(p * s.length))] ?? 0
  return `${s.length} frames, p50 ${q(0.5).toFixed(1)} ms, p95 ${q(0.95).toFixed(1)} ms, max ${(s[s.length - 1] ?? 0).toFixed(1)} ms`
}

// Scripts run in the page are strings: tsx would wrap functions with a helper the page lacks.
/** Frame deltas recorded in the page from now on. */
const startFrames = (page: Page) =>
  page.evaluate(`(() => {
    window.__frames = []
    let last = performance.now()
    const tick = (t) => { window.__frames.push(t - last); last = t; requestAnimationFrame(tick) }
    requestAnimationFrame(tick)
  })()`)
const takeFrames = (page: Page) => page.evaluate('window.__frames.splice(0)') as Promise<number[]>
const labelCount = `document.querySelectorAll('[data-testid^="pipe-label-"]').length`
/** The texts of the pipe labels on screen, in document order. */
const labelTexts = `[...document.querySelectorAll('[data-testid^="pipe-text-"]')].map((e) => e.textContent)`

/** Opens one generated diagram and makes the material edit, printing what it measured. */
async function benchDiagram(app: AppServer, context: BrowserContext, targetNodes: number) {
  const doc = editorBenchDiagram(targetNodes)
  const created = await app.api(`/projects/${projectId}/diagrams`, cookie, {
    name: 'Bench',
    document: doc,
  })
  const diagram = (await created.json()).diagram
  console.log(`Diagram: ${doc.nodes.length} nodes, ${doc.pipes.length} pipes`)
  const page = await context.newPage()
  await page.goto(`${app.base}/projects`)
  await startFrames(page)

  const t0 = Date.now()
  await page.goto(`${app.base}/projects/${projectId}/diagrams/${diagram.id}`)
  await startFrames(page)
  const probe = doc.pipes[0]!.id
  await page.getByTestId(`pipe-label-${probe}`).waitFor({ timeout: 120_000 })
  await page.evaluate('new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(r)))')
  const openMs = Date.now() - t0
  const openFrames = await takeFrames(page)
  const drawn = await page.evaluate(labelCount)
  console.log(
    `Open to the first screen drawn (${drawn} of ${doc.pipes.length} pipe labels on screen): ${openMs} ms (${stats(openFrames)})`,
  )

  // One edit that resizes every pipe: the default material, steel → copper. A few pipes may keep
  // their label (same size and velocity), so it waits for any label on screen to change: they are
  // all drawn in the same render.
  await page.evaluate(`window.__labels = ${labelTexts}`)
  await page.getByTestId('open-settings').click()
  await startFrames(page)
  const t1 = Date.now()
  await page.getByTestId('settings-material').click()
  await page.locator('.n-base-select-option', { hasText: 'Type L' }).first().click()
  const changed = `${labelTexts}.filter((text, i) => text !== window.__labels[i]).length`
  await page
    .waitForFunction(`${changed} > 0`, undefined, { timeout: 60_000, polling: 'raf' })
    .catch(async (error: unknown) => {
      await page.screenshot({ path: `test-results/editor-bench-${targetNodes}.png` })
      console.log('No label on screen changed; screenshot in test-results/')
      throw error
    })
  const editMs = Date.now() - t1
  await page.waitForTimeout(500)
  const editFrames = await takeFrames(page)
  const updated = await page.evaluate(changed)
  console.log(
    `Material edit to labels updated (${updated} of ${drawn} on screen changed): ${editMs} ms, including choosing in the select (${stats(editFrames)})`,
  )
  await page.close()
}

run('bash scripts/pg.sh start')
run(`bash scripts/pg.sh ensure-db ${DATABASE}`, { PGPORT })
run('node --import tsx scripts/migrate.ts', { DATABASE_URL })
if (!existsSync('dist/index.html')) run('node_modules/.bin/vite build --logLevel warn')

const app = await startAppServer(PORT, DATABASE_URL)
const browser = await chromium.launch({
  executablePath: CHROMIUM_EXECUTABLE,
  args: CHROMIUM_ARGS,
})
let projectId = ''
let cookie = ''
try {
  ;({ cookie, projectId } = await app.ownerWithProject('Editor benchmark'))
  // Polling a string predicate needs eval, which the app's CSP rightly forbids; the bench bypasses it.
  const context = await browser.newContext({
    viewport: { width: 1600, height: 1000 },
    bypassCSP: true,
  })
  const [name, value] = cookie.split('=') as [string, string]
  await context.addCookies([{ name, value, url: app.base }])
  // Other work on the machine stretches every wall time below; print it so runs can be compared.
  console.log(
    `Load average at start: ${loadavg()
      .map((l) => l.toFixed(1))
      .join(' ')}`,
  )
  for (const size of SIZES) await benchDiagram(app, context, size)
} finally {
  if (projectId)
    await app.api(`/projects/${projectId}`, cookie, undefined, 'DELETE').catch(() => undefined)
  await browser.close()
  app.process.kill('SIGTERM')
}
