/**
 * Compiles a structurally valid diagram into index arrays. Pipes form a forest: a pipe's parent is
 * the inlet of the node it leaves (for a water heater's hot outlets, the heater's cold inlet), so a
 * fixture's hot supply climbs through its heater onto the cold side. Children are ordered by pipe
 * id, which makes every traversal independent of the order of pipes and nodes in the document.
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

/** Index form of a diagram's graph. */
export interface CompiledGraph {
  nodeCount: number
  pipeCount: number
  nodeIndex: Map<string, number>
  pipeIndex: Map<string, number>
  nodeKind: Uint8Array
  /** Index of the supply node, or -1. */
  supply: number
  inCold: Int32Array
  inHot: Int32Array
  from: Int32Array
  to: Int32Array
  hot: Uint8Array
  /** Parent pipe in the pipe forest, or -1. */
  parent: Int32Array
  childStart: Int32Array
  children: Int32Array
  /** Pipes in pre-order; `pos[q]` is q's place, `end[q]` one past its subtree. */
  order: Int32Array
  pos: Int32Array
  end: Int32Array
  /** 1 when the pipe's forest root leaves the supply. */
  rooted: Uint8Array
  /** Pressure-reducing valves with a rooted inlet, in pre-order of that inlet. */
  prvs: Int32Array
  /** Pipe into which a fixture's cold and hot paths merge (lowest common ancestor), or -1. */
  lca: Int32Array
}

const byId = (ids: string[]) => (a: number, b: number) =>
  ids[a]! < ids[b]! ? -1 : ids[a]! > ids[b]! ? 1 : 0

/** Builds the index arrays; the document must have passed validateDiagram without structural errors. */
export function compileGraph(
  doc: Diagram,
  nodeIndex: Map<string, number>,
  pipeIndex: Map<string, number>,
): CompiledGraph {
  const nodeCount = doc.nodes.length
  const pipeCount = doc.pipes.length
  const nodeKind = new Uint8Array(nodeCount)
  let supply = -1
  doc.nodes.forEach((n, i) => {
    nodeKind[i] = KIND[n.kind]
    if (n.kind === 'supply') supply = i
  })
  const inCold = new Int32Array(nodeCount).fill(-1)
  const inHot = new Int32Array(nodeCount).fill(-1)
  const from = new Int32Array(pipeCount)
  const to = new Int32Array(pipeCount)
  const hot = new Uint8Array(pipeCount)
  const pipeIds = doc.pipes.map((p) => p.id)
  doc.pipes.forEach((p, q) => {
    from[q] = nodeIndex.get(p.from)!
    to[q] = nodeIndex.get(p.to)!
    hot[q] = p.system === 'hot' ? 1 : 0
    if (hot[q]) inHot[to[q]!] = q
    else inCold[to[q]!] = q
  })
  const parent = new Int32Array(pipeCount)
  for (let q = 0; q < pipeCount; q++) {
    const v = from[q]!
    parent[q] = nodeKind[v] === KIND['water-heater'] || !hot[q] ? inCold[v]! : inHot[v]!
  }

  // Children lists (CSR), each sorted by pipe id.
  const childStart = new Int32Array(pipeCount + 2)
  for (let q = 0; q < pipeCount; q++) childStart[parent[q]! + 2]!++
  for (let i = 2; i < childStart.length; i++) childStart[i]! += childStart[i - 1]!
  const fill = childStart.slice(0, pipeCount + 1)
  const flat = new Int32Array(pipeCount)
  for (let q = 0; q < pipeCount; q++) flat[fill[parent[q]! + 1]!++] = q
  const cmp = byId(pipeIds)
  for (let g = 0; g <= pipeCount; g++) {
    flat.subarray(childStart[g]!, childStart[g + 1]!).sort(cmp)
  }
  // Group 0 holds the roots; groups 1..n the children of pipe g-1.
  const rootsEnd = childStart[1]!
  const children = flat
  const kids = childStart.subarray(1)

  const order = new Int32Array(pipeCount)
  const pos = new Int32Array(pipeCount)
  const end = new Int32Array(pipeCount)
  const rooted = new Uint8Array(pipeCount)
  const stack: number[] = []
  let k = 0
  for (let r = rootsEnd - 1; r >= 0; r--) stack.push(children[r]!)
  while (stack.length > 0) {
    const q = stack.pop()!
    if (q < 0) {
      end[~q] = k
      continue
    }
    pos[q] = k
    order[k++] = q
    const p = parent[q]!
    rooted[q] = p < 0 ? (from[q] === supply ? 1 : 0) : rooted[p]!
    stack.push(~q)
    for (let c = kids[q + 1]! - 1; c >= kids[q]!; c--) stack.push(children[c]!)
  }

  const prvList: number[] = []
  const lca = new Int32Array(nodeCount).fill(-1)
  for (let v = 0; v < nodeCount; v++) {
    if (nodeKind[v] === KIND['pressure-reducing-valve'] && inCold[v]! + inHot[v]! > -2) {
      const q = Math.max(inCold[v]!, inHot[v]!)
      if (rooted[q]) prvList.push(v)
    }
    const qc = inCold[v]!
    const qh = inHot[v]!
    if (nodeKind[v] === KIND.fixture && qc >= 0 && qh >= 0) {
      let x = qc
      while (x >= 0 && !(pos[x]! <= pos[qh]! && pos[qh]! < end[x]!)) x = parent[x]!
      lca[v] = x
    }
  }
  const inletOf = (v: number) => Math.max(inCold[v]!, inHot[v]!)
  prvList.sort((a, b) => pos[inletOf(a)]! - pos[inletOf(b)]!)

  return {
    nodeCount,
    pipeCount,
    nodeIndex,
    pipeIndex,
    nodeKind,
    supply,
    inCold,
    inHot,
    from,
    to,
    hot,
    parent,
    childStart: kids,
    children,
    order,
    pos,
    end,
    rooted,
    prvs: Int32Array.from(prvList),
    lca,
  }
}
