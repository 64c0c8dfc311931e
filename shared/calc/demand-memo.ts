/**
 * Memo of the per-pipe step that depends only on the load and the pipe's sizing class:
 * (load, demand curve, class) → probable flow, the Hazen-Williams flow term flow^1.852, the base
 * size and friction per metre of equivalent length. The class is what sizing reads besides the
 * flow: the material's capacity row in the pipe's system, a locked size and the fixture's minimum
 * size. A riser diagram repeats the same branch loads and classes floor after floor, so the
 * sizing sweep reads these instead of interpolating, raising to a power and scanning sizes for
 * every pipe. Direct-mapped, per engine (capacities depend on the project's velocity limits);
 * keys are compared exactly, so a hit returns the very numbers a miss computes.
 */

/** Capacity rows a class can name: flat size starts of both systems, plus "no material". */
export const MEMO_ROWS = 256
/** Sizes per material a class can name (locked and minimum size indices). */
export const MEMO_SIZES = 32
/** Distinct sizing classes; the key's factor for the load. */
export const MEMO_CLASSES = MEMO_ROWS * MEMO_SIZES * MEMO_SIZES

/**
 * The sizing class of a pipe: capacity row (-1: no material or an invalid pipe), locked size
 * index (-1: none) and the fixture's minimum size index.
 */
export function sizingClass(row: number, locked: number, minSize: number): number {
  return ((row + 1) * MEMO_SIZES + (locked + 1)) * MEMO_SIZES + minSize
}

/** Fields of a memo slot, side by side in `rows` (one slot = MEMO_STRIDE numbers). */
export const M_KEY = 0
export const M_LPS = 1
/** The Hazen-Williams flow term flow^1.852. */
export const M_POW = 2
/** Base size (before any budget enlargement), -1 when none fits. */
export const M_BASE = 3
/** Hazen-Williams friction, kPa per metre of equivalent length, at the base size. */
export const M_PER_M = 4
export const MEMO_STRIDE = 5

/** The memo: slots of MEMO_STRIDE numbers; the key is NaN in an empty slot. */
export interface DemandMemo {
  /** Hash shift: slot = (imul(key, golden) >>> shift). */
  shift: number
  rows: Float64Array
}

/** A memo with room for about `expected` distinct keys (at least 256 slots, at most 8,192). */
export function createDemandMemo(expected: number): DemandMemo {
  let bits = 8
  while (bits < 13 && 1 << bits < expected) bits++
  const rows = new Float64Array((1 << bits) * MEMO_STRIDE)
  for (let i = 0; i < rows.length; i += MEMO_STRIDE) rows[i + M_KEY] = NaN
  return { shift: 32 - bits, rows }
}

/*
 * Key and slot, computed inline by the sizing sweep (hydraulics.ts), where a call or a read of
 * an imported constant costs a noticeable share of the loop:
 *   key  = (milli × MEMO_CLASSES + class) × 2 + curve — exact below 2^34 milli-WSFU (17 million
 *          WSFU), with milli the load in milli-WSFU (an integer) and curve 0 flush tank, 1 flush
 *          valve;
 *   slot = imul(milli ^ imul(class × 2 + curve, 0x85ebca6b), 0x9e3779b1) >>> shift — hashed
 *          from the parts, which are int32: the key itself passes 2^31, and truncating such a
 *          double to an integer takes V8's slow path.
 */
