/**
 * Result types of the calculation engine. The editor, the server reports and the CLI read these;
 * shared/calc/compute.ts produces them. All values SI.
 */
import type { System } from '../document/model.ts'

export type Severity = 'error' | 'warning'

/** A problem found in a document; `ids` name the nodes and pipes involved. */
export interface CalcIssue {
  severity: Severity
  code: string
  message: string
  ids: string[]
}

/** Which Hunter curve turned a load into a flow. */
export type DemandCurve = 'flush-tank' | 'flush-valve'

export interface PipeResult {
  id: string
  system: System
  /** Hydraulic load on the pipe, WSFU (after the flush valve series where that basis applies). */
  load: number
  /** Flush valve water closets and urinals served (counted for the series and the curve). */
  flushValveClosets: number
  flushValveUrinals: number
  curve: DemandCurve
  /** Key of the demand table used (shared/calc/demand-tables.ts). */
  demandTable: string
  /** Probable flow from the load (Hunter), L/s. */
  fixtureFlowLps: number
  /** Continuous equipment demand added, L/s. */
  equipmentFlowLps: number
  /** Design flow = fixtureFlowLps + equipmentFlowLps, L/s. */
  flowLps: number
  material: string
  /** Chosen (or locked) nominal size; null when no size of the material fits. */
  nominal: string | null
  locked: boolean
  insideDiameterMm: number | null
  velocityMps: number | null
  /** Length plus fitting allowance, m. */
  equivalentLengthM: number
  /** Friction loss over the equivalent length, kPa. */
  lossKPa: number | null
  /** Residual pressure at the pipe's inlet and outlet ends, kPa (null when unreachable). */
  inletPressureKPa: number | null
  outletPressureKPa: number | null
}

export interface NodeResult {
  id: string
  /** Residual (flowing) pressure at the node, kPa; null when no supply reaches it. */
  pressureKPa: number | null
  /** Static pressure (no flow) at the node, kPa. */
  staticPressureKPa: number | null
}

export interface DiagramResult {
  /** False when the document has errors; pipes/nodes then hold what could be computed. */
  ok: boolean
  pipes: Record<string, PipeResult>
  nodes: Record<string, NodeResult>
  issues: CalcIssue[]
}
