/**
 * Hunter demand tables: fixture load (WSFU) to probable peak flow. Values in gpm as printed, with
 * the reference's status tag per row (/work/shared/reference/water-supply-sizing.md §1.2):
 * C1 = printed in the Engineering ToolBox copy [S5] that matches the IPC table; =IL = same value in
 * Illinois Table N [S6]; M = from memory. Both columns meet from 1000 WSFU up (C [S7]).
 */
import type { DemandCurve } from './types.ts'

/** One row of a demand column. */
export interface DemandPoint {
  load: number
  gpm: number
  status: string
}

/** A published demand table with one column per Hunter curve. */
export interface DemandTable {
  key: string
  label: string
  source: string
  columns: Record<DemandCurve, DemandPoint[]>
}

type Row = [load: number, gpm: number, status: string]
const points = (rows: Row[]): DemandPoint[] =>
  rows.map(([load, gpm, status]) => ({ load, gpm, status }))

// Rows from 1000 WSFU up are shared by both columns.
const UPPER: Row[] = [
  [1000, 208, 'M, =IL'],
  [1250, 239, 'M'],
  [1500, 269, 'M'],
  [1750, 297, 'M'],
  [2000, 325, 'M'],
  [2500, 380, 'M'],
  [3000, 433, 'M'],
  [4000, 525, 'M'],
  [5000, 593, 'M'],
]

const FLUSH_TANK: Row[] = [
  [1, 3.0, 'C1'],
  [2, 5.0, 'C1'],
  [3, 6.5, 'M'],
  [4, 8.0, 'C1'],
  [5, 9.4, 'M'],
  [6, 10.7, 'M'],
  [7, 11.8, 'M'],
  [8, 12.8, 'C1'],
  [9, 13.7, 'M'],
  [10, 14.6, 'M'],
  [11, 15.4, 'M'],
  [12, 16.0, 'M'],
  [13, 16.5, 'M'],
  [14, 17.0, 'M'],
  [15, 17.5, 'C1'],
  [16, 18.0, 'M'],
  [17, 18.4, 'M'],
  [18, 18.8, 'M'],
  [19, 19.2, 'M'],
  [20, 19.6, 'M'],
  [25, 21.5, 'M'],
  [30, 23.3, 'C1'],
  [35, 24.9, 'M'],
  [40, 26.3, 'M'],
  [45, 27.7, 'M'],
  [50, 29.1, 'C1'],
  [60, 32.0, 'M, =IL'],
  [70, 35.0, 'M, =IL'],
  [80, 38.0, 'M, =IL'],
  [90, 41.0, 'M, =IL'],
  [100, 43.5, 'M, =IL'],
  [120, 48.0, 'M, =IL'],
  [140, 52.5, 'M, =IL'],
  [160, 57.0, 'M, =IL'],
  [180, 61.0, 'M, =IL'],
  [200, 65.0, 'M, =IL'],
  [225, 70.0, 'M, =IL'],
  [250, 75.0, 'M, =IL'],
  [275, 80.0, 'M, =IL'],
  [300, 85.0, 'M, =IL'],
  [400, 105.0, 'M, =IL'],
  [500, 124.0, 'M (IL 125)'],
  [750, 170.0, 'M, =IL'],
]

const FLUSH_VALVE: Row[] = [
  [5, 15.0, 'C1'],
  [6, 17.4, 'M'],
  [7, 19.8, 'C1'],
  [8, 22.2, 'M'],
  [9, 24.6, 'M'],
  [10, 27.0, 'C1'],
  [11, 27.8, 'M'],
  [12, 28.6, 'M'],
  [13, 29.4, 'M'],
  [14, 30.2, 'M'],
  [15, 31.0, 'C1'],
  [16, 31.8, 'M'],
  [17, 32.6, 'M'],
  [18, 33.4, 'M'],
  [19, 34.2, 'M'],
  [20, 35.0, 'C1'],
  [25, 38.0, 'M'],
  [30, 42.0, 'C1'],
  [35, 44.0, 'M'],
  [40, 46.0, 'M'],
  [45, 48.0, 'M'],
  [50, 50.0, 'C1'],
  [60, 54.0, 'M'],
  [70, 58.0, 'M'],
  [80, 61.2, 'M'],
  [90, 64.3, 'M'],
  [100, 67.5, 'M'],
  [120, 73.0, 'M'],
  [140, 77.0, 'M'],
  [160, 81.0, 'M'],
  [180, 85.5, 'M'],
  [200, 90.0, 'M'],
  [225, 95.5, 'M'],
  [250, 101.0, 'M'],
  [275, 104.5, 'M'],
  [300, 108.0, 'M'],
  [400, 127.0, 'M'],
  [500, 143.0, 'M'],
  [750, 177.0, 'M'],
]

/** Key of the table the engine uses. */
export const IPC_DEMAND_TABLE = 'ipc-e103.3(3)'

/** Demand tables by key. Only tables with both columns complete enough to size with are shipped. */
export const DEMAND_TABLES: Record<string, DemandTable> = {
  [IPC_DEMAND_TABLE]: {
    key: IPC_DEMAND_TABLE,
    label: 'IPC Table E103.3(3), table for estimating demand (Hunter)',
    source:
      'IPC Appendix E Table E103.3(3) as printed by Engineering ToolBox [S5] (C1 rows) and ' +
      'Illinois Table N [S6] (=IL rows); other rows from memory (M)',
    columns: {
      'flush-tank': points([...FLUSH_TANK, ...UPPER]),
      'flush-valve': points([...FLUSH_VALVE, ...UPPER]),
    },
  },
}
