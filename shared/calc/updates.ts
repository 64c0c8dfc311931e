/**
 * Live updates of the engine state after one property edit: the edited node's contribution
 * differences are pushed up its cold and hot paths, only those pipes are re-sized, and their
 * pressure-drop changes move into the margin tree as range adds. When every fixture keeps its
 * margin the update stops there; otherwise the budget pass re-runs so the state stays equal to a
 * full recompute.
 */
import type { DiagramNode, Pipe } from '../document/model.ts'
import type { Engine, UpdateMode } from './engine.ts'
import { hydraulicsAt } from './hydraulics.ts'
import { IREC, SIZE } from './pipe-record.ts'
import { budget, dropAt, inletOf, pathPressure, staticPass } from './pressures.ts'

/** What an engine update did and which pipes (internal indices) it touched. */
export interface UpdateResult {
  mode: UpdateMode
  pipes: number[]
}

/** Margin (kPa) the incremental path needs at every fixture to skip the pressure budget pass. */
const FAST_MARGIN_KPA = 1e-6

function nextStamp(e: Engine): number {
  if (++e.stampNo === 0x7fffffff) {
    e.stamp.fill(0)
    e.stampNo = 1
  }
  return e.stampNo
}

function mark(e: Engine, touched: number[], st: number, x: number): void {
  if (e.stamp[x] !== st) {
    e.stamp[x] = st
    touched.push(x)
  }
}

// Adds `d` to column `s` on pipe `from` and every pipe above it, marking them touched.
function addUp(e: Engine, s: Float64Array, from: number, d: number, touched: number[], st: number) {
  for (let x = from; x >= 0; x = e.g.parent[x]!) {
    s[x]! += d
    mark(e, touched, st, x)
  }
}

function isClean(e: Engine): boolean {
  return e.upsized.length === 0 && e.givenUpCount === 0 && e.unsizedCount === 0
}

/** Re-reads node i after a property edit and updates what depends on it. */
export function updateNode(e: Engine, i: number, node: DiagramNode): UpdateResult {
  e.tree.ready() // its deferred leaves read required pressures, which readNode may change
  const old = e.doc.nodes[i]!
  ;(e.doc.nodes as DiagramNode[])[i] = node
  const global =
    node.elevationM !== old.elevationM ||
    node.kind === 'supply' ||
    node.kind === 'pressure-reducing-valve'
  if (global) {
    for (let q = 0; q < e.g.pipeCount; q++) e.readPipe(q)
    e.readNode(i)
    staticPass(e)
    e.recomputeAll()
    return { mode: 'recompute', pipes: Array.from({ length: e.g.pipeCount }, (_, q) => q) }
  }
  const clean = isClean(e)
  const touched: number[] = []
  const st = nextStamp(e)
  const oldC = e.contrib[i]!
  const oldLoss = e.devLoss[i]!
  const qc = e.g.inCold[i]!
  const qh = e.g.inHot[i]!
  const oldMin = [qc >= 0 ? e.minSize[qc]! : 0, qh >= 0 ? e.minSize[qh]! : 0]
  // Re-read the node, then push the differences up both paths.
  e.readNode(i)
  const c = e.contrib[i]!
  const eq = node.kind === 'equipment' ? c.flow - oldC.flow : 0
  if (qc >= 0) {
    const dC = c.cold - oldC.cold
    if (dC) addUp(e, e.sLoad, qc, dC, touched, st)
    if (c.closets !== oldC.closets) addUp(e, e.sWC, qc, c.closets - oldC.closets, touched, st)
    if (c.urinals !== oldC.urinals) addUp(e, e.sU, qc, c.urinals - oldC.urinals, touched, st)
    const dFV = c.otherValves - oldC.otherValves
    if (dFV) addUp(e, e.sFV, qc, dFV, touched, st)
    if (eq) addUp(e, e.sEq, qc, eq, touched, st)
    if (e.minSize[qc] !== oldMin[0]) mark(e, touched, st, qc)
  }
  if (qh >= 0) {
    const dH = c.hot - oldC.hot
    if (dH) addUp(e, e.sLoad, qh, dH, touched, st)
    if (eq && qc < 0) addUp(e, e.sEq, qh, eq, touched, st)
    if (e.minSize[qh] !== oldMin[1]) mark(e, touched, st, qh)
  }
  const l = e.g.lca[i]!
  const dB = c.total - c.cold - c.hot - (oldC.total - oldC.cold - oldC.hot)
  if (l >= 0 && dB) addUp(e, e.sLoad, l, dB, touched, st)
  // Required pressure changed: shift the node's leaves by the difference.
  const dReq = c.requiredKPa - oldC.requiredKPa
  if (dReq && dReq === dReq) {
    for (const q of [qc, qh]) if (q >= 0) e.tree.rangeAdd(q, q + 1, -dReq)
  }
  // A device loss shifts everything downstream of the node.
  const inlet = qc >= 0 ? qc : qh
  const dLoss = e.devLoss[i]! - oldLoss
  if (dLoss && inlet >= 0) e.tree.rangeAdd(inlet + 1, e.g.end[inlet]!, -dLoss)
  return finish(e, touched, clean)
}

/** Re-reads pipe q after an edit of its length, material or locked size. */
export function updatePipe(e: Engine, q: number, pipe: Pipe): UpdateResult {
  e.tree.ready()
  ;(e.doc.pipes as Pipe[])[e.g.pipeDoc[q]!] = pipe
  const clean = isClean(e)
  e.readPipe(q)
  return finish(e, [q], clean)
}

// Resizes the touched pipes, moves their pressure drops into the tree, corrects for
// pressure-reducing valves, then either stops (every fixture keeps its minimum) or re-runs the
// budget pass so the result stays equal to a full recompute.
function finish(e: Engine, touched: number[], clean: boolean): UpdateResult {
  const end = e.g.end
  for (const q of touched) {
    const oldDrop = dropAt(e, q)
    const wasUnsized = e.irec[q * IREC + SIZE]! < 0 && !e.invalid[q]
    hydraulicsAt(e, q)
    const isUnsized = e.irec[q * IREC + SIZE]! < 0 && !e.invalid[q]
    e.unsizedCount += (isUnsized ? 1 : 0) - (wasUnsized ? 1 : 0)
    const d = dropAt(e, q) - oldDrop
    if (d !== 0) e.tree.rangeAdd(q, end[q]!, -d)
  }
  for (const v of e.g.prvs) {
    const qin = inletOf(e, v)
    const set = e.cap[v]!
    const now = pathPressure(e, qin)
    const was = e.prvIn[v]!
    if (now === was) continue
    const corr = Math.min(now, set) - Math.min(was, set) - (now - was)
    e.tree.rangeAdd(qin + 1, end[qin]!, corr)
    e.prvIn[v] = now
  }
  if (clean && e.unsizedCount === 0 && e.tree.min() >= FAST_MARGIN_KPA) {
    e.stale = true
    return { mode: 'incremental', pipes: touched }
  }
  budget(e)
  return { mode: 'budget', pipes: touched }
}
