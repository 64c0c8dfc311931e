/**
 * Pressures and the pressure budget. From the supply down each pipe: minus the device loss of the
 * node it leaves (a pressure-reducing valve caps instead), minus friction and 9.81 kPa per metre of
 * rise. Each pipe outlet's margin (residual − the fixture's required pressure) sits in the margin
 * tree, so "is any fixture short?" is one read. While one is short, the budget pass enlarges the
 * steepest unlocked pipe on its path.
 */
import type { Engine } from './engine.ts'
import { hydraulicsAt, PRESSURES, sizeHydraulics, sweep } from './hydraulics.ts'
import {
  FLAGS,
  FRICTION,
  GIVEN_UP,
  IREC,
  LEQ,
  OUT_P,
  REC,
  REQ,
  RISE,
  SIZE,
  UP,
} from './pipe-record.ts'

/** Residual pressure leaving node v given the pressure arriving at it. */
export function nodeOut(e: Engine, v: number, inP: number): number {
  if (v === e.g.supply) return (e.doc.nodes[v] as { pressureKPa: number }).pressureKPa
  // cap is +Infinity except at a valve, whose device loss is 0: one expression for both.
  return Math.min(inP, e.cap[v]!) - e.devLoss[v]!
}

/** Records the pressure arriving at each pressure-reducing valve (for live corrections). */
export function updatePrvInlets(e: Engine): void {
  for (const v of e.g.prvs) e.prvIn[v] = e.rec[inletOf(e, v) * REC + OUT_P]!
}

/**
 * Static pressure (no flow, so no friction or device losses) at every pipe outlet: the supply
 * pressure, capped by pressure-reducing valves, minus 9.81 kPa per metre of rise. Depends only on
 * the graph, elevations and set pressures, so it runs when one of those changes, not per edit.
 */
export function staticPass(e: Engine): void {
  const { parent, from, supply, pipeCount } = e.g
  const { rec, staticOut } = e
  const supplyKPa = supply >= 0 ? nodeOut(e, supply, 0) : 0
  for (let q = 0; q < pipeCount; q++) {
    const p = parent[q]!
    let inStatic = 0
    if (p >= 0) inStatic = e.nodeOutStatic(from[q]!, staticOut[p]!)
    else if (from[q] === supply) inStatic = supplyKPa
    staticOut[q] = inStatic - rec[q * REC + RISE]!
  }
}

/**
 * Exact pre-order pass: residual pressure at every pipe outlet; renews the tree's
 * leaves. Returns the smallest margin.
 */
export function pressurePass(e: Engine): number {
  const minMargin = sweep(e, 0, e.g.pipeCount, PRESSURES)
  deferMargins(e)
  updatePrvInlets(e)
  e.stale = false
  return minMargin
}

/** Pressure drop over pipe q: friction plus static head, kPa. */
export function dropAt(e: Engine, q: number): number {
  return e.rec[q * REC + FRICTION]! + e.rec[q * REC + RISE]!
}

/**
 * Margin at pipe q's outlet: residual − required, +Infinity where nothing is checked (no
 * requirement, pressure unknown, or the budget gave up on the fixture). The sweep computes the
 * same inline (without the test for an unknown pressure: NaN is never the smallest).
 */
export function marginAt(e: Engine, q: number): number {
  const m = e.rec[q * REC + OUT_P]! - e.rec[q * REC + REQ]!
  return m !== m || e.irec[q * IREC + FLAGS]! & GIVEN_UP ? Infinity : m
}

/** Hands the margin tree its leaves, to build when the live path first needs it. */
export function deferMargins(e: Engine): void {
  e.tree.defer((q) => marginAt(e, q))
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
  p -= dropAt(e, root)
  for (let i = path.length - 2; i >= 0; i--) {
    const x = path[i]!
    p = nodeOut(e, e.g.from[x]!, p) - dropAt(e, x)
  }
  return p
}

/** Undoes every budget enlargement and given-up fixture; returns the pipes it had enlarged. */
export function clearBudget(e: Engine): number[] {
  const upsized = e.upsized
  for (const q of upsized) e.irec[q * IREC + UP] = 0
  e.upsized = []
  if (e.givenUpCount > 0) {
    for (let q = 0; q < e.g.pipeCount; q++) e.irec[q * IREC + FLAGS]! &= ~GIVEN_UP
  }
  e.givenUpCount = 0
  return upsized
}

/** Undoes earlier enlargements, recomputes every pressure, then runs the budget rounds. */
export function budget(e: Engine): void {
  for (const q of clearBudget(e)) hydraulicsAt(e, q)
  const minMargin = pressurePass(e)
  if (e.unsizedCount === 0 && minMargin < 0) budgetRounds(e)
}

/**
 * While some fixture is below its minimum, enlarge by one size the unlocked pipe on its path with
 * the largest friction loss per metre (ties: lowest pipe id). A fixture whose path has nothing
 * left to enlarge is given up on and reported. Each round either enlarges a pipe or gives up a
 * fixture, so the loop ends.
 */
export function budgetRounds(e: Engine): void {
  const { parent, end } = e.g
  const { rec, irec } = e
  while (e.tree.min() < 0) {
    const q = e.tree.argMin()
    let best = -1
    let bestRate = 0
    for (let x = q; x >= 0; x = parent[x]!) {
      const s = irec[x * IREC + SIZE]!
      if (e.locked[x]! >= 0 || e.matStart[x]! < 0 || s < 0 || s === e.matCount[x]! - 1) continue
      const rate = rec[x * REC + FRICTION]! / rec[x * REC + LEQ]!
      if (rate > bestRate || (rate === bestRate && best >= 0 && e.pipeIds[x]! < e.pipeIds[best]!)) {
        best = x
        bestRate = rate
      }
    }
    if (best < 0) {
      irec[q * IREC + FLAGS]! |= GIVEN_UP
      e.givenUpCount++
      e.tree.set(q, Infinity)
      continue
    }
    if (irec[best * IREC + UP] === 0) e.upsized.push(best)
    irec[best * IREC + UP]!++
    irec[best * IREC + SIZE]!++
    sizeHydraulics(e, best)
    sweep(e, best, end[best]!, PRESSURES)
    for (let x = best; x < end[best]!; x++) e.tree.set(x, marginAt(e, x))
    updatePrvInlets(e)
  }
}
