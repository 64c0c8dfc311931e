/** Node pressures of the report: every node with its level, elevation and pressures. */
import { FIXTURES } from '../calc/fixtures.ts'
import type { DiagramResult } from '../calc/types.ts'
import type { Diagram, DiagramNode } from '../document/model.ts'
import { formatQuantity, NO_VALUE } from '../units/format.ts'
import { unitSymbol } from '../units/quantities.ts'
import type { UnitSystem } from '../units/system.ts'
import { issuesById, markOf } from './report-schedule.ts'
import type { ReportTable } from './report-table.ts'

const KIND_TEXT: Record<DiagramNode['kind'], string> = {
  supply: 'Supply',
  meter: 'Meter',
  'backflow-preventer': 'Backflow preventer',
  'pressure-reducing-valve': 'Pressure reducing valve',
  'water-heater': 'Water heater',
  junction: 'Junction',
  fixture: 'Fixture',
  equipment: 'Equipment',
}

/** "Fixture: Lavatory × 3" for fixtures, the kind for the rest. */
export function nodeKindText(node: DiagramNode): string {
  if (node.kind !== 'fixture') return KIND_TEXT[node.kind]
  const name = FIXTURES[node.fixture]?.label ?? node.fixture
  return node.count > 1 ? `${name} × ${node.count}` : name
}

/** The node pressure table of `doc` with `result`. */
export function reportNodes(doc: Diagram, result: DiagramResult, units: UnitSystem): ReportTable {
  const p = unitSymbol('pressure', units)
  const levels = new Map(doc.levels.map((l) => [l.id, l.name]))
  const byId = issuesById(result.issues)
  const table: ReportTable = {
    columns: [
      { title: 'Node', weight: 6 },
      { title: 'Kind', weight: 14 },
      { title: 'Label', weight: 14 },
      { title: 'Level', weight: 7 },
      { title: `Elevation\n(${unitSymbol('elevation', units)})`, numeric: true, weight: 7 },
      { title: `Residual pressure\n(${p})`, numeric: true, weight: 8 },
      { title: `Static pressure\n(${p})`, numeric: true, weight: 8 },
      { title: 'Status', weight: 12 },
    ],
    rows: [],
    marks: [],
  }
  for (const node of doc.nodes) {
    const r = result.nodes[node.id]
    const issues = byId.get(node.id) ?? []
    const status = issues.length
      ? [...new Set(issues.map((i) => i.code))].join(', ')
      : r && r.pressureKPa !== null
        ? 'ok'
        : 'not computed'
    table.rows.push([
      node.id,
      nodeKindText(node),
      node.label,
      (node.levelId && levels.get(node.levelId)) || NO_VALUE,
      formatQuantity('elevation', node.elevationM, units, { unit: false }),
      formatQuantity('pressure', r?.pressureKPa ?? null, units, { unit: false }),
      formatQuantity('pressure', r?.staticPressureKPa ?? null, units, { unit: false }),
      status,
    ])
    table.marks.push(markOf(issues))
  }
  return table
}
