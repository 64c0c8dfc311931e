/**
 * The sizing loop: fixture-unit sums up the pipe forest, then per pipe the load (with the flush
 * valve series), the demand flow, the size (velocity, then the fixture's minimum supply size),
 * friction and pressure drop, and — in the same forward sweep — the residual pressure at its
 * outlet. (Static pressures do not depend on flow: pressures.ts computes them when the graph,
 * an elevation or a set pressure changes.) `sweep` is the one per-pipe step: the full recompute, the live updates and the
 * pressure budget all run it, so they agree to the last bit.
 *
 * Speed (bench/calc.bench.ts): pipes are numbered in pre-order (graph.ts), so the sums are one
 * backward sweep and sizes and pressures one forward sweep over typed arrays, read into locals
 * once per sweep. The load-only part (flow, flow^1.852, velocity size) comes from a memo
 * (demand-memo.ts). No closures or object allocations in these loops.
 */
import { columnLps } from './demand-lookup.ts'
import { M_BASE, M_KEY, M_LPS, M_PER_M, M_POW, MEMO_CLASSES, MEMO_STRIDE } from './demand-memo.ts'
import type { Engine } from './engine.ts'
import { darcyLossKPa } from './friction.ts'
import {
  AFTER_DEVICE,
  CLASS,
  FLAGS,
  FLOW,
  FRICTION,
  GIVEN_UP,
  IREC,
  LEQ,
  OUT_P,
  PARENT,
  REC,
  REQ,
  RISE,
  SIZE,
  UP,
  VALVE_CURVE,
} from './pipe-record.ts'
import { budgetRounds, clearBudget, deferMargins, updatePrvInlets } from './pressures.ts'
import { SERIES_TOTALS, seriesFromTotals, FLUSH_VALVE_SERIES } from './series.ts'
import { FLOW_SCALE, LOAD_SCALE } from './units.ts'

const CLOSETS = SERIES_TOTALS.closet
const URINALS = SERIES_TOTALS.urinal
const CLOSET_THEN = FLUSH_VALVE_SERIES.closet.then
const URINAL_THEN = FLUSH_VALVE_SERIES.urinal.then
const HW_EXPONENT = 1.852 // Hazen-Williams flow exponent, C* [S41]

/** The Hazen-Williams flow term: (flow in m³/s)^1.852. */
export function hwFlowTerm(lps: number): number {
  return Math.pow(lps / 1000, HW_EXPONENT)
}

/**
 * Smallest size index of pipe q's material whose capacity at the system's velocity limit holds
 * `lps`, or -1 (none fits, or the pipe has no valid material).
 */
export function velocitySize(e: Engine, q: number, lps: number): number {
  const row = e.capStart[q]!
  if (row < 0 || e.invalid[q]) return -1
  const n = e.matCount[q]!
  const cap = e.capacity
  let b = 0
  while (b < n && lps > cap[row + b]!) b++
  return b === n ? -1 : b
}

/**
 * Pipe q's size before any pressure budget enlargement, from its velocity size: the locked
 * size, else the velocity size raised to the fixture's minimum supply size (fixtures.ts).
 */
export function baseSize(e: Engine, q: number, velSize: number): number {
  if (e.capStart[q]! < 0 || e.invalid[q]) return -1
  const locked = e.locked[q]!
  if (locked >= 0) return locked
  const min = e.minSize[q]!
  return velSize >= 0 && velSize < min ? min : velSize
}

/** Fixture units the flush valve series adds for `closets` and `urinals` valves on one pipe. */
function seriesUnits(closets: number, urinals: number): number {
  return (
    seriesFromTotals(CLOSETS, CLOSET_THEN, closets) +
    seriesFromTotals(URINALS, URINAL_THEN, urinals)
  )
}

/** Load on pipe q, WSFU: its fixture-unit sum plus, on that basis, the flush valve series. */
export function loadAt(e: Engine, q: number): number {
  let milli = e.sLoad[q]!
  if (e.valvesOn && e.series) milli += seriesUnits(e.sWC[q]!, e.sU[q]!) * LOAD_SCALE
  return milli / LOAD_SCALE
}

/** Hazen-Williams friction per metre of equivalent length of pipe q at size s, kPa/m. */
function perMetre(e: Engine, q: number, s: number, pw: number): number {
  return s >= 0 ? e.sizes.hw[e.matStart[q]! + s]! * pw : 0
}

// The sweep indexes the interleaved records with number literals (commented with the field's
// name): V8 does not fold imported constants, and reading them cost half the sweep's time.
// This check ties the literals to the layout in pipe-record.ts and demand-memo.ts.
// prettier-ignore
const LAYOUT: [number, number][] = [
  [REC, 6], [LEQ, 0], [RISE, 1], [REQ, 2], [FLOW, 3], [FRICTION, 4], [OUT_P, 5],
  [IREC, 5], [CLASS, 0], [UP, 1], [SIZE, 2], [FLAGS, 3], [PARENT, 4],
  [GIVEN_UP, 1], [VALVE_CURVE, 2], [AFTER_DEVICE, 4],
  [MEMO_STRIDE, 5], [M_KEY, 0], [M_LPS, 1], [M_POW, 2], [M_BASE, 3], [M_PER_M, 4],
  [MEMO_CLASSES, 262144],
]
if (LAYOUT.some(([field, literal]) => field !== literal)) throw new Error('sweep layout mismatch')

/**
 * Where the sweep stopped on a memo miss: [pipe, load in milli-WSFU, curve, key, slot offset].
 * The sweep returns to `sweep` to have the slot filled rather than calling out of its loop: a
 * call there, once the first sweeps had taken it often, was compiled into the loop and made
 * every pipe's step about a quarter slower for good.
 */
const MISS = new Float64Array(5)

/** Fills the memo slot of the miss recorded in MISS. */
function fillMemo(e: Engine): void {
  const q = MISS[0]!
  const milli = MISS[1]!
  const m = MISS[4]!
  const lps = columnLps(e.columns[MISS[2]!]!, milli / LOAD_SCALE)
  const pw = hwFlowTerm(lps)
  const b = baseSize(e, q, velocitySize(e, q, lps))
  const mem = e.memo.rows
  mem[m + M_KEY] = MISS[3]!
  mem[m + M_LPS] = lps
  mem[m + M_POW] = pw
  mem[m + M_BASE] = b
  mem[m + M_PER_M] = perMetre(e, q, b, pw)
}

// NaN, the unknown pressure, read from memory: with a NaN literal in the loop V8 compiled the
// pressure part to twice the time.
const UNKNOWN = new Float64Array([NaN])

/** Sweep parts (bit flags): sizes and losses; pressures and margins. */
export const HYDRAULICS = 1
export const PRESSURES = 2

/**
 * One forward pass over pipes [lo, hi) in pre-order. HYDRAULICS: flow, size and friction of each
 * pipe from its sums (the load is read from the sums when asked: loadAt). PRESSURES: residual
 * pressure at each outlet from its parent's (so the parent must be current; NaN when unknown).
 * Returns the smallest margin met (residual − required; +Infinity without PRESSURES) and leaves
 * the count of valid pipes that no size fits in `e.sweepUnsized`.
 */
export function sweep(e: Engine, lo: number, hi: number, parts: number): number {
  if (!(lo >= 0 && hi <= 0x3ffffff)) throw new RangeError(`sweep over pipes ${lo}–${hi}`)
  e.sweepUnsized = 0
  e.sweepMargin = Infinity
  for (let q = lo, last = -1; (q = sweepFrom(e, q, hi, parts)) < hi; last = q) {
    // A key that never equals itself (a NaN load) would stop at the same pipe for ever.
    if (q === last) throw new Error(`pipe ${e.pipeIds[q]}: its load is not a number`)
    fillMemo(e)
  }
  return e.sweepMargin
}

/**
 * The sweep's loop, from pipe `lo` on, adding to e.sweepUnsized and e.sweepMargin. Returns `hi`
 * when done, or the pipe whose memo slot is missing (recorded in MISS; that pipe is not
 * written and is swept again once the slot is filled).
 */
function sweepFrom(e: Engine, lo: number, hi: number, parts: number): number {
  // Switches as 0/1 numbers, tested with `!== 0`: a boolean read from the engine was compiled
  // to the full truthiness test (false, '', 0, NaN …) at every use in every step, 5–8 % of the
  // sweep.
  const hydraulics = parts & HYDRAULICS
  const pressures = parts & PRESSURES
  const givenUp = e.givenUpCount > 0 ? 1 : 0
  const anyUp = e.upsized.length > 0 ? 1 : 0
  const { from, hot, supply } = e.g
  const { sLoad, sWC, sU, sFV, sEq, matStart, matCount, invalid, rec, irec } = e
  const { fixtureFlow, cap, devLoss } = e
  const { idMm, roughnessMm } = e.sizes
  const mem = e.memo.rows
  const shift = e.memo.shift
  const series = e.series ? 1 : 0
  const valvesOn = e.valvesOn ? 1 : 0
  const equipmentOn = e.equipmentOn ? 1 : 0
  const darcy = e.darcy ? 1 : 0
  const water = e.water
  const supplyKPa = supply >= 0 ? e.nodeOut(supply, 0) : 0
  const unknown = UNKNOWN[0]!
  let minMargin = e.sweepMargin
  let unsized = e.sweepUnsized
  // Masked bounds (sweep checks them) let V8 prove q × 6 + 5 fits an int32 and drop the
  // overflow tests on every record index.
  const end = hi & 0x3ffffff
  let q = lo & 0x3ffffff
  for (; q < end; q++) {
    const r = q * 6 /* REC */
    const i = q * 5 /* IREC */
    let fr: number
    let s: number
    if (hydraulics !== 0) {
      let milli = sLoad[q]!
      let fv = 0
      if (valvesOn !== 0) {
        const wc = sWC[q]!
        const u = sU[q]!
        if (series !== 0) milli += seriesUnits(wc, u) * LOAD_SCALE
        fv = wc + u + sFV[q]! > 0 ? 1 : 0
        // VALVE_CURVE; without flush valves it stays 0 (valvesOn never reverts).
        irec[i + 3 /* FLAGS */] = (irec[i + 3]! & ~2) | (fv << 1)
      }
      // Memo key and slot as demand-memo.ts describes them (MEMO_CLASSES = 262144).
      const cls = irec[i + 0 /* CLASS */]!
      const key = (milli * 262144 + cls) * 2 + fv
      const m = (Math.imul(milli ^ Math.imul(cls * 2 + fv, 0x85ebca6b), 0x9e3779b1) >>> shift) * 5
      if (mem[m + 0 /* M_KEY */] !== key) {
        MISS[0] = q
        MISS[1] = milli
        MISS[2] = fv
        MISS[3] = key
        MISS[4] = m
        break
      }
      const lps = mem[m + 1 /* M_LPS */]!
      let b = mem[m + 3 /* M_BASE */]!
      let perM = mem[m + 4 /* M_PER_M */]!
      let f = lps
      if (equipmentOn !== 0) {
        fixtureFlow[q] = lps
        const eq = sEq[q]!
        if (eq !== 0) {
          f = lps + eq / FLOW_SCALE
          b = baseSize(e, q, velocitySize(e, q, f))
          perM = perMetre(e, q, b, hwFlowTerm(f))
        }
      }
      rec[r + 3 /* FLOW */] = f
      s = b
      if (b >= 0) {
        const u = anyUp !== 0 ? irec[i + 1 /* UP */]! : 0
        if (u !== 0) {
          s = Math.min(b + u, matCount[q]! - 1)
          // The flow term is read only here: an unconditional read cost 4 % of the sweep.
          perM = perMetre(e, q, s, f === lps ? mem[m + 2 /* M_POW */]! : hwFlowTerm(f))
        }
      } else if (!invalid[q]) {
        unsized++
      }
      irec[i + 2 /* SIZE */] = s
      if (darcy === 0) {
        fr = perM * rec[r + 0 /* LEQ */]! // perM is 0 without a size or a flow
      } else if (s >= 0 && f > 0) {
        const k = matStart[q]! + s
        const w = hot[q] ? water.hot : water.cold
        fr = darcyLossKPa(f, idMm[k]!, rec[r + 0 /* LEQ */]!, roughnessMm[k]!, w.nu, w.rho)
      } else {
        fr = 0
      }
      rec[r + 4 /* FRICTION */] = fr
    } else {
      fr = rec[r + 4 /* FRICTION */]!
      s = irec[i + 2 /* SIZE */]!
    }
    if (pressures !== 0) {
      const p = irec[i + 4 /* PARENT */]!
      let inP: number
      if (p >= 0) {
        inP = rec[p * 6 + 5 /* OUT_P */]!
        // As nodeOut (pressures.ts): a valve caps, a device loses; a junction passes on.
        if (irec[i + 3 /* FLAGS */]! & 4 /* AFTER_DEVICE */) {
          const v = from[q]!
          inP = Math.min(inP, cap[v]!) - devLoss[v]!
        }
      } else {
        inP = from[q] === supply ? supplyKPa : unknown
      }
      // NaN marks an unknown pressure: not reached from the supply, or a pipe on the way unsized.
      const out = s >= 0 ? inP - (fr + rec[r + 1 /* RISE */]!) : unknown // as dropAt
      rec[r + 5 /* OUT_P */] = out
      // As marginAt (pressures.ts), which builds the margin tree from the same numbers: +Infinity
      // where nothing is required (REQ is -Infinity), NaN where unknown (never the smallest).
      const margin = out - rec[r + 2 /* REQ */]!
      if (margin < minMargin && !(givenUp !== 0 && irec[i + 3 /* FLAGS */]! & 1) /* GIVEN_UP */) {
        minMargin = margin
      }
    }
  }
  e.sweepUnsized = unsized
  e.sweepMargin = minMargin
  return q
}

/** Load, flow, size and friction of pipe q from its sums (pressures untouched). */
export function hydraulicsAt(e: Engine, q: number): void {
  sweep(e, q, q + 1, HYDRAULICS)
}

/** Friction of pipe q at its current size (after the budget enlarged it). */
export function sizeHydraulics(e: Engine, q: number): void {
  const s = e.irec[q * IREC + SIZE]!
  const f = e.rec[q * REC + FLOW]!
  const leq = e.rec[q * REC + LEQ]!
  let fr = 0
  if (s >= 0 && f > 0) {
    if (e.darcy) {
      const k = e.matStart[q]! + s
      const t = e.sizes
      const w = e.g.hot[q] ? e.water.hot : e.water.cold
      fr = darcyLossKPa(f, t.idMm[k]!, leq, t.roughnessMm[k]!, w.nu, w.rho)
    } else {
      fr = perMetre(e, q, s, hwFlowTerm(f)) * leq
    }
  }
  e.rec[q * REC + FRICTION] = fr
}

/** Sums, sizes and pressures from scratch, then the pressure budget if some fixture is short. */
export function recomputeAll(e: Engine): void {
  sumLoads(e)
  clearBudget(e)
  // Pre-order: a pipe's parent is done before it, so sizes and pressures share one sweep.
  const minMargin = sweep(e, 0, e.g.pipeCount, HYDRAULICS | PRESSURES)
  e.unsizedCount = e.sweepUnsized
  deferMargins(e)
  updatePrvInlets(e)
  e.stale = false
  if (e.unsizedCount === 0 && minMargin < 0) budgetRounds(e)
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
