/**
 * The data the editor hands to Vue Flow: what each node and pipe carries, the typed node and
 * edge aliases, and the registered node and edge components. Handle ids and sides live in
 * nodes/handles.ts and are re-exported here for the mapping code.
 */
import { markRaw } from 'vue'
import type { Edge, EdgeTypesObject, Node, NodeTypesObject } from '@vue-flow/core'
import type { CalcIssue, NodeResult, PipeResult } from '@shared/calc/types.ts'
import type { NodeKind, NodeOfKind, Pipe } from '@shared/document/model.ts'
import type { UnitSystem } from '@shared/units/system.ts'
import PipeEdge from './edges/PipeEdge.vue'
import DeviceNode from './nodes/DeviceNode.vue'
import FixtureNode from './nodes/FixtureNode.vue'
import JunctionNode from './nodes/JunctionNode.vue'
import type { RemoteSelection } from './nodes/selection-ring.ts'

export { HANDLE, HANDLE_SIDES, sourceHandleFor, targetHandleFor } from './nodes/handles.ts'
export type { HandleId } from './nodes/handles.ts'
export type { RemoteSelection } from './nodes/selection-ring.ts'

/** What a diagram node carries on the canvas; `K` narrows `node` for one kind's component. */
export interface DiagramNodeData<K extends NodeKind = NodeKind> {
  node: NodeOfKind<K>
  /** Live result; absent until the calculation has reached the node. */
  result?: NodeResult
  /** Issues naming this node. */
  problems: CalcIssue[]
  units: UnitSystem
  /** Other people who have this node selected. */
  selectedBy?: RemoteSelection[]
}

/** What a pipe carries on the canvas. */
export interface PipeEdgeData {
  pipe: Pipe
  result?: PipeResult
  problems: CalcIssue[]
  units: UnitSystem
  /** Other people who have this pipe selected. */
  selectedBy?: RemoteSelection[]
}

/** Vue Flow type of every pipe edge. */
export const PIPE_EDGE_TYPE = 'pipe'

/** Nodes and pipes talk to the editor through Vue Flow's own events only, not custom ones. */
type NoCustomEvents = Record<string, never>

/**
 * A canvas node; its `type` is the diagram node kind, so an unknown kind fails to compile.
 * `selected` is not in Vue Flow's input node type, but Vue Flow copies it onto the graph node.
 */
export type DiagramFlowNode = Node<DiagramNodeData, NoCustomEvents, NodeKind> & {
  selected?: boolean
}

/**
 * A canvas edge for one pipe. `selected` is not in Vue Flow's input edge type, but Vue Flow copies
 * it onto the graph edge, so a store-driven selection can be passed in.
 */
export type PipeFlowEdge = Edge<PipeEdgeData, NoCustomEvents, typeof PIPE_EDGE_TYPE> & {
  selected?: boolean
}

/**
 * Whether two pieces of plain data (results, issues, document objects) hold the same values.
 * Identical objects answer at once, so unchanged document nodes cost nothing.
 */
export function samePlain(a: unknown, b: unknown): boolean {
  if (a === b) return true
  if (typeof a !== 'object' || typeof b !== 'object' || a === null || b === null) return false
  if (Array.isArray(a) !== Array.isArray(b)) return false
  // for…in rather than Object.keys: this runs for every node and pipe on every calculation.
  const left = a as Record<string, unknown>
  const right = b as Record<string, unknown>
  let keys = 0
  for (const key in left) {
    if (!samePlain(left[key], right[key])) return false
    keys++
  }
  for (const _key in right) keys--
  return keys === 0
}

/** Node components by kind, for `<VueFlow :node-types>`. */
export const nodeTypes = markRaw({
  supply: DeviceNode,
  meter: DeviceNode,
  'backflow-preventer': DeviceNode,
  'pressure-reducing-valve': DeviceNode,
  'water-heater': DeviceNode,
  junction: JunctionNode,
  fixture: FixtureNode,
  equipment: DeviceNode,
} satisfies Record<NodeKind, unknown>) as NodeTypesObject

/** Edge components by type, for `<VueFlow :edge-types>`. */
export const edgeTypes = markRaw({ [PIPE_EDGE_TYPE]: PipeEdge }) as EdgeTypesObject
