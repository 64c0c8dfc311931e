/**
 * The pipe schedule of the report: the editor's schedule rows (shared/schedule), one per pipe in
 * document order, in the project's units.
 */
import type { CalcIssue, DiagramResult } from '../calc/types.ts'
import type { Diagram } from '../document/model.ts'
import { buildScheduleRows } from '../schedule/schedule-rows.ts'
import { unitSymbol, type Quantity } from '../units/quantities.ts'
import type { UnitSystem } from '../units/system.ts'
import type { ReportTable } from './report-table.ts'

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

/** The schedule table of `doc` with `result` (computeDiagram of the same document). */
export function reportSchedule(
  doc: Diagram,
  result: DiagramResult,
  units: UnitSystem,
): ReportTable {
  const u = (q: Quantity) => unitSymbol(q, units)
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
  const byId = issuesById(result.issues)
  for (const row of buildScheduleRows(doc, result, units)) {
    const t = row.text
    table.rows.push([
      t.id,
      t.from,
      t.to,
      t.system,
      t.load,
      t.curve,
      t.flow,
      t.material,
      t.nominal + (row.locked ? ' (locked)' : ''),
      t.insideDiameter,
      t.velocity,
      t.length,
      t.equivalentLength,
      t.loss,
      t.inletPressure,
      t.outletPressure,
      t.status,
    ])
    table.marks.push(markOf(byId.get(row.id)))
  }
  return table
}
