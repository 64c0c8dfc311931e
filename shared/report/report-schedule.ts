/**
 * The pipe schedule of the report: one row per pipe in document order, in the project's units,
 * formatted with the same shared formatters as the editor's schedule (a unit test holds the two
 * to the same text).
 */
import { MATERIALS } from '../calc/materials.ts'
import type { CalcIssue, DiagramResult } from '../calc/types.ts'
import type { Diagram } from '../document/model.ts'
import { formatLoad, formatQuantity, NO_VALUE } from '../units/format.ts'
import { formatNominal } from '../units/nominal.ts'
import { unitSymbol, type Quantity } from '../units/quantities.ts'
import type { UnitSystem } from '../units/system.ts'
import type { ReportTable } from './report-table.ts'

const CURVE = { 'flush-tank': 'flush tank', 'flush-valve': 'flush valve' } as const

/** Issues by the ids they name (an issue naming two elements is listed under both). */
export function issuesById(issues: readonly CalcIssue[]): Map<string, CalcIssue[]> {
  const byId = new Map<string, CalcIssue[]>()
  for (const issue of issues) {
    for (const id of new Set(issue.ids)) byId.set(id, [...(byId.get(id) ?? []), issue])
  }
  return byId
}

/** Worst severity of a list of issues, for marking a row. */
export const markOf = (issues: readonly CalcIssue[] = []) =>
  issues.some((i) => i.severity === 'error') ? 'error' : issues.length ? 'warning' : null

const ref = (id: string, label: string | undefined) => (label ? `${id} (${label})` : id)

/** The schedule table of `doc` with `result` (computeDiagram of the same document). */
export function reportSchedule(
  doc: Diagram,
  result: DiagramResult,
  units: UnitSystem,
): ReportTable {
  const u = (q: Quantity) => unitSymbol(q, units)
  const num = (q: Quantity, v: number | null | undefined) =>
    formatQuantity(q, v ?? null, units, { unit: false })
  const labels = new Map(doc.nodes.map((n) => [n.id, n.label]))
  const byId = issuesById(result.issues)
  const table: ReportTable = {
    columns: [
      { title: 'Pipe', weight: 7 },
      { title: 'From', weight: 8 },
      { title: 'To', weight: 8 },
      { title: 'System', weight: 4 },
      { title: 'Load\n(FU)', numeric: true, weight: 4 },
      { title: 'Curve', weight: 5 },
      { title: `Flow\n(${u('flow')})`, numeric: true, weight: 4 },
      { title: 'Material', weight: 8 },
      { title: 'Size', weight: 4 },
      { title: `ID\n(${u('diameter')})`, numeric: true, weight: 4 },
      { title: `Velocity\n(${u('velocity')})`, numeric: true, weight: 5 },
      { title: `Length\n(${u('length')})`, numeric: true, weight: 4.5 },
      { title: `Eq. length\n(${u('length')})`, numeric: true, weight: 5 },
      { title: `Loss\n(${u('pressure')})`, numeric: true, weight: 4.5 },
      { title: `Inlet\n(${u('pressure')})`, numeric: true, weight: 4.5 },
      { title: `Outlet\n(${u('pressure')})`, numeric: true, weight: 4.5 },
      { title: 'Status', weight: 7 },
    ],
    rows: [],
    marks: [],
  }
  for (const pipe of doc.pipes) {
    const r = result.pipes[pipe.id]
    const material = r?.material ?? pipe.material ?? doc.settings.material
    const issues = byId.get(pipe.id) ?? []
    const status = issues.length
      ? [...new Set(issues.map((i) => i.code))].join(', ')
      : r
        ? 'ok'
        : 'not computed'
    table.rows.push([
      pipe.id,
      ref(pipe.from, labels.get(pipe.from)),
      ref(pipe.to, labels.get(pipe.to)),
      pipe.system,
      formatLoad(r?.load).replace(/ FU$/, ''),
      r ? CURVE[r.curve] : NO_VALUE,
      num('flow', r?.flowLps),
      MATERIALS[material]?.label ?? material,
      formatNominal(r ? r.nominal : pipe.nominal, units) + (pipe.nominal ? ' (locked)' : ''),
      num('diameter', r?.insideDiameterMm),
      num('velocity', r?.velocityMps),
      num('length', pipe.lengthM),
      num('length', r?.equivalentLengthM),
      num('pressure', r?.lossKPa),
      num('pressure', r?.inletPressureKPa),
      num('pressure', r?.outletPressureKPa),
      status,
    ])
    table.marks.push(markOf(issues))
  }
  return table
}
