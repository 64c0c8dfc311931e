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

/**
 * Why a pipe has its size: locked by the designer; the smallest within the velocity limit; raised
 * to the minimum supply size of the fixture it feeds; enlarged by the pressure budget; or none fits.
 */
export type SizeBasis = 'locked' | 'velocity' | 'fixture-minimum' | 'pressure-budget' | 'none'

/** The minimum supply size that applies to a pipe feeding a fixture. */
export interface FixtureMinimum {
  /** The fixture node fed. */
  nodeId: string
  /** Its catalogue key and label. */
  fixture: string
  label: string
  /** Minimum nominal size of the supply ("1/2") and where it comes from. */
  nominal: string
  source: string
}

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
  /**
   * Why it has that size. Always set by the engine; optional only so that hand-made results
   * (editor previews, test builders) written before it existed stay valid.
   */
  sizeBasis?: SizeBasis
  /** The minimum supply size of the fixture the pipe feeds (null: none); set as sizeBasis is. */
  fixtureMinimum?: FixtureMinimum | null
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
