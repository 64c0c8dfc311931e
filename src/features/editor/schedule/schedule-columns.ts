/**
 * The pipe schedule's columns: one list that the table and the CSV both read, so a header says the
 * same thing on screen and in the spreadsheet. Quantity columns carry their unit in the title;
 * their cells hold bare numbers.
 */
import { SCHEDULE_COLUMN_KEYS, type ScheduleColumnKey } from '@shared/schedule/schedule-rows'
import { unitSymbol, type Quantity } from '@shared/units/quantities'
import type { UnitSystem } from '@shared/units/system'

export { SCHEDULE_COLUMN_KEYS, type ScheduleColumnKey }

interface ColumnSpec {
  title: string
  /** Quantity whose unit the title names; 'load' is fixture units in both systems. */
  unit?: Quantity | 'load'
  /** Right-aligned numeric column. */
  numeric?: boolean
}

const SPECS: Record<ScheduleColumnKey, ColumnSpec> = {
  id: { title: 'Pipe' },
  from: { title: 'From' },
  to: { title: 'To' },
  system: { title: 'System' },
  load: { title: 'Load', unit: 'load', numeric: true },
  closets: { title: 'Flush valve closets', numeric: true },
  urinals: { title: 'Flush valve urinals', numeric: true },
  curve: { title: 'Demand curve' },
  flow: { title: 'Flow', unit: 'flow', numeric: true },
  material: { title: 'Material' },
  // No unit in the title: each cell names its own (DN50, 1-1/4"), which also keeps a spreadsheet
  // from reading 1/2 as a date.
  nominal: { title: 'Size' },
  insideDiameter: { title: 'Inside diameter', unit: 'diameter', numeric: true },
  velocity: { title: 'Velocity', unit: 'velocity', numeric: true },
  length: { title: 'Developed length', unit: 'length', numeric: true },
  equivalentLength: { title: 'Equivalent length', unit: 'length', numeric: true },
  loss: { title: 'Friction loss', unit: 'pressure', numeric: true },
  inletPressure: { title: 'Inlet pressure', unit: 'pressure', numeric: true },
  outletPressure: { title: 'Outlet pressure', unit: 'pressure', numeric: true },
  status: { title: 'Status' },
}

function unitText(unit: NonNullable<ColumnSpec['unit']>, units: UnitSystem): string {
  return unit === 'load' ? 'FU' : unitSymbol(unit, units)
}

/**
 * Header text of a column in a unit system.
 * @example columnTitle('flow', 'us') // 'Flow (gpm)'
 */
export function columnTitle(key: ScheduleColumnKey, units: UnitSystem): string {
  const spec = SPECS[key]
  return spec.unit ? `${spec.title} (${unitText(spec.unit, units)})` : spec.title
}

/** True for columns holding numbers (aligned right, sorted numerically). */
export function isNumericColumn(key: ScheduleColumnKey): boolean {
  return SPECS[key].numeric === true
}
