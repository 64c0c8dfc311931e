/**
 * Diminishing fixture-unit series for flush valve water closets and urinals (UPC practice: the
 * Los Angeles plan-check worksheet for UPC 2009 Tables 6-5/6-6, C* [S18]; reference §2.3).
 * The two kinds are counted as separate series on each pipe (M: as the worksheet implies).
 */
import type { FlushValveKind } from './fixtures.ts'

/** Increments per flush valve, in order; after the listed ones each further valve adds `then`. */
export const FLUSH_VALVE_SERIES: Record<FlushValveKind, { steps: number[]; then: number }> = {
  closet: { steps: [40, 30, 20, 15], then: 10 },
  urinal: { steps: [20, 15, 10, 8], then: 5 },
}

/** Increment added by the `n`-th flush valve of a kind (n from 1). */
export function seriesStep(kind: FlushValveKind, n: number): number {
  const { steps, then } = FLUSH_VALVE_SERIES[kind]
  return n <= steps.length ? steps[n - 1]! : then
}

/** Fixture units of `count` flush valves of one kind on one pipe (running total of the series). */
export function seriesLoad(kind: FlushValveKind, count: number): number {
  if (!(count > 0)) return 0
  const { steps, then } = FLUSH_VALVE_SERIES[kind]
  let sum = 0
  const listed = Math.min(count, steps.length)
  for (let i = 0; i < listed; i++) sum += steps[i]!
  return sum + (count - listed) * then
}

/** Running totals of each series for 0 … 63 valves, so the sizing loop reads instead of adds. */
export const SERIES_TOTALS: Record<FlushValveKind, Float64Array> = {
  closet: Float64Array.from({ length: 64 }, (_, n) => seriesLoad('closet', n)),
  urinal: Float64Array.from({ length: 64 }, (_, n) => seriesLoad('urinal', n)),
}

/** seriesLoad from a SERIES_TOTALS row (same integers, so the same result). */
export function seriesFromTotals(totals: Float64Array, then: number, count: number): number {
  if (!(count > 0)) return 0
  const last = totals.length - 1
  return count <= last ? totals[count]! : totals[last]! + (count - last) * then
}
