/**
 * Demand columns compiled for the sizing loop: the rows as two number arrays plus, for every whole
 * WSFU up to the last row, the row that starts its segment. Every row of the shipped tables sits
 * at a whole WSFU (demand-tables.ts), so floor(load) finds the segment in one read instead of a
 * binary search; the arithmetic is then the same as readDemand's, to the last bit.
 */
import type { DemandPoint } from './demand-tables.ts'
import { GPM_TO_LPS } from './units.ts'

/** A demand column as arrays. */
export interface DemandColumn {
  load: Float64Array
  gpm: Float64Array
  /** seg[L]: index of the row starting the segment that holds loads in [L, L + 1). */
  seg: Int32Array
}

/** Compiles a column; throws when a row is not at a whole WSFU (the lookup would be wrong). */
export function compileColumn(column: DemandPoint[]): DemandColumn {
  const n = column.length
  const load = Float64Array.from(column, (p) => p.load)
  const gpm = Float64Array.from(column, (p) => p.gpm)
  if (load.some((l) => !Number.isInteger(l))) throw new Error('demand rows must be whole WSFU')
  const last = load[n - 1]!
  const seg = new Int32Array(last + 1)
  let lo = 0
  for (let L = 0; L <= last; L++) {
    while (lo < n - 2 && load[lo + 1]! <= L) lo++
    seg[L] = lo
  }
  return { load, gpm, seg }
}

/**
 * Probable flow in L/s for `load` WSFU: equal to demandLps(column, load) (demand.ts) bit for bit,
 * including below the first row and beyond the last.
 */
export function columnLps(c: DemandColumn, load: number): number {
  if (!(load > 0)) return 0
  const L = c.load
  const G = c.gpm
  const first = L[0]!
  let gpm: number
  if (load < first) {
    gpm = first <= 1 ? (G[0]! * load) / first : G[0]!
  } else {
    const n = L.length
    const last = L[n - 1]!
    if (load > last) {
      gpm = G[n - 1]! + ((load - last) * (G[n - 1]! - G[n - 2]!)) / (last - L[n - 2]!)
    } else {
      const lo = c.seg[Math.floor(load)]!
      const a = L[lo]!
      gpm = load === a ? G[lo]! : G[lo]! + ((load - a) * (G[lo + 1]! - G[lo]!)) / (L[lo + 1]! - a)
    }
  }
  return gpm * GPM_TO_LPS
}
