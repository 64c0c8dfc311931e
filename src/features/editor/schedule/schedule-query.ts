/**
 * Sorting and filtering of schedule rows. Sorting reads the SI numbers, never the display text, so
 * "10" sorts after "9" and a switch of units keeps the order.
 */
import { nominalInches } from '@shared/units/nominal'
import type { ScheduleColumnKey } from './schedule-columns'
import type { ScheduleRow, ScheduleStatus } from '@shared/schedule/schedule-rows'

/** What the schedule's filter bar asks for. */
export interface ScheduleFilter {
  system: 'all' | 'cold' | 'hot'
  /** Matched, case-insensitively, against the pipe id and both ends' ids and labels. */
  search: string
  problemsOnly: boolean
}

/** A filter that keeps every row. */
export const NO_FILTER: ScheduleFilter = { system: 'all', search: '', problemsOnly: false }

// Worse states sort higher, so a descending sort puts errors first.
const STATUS_RANK: Record<ScheduleStatus, number> = {
  ok: 0,
  warning: 1,
  'not-computed': 2,
  error: 3,
}

type SortKey = number | string | null

/** Direction of a sort, as the table reports it. */
export type SortOrder = 'ascend' | 'descend'

/** The value a column sorts by; null for a value the calculation did not produce. */
export function sortKey(row: ScheduleRow, key: ScheduleColumnKey): SortKey {
  switch (key) {
    case 'id':
      return row.id
    case 'from':
      return row.from.label || row.from.id
    case 'to':
      return row.to.label || row.to.id
    case 'system':
      return row.system
    case 'load':
      return row.load
    case 'closets':
      return row.closets
    case 'urinals':
      return row.urinals
    case 'curve':
      return row.curve
    case 'flow':
      return row.flowLps
    case 'material':
      return row.materialLabel
    case 'nominal':
      return row.nominal === null ? null : nominalInches(row.nominal)
    case 'insideDiameter':
      return row.insideDiameterMm
    case 'velocity':
      return row.velocityMps
    case 'length':
      return row.lengthM
    case 'equivalentLength':
      return row.equivalentLengthM
    case 'loss':
      return row.lossKPa
    case 'inletPressure':
      return row.inletPressureKPa
    case 'outletPressure':
      return row.outletPressureKPa
    case 'status':
      return STATUS_RANK[row.status]
  }
}

// Natural order for ids and labels: p2 before p10.
const collator = new Intl.Collator('en', { numeric: true, sensitivity: 'base' })

function compareKeys(a: number | string, b: number | string): number {
  if (typeof a === 'number' && typeof b === 'number') return a - b
  return collator.compare(String(a), String(b))
}

/**
 * Comparator for a column in either direction. Missing values go last both ways (they are the rows
 * to look at, but not mixed in with the largest); ties fall back to the pipe id, ascending, so the
 * order does not depend on the document's order.
 */
export function compareScheduleRows(key: ScheduleColumnKey, order: SortOrder = 'ascend') {
  const sign = order === 'ascend' ? 1 : -1
  return (a: ScheduleRow, b: ScheduleRow): number => {
    const ka = sortKey(a, key)
    const kb = sortKey(b, key)
    if (ka === null || kb === null) {
      if (ka !== kb) return ka === null ? 1 : -1
    } else {
      const byKey = compareKeys(ka, kb)
      if (byKey !== 0) return sign * byKey
    }
    return collator.compare(a.id, b.id)
  }
}

/** Rows sorted by `key` in `order`; `false` keeps the document's order. */
export function sortScheduleRows(
  rows: readonly ScheduleRow[],
  key: ScheduleColumnKey | null,
  order: SortOrder | false,
): ScheduleRow[] {
  if (key === null || order === false) return rows.slice()
  return rows.slice().sort(compareScheduleRows(key, order))
}

/** Rows that pass the filter, in their given order. */
export function filterScheduleRows(
  rows: readonly ScheduleRow[],
  filter: ScheduleFilter,
): ScheduleRow[] {
  const needle = filter.search.trim().toLowerCase()
  return rows.filter((row) => {
    if (filter.system !== 'all' && row.system !== filter.system) return false
    if (filter.problemsOnly && row.status === 'ok') return false
    if (needle === '') return true
    const haystack = [row.id, row.from.id, row.from.label, row.to.id, row.to.label]
    return haystack.some((text) => text.toLowerCase().includes(needle))
  })
}
