/**
 * computeDiagram: the whole calculation in one call. The client runs it on every edit for
 * ordinary diagrams; the server runs it for reports. Expects a parsed document (parseDiagram in
 * validate.ts turns untrusted input into one).
 */
import type { Diagram } from '../document/model.ts'
import { Engine } from './engine.ts'
import { buildResult } from './result.ts'
import type { DiagramResult } from './types.ts'

/**
 * Computes loads, design flows, pipe sizes and pressures for every pipe and node.
 * @example
 * const result = computeDiagram(fernhollowHallDiagram)
 * result.pipes['c-service'].nominal // '2-1/2'
 */
export function computeDiagram(doc: Diagram): DiagramResult {
  return buildResult(new Engine(cloneForEngine(doc)))
}

/** Shallow copy of the node and pipe arrays: the engine replaces entries, never the caller's. */
export function cloneForEngine(doc: Diagram): Diagram {
  return { ...doc, nodes: doc.nodes.slice(), pipes: doc.pipes.slice() }
}
