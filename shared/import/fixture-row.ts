/**
 * One row of the fixture schedule CSV: a zod schema built for the diagram's levels, and the
 * check that turns raw cells into a typed row or messages naming the row and the column.
 */
import { z } from 'zod'
import { FIXTURES } from '../calc/fixtures.ts'
import type { Level, Occupancy } from '../document/model.ts'
import { FIXTURE_COLUMNS, type FixtureColumn } from './fixture-columns.ts'

/** A row that passed: what the import places. */
export interface FixtureRow {
  /** Line in the file (the header is line 1), as a spreadsheet numbers it. */
  line: number
  room: string
  /** Null when the diagram has no levels. */
  levelId: string | null
  /** Catalogue key. */
  fixture: string
  count: number
  occupancy?: Occupancy
}

/** Raw cell text by column; a missing column reads as ''. */
export type FixtureCells = Record<FixtureColumn, string>

export type RowCheck = { ok: true; row: FixtureRow } | { ok: false; errors: string[] }

/** Key or label to a comparable slug: "Water closet, flush valve" → "water-closet-flush-valve". */
const slug = (text: string) =>
  text
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-|-$/g, '')

const FIXTURE_BY_SLUG = new Map<string, string>()
for (const spec of Object.values(FIXTURES)) {
  FIXTURE_BY_SLUG.set(slug(spec.label), spec.key)
  FIXTURE_BY_SLUG.set(slug(spec.key), spec.key)
}

/** "did you mean" for up to three keys that contain the text, else every key. */
function unknownFixture(text: string): string {
  const wanted = slug(text)
  const near = Object.values(FIXTURES)
    .filter((f) => wanted && (f.key.includes(wanted) || slug(f.label).includes(wanted)))
    .map((f) => f.key)
  const hint =
    near.length > 0 && near.length <= 3
      ? `did you mean ${near.length > 1 ? `${near.slice(0, -1).join(', ')} or ${near.at(-1)}` : near[0]}?`
      : `keys: ${Object.keys(FIXTURES).join(', ')}`
  return `"${text}" is not in the fixture catalogue; ${hint}`
}

const levelList = (levels: readonly Level[]) => levels.map((level) => level.name).join(', ')

/** The schema of one row's cells for a diagram with `levels`. */
export function fixtureRowSchema(levels: readonly Level[]) {
  const cell = () => z.string().trim()
  return z.object({
    room: cell()
      .min(1, 'is empty; name the room the fixtures are in')
      .max(120, 'is longer than 120 characters'),
    level: cell().transform((text, ctx): string | null => {
      if (levels.length === 0) {
        if (text === '') return null
        ctx.addIssue({ code: 'custom', message: `"${text}" given, but the diagram has no levels` })
        return z.NEVER
      }
      if (text === '') {
        ctx.addIssue({ code: 'custom', message: `is empty; use one of ${levelList(levels)}` })
        return z.NEVER
      }
      const wanted = text.toLowerCase()
      const level =
        levels.find((l) => l.name.toLowerCase() === wanted) ?? levels.find((l) => l.id === text)
      if (level) return level.id
      ctx.addIssue({
        code: 'custom',
        message: `"${text}" is not a level of this diagram (levels: ${levelList(levels)})`,
      })
      return z.NEVER
    }),
    fixture: cell().transform((text, ctx) => {
      const key = FIXTURE_BY_SLUG.get(slug(text))
      if (key) return key
      ctx.addIssue({
        code: 'custom',
        message: text === '' ? 'is empty; give a fixture catalogue key' : unknownFixture(text),
      })
      return z.NEVER
    }),
    count: cell().transform((text, ctx) => {
      const count = /^\d+$/.test(text) ? Number(text) : NaN
      if (count >= 1 && count <= 500) return count
      ctx.addIssue({
        code: 'custom',
        message: `must be a whole number from 1 to 500, got ${text === '' ? 'nothing' : `"${text}"`}`,
      })
      return z.NEVER
    }),
    occupancy: cell().transform((text, ctx): Occupancy | undefined => {
      const value = text.toLowerCase()
      if (value === '') return undefined
      if (value === 'public' || value === 'private') return value
      ctx.addIssue({ code: 'custom', message: `must be public, private or empty, got "${text}"` })
      return z.NEVER
    }),
  })
}

/**
 * Checks one row's cells; every message names the row and the column.
 * @example
 * checkFixtureRow(schema, { room: 'WC', level: 'Ground', fixture: 'lav', count: '2', occupancy: '' }, 3)
 * // { ok: false, errors: ['Row 3, column "fixture": "lav" is not in the fixture catalogue (...)'] }
 */
export function checkFixtureRow(
  schema: ReturnType<typeof fixtureRowSchema>,
  cells: FixtureCells,
  line: number,
): RowCheck {
  const parsed = schema.safeParse(cells)
  if (!parsed.success) {
    // Keep the column order of the file format so messages read left to right.
    const issues = [...parsed.error.issues].sort(
      (a, b) =>
        FIXTURE_COLUMNS.indexOf(a.path[0] as FixtureColumn) -
        FIXTURE_COLUMNS.indexOf(b.path[0] as FixtureColumn),
    )
    return {
      ok: false,
      errors: issues.map((i) => `Row ${line}, column "${String(i.path[0])}": ${i.message}`),
    }
  }
  const { room, level, fixture, count, occupancy } = parsed.data
  const row: FixtureRow = { line, room, levelId: level, fixture, count }
  if (occupancy) row.occupancy = occupancy
  return { ok: true, row }
}
