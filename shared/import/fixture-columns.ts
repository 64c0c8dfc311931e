/**
 * The fixture schedule CSV: one row per fixture type in a room. The column list is the single
 * definition the parser, the template and the docs (docs/diagram-format.md) follow.
 */
import type { Level } from '../document/model.ts'

/** Column keys, in template order; headers match them case-insensitively. */
export const FIXTURE_COLUMNS = ['room', 'level', 'fixture', 'count', 'occupancy'] as const
export type FixtureColumn = (typeof FIXTURE_COLUMNS)[number]

/** Columns a file must have; `occupancy` may be left out (the project setting applies). */
export const REQUIRED_COLUMNS: readonly FixtureColumn[] = ['room', 'level', 'fixture', 'count']

/** What each column means, for the dialog and the docs. */
export const COLUMN_HELP: Record<FixtureColumn, string> = {
  room: 'Room name; fixtures of one room on one level hang off the same junction',
  level: 'Level name or id from the diagram (leave empty when the diagram has no levels)',
  fixture: 'Fixture catalogue key or label, e.g. lavatory or "Water closet, flush valve"',
  count: 'Number of identical fixtures, a whole number from 1 to 500',
  occupancy: 'public or private; empty = the project setting',
}

/** Largest file the import reads: 3 ops per row must stay inside one batch. */
export const MAX_IMPORT_ROWS = 2000

/**
 * Height of a fixture connection above its floor, m. Common practice, no source (the demo uses
 * the same); the designer edits elevations per fixture.
 */
export const FIXTURE_HEIGHT_M = 1.0

const quote = (value: string) => (/[",\n]/.test(value) ? `"${value.replace(/"/g, '""')}"` : value)

/**
 * Template CSV with the header and a few example rows on the diagram's first level.
 * @example fixtureTemplateCsv([]).split('\n')[0] // 'room,level,fixture,count,occupancy'
 */
export function fixtureTemplateCsv(levels: readonly Level[]): string {
  const level = levels[0]?.name ?? ''
  const rows = [
    [...FIXTURE_COLUMNS],
    ['Washroom 101', level, 'water-closet-flush-valve', '3', 'public'],
    ['Washroom 101', level, 'lavatory', '3', ''],
    ['Kitchenette', level, 'kitchen-sink', '1', ''],
    ['Janitor closet', level, 'service-sink', '1', 'private'],
  ]
  return rows.map((row) => row.map(quote).join(',')).join('\r\n') + '\r\n'
}
