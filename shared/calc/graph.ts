/**
 * Compiles a structurally valid diagram into index arrays. Pipes form a forest: a pipe's parent is
 * the inlet of the node it leaves (for a water heater's hot outlets, the heater's cold inlet), so a
 * fixture's hot supply climbs through its heater onto the cold side. Children are ordered by pipe
 * id, which makes every traversal independent of the order of pipes and nodes in the document.
 *
 * Pipes are renumbered into that pre-order: internal pipe index q is its place in the walk, so a
 * parent always comes before its children, a subtree is the range [q, end[q]) and the whole
 * calculation reads its arrays front to back (or back to front) instead of jumping around.
 */
import type { Diagram, NodeKind } from '../document/model.ts'

/** Node kind codes used in the typed arrays. */
export const KIND: Record<NodeKind, number> = {
  supply: 0,
  junction: 1,
  meter: 2,
  'backflow-preventer': 3,
  'pressure-reducing-valve': 4,
  'water-heater': 5,
  fixture: 6,
  equipment: 7,
}

/** Index form of a diagram's graph. Pipe indices are pre-order places (see the file comment). */
export interface CompiledGraph {
  nodeCount: number
  pipeCount: number
  nodeIndex: Map<string, number>
  /** Pipe id → internal (pre-order) index. */
  pipeIndex: Map<string, number>
  /** Internal pipe index → index in `doc.pipes`. */
  pipeDoc: Int32Array
  /** Index in `doc.pipes` → internal pipe index. */
  docPipe: Int32Array
  nodeKind: Uint8Array
  /** Index of the supply node, or -1. */
  supply: number
  inCold: Int32Array
  inHot: Int32Array
  from: Int32Array
  to: Int32Array
  hot: Uint8Array
  /** Parent pipe in the pipe forest (always a smaller index), or -1. */
  parent: Int32Array
  /** One past the last pipe of q's subtree: the subtree is [q, end[q]). */
  end: Int32Array
  /** 1 when the pipe's forest root leaves the supply. */
  rooted: Uint8Array
  /** Pressure-reducing valves with a rooted inlet, in pre-order of that inlet. */
  prvs: Int32Array
  /** Pipe into which a fixture's cold and hot paths merge (lowest common ancestor), or -1. */
  lca: Int32Array
  /** Pipes leaving node v: outPipes[outStart[v] … outStart[v + 1]). */
  outStart: Int32Array
  outPipes: Int32Array
}

const byId = (ids: string[]) => (a: number, b: number) =>
  ids[a]! < ids[b]! ? -1 : ids[a]! > ids[b]! ? 1 : 0

/** Builds the index arrays; the document must have passed validateDiagram without structural errors. */
export function compileGraph(doc: Diagram, nodeIndex: Map<string, number>): CompiledGraph {
  const nodeCount = doc.nodes.length
  const pipeCount = doc.pipes.length
  const nodeKind = new Uint8Array(nodeCount)
  let supply = -1
  for (let i = 0; i < nodeCount; i++) {
    const n = doc.nodes[i]!
    nodeKind[i] = KIND[n.kind]
    if (n.kind === 'supply') supply = i
  }
  // First in document indices.
  const dFrom = new Int32Array(pipeCount)
  const dHot = new Uint8Array(pipeCount)
  const dInCold = new Int32Array(nodeCount).fill(-1)
  const dInHot = new Int32Array(nodeCount).fill(-1)
  const pipeIds: string[] = new Array<string>(pipeCount)
  for (let q = 0; q < pipeCount; q++) {
    const p = doc.pipes[q]!
    pipeIds[q] = p.id
    dFrom[q] = nodeIndex.get(p.from)!
    dHot[q] = p.system === 'hot' ? 1 : 0
    const to = nodeIndex.get(p.to)!
    if (dHot[q]) dInHot[to] = q
    else dInCold[to] = q
  }
  const dParent = new Int32Array(pipeCount)
  for (let q = 0; q < pipeCount; q++) {
    const v = dFrom[q]!
    dParent[q] = nodeKind[v] === KIND['water-heater'] || !dHot[q] ? dInCold[v]! : dInHot[v]!
  }
  const pipeDoc = preOrder(dParent, pipeIds)

  // Then everything per pipe in pre-order.
  const docPipe = new Int32Array(pipeCount)
  for (let q = 0; q < pipeCount; q++) docPipe[pipeDoc[q]!] = q
  const pipeIndex = new Map<string, number>()
  const from = new Int32Array(pipeCount)
  const to = new Int32Array(pipeCount)
  const hot = new Uint8Array(pipeCount)
  const parent = new Int32Array(pipeCount)
  const rooted = new Uint8Array(pipeCount)
  for (let q = 0; q < pipeCount; q++) {
    const d = pipeDoc[q]!
    pipeIndex.set(pipeIds[d]!, q)
    from[q] = dFrom[d]!
    to[q] = nodeIndex.get(doc.pipes[d]!.to)!
    hot[q] = dHot[d]!
    const p = dParent[d]! < 0 ? -1 : docPipe[dParent[d]!]!
    parent[q] = p
    rooted[q] = p < 0 ? (from[q] === supply ? 1 : 0) : rooted[p]!
  }
  const end = new Int32Array(pipeCount)
  for (let q = 0; q < pipeCount; q++) end[q] = q + 1
  for (let q = pipeCount - 1; q >= 0; q--) {
    const p = parent[q]!
    if (p >= 0 && end[q]! > end[p]!) end[p] = end[q]!
  }
  const inCold = dInCold.map((q) => (q < 0 ? -1 : docPipe[q]!))
  const inHot = dInHot.map((q) => (q < 0 ? -1 : docPipe[q]!))

  const prvList: number[] = []
  const lca = new Int32Array(nodeCount).fill(-1)
  for (let v = 0; v < nodeCount; v++) {
    const qc = inCold[v]!
    const qh = inHot[v]!
    if (nodeKind[v] === KIND['pressure-reducing-valve'] && qc + qh > -2) {
      if (rooted[Math.max(qc, qh)]) prvList.push(v)
    }
    if (nodeKind[v] === KIND.fixture && qc >= 0 && qh >= 0) {
      let x = qc
      while (x >= 0 && !(x <= qh && qh < end[x]!)) x = parent[x]!
      lca[v] = x
    }
  }
  prvList.sort((a, b) => Math.max(inCold[a]!, inHot[a]!) - Math.max(inCold[b]!, inHot[b]!))
  const outStart = new Int32Array(nodeCount + 1)
  for (let q = 0; q < pipeCount; q++) outStart[from[q]! + 1]!++
  for (let v = 0; v < nodeCount; v++) outStart[v + 1]! += outStart[v]!
  const outFill = outStart.slice(0, nodeCount)
  const outPipes = new Int32Array(pipeCount)
  for (let q = 0; q < pipeCount; q++) outPipes[outFill[from[q]!]!++] = q

  return {
    nodeCount,
    pipeCount,
    nodeIndex,
    pipeIndex,
    pipeDoc,
    docPipe,
    nodeKind,
    supply,
    inCold,
    inHot,
    from,
    to,
    hot,
    parent,
    end,
    rooted,
    prvs: Int32Array.from(prvList),
    lca,
    outStart,
    outPipes,
  }
}

/** Document pipe indices in pre-order of the forest, children by pipe id. */
function preOrder(parent: Int32Array, pipeIds: string[]): Int32Array {
  const n = parent.length
  // Children lists (CSR): group 0 holds the roots, group g + 1 the children of pipe g.
  const start = new Int32Array(n + 2)
  for (let q = 0; q < n; q++) start[parent[q]! + 2]!++
  for (let i = 2; i < start.length; i++) start[i]! += start[i - 1]!
  const fill = start.slice(0, n + 1)
  const flat = new Int32Array(n)
  for (let q = 0; q < n; q++) flat[fill[parent[q]! + 1]!++] = q
  const cmp = byId(pipeIds)
  for (let g = 0; g <= n; g++) {
    if (start[g + 1]! - start[g]! > 1) flat.subarray(start[g]!, start[g + 1]!).sort(cmp)
  }
  const order = new Int32Array(n)
  const stack: number[] = []
  let k = 0
  for (let r = start[1]! - 1; r >= 0; r--) stack.push(flat[r]!)
  while (stack.length > 0) {
    const q = stack.pop()!
    order[k++] = q
    for (let c = start[q + 2]! - 1; c >= start[q + 1]!; c--) stack.push(flat[c]!)
  }
  return order
}
