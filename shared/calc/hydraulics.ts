/**
 * The sizing loop: fixture-unit sums up the pipe forest, then per pipe the load (with the flush
 * valve series), the demand flow, the size (velocity, then the fixture's minimum supply size),
 * velocity, friction and pressure drop. hydraulicsAt is the one per-pipe step; the full recompute
 * and the live updates both use it, so they agree to the last bit.
 *
 * Speed (bench/calc.bench.ts): pipes are numbered in pre-order (graph.ts), so the sums are one
 * backward sweep and sizes and pressures one forward sweep over typed arrays; demand is a table
 * read (demand-lookup.ts), sizing compares against precomputed capacities, and friction costs one
 * Math.pow per pipe. No closures in these loops.
 */
import { columnLps } from './demand-lookup.ts'
import type { Engine } from './engine.ts'
import { darcyLossKPa } from './friction.ts'
import { budgetRounds, pressureAt, leafValue, updatePrvInlets } from './pressures.ts'
import { SERIES_TOTALS, seriesFromTotals, FLUSH_VALVE_SERIES } from './series.ts'
import { FLOW_SCALE, LOAD_SCALE } from './units.ts'

const CLOSETS = SERIES_TOTALS.closet
const URINALS = SERIES_TOTALS.urinal
const CLOSET_THEN = FLUSH_VALVE_SERIES.closet.then
const URINAL_THEN = FLUSH_VALVE_SERIES.urinal.then
const HW_EXPONENT = 1.852 // Hazen-Williams flow exponent, C* [S41]

// Direct-mapped memo per demand column, shared by all engines (the columns are constants):
// 4096 slots; a riser diagram repeats the same branch loads floor after floor.
const MEMO_SHIFT = 20
const MEMO = [0, 1].map(() => ({
  load: new Float64Array(1 << (32 - MEMO_SHIFT)).fill(NaN),
  lps: new Float64Array(1 << (32 - MEMO_SHIFT)),
  pow: new Float64Array(1 << (32 - MEMO_SHIFT)),
}))

/** Load, flow, size and friction of pipe q from its sums. */
export function hydraulicsAt(e: Engine, q: number): void {
  let load = e.sLoad[q]! / LOAD_SCALE
  let fv = 0
  if (e.valvesOn) {
    if (e.series) {
      load +=
        seriesFromTotals(CLOSETS, CLOSET_THEN, e.sWC[q]!) +
        seriesFromTotals(URINALS, URINAL_THEN, e.sU[q]!)
    }
    fv = e.sWC[q]! + e.sU[q]! + e.sFV[q]! > 0 ? 1 : 0
  }
  const column = e.columns[fv]!
  // Memo of the pure load → (flow, flow^1.852) step; keys are compared exactly, so a hit returns
  // the very numbers a miss would compute.
  const memo = MEMO[fv]!
  const h = Math.imul((load * 1000) | 0, 0x9e3779b1) >>> MEMO_SHIFT
  let lps: number
  let pw: number
  if (memo.load[h] === load) {
    lps = memo.lps[h]!
    pw = memo.pow[h]!
  } else {
    lps = columnLps(column, load)
    pw = Math.pow(lps / 1000, HW_EXPONENT)
    memo.load[h] = load
    memo.lps[h] = lps
    memo.pow[h] = pw
  }
  let flow = lps
  if (e.equipmentOn) {
    const eq = e.sEq[q]!
    if (eq !== 0) {
      flow = lps + eq / FLOW_SCALE
      pw = Math.pow(flow / 1000, HW_EXPONENT)
    }
  }
  e.load[q] = load
  e.flushValve[q] = fv
  e.beyondTable[q] = load > column.load[column.load.length - 1]! ? 1 : 0
  e.fixtureFlow[q] = lps
  e.flow[q] = flow
  const start = e.matStart[q]!
  if (e.invalid[q] || start < 0) {
    e.velSize[q] = -1
    e.base[q] = -1
    e.size[q] = -1
  } else {
    const n = e.matCount[q]!
    let b = e.locked[q]!
    let v = b
    if (b < 0) {
      const cap = e.g.hot[q] ? e.capHot : e.capCold
      b = 0
      while (b < n && flow > cap[start + b]!) b++
      if (b === n) b = -1
      v = b
      // The fixture's minimum supply size (fixtures.ts) raises a smaller velocity size.
      if (b >= 0 && b < e.minSize[q]!) b = e.minSize[q]!
    }
    e.velSize[q] = v
    e.base[q] = b
    e.size[q] = b < 0 ? -1 : Math.min(b + e.up[q]!, n - 1)
  }
  e.flowPow[q] = pw
  sizeHydraulics(e, q)
}

/** Velocity, friction and pressure drop of pipe q at its current size. */
export function sizeHydraulics(e: Engine, q: number): void {
  const s = e.size[q]!
  const flow = e.flow[q]!
  let fr = 0
  if (s >= 0) {
    const k = e.matStart[q]! + s
    const t = e.sizes
    e.velocity[q] = flow / 1000 / t.area[k]!
    if (flow > 0) {
      if (e.darcy) {
        const w = e.g.hot[q] ? e.water.hot : e.water.cold
        fr = darcyLossKPa(flow, t.idMm[k]!, e.leq[q]!, t.roughnessMm[k]!, w.nu, w.rho)
      } else {
        fr = t.hw[k]! * e.leq[q]! * e.flowPow[q]!
      }
    }
  } else {
    e.velocity[q] = NaN
  }
  e.friction[q] = fr
  e.drop[q] = fr + e.riseKPa[q]!
}

/** Sums, sizes and pressures from scratch, then the pressure budget if some fixture is short. */
export function recomputeAll(e: Engine): void {
  sumLoads(e)
  const n = e.g.pipeCount
  e.up.fill(0)
  e.upsized = []
  e.givenUp.fill(0)
  e.givenUpCount = 0
  let unsized = 0
  const leaves = e.leaves
  // Pre-order: a pipe's parent is done before it, so sizes and pressures share one sweep.
  for (let q = 0; q < n; q++) {
    hydraulicsAt(e, q)
    if (e.size[q]! < 0 && !e.invalid[q]) unsized++
    pressureAt(e, q)
    leaves[q] = leafValue(e, q)
  }
  e.unsizedCount = unsized
  e.tree.build(leaves)
  updatePrvInlets(e)
  e.stale = false
  if (unsized === 0) budgetRounds(e)
}

// Post-order sums: children have larger indices than their parent, so one backward sweep.
function sumLoads(e: Engine): void {
  const parent = e.g.parent
  const n = parent.length
  const sLoad = e.sLoad
  sLoad.set(e.oLoad)
  for (let q = n - 1; q >= 0; q--) {
    const p = parent[q]!
    if (p >= 0) sLoad[p]! += sLoad[q]!
  }
  if (e.valvesOn) {
    const { sWC, sU, sFV } = e
    sWC.set(e.oWC)
    sU.set(e.oU)
    sFV.set(e.oFV)
    for (let q = n - 1; q >= 0; q--) {
      const p = parent[q]!
      if (p < 0) continue
      sWC[p]! += sWC[q]!
      sU[p]! += sU[q]!
      sFV[p]! += sFV[q]!
    }
  }
  if (e.equipmentOn) {
    const sEq = e.sEq
    sEq.set(e.oEq)
    for (let q = n - 1; q >= 0; q--) {
      const p = parent[q]!
      if (p >= 0) sEq[p]! += sEq[q]!
    }
  }
}
