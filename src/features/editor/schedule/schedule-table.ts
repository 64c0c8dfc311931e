/**
 * NDataTable columns of the pipe schedule. Sorting is done by the view (the table runs `remote`),
 * so the columns only show the sort state they are given.
 */
import type { UnitSystem } from '@shared/units/system'
import { NTag, type DataTableColumns } from 'naive-ui'
import { h } from 'vue'
import {
  columnTitle,
  isNumericColumn,
  SCHEDULE_COLUMN_KEYS,
  type ScheduleColumnKey,
} from './schedule-columns'
import type { SortOrder } from './schedule-query'
import type { ScheduleRow } from '@shared/schedule/schedule-rows'

/** The sort the table shows; null key = the document's order. */
export interface ScheduleSort {
  key: ScheduleColumnKey | null
  order: SortOrder | false
}

// Fixed widths keep the virtual rows aligned with the header and give scroll-x its total.
const WIDTHS: Record<ScheduleColumnKey, number> = {
  id: 128,
  from: 170,
  to: 170,
  system: 96,
  load: 90,
  closets: 100,
  urinals: 100,
  curve: 110,
  flow: 100,
  material: 170,
  nominal: 80,
  insideDiameter: 120,
  velocity: 110,
  length: 130,
  equivalentLength: 140,
  loss: 120,
  inletPressure: 130,
  outletPressure: 130,
  status: 190,
}

/**
 * Row count from which the table renders only the visible rows. Below it every row is in the DOM:
 * no gain from virtualising, and rows keep their natural height and stay findable by the browser.
 */
export const VIRTUAL_SCROLL_FROM = 200

/** Total width of the columns, px (the table's scroll-x). */
export const SCHEDULE_WIDTH = Object.values(WIDTHS).reduce((sum, w) => sum + w, 0)

function statusCell(row: ScheduleRow) {
  if (row.status === 'ok') return h('span', { class: 'status-ok' }, 'ok')
  const type = row.status === 'error' ? 'error' : 'warning'
  return h(
    NTag,
    { size: 'small', type, bordered: false, title: row.problems.map((p) => p.message).join('\n') },
    () => row.text.status,
  )
}

function cell(key: ScheduleColumnKey, row: ScheduleRow) {
  if (key === 'id') return h('span', { 'data-testid': `schedule-pipe-${row.id}` }, row.id)
  if (key === 'status') return statusCell(row)
  if (key === 'nominal' && row.locked && row.nominal !== null) {
    return h('span', { title: 'Size locked by the designer' }, `${row.text.nominal} (locked)`)
  }
  return row.text[key]
}

/** Columns for the rows built in `units`, showing `sort`. */
export function scheduleColumns(
  units: UnitSystem,
  sort: ScheduleSort,
): DataTableColumns<ScheduleRow> {
  return SCHEDULE_COLUMN_KEYS.map((key) => ({
    key,
    title: columnTitle(key, units),
    width: WIDTHS[key],
    fixed: key === 'id' ? 'left' : undefined,
    align: isNumericColumn(key) ? 'right' : 'left',
    ellipsis: key === 'from' || key === 'to' || key === 'material' ? { tooltip: true } : false,
    sorter: true,
    sortOrder: sort.key === key ? sort.order : false,
    render: (row: ScheduleRow) => cell(key, row),
  }))
}
