/**
 * Fixture schedule CSV → preview: every row accepted or rejected with its reasons, grouped into
 * rooms. Nothing is applied here; the dialog shows this and the designer decides.
 */
import Papa from 'papaparse'
import { FIXTURES } from '../calc/fixtures.ts'
import type { Diagram } from '../document/model.ts'
import {
  FIXTURE_COLUMNS,
  MAX_IMPORT_ROWS,
  REQUIRED_COLUMNS,
  type FixtureColumn,
} from './fixture-columns.ts'
import {
  checkFixtureRow,
  fixtureRowSchema,
  type FixtureCells,
  type FixtureRow,
} from './fixture-row.ts'

/** One data row of the file as the preview shows it. */
export interface PreviewRow {
  line: number
  cells: FixtureCells
  status: 'accepted' | 'error'
  errors: string[]
  /** Accepted, but worth a look (a repeated row). */
  warnings: string[]
  row: FixtureRow | null
}

/** The accepted rows of one room on one level: they share a feeding junction. */
export interface RoomGroup {
  key: string
  room: string
  levelId: string | null
  levelName: string
  lines: number[]
  fixtures: number
  /** Some fixture of the room takes hot water. */
  usesHot: boolean
}

export interface FixturePreview {
  /** Problems with the file as a whole; no row can be imported while there are any. */
  fileErrors: string[]
  /** Things ignored on purpose (unused columns), said out loud. */
  notices: string[]
  rows: PreviewRow[]
  rooms: RoomGroup[]
  accepted: number
  rejected: number
}

export const roomKey = (levelId: string | null, room: string) =>
  `${levelId ?? ''}\u0000${room.toLowerCase()}`

const emptyCells = (): FixtureCells =>
  Object.fromEntries(FIXTURE_COLUMNS.map((c) => [c, ''])) as FixtureCells

const blank = (cells: readonly string[]) => cells.every((cell) => cell.trim() === '')

function readHeader(header: readonly string[], preview: FixturePreview) {
  const columns = new Map<FixtureColumn, number>()
  header.forEach((raw, at) => {
    const name = raw.trim().toLowerCase()
    if (name === '') return
    if (!(FIXTURE_COLUMNS as readonly string[]).includes(name)) {
      preview.notices.push(`Column "${raw.trim()}" is not used and is ignored.`)
    } else if (columns.has(name as FixtureColumn)) {
      preview.fileErrors.push(`Column "${name}" appears twice in the header.`)
    } else columns.set(name as FixtureColumn, at)
  })
  const missing = REQUIRED_COLUMNS.filter((c) => !columns.has(c))
  if (missing.length) {
    preview.fileErrors.push(
      `The header lacks column${missing.length > 1 ? 's' : ''} ${missing.map((c) => `"${c}"`).join(', ')}; ` +
        `expected ${FIXTURE_COLUMNS.join(', ')} (download the template).`,
    )
  }
  return columns
}

function groupRooms(doc: Diagram, rows: PreviewRow[]): RoomGroup[] {
  const rooms = new Map<string, RoomGroup>()
  for (const { row } of rows) {
    if (!row) continue
    const key = roomKey(row.levelId, row.room)
    const group = rooms.get(key) ?? {
      key,
      room: row.room,
      levelId: row.levelId,
      levelName: doc.levels.find((l) => l.id === row.levelId)?.name ?? '',
      lines: [],
      fixtures: 0,
      usesHot: false,
    }
    group.lines.push(row.line)
    group.fixtures += row.count
    group.usesHot ||= FIXTURES[row.fixture]?.supplies.hot ?? false
    rooms.set(key, group)
  }
  return [...rooms.values()]
}

function markRepeats(rows: PreviewRow[]) {
  const seen = new Map<string, number>()
  for (const preview of rows) {
    const row = preview.row
    if (!row) continue
    const key = `${roomKey(row.levelId, row.room)}\u0000${row.fixture}\u0000${row.occupancy ?? ''}`
    const first = seen.get(key)
    if (first === undefined) seen.set(key, row.line)
    else preview.warnings.push(`Same room, level and fixture as row ${first}; both are imported.`)
  }
}

/**
 * Reads a fixture schedule for `doc` (its levels name the `level` column's values).
 * @example
 * const preview = previewFixtureCsv('room,level,fixture,count\nWC 1,Ground,lavatory,2\n', doc)
 * preview.rows[0].status // 'accepted'
 */
export function previewFixtureCsv(text: string, doc: Diagram): FixturePreview {
  const preview: FixturePreview = {
    fileErrors: [],
    notices: [],
    rows: [],
    rooms: [],
    accepted: 0,
    rejected: 0,
  }
  const parsed = Papa.parse<string[]>(text.replace(/^\uFEFF/, ''), {
    header: false,
    skipEmptyLines: false,
  })
  const data = parsed.data
  // Spreadsheet line of each parsed row: a quoted cell may hold line breaks of its own.
  const lines: number[] = []
  data.reduce((line, cells, i) => {
    lines[i] = line
    return line + 1 + cells.reduce((n, cell) => n + (cell.match(/\r\n|\r|\n/g)?.length ?? 0), 0)
  }, 1)
  const headerAt = data.findIndex((cells) => !blank(cells))
  if (headerAt < 0) {
    preview.fileErrors.push('The file is empty; download the template for the expected columns.')
    return preview
  }
  const columns = readHeader(data[headerAt]!, preview)
  const parseErrors = new Map<number, string[]>()
  for (const error of parsed.errors) {
    if (error.code === 'UndetectableDelimiter' || error.row === undefined) continue
    parseErrors.set(error.row, [...(parseErrors.get(error.row) ?? []), error.message])
  }
  const body = data.map((cells, i) => ({ cells, i })).slice(headerAt + 1)
  const records = body.filter(({ cells }) => !blank(cells))
  if (records.length === 0) preview.fileErrors.push('The file has a header but no fixture rows.')
  if (records.length > MAX_IMPORT_ROWS) {
    preview.fileErrors.push(
      `The file has ${records.length} fixture rows; one import takes at most ${MAX_IMPORT_ROWS}. ` +
        'Split the file and import the parts one after another.',
    )
  }
  if (preview.fileErrors.length) return preview

  const schema = fixtureRowSchema(doc.levels)
  const width = data[headerAt]!.length
  for (const { cells, i } of records) {
    const line = lines[i]!
    const named = emptyCells()
    for (const [column, at] of columns) named[column] = cells[at] ?? ''
    const errors = (parseErrors.get(i) ?? []).map((message) => `Row ${line}: ${message}`)
    if (cells.slice(width).some((cell) => cell.trim() !== '')) {
      errors.push(`Row ${line} has ${cells.length} values but the header names ${width} columns.`)
    }
    const check = checkFixtureRow(schema, named, line)
    if (!check.ok) errors.push(...check.errors)
    const row = errors.length === 0 && check.ok ? check.row : null
    preview.rows.push({
      line,
      cells: named,
      status: row ? 'accepted' : 'error',
      errors,
      warnings: [],
      row,
    })
  }
  markRepeats(preview.rows)
  preview.rooms = groupRooms(doc, preview.rows)
  preview.accepted = preview.rows.filter((r) => r.status === 'accepted').length
  preview.rejected = preview.rows.length - preview.accepted
  return preview
}
