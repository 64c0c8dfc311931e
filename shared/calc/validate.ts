/**
 * Checks a diagram before it is computed: the zod schema for untrusted input, then the graph
 * rules, each message naming the ids involved. Errors split in two: structural ones (the graph
 * cannot be walked: cycles, extra inlets, missing nodes...) stop the calculation; local ones
 * (an unknown key, a bad length) only blank out the element they name.
 */
import { diagramSchema, type Diagram, type DiagramNode, type Pipe } from '../document/model.ts'
import { FIXTURES } from './fixtures.ts'
import { MATERIALS, sizeIndex } from './materials.ts'
import type { CalcIssue } from './types.ts'

/** The result of validating a document's graph. */
export interface Validation {
  issues: CalcIssue[]
  /** False when the graph cannot be walked; nothing is computed then. */
  structuralOk: boolean
  nodeIndex: Map<string, number>
  pipeIndex: Map<string, number>
}

/** Outcome of parsing untrusted input. */
export type ParseOutcome = { ok: true; doc: Diagram } | { ok: false; issues: CalcIssue[] }

/**
 * Parses unknown input (a file, a request body) into a Diagram, or returns schema errors whose
 * message names the field path and whose ids name the node or pipe it sits in.
 */
export function parseDiagram(input: unknown): ParseOutcome {
  const parsed = diagramSchema.safeParse(input)
  if (parsed.success) return { ok: true, doc: parsed.data }
  const raw = input as { nodes?: unknown[]; pipes?: unknown[] } | null
  const issues = parsed.error.issues.map((issue): CalcIssue => {
    const path = issue.path.map(String)
    const ids: string[] = []
    if ((path[0] === 'nodes' || path[0] === 'pipes') && path[1] !== undefined) {
      const item = (raw?.[path[0]] as { id?: unknown }[] | undefined)?.[Number(path[1])]
      if (typeof item?.id === 'string') ids.push(item.id)
    }
    const where = path.length > 0 ? path.join('.') : 'document'
    return { severity: 'error', code: 'schema', message: `${where}: ${issue.message}`, ids }
  })
  return { ok: false, issues }
}

const STRUCTURAL = new Set([
  'duplicate-id',
  'two-supplies',
  'no-supply',
  'missing-node',
  'cycle',
  'two-inlets',
  'outlet-from-terminal',
  'supply-inlet',
  'heater-hot-inlet',
  'heater-cold-outlet',
  'mixed-systems',
  'hot-not-from-heater',
])

/** Material key a pipe uses (its own or the project default). */
export function pipeMaterialKey(doc: Diagram, pipe: Pipe): string {
  return pipe.material ?? doc.settings.material
}

/** Checks the graph rules of a parsed diagram. */
export function validateDiagram(doc: Diagram): Validation {
  const issues: CalcIssue[] = []
  const err = (code: string, message: string, ids: string[]) =>
    issues.push({ severity: 'error', code, message, ids })
  const nodeIndex = new Map<string, number>()
  const pipeIndex = new Map<string, number>()
  doc.nodes.forEach((n, i) => {
    if (nodeIndex.has(n.id)) err('duplicate-id', `Two nodes share the id "${n.id}".`, [n.id])
    else nodeIndex.set(n.id, i)
  })
  doc.pipes.forEach((p, i) => {
    if (pipeIndex.has(p.id)) err('duplicate-id', `Two pipes share the id "${p.id}".`, [p.id])
    else pipeIndex.set(p.id, i)
  })

  const supplies = doc.nodes.filter((n) => n.kind === 'supply').map((n) => n.id)
  if (supplies.length > 1) {
    err('two-supplies', `A diagram has one supply; found ${supplies.join(', ')}.`, supplies)
  } else if (supplies.length === 0 && doc.nodes.length > 0) {
    err('no-supply', 'The diagram has no supply node.', [])
  }

  if (!MATERIALS[doc.settings.material]) {
    err(
      'unknown-material',
      `settings.material "${doc.settings.material}" is not a known material.`,
      [],
    )
  }

  // Pipe counts per node and system: in[2v + s], out[2v + s]; lists are only built for errors.
  const n = doc.nodes.length
  const ins = new Int32Array(2 * n)
  const outs = new Int32Array(2 * n)
  const fromIdx = new Int32Array(doc.pipes.length).fill(-1)
  const toIdx = new Int32Array(doc.pipes.length).fill(-1)
  doc.pipes.forEach((p, q) => {
    checkPipe(doc, p, err)
    const f = nodeIndex.get(p.from)
    const t = nodeIndex.get(p.to)
    if (f === undefined || t === undefined) {
      const missing = [f === undefined ? p.from : null, t === undefined ? p.to : null].filter(
        Boolean,
      )
      err('missing-node', `Pipe ${p.id} refers to missing node ${missing.join(' and ')}.`, [p.id])
      return
    }
    if (p.from === p.to) {
      err('cycle', `Pipe ${p.id} starts and ends at ${p.from}.`, [p.id, p.from])
      return
    }
    const s = p.system === 'hot' ? 1 : 0
    fromIdx[q] = f
    toIdx[q] = t
    outs[2 * f + s]!++
    ins[2 * t + s]!++
  })
  const listOf = (v: number, side: Int32Array) => doc.pipes.filter((_, q) => side[q] === v)
  for (let v = 0; v < n; v++) {
    const node = doc.nodes[v]!
    checkFixtureKey(node, err)
    const inC = ins[2 * v]!
    const inH = ins[2 * v + 1]!
    const outC = outs[2 * v]!
    const outH = outs[2 * v + 1]!
    const bad =
      (node.kind === 'supply' && inC + inH > 0) ||
      ((node.kind === 'fixture' || node.kind === 'equipment') && outC + outH > 0) ||
      inC > 1 ||
      inH > 1 ||
      (node.kind === 'equipment' && inC + inH > 1) ||
      (node.kind === 'water-heater' && inH + outC > 0) ||
      (node.kind !== 'water-heater' &&
        node.kind !== 'fixture' &&
        node.kind !== 'equipment' &&
        inC + outC > 0 &&
        inH + outH > 0)
    if (bad) checkNode(node, listOf(v, toIdx), listOf(v, fromIdx), err)
  }

  findCycles(doc, fromIdx, toIdx, err)
  if (!issues.some((i) => STRUCTURAL.has(i.code))) checkHotOrigins(doc, fromIdx, toIdx, err)
  return {
    issues,
    structuralOk: !issues.some((i) => STRUCTURAL.has(i.code)),
    nodeIndex,
    pipeIndex,
  }
}

type Report = (code: string, message: string, ids: string[]) => void

/** Local checks of one pipe: length, material and locked size. */
export function checkPipe(doc: Diagram, p: Pipe, err: Report): void {
  if (!(Number.isFinite(p.lengthM) && p.lengthM > 0)) {
    err('bad-length', `Pipe ${p.id} has length ${p.lengthM} m; lengths must be above 0.`, [p.id])
  }
  const key = pipeMaterialKey(doc, p)
  const material = MATERIALS[key]
  if (!material) {
    if (p.material !== undefined) {
      err('unknown-material', `Pipe ${p.id} uses unknown material "${key}".`, [p.id])
    }
    return
  }
  if (p.nominal !== undefined && sizeIndex(material, p.nominal) < 0) {
    const known = material.sizes.map((s) => s.nominal).join(', ')
    err('unknown-size', `Pipe ${p.id}: ${key} has no size "${p.nominal}" (${known}).`, [p.id])
  }
}

/** Local check of a fixture's catalogue key. */
export function checkFixtureKey(n: DiagramNode, err: Report): void {
  if (n.kind === 'fixture' && !FIXTURES[n.fixture] && !n.load) {
    err(
      'unknown-fixture',
      `Fixture ${n.id} uses unknown fixture "${n.fixture}"; pick a catalogue key or give a load.`,
      [n.id],
    )
  }
}

function checkNode(n: DiagramNode, ins: Pipe[], outs: Pipe[], err: Report): void {
  const ids = (ps: Pipe[]) => ps.map((p) => p.id)
  if (n.kind === 'supply' && ins.length > 0) {
    err('supply-inlet', `Supply ${n.id} cannot be fed by ${ids(ins).join(', ')}.`, [
      n.id,
      ...ids(ins),
    ])
  }
  if ((n.kind === 'fixture' || n.kind === 'equipment') && outs.length > 0) {
    err('outlet-from-terminal', `${n.kind} ${n.id} cannot feed pipes ${ids(outs).join(', ')}.`, [
      n.id,
      ...ids(outs),
    ])
  }
  for (const system of ['cold', 'hot'] as const) {
    const same = ins.filter((p) => p.system === system)
    if (same.length > 1) {
      err(
        'two-inlets',
        `Node ${n.id} has ${same.length} ${system} inlets: ${ids(same).join(', ')}.`,
        [n.id, ...ids(same)],
      )
    }
  }
  if (n.kind === 'equipment' && ins.length > 1) {
    err('two-inlets', `Equipment ${n.id} takes one inlet; found ${ids(ins).join(', ')}.`, [
      n.id,
      ...ids(ins),
    ])
  }
  if (n.kind === 'water-heater') {
    const hotIn = ins.filter((p) => p.system === 'hot')
    if (hotIn.length > 0) {
      err('heater-hot-inlet', `Water heater ${n.id} is fed by hot pipe ${ids(hotIn).join(', ')}.`, [
        n.id,
        ...ids(hotIn),
      ])
    }
    const coldOut = outs.filter((p) => p.system === 'cold')
    if (coldOut.length > 0) {
      err(
        'heater-cold-outlet',
        `Water heater ${n.id} feeds cold pipe ${ids(coldOut).join(', ')}.`,
        [n.id, ...ids(coldOut)],
      )
    }
  } else if (n.kind !== 'fixture' && n.kind !== 'equipment') {
    const all = [...ins, ...outs]
    if (all.some((p) => p.system !== all[0]!.system)) {
      err('mixed-systems', `Node ${n.id} joins cold and hot pipes (${ids(all).join(', ')}).`, [
        n.id,
        ...ids(all),
      ])
    }
  }
}

// Kahn's algorithm; every node left over sits on or below a cycle, so walk inlets back from one
// until a node repeats to name the cycle itself. Once structural checks pass, each node has at
// most one inlet per system, so `inletsOf` is short.
function findCycles(doc: Diagram, fromIdx: Int32Array, toIdx: Int32Array, err: Report) {
  const n = doc.nodes.length
  const indeg = new Int32Array(n)
  const inlets: number[][] = Array.from({ length: n }, () => [])
  const outStart = new Int32Array(n + 1)
  for (let q = 0; q < fromIdx.length; q++) {
    if (fromIdx[q]! < 0) continue // missing node or self-loop, reported already
    indeg[toIdx[q]!]!++
    outStart[fromIdx[q]! + 1]!++
    inlets[toIdx[q]!]!.push(q)
  }
  for (let v = 0; v < n; v++) outStart[v + 1]! += outStart[v]!
  const fill = outStart.slice()
  const outTo = new Int32Array(fromIdx.length)
  for (let q = 0; q < fromIdx.length; q++)
    if (fromIdx[q]! >= 0) outTo[fill[fromIdx[q]!]!++] = toIdx[q]!
  const queue: number[] = []
  for (let v = 0; v < n; v++) if (indeg[v] === 0) queue.push(v)
  while (queue.length > 0) {
    const v = queue.pop()!
    for (let k = outStart[v]!; k < outStart[v + 1]!; k++)
      if (--indeg[outTo[k]!]! === 0) queue.push(outTo[k]!)
  }
  const reported = new Uint8Array(n)
  for (let start = 0; start < n; start++) {
    if (indeg[start] === 0 || reported[start]) continue
    const seenAt = new Map<number, number>()
    const path: number[] = []
    const pipes: string[] = []
    let cur = start
    while (!seenAt.has(cur)) {
      seenAt.set(cur, path.length)
      path.push(cur)
      const back = inlets[cur]!.find((q) => indeg[fromIdx[q]!]! > 0)!
      pipes.push(doc.pipes[back]!.id)
      cur = fromIdx[back]!
    }
    const from = seenAt.get(cur)!
    const loopNodes = path.slice(from).reverse()
    const loopPipes = pipes.slice(from).reverse()
    if (loopNodes.some((i) => reported[i])) continue
    for (const i of loopNodes) reported[i] = 1
    const names = loopNodes.map((i) => doc.nodes[i]!.id)
    err('cycle', `Pipes ${loopPipes.join(', ')} form a loop through ${names.join(', ')}.`, [
      ...loopPipes,
      ...names,
    ])
  }
}

// A hot pipe must trace back, through hot pipes only, to a water heater.
function checkHotOrigins(doc: Diagram, fromIdx: Int32Array, toIdx: Int32Array, err: Report) {
  const n = doc.nodes.length
  const hotIn = new Int32Array(n).fill(-1)
  doc.pipes.forEach((p, q) => {
    if (p.system === 'hot') hotIn[toIdx[q]!] = q
  })
  // 0 unknown, 1 reaches a heater, 2 does not.
  const state = new Uint8Array(n)
  const trail: number[] = []
  for (let q = 0; q < doc.pipes.length; q++) {
    if (doc.pipes[q]!.system !== 'hot') continue
    let cur = fromIdx[q]!
    let result = 2
    trail.length = 0
    for (;;) {
      if (state[cur]) {
        result = state[cur]!
        break
      }
      trail.push(cur)
      if (doc.nodes[cur]!.kind === 'water-heater') {
        result = 1
        break
      }
      const up = hotIn[cur]!
      if (up < 0) break
      cur = fromIdx[up]!
    }
    for (const t of trail) state[t] = result
    if (result === 2) {
      err('hot-not-from-heater', `Hot pipe ${doc.pipes[q]!.id} is not fed from a water heater.`, [
        doc.pipes[q]!.id,
      ])
    }
  }
}
