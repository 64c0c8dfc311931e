/**
 * Load to probable flow: linear interpolation in a Hunter demand table. The code tables list points
 * only; straight-line interpolation is common practice (M; "interpolating if needed", C* [S8]).
 */
import type { DemandPoint } from './demand-tables.ts'
import { GPM_TO_LPS } from './units.ts'

/** A probable flow and how it was read from the table. */
export interface DemandReading {
  gpm: number
  lps: number
  /** 'interpolated' inside the table, 'below-first-row', or 'beyond-last-row' (extrapolated). */
  range: 'interpolated' | 'below-first-row' | 'beyond-last-row' | 'zero'
}

/**
 * Probable flow for `load` WSFU from one table column.
 * Below the first row: the flush-tank column runs straight from the origin (0.25 WSFU → 0.75 gpm,
 * which matches IPC Table 604.3's drinking fountain, C [S3]); the flush-valve column, which starts
 * at 5 WSFU, keeps its first value, since a pipe serving a flush valve never carries less than one
 * valve's flow (C [S5], minimum = largest fixture). Beyond the last row the last segment is
 * extended and the caller reports it.
 */
export function readDemand(column: DemandPoint[], load: number): DemandReading {
  if (!(load > 0)) return { gpm: 0, lps: 0, range: 'zero' }
  const first = column[0]!
  if (load < first.load) {
    const gpm = first.load <= 1 ? (first.gpm * load) / first.load : first.gpm
    return { gpm, lps: gpm * GPM_TO_LPS, range: 'below-first-row' }
  }
  const n = column.length
  const last = column[n - 1]!
  if (load > last.load) {
    const prev = column[n - 2]!
    const gpm = last.gpm + ((load - last.load) * (last.gpm - prev.gpm)) / (last.load - prev.load)
    return { gpm, lps: gpm * GPM_TO_LPS, range: 'beyond-last-row' }
  }
  const gpm = interpolateGpm(column, load)
  return { gpm, lps: gpm * GPM_TO_LPS, range: 'interpolated' }
}

/** Linear interpolation inside the table: binary search for the segment holding `load`. */
function interpolateGpm(column: DemandPoint[], load: number): number {
  let lo = 0
  let hi = column.length - 1
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1
    if (column[mid]!.load <= load) lo = mid
    else hi = mid
  }
  const a = column[lo]!
  const b = column[hi]!
  return load === a.load ? a.gpm : a.gpm + ((load - a.load) * (b.gpm - a.gpm)) / (b.load - a.load)
}

/** Probable flow in L/s, as readDemand but without allocating (the engine's hot path). */
export function demandLps(column: DemandPoint[], load: number): number {
  if (!(load > 0)) return 0
  const n = column.length
  const first = column[0]!
  if (load <= first.load || load >= column[n - 1]!.load) return readDemand(column, load).lps
  return interpolateGpm(column, load) * GPM_TO_LPS
}
