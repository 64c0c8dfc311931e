/**
 * Rows of the pipe schedule: one per pipe of the document, SI numbers for sorting and export plus
 * display text in the chosen units. The editor's schedule, its CSV and the report's schedule all
 * read these rows. Pure, so thousands of pipes cost one pass over the document and one over the
 * issues.
 */
import { MATERIALS } from '../calc/materials.ts'
import type { CalcIssue, DemandCurve, DiagramResult, Severity } from '../calc/types.ts'
import type { Diagram, System } from '../document/model.ts'
import { formatLoad, formatQuantity, NO_VALUE } from '../units/format.ts'
import { formatNominal } from '../units/nominal.ts'
import type { Quantity } from '../units/quantities.ts'
import type { UnitSystem } from '../units/system.ts'

/** Keys of the schedule columns, in table order. */
export const SCHEDULE_COLUMN_KEYS = [
  'id',
  'from',
  'to',
  'system',
  'load',
  'closets',
  'urinals',
  'curve',
  'flow',
  'material',
  'nominal',
  'insideDiameter',
  'velocity',
  'length',
  'equivalentLength',
  'loss',
  'inletPressure',
  'outletPressure',
  'status',
] as const

export type ScheduleColumnKey = (typeof SCHEDULE_COLUMN_KEYS)[number]

/** A node at one end of a pipe. */
export interface NodeRef {
  id: string
  label: string
}

/** A problem that names the pipe. */
export interface ScheduleProblem {
  severity: Severity
  code: string
  message: string
}

/** Worst state of a pipe; 'not-computed' when the document's errors stopped the calculation. */
export type ScheduleStatus = 'ok' | 'warning' | 'not-computed' | 'error'

/** One pipe of the schedule. Numbers are SI (L/s, m, mm, m/s, kPa); null when not computed. */
export interface ScheduleRow {
  id: string
  from: NodeRef
  to: NodeRef
  system: System
  computed: boolean
  load: number | null
  closets: number | null
  urinals: number | null
  curve: DemandCurve | null
  flowLps: number | null
  material: string
  materialLabel: string
  nominal: string | null
  locked: boolean
  insideDiameterMm: number | null
  velocityMps: number | null
  lengthM: number
  equivalentLengthM: number | null
  lossKPa: number | null
  inletPressureKPa: number | null
  outletPressureKPa: number | null
  problems: ScheduleProblem[]
  status: ScheduleStatus
  /** Display text of every column in the units the rows were built for. */
  text: Record<ScheduleColumnKey, string>
}

const CURVE_TEXT: Record<DemandCurve, string> = {
  'flush-tank': 'flush tank',
  'flush-valve': 'flush valve',
}

/** Reads a node reference as "id (label)", or the id alone when the node has no label. */
export function nodeRefText(ref: NodeRef): string {
  return ref.label ? `${ref.id} (${ref.label})` : ref.id
}

/** Display text of the curve, e.g. 'flush valve'. */
export function curveText(curve: DemandCurve | null): string {
  return curve ? CURVE_TEXT[curve] : NO_VALUE
}

function statusOf(problems: ScheduleProblem[], computed: boolean): ScheduleStatus {
  if (problems.some((p) => p.severity === 'error')) return 'error'
  if (!computed) return 'not-computed'
  return problems.length > 0 ? 'warning' : 'ok'
}

function statusText(row: Pick<ScheduleRow, 'problems' | 'status'>): string {
  if (row.problems.length > 0) return [...new Set(row.problems.map((p) => p.code))].join(', ')
  return row.status === 'not-computed' ? 'not computed' : 'ok'
}

/** Issues by the pipe ids they name (an issue naming two pipes is listed under both). */
function problemsByPipe(issues: CalcIssue[], pipeIds: Set<string>): Map<string, ScheduleProblem[]> {
  const byPipe = new Map<string, ScheduleProblem[]>()
  for (const issue of issues) {
    for (const id of new Set(issue.ids)) {
      if (!pipeIds.has(id)) continue
      const list = byPipe.get(id) ?? []
      list.push({ severity: issue.severity, code: issue.code, message: issue.message })
      byPipe.set(id, list)
    }
  }
  return byPipe
}

/** Builds the schedule rows of `doc` from `result` (computeDiagram of the same document). */
export function buildScheduleRows(
  doc: Diagram,
  result: DiagramResult,
  units: UnitSystem,
): ScheduleRow[] {
  const labels = new Map(doc.nodes.map((n) => [n.id, n.label]))
  const problems = problemsByPipe(result.issues, new Set(doc.pipes.map((p) => p.id)))
  const num = (q: Quantity, v: number | null) => formatQuantity(q, v, units, { unit: false })
  const count = (v: number | null) => (v === null ? NO_VALUE : String(v))
  return doc.pipes.map((pipe) => {
    const r = result.pipes[pipe.id]
    const material = r?.material ?? pipe.material ?? doc.settings.material
    const own = problems.get(pipe.id) ?? []
    const row: Omit<ScheduleRow, 'text'> = {
      id: pipe.id,
      from: { id: pipe.from, label: labels.get(pipe.from) ?? '' },
      to: { id: pipe.to, label: labels.get(pipe.to) ?? '' },
      system: pipe.system,
      computed: r !== undefined,
      load: r?.load ?? null,
      closets: r?.flushValveClosets ?? null,
      urinals: r?.flushValveUrinals ?? null,
      curve: r?.curve ?? null,
      flowLps: r?.flowLps ?? null,
      material,
      materialLabel: MATERIALS[material]?.label ?? material,
      nominal: r ? r.nominal : (pipe.nominal ?? null),
      locked: pipe.nominal !== undefined,
      insideDiameterMm: r?.insideDiameterMm ?? null,
      velocityMps: r?.velocityMps ?? null,
      lengthM: pipe.lengthM,
      equivalentLengthM: r?.equivalentLengthM ?? null,
      lossKPa: r?.lossKPa ?? null,
      inletPressureKPa: r?.inletPressureKPa ?? null,
      outletPressureKPa: r?.outletPressureKPa ?? null,
      problems: own,
      status: statusOf(own, r !== undefined),
    }
    const text: Record<ScheduleColumnKey, string> = {
      id: row.id,
      from: nodeRefText(row.from),
      to: nodeRefText(row.to),
      system: row.system,
      load: formatLoad(row.load).replace(/ FU$/, ''),
      closets: count(row.closets),
      urinals: count(row.urinals),
      curve: curveText(row.curve),
      flow: num('flow', row.flowLps),
      material: row.materialLabel,
      nominal: formatNominal(row.nominal, units),
      insideDiameter: num('diameter', row.insideDiameterMm),
      velocity: num('velocity', row.velocityMps),
      length: num('length', row.lengthM),
      equivalentLength: num('length', row.equivalentLengthM),
      loss: num('pressure', row.lossKPa),
      inletPressure: num('pressure', row.inletPressureKPa),
      outletPressure: num('pressure', row.outletPressureKPa),
      status: statusText(row),
    }
    return { ...row, text }
  })
}
