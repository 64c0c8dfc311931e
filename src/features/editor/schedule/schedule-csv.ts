/**
 * The pipe schedule as CSV text: a plain table a spreadsheet opens (header row first, no comment
 * lines), numbers in the chosen units without unit symbols, the units in the headers.
 */
import Papa from 'papaparse'
import { toDisplay, type Quantity } from '@shared/units/quantities'
import type { UnitSystem } from '@shared/units/system'
import { columnTitle, type ScheduleColumnKey } from './schedule-columns'
import { curveText, type ScheduleRow } from '@shared/schedule/schedule-rows'

// Decimals kept per quantity: finer than the screen so a reviewer can recompute, but no float noise.
const DECIMALS: Record<Quantity | 'load', Record<UnitSystem, number>> = {
  load: { si: 2, us: 2 },
  flow: { si: 3, us: 2 },
  pressure: { si: 1, us: 2 },
  length: { si: 2, us: 1 },
  elevation: { si: 2, us: 1 },
  velocity: { si: 2, us: 2 },
  diameter: { si: 2, us: 3 },
}

/** Rounds a value for the CSV; null stays null (an empty cell). */
export function csvNumber(
  quantity: Quantity | 'load',
  si: number | null,
  units: UnitSystem,
): number | null {
  if (si === null || !Number.isFinite(si)) return null
  const display = quantity === 'load' ? si : toDisplay(quantity, si, units)
  const rounded = Number(display.toFixed(DECIMALS[quantity][units]))
  // Avoid "-0" in a cell.
  return rounded === 0 ? 0 : rounded
}

type Cell = string | number | null

interface CsvColumn {
  header: (units: UnitSystem) => string
  value: (row: ScheduleRow, units: UnitSystem) => Cell
}

const titled = (key: ScheduleColumnKey) => (units: UnitSystem) => columnTitle(key, units)
const fixed = (text: string) => () => text
const quantity =
  (q: Quantity | 'load', pick: (row: ScheduleRow) => number | null) =>
  (row: ScheduleRow, units: UnitSystem) =>
    csvNumber(q, pick(row), units)

// The ends get an id column and a label column each, so a spreadsheet can filter on either.
const CSV_COLUMNS: CsvColumn[] = [
  { header: titled('id'), value: (r) => r.id },
  { header: fixed('From'), value: (r) => r.from.id },
  { header: fixed('From label'), value: (r) => r.from.label },
  { header: fixed('To'), value: (r) => r.to.id },
  { header: fixed('To label'), value: (r) => r.to.label },
  { header: titled('system'), value: (r) => r.system },
  { header: titled('load'), value: quantity('load', (r) => r.load) },
  { header: titled('closets'), value: (r) => r.closets },
  { header: titled('urinals'), value: (r) => r.urinals },
  { header: titled('curve'), value: (r) => (r.curve ? curveText(r.curve) : null) },
  { header: titled('flow'), value: quantity('flow', (r) => r.flowLps) },
  { header: titled('material'), value: (r) => r.materialLabel },
  { header: titled('nominal'), value: (r) => (r.nominal === null ? null : r.text.nominal) },
  { header: fixed('Size locked'), value: (r) => (r.locked ? 'yes' : 'no') },
  { header: titled('insideDiameter'), value: quantity('diameter', (r) => r.insideDiameterMm) },
  { header: titled('velocity'), value: quantity('velocity', (r) => r.velocityMps) },
  { header: titled('length'), value: quantity('length', (r) => r.lengthM) },
  { header: titled('equivalentLength'), value: quantity('length', (r) => r.equivalentLengthM) },
  { header: titled('loss'), value: quantity('pressure', (r) => r.lossKPa) },
  { header: titled('inletPressure'), value: quantity('pressure', (r) => r.inletPressureKPa) },
  { header: titled('outletPressure'), value: quantity('pressure', (r) => r.outletPressureKPa) },
  { header: titled('status'), value: (r) => r.text.status },
]

/** Header row of the CSV in a unit system. */
export function scheduleCsvHeaders(units: UnitSystem): string[] {
  return CSV_COLUMNS.map((c) => c.header(units))
}

/**
 * CSV text of `rows` in `units`. `rows` must have been built for the same units (the size column
 * reuses their display text). Cells that start like a formula are escaped by Papa.
 */
export function scheduleCsv(rows: readonly ScheduleRow[], units: UnitSystem): string {
  return Papa.unparse(
    {
      fields: scheduleCsvHeaders(units),
      data: rows.map((row) => CSV_COLUMNS.map((c) => c.value(row, units))),
    },
    // CRLF is what RFC 4180 and spreadsheets expect; a label like "=1+1" must not run as a formula.
    { newline: '\r\n', escapeFormulae: true },
  )
}

/** Lower-case ASCII words joined by hyphens; accents are dropped, never the letter. */
export function slugify(text: string): string {
  return text
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 80)
    .replace(/-+$/, '')
}

/**
 * Download name of the schedule, e.g. `scheduleFileName('Fernhollow Hall', 'us')` →
 * `'fernhollow-hall-pipe-schedule-us.csv'`. A name with nothing usable falls back to "diagram".
 */
export function scheduleFileName(diagramName: string, units: UnitSystem): string {
  return `${slugify(diagramName) || 'diagram'}-pipe-schedule-${units}.csv`
}
