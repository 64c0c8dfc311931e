/**
 * Command line: compute a diagram file.
 *   npm run -s calc -- FILE.json [--json]
 * --json prints only JSON on stdout; otherwise a readable table. Exits 1 when the document is
 * invalid or the design has errors (the errors are printed).
 */
import { readFileSync } from 'node:fs'
import { computeDiagram } from '../shared/calc/compute.ts'
import type { CalcIssue, DiagramResult } from '../shared/calc/types.ts'
import { parseDiagram } from '../shared/calc/validate.ts'

const args = process.argv.slice(2)
const json = args.includes('--json')
const file = args.find((a) => !a.startsWith('--'))

function fail(issues: CalcIssue[]): never {
  if (json) process.stdout.write(JSON.stringify({ pipes: [], nodes: [], issues }, null, 2) + '\n')
  for (const i of issues) process.stderr.write(`${i.severity}: ${i.message}\n`)
  process.exit(1)
}

if (!file) {
  process.stderr.write('usage: npm run -s calc -- FILE.json [--json]\n')
  process.exit(2)
}

let input: unknown
try {
  input = JSON.parse(readFileSync(file, 'utf8'))
} catch (e) {
  fail([{ severity: 'error', code: 'read', message: `${file}: ${(e as Error).message}`, ids: [] }])
}
const parsed = parseDiagram(input)
if (!parsed.ok) fail(parsed.issues)
const result = computeDiagram(parsed.doc)

if (json) {
  process.stdout.write(JSON.stringify(toJson(result), null, 2) + '\n')
} else {
  printTable(parsed.doc.name, result)
}
if (!result.ok) {
  if (json)
    for (const i of result.issues)
      if (i.severity === 'error') process.stderr.write(`error: ${i.message}\n`)
  process.exit(1)
}

function toJson(r: DiagramResult) {
  return {
    pipes: Object.values(r.pipes).map((p) => ({
      id: p.id,
      system: p.system,
      load: p.load,
      flushValveClosets: p.flushValveClosets,
      flushValveUrinals: p.flushValveUrinals,
      flowLps: p.flowLps,
      nominal: p.nominal,
      insideDiameterMm: p.insideDiameterMm,
      velocityMps: p.velocityMps,
      lossKPa: p.lossKPa,
    })),
    nodes: Object.values(r.nodes).map((n) => ({ id: n.id, pressureKPa: n.pressureKPa })),
    issues: r.issues,
  }
}

function printTable(name: string, r: DiagramResult) {
  const num = (v: number | null, d: number) => (v === null ? '—' : v.toFixed(d))
  const rows = [
    [
      'pipe',
      'sys',
      'WSFU',
      'FV wc/ur',
      'curve',
      'L/s',
      'size',
      'ID mm',
      'm/s',
      'loss kPa',
      'out kPa',
    ],
    ...Object.values(r.pipes).map((p) => [
      p.id,
      p.system,
      num(p.load, 2),
      `${p.flushValveClosets}/${p.flushValveUrinals}`,
      p.curve,
      num(p.flowLps, 3),
      (p.nominal ?? '—') + (p.locked ? '*' : ''),
      num(p.insideDiameterMm, 2),
      num(p.velocityMps, 2),
      num(p.lossKPa, 2),
      num(p.outletPressureKPa, 1),
    ]),
  ]
  const widths = rows[0]!.map((_, c) => Math.max(...rows.map((row) => row[c]!.length)))
  const line = (row: string[]) =>
    row
      .map((cell, c) =>
        c < 2 || c === 4 || c === 6 ? cell.padEnd(widths[c]!) : cell.padStart(widths[c]!),
      )
      .join('  ')
  console.log(
    `${name || 'Diagram'} — ${Object.keys(r.pipes).length} pipes, ${Object.keys(r.nodes).length} nodes`,
  )
  console.log(line(rows[0]!))
  for (const row of rows.slice(1)) console.log(line(row))
  console.log('\nnode pressures (flowing / static, kPa)')
  for (const n of Object.values(r.nodes))
    console.log(
      `  ${n.id.padEnd(widths[0]!)}  ${num(n.pressureKPa, 1).padStart(7)}  ${num(n.staticPressureKPa, 1).padStart(7)}`,
    )
  console.log(r.issues.length === 0 ? '\nno issues' : '\nissues')
  for (const i of r.issues) console.log(`  ${i.severity}: [${i.code}] ${i.message}`)
  console.log('* locked size')
}
