/**
 * Profiling aid for the editor: opens a generated diagram of N nodes (env N, default 2000) in
 * Chromium with the CPU profiler on and prints where the time went (self and inclusive), plus
 * `T ...` timing lines the page logs. Needs a built client, PostgreSQL and a migrated bench DB.
 */
import { spawn } from 'node:child_process'
import { chromium } from '@playwright/test'
import { editorBenchDiagram } from './editor-diagram.ts'
const PORT = 3212, BASE = `http://127.0.0.1:${PORT}`
const DATABASE_URL = process.env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/tributary_bench'
const server = spawn('node', ['--import', 'tsx', 'server/index.ts'], { env: { ...process.env, PORT: String(PORT), DATABASE_URL, NODE_ENV: 'test' }, stdio: 'ignore' })
for (let i = 0; i < 60; i++) { if (await fetch(`${BASE}/api/health`).then((r) => r.ok, () => false)) break; await new Promise((r) => setTimeout(r, 250)) }
const api = async (path: string, cookie: string, body?: unknown) => fetch(`${BASE}/api${path}`, { method: 'POST', headers: { 'Content-Type': 'application/json', cookie }, body: JSON.stringify(body) })
const su = await api('/auth/sign-up', '', { email: `prof-${Date.now()}@example.test`, name: 'Prof', password: 'bench-password-1' })
const cookie = su.headers.get('set-cookie')!.split(';')[0]!
const pid = (await (await api('/projects', cookie, { name: 'Prof' })).json()).project.id
const doc = editorBenchDiagram(Number(process.env.N ?? 2000))
const did = (await (await api(`/projects/${pid}/diagrams`, cookie, { name: 'P', document: doc })).json()).diagram.id
const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ['--no-sandbox', '--disable-gpu'] })
const ctx = await browser.newContext({ viewport: { width: 1600, height: 1000 } })
const [n, v] = cookie.split('=') as [string, string]
await ctx.addCookies([{ name: n, value: v, url: BASE }])
const page = await ctx.newPage()
page.on('console', (m) => { if (m.text().startsWith('T ')) console.log(m.text()) })
const cdp = await ctx.newCDPSession(page)
await cdp.send('Profiler.enable'); await cdp.send('Profiler.setSamplingInterval', { interval: 1000 })
await page.goto(`${BASE}/projects`)
await cdp.send('Profiler.start')
const t0 = Date.now()
await page.goto(`${BASE}/projects/${pid}/diagrams/${did}`)
await page.locator(`[data-testid="pipe-label-${doc.pipes[0]!.id}"]`).waitFor({ timeout: 120000 })
console.log('now', await page.evaluate('performance.now()'));console.log('open ms', Date.now() - t0, await page.evaluate('JSON.stringify([window.__mapNodes, window.__mapEdges, window.__calc, document.querySelectorAll(".vue-flow__node").length, document.querySelectorAll(".vue-flow__edge").length, document.querySelectorAll("*").length, document.querySelectorAll(".vue-flow__minimap-node").length])'))
const { profile } = await cdp.send('Profiler.stop') as any
const self = new Map<string, number>()
const byId = new Map(profile.nodes.map((x: any) => [x.id, x]))
const dt = profile.timeDeltas as number[]
profile.samples.forEach((id: number, i: number) => { const node: any = byId.get(id); const cf = node.callFrame; const key = `${cf.functionName || "(anon)"} ${cf.url.split("/").pop()}:${cf.lineNumber}:${cf.columnNumber}`; self.set(key, (self.get(key) ?? 0) + (dt[i] ?? 0)) })
const selfById = new Map<number, number>()
profile.samples.forEach((id: number, i: number) => selfById.set(id, (selfById.get(id) ?? 0) + (dt[i] ?? 0)))
const incl = new Map<string, number>()
const walk = (id: number, stack: Set<string>): number => { const node: any = byId.get(id); const cf = node.callFrame; const key = `${cf.functionName || '(anon)'} ${cf.url.split('/').pop()}:${cf.lineNumber}`; let t = selfById.get(id) ?? 0; for (const c of node.children ?? []) t += walk(c, new Set([...stack, key])); if (!stack.has(key)) incl.set(key, (incl.get(key) ?? 0) + t); return t }
walk(profile.nodes[0].id, new Set())
console.log('INCLUSIVE'); console.log([...incl].sort((a, b) => b[1] - a[1]).slice(0, 400).map(([k, t]) => `${(t / 1000).toFixed(0).padStart(7)} ms  ${k}`).join('\n'))
console.log([...self].sort((a, b) => b[1] - a[1]).slice(0, 25).map(([k, t]) => `${(t / 1000).toFixed(0).padStart(7)} ms  ${k}`).join('\n'))
await browser.close(); server.kill()
