/**
 * Pressures and the pressure budget. From the supply down each pipe: minus the device loss of the
 * node it leaves (a pressure-reducing valve caps instead), minus friction and 9.81 kPa per metre of
 * rise. Each pipe outlet's margin (residual − the fixture's required pressure) sits in the margin
 * tree, so "is any fixture short?" is one read. While one is short, the budget pass enlarges the
 * steepest unlocked pipe on its path.
 */
import type { Engine } from './engine.ts'
import { sizeHydraulics, hydraulicsAt } from './hydraulics.ts'

/** Residual pressure leaving node v given the pressure arriving at it. */
export function nodeOut(e: Engine, v: number, inP: number): number {
  if (v === e.g.supply) return (e.doc.nodes[v] as { pressureKPa: number }).pressureKPa
  // cap is +Infinity except at a valve, whose device loss is 0: one expression for both.
  return Math.min(inP, e.cap[v]!) - e.devLoss[v]!
}

/** Residual and static pressure at pipe q's outlet from its parent's (or the supply's). */
export function pressureAt(e: Engine, q: number): void {
  const p = e.g.parent[q]!
  const v = e.g.from[q]!
  let base = 0
  let sBase = 0
  let kb = 0
  if (p < 0) {
    if (v === e.g.supply) {
      base = sBase = (e.doc.nodes[v] as { pressureKPa: number }).pressureKPa
      kb = 1
    }
  } else {
    const cap = e.inCap[q]!
    base = Math.min(e.outP[p]!, cap) - e.inLoss[q]!
    sBase = Math.min(e.staticOut[p]!, cap)
    kb = e.known[p]!
  }
  e.outP[q] = base - e.drop[q]!
  e.staticOut[q] = sBase - e.riseKPa[q]!
  e.known[q] = kb && e.size[q]! >= 0 ? 1 : 0
}

/** Margin at pipe q's outlet, or +Infinity where nothing is checked. */
export function leafValue(e: Engine, q: number): number {
  const r = e.outReq[q]!
  return e.known[q] && r === r && !e.givenUp[q] ? e.outP[q]! - r : Infinity
}

/** Records the pressure arriving at each pressure-reducing valve (for live corrections). */
export function updatePrvInlets(e: Engine): void {
  for (const v of e.g.prvs) e.prvIn[v] = e.outP[inletOf(e, v)]!
}

/** Exact pre-order pass: residual and static pressure at every pipe outlet; rebuilds the tree. */
export function pressurePass(e: Engine): void {
  const n = e.g.pipeCount
  for (let q = 0; q < n; q++) pressureAt(e, q)
  for (let q = 0; q < n; q++) e.leaves[q] = leafValue(e, q)
  e.tree.build(e.leaves)
  updatePrvInlets(e)
  e.stale = false
}

/** The inlet pipe of node v (cold first), or -1. */
export function inletOf(e: Engine, v: number): number {
  const c = e.g.inCold[v]!
  return c >= 0 ? c : e.g.inHot[v]!
}

/** Exact residual pressure at pipe q's outlet by walking its path (for stale reads). */
export function pathPressure(e: Engine, q: number): number {
  const path: number[] = []
  for (let x = q; x >= 0; x = e.g.parent[x]!) path.push(x)
  const root = path[path.length - 1]!
  const v0 = e.g.from[root]!
  let p = v0 === e.g.supply ? nodeOut(e, v0, 0) : 0
  p -= e.drop[root]!
  for (let i = path.length - 2; i >= 0; i--) {
    const x = path[i]!
    p = nodeOut(e, e.g.from[x]!, p) - e.drop[x]!
  }
  return p
}

/** Undoes earlier enlargements, recomputes every pressure, then runs the budget rounds. */
export function budget(e: Engine): void {
  for (const q of e.upsized) {
    e.up[q] = 0
    hydraulicsAt(e, q)
  }
  e.upsized = []
  e.givenUp.fill(0)
  e.givenUpCount = 0
  pressurePass(e)
  if (e.unsizedCount === 0) budgetRounds(e)
}

/**
 * While some fixture is below its minimum, enlarge by one size the unlocked pipe on its path with
 * the largest friction loss per metre (ties: lowest pipe id). A fixture whose path has nothing
 * left to enlarge is given up on and reported. Each round either enlarges a pipe or gives up a
 * fixture, so the loop ends.
 */
export function budgetRounds(e: Engine): void {
  const { parent, end } = e.g
  while (e.tree.min() < 0) {
    const q = e.tree.argMin()
    let best = -1
    let bestRate = 0
    for (let x = q; x >= 0; x = parent[x]!) {
      const s = e.size[x]!
      if (e.locked[x]! >= 0 || e.matStart[x]! < 0 || s < 0 || s === e.matCount[x]! - 1) continue
      const rate = e.friction[x]! / e.leq[x]!
      if (rate > bestRate || (rate === bestRate && best >= 0 && e.pipeIds[x]! < e.pipeIds[best]!)) {
        best = x
        bestRate = rate
      }
    }
    if (best < 0) {
      e.givenUp[q] = 1
      e.givenUpCount++
      e.tree.set(q, Infinity)
      continue
    }
    if (e.up[best] === 0) e.upsized.push(best)
    e.up[best]!++
    e.size[best]!++
    sizeHydraulics(e, best)
    for (let x = best; x < end[best]!; x++) {
      pressureAt(e, x)
      e.tree.set(x, leafValue(e, x))
    }
    updatePrvInlets(e)
  }
}
