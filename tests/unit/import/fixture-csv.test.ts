import { describe, expect, test } from 'vitest'
import { computeDiagram } from '@shared/calc/compute'
import { fixtureTemplateCsv, MAX_IMPORT_ROWS } from '@shared/import/fixture-columns'
import { previewFixtureCsv } from '@shared/import/fixture-csv'
import { sampleDiagram } from '../document/sample'

const doc = sampleDiagram()
const csv = (...lines: string[]) => lines.join('\n') + '\n'
const HEADER = 'room,level,fixture,count,occupancy'

describe('previewFixtureCsv: good rows', () => {
  test('accepts keys and labels, matches levels by name, groups rows by room and level', () => {
    const preview = previewFixtureCsv(
      csv(
        HEADER,
        'Washroom 2.01,First,water-closet-flush-valve,3,public',
        'Washroom 2.01,first,Lavatory,3,',
        '"Kitchenette, staff",Ground,"Kitchen sink",1,private',
      ),
      doc,
    )
    expect(preview.fileErrors).toEqual([])
    expect(preview.rows.map((r) => r.status)).toEqual(['accepted', 'accepted', 'accepted'])
    expect(preview.rows.map((r) => r.row)).toEqual([
      {
        line: 2,
        room: 'Washroom 2.01',
        levelId: 'L2',
        fixture: 'water-closet-flush-valve',
        count: 3,
        occupancy: 'public',
      },
      { line: 3, room: 'Washroom 2.01', levelId: 'L2', fixture: 'lavatory', count: 3 },
      {
        line: 4,
        room: 'Kitchenette, staff',
        levelId: 'L1',
        fixture: 'kitchen-sink',
        count: 1,
        occupancy: 'private',
      },
    ])
    expect(preview.rooms.map((r) => [r.room, r.levelName, r.lines, r.fixtures, r.usesHot])).toEqual(
      [
        ['Washroom 2.01', 'First', [2, 3], 6, true],
        ['Kitchenette, staff', 'Ground', [4], 1, true],
      ],
    )
    expect([preview.accepted, preview.rejected]).toEqual([2 + 1, 0])
  })

  test("the template parses with every row accepted on the diagram's first level", () => {
    const preview = previewFixtureCsv(fixtureTemplateCsv(doc.levels), doc)
    expect(preview.fileErrors).toEqual([])
    expect(preview.rows).toHaveLength(4)
    expect(preview.rows.every((r) => r.status === 'accepted' && r.row?.levelId === 'L1')).toBe(true)
  })

  test('header order and case do not matter; occupancy may be left out; a BOM and CRLF are read', () => {
    const text = '\uFEFFCount,Fixture,Room,LEVEL\r\n2,shower,Changing room,Ground\r\n'
    const preview = previewFixtureCsv(text, doc)
    expect(preview.rows[0]!.row).toEqual({
      line: 2,
      room: 'Changing room',
      levelId: 'L1',
      fixture: 'shower',
      count: 2,
    })
  })

  test('semicolon files (a spreadsheet in a comma-decimal locale) are read too', () => {
    const preview = previewFixtureCsv(csv('room;level;fixture;count', 'Bar;Ground;bar-sink;2'), doc)
    expect(preview.rows[0]!.status).toBe('accepted')
  })

  test('an unused column is named as ignored, not dropped silently', () => {
    const preview = previewFixtureCsv(
      csv('room,level,fixture,count,notes', 'WC,Ground,lavatory,1,by window'),
      doc,
    )
    expect(preview.notices).toEqual(['Column "notes" is not used and is ignored.'])
    expect(preview.rows[0]!.status).toBe('accepted')
  })

  test('a repeated row is accepted with a warning naming the first one', () => {
    const preview = previewFixtureCsv(
      csv(HEADER, 'WC,Ground,lavatory,1,', 'WC,Ground,lavatory,2,'),
      doc,
    )
    expect(preview.rows[1]!.warnings).toEqual([
      'Same room, level and fixture as row 2; both are imported.',
    ])
  })

  test('without levels in the diagram the level column stays empty', () => {
    const flat = { ...doc, levels: [], nodes: doc.nodes.map(({ levelId: _l, ...n }) => n) }
    expect(computeDiagram(flat).issues.filter((i) => i.severity === 'error')).toEqual([])
    const preview = previewFixtureCsv(
      csv(HEADER, 'WC,,lavatory,1,', 'WC 2,Ground,lavatory,1,'),
      flat,
    )
    expect(preview.rows[0]!.row?.levelId).toBeNull()
    expect(preview.rows[1]!.errors).toEqual([
      'Row 3, column "level": "Ground" given, but the diagram has no levels',
    ])
  })
})

describe('previewFixtureCsv: bad rows are shown with row and column, never dropped', () => {
  test.each([
    [
      'WC,Ground,lav,1,',
      'Row 2, column "fixture": "lav" is not in the fixture catalogue; did you mean lavatory?',
    ],
    [
      'WC,Ground,sink,1,',
      '"sink" is not in the fixture catalogue; did you mean kitchen-sink, bar-sink or service-sink?',
    ],
    [
      'WC,Ground,tap,1,',
      '"tap" is not in the fixture catalogue; keys: lavatory, water-closet-tank,',
    ],
    [',Ground,lavatory,1,', 'Row 2, column "room": is empty; name the room the fixtures are in'],
    [
      'WC,Basement,lavatory,1,',
      'Row 2, column "level": "Basement" is not a level of this diagram (levels: Ground, First, Roof)',
    ],
    ['WC,,lavatory,1,', 'Row 2, column "level": is empty; use one of Ground, First, Roof'],
    [
      'WC,Ground,lavatory,0,',
      'Row 2, column "count": must be a whole number from 1 to 500, got "0"',
    ],
    [
      'WC,Ground,lavatory,2.5,',
      'Row 2, column "count": must be a whole number from 1 to 500, got "2.5"',
    ],
    [
      'WC,Ground,lavatory,,',
      'Row 2, column "count": must be a whole number from 1 to 500, got nothing',
    ],
    [
      'WC,Ground,lavatory,501,',
      'Row 2, column "count": must be a whole number from 1 to 500, got "501"',
    ],
    [
      'WC,Ground,lavatory,1,hotel',
      'Row 2, column "occupancy": must be public, private or empty, got "hotel"',
    ],
    ['WC,Ground,lavatory,1,,surplus', 'Row 2 has 6 values but the header names 5 columns.'],
  ])('%s', (line, message) => {
    const preview = previewFixtureCsv(csv(HEADER, line), doc)
    expect(preview.rows).toHaveLength(1)
    expect(preview.rows[0]!.status).toBe('error')
    expect(preview.rows[0]!.row).toBeNull()
    expect(preview.rows[0]!.errors[0]).toContain(message)
    expect(preview.rooms).toEqual([])
  })

  test('every error of a row is listed, in column order, and good rows around it stay accepted', () => {
    const preview = previewFixtureCsv(
      csv(HEADER, 'WC,Ground,lavatory,1,', ',Attic,sink,many,', 'WC,Ground,shower,1,'),
      doc,
    )
    expect(preview.rows.map((r) => r.status)).toEqual(['accepted', 'error', 'accepted'])
    expect(preview.rows[1]!.errors.map((e) => e.split(':')[0])).toEqual([
      'Row 3, column "room"',
      'Row 3, column "level"',
      'Row 3, column "fixture"',
      'Row 3, column "count"',
    ])
    expect([preview.accepted, preview.rejected]).toEqual([2, 1])
  })

  test('row numbers follow the file: blank lines and line breaks inside quotes count', () => {
    const preview = previewFixtureCsv(
      csv(HEADER, '', '"Wash\nroom",Ground,lavatory,1,', 'WC,Ground,lav,1,'),
      doc,
    )
    expect(preview.rows.map((r) => r.line)).toEqual([3, 5])
    expect(preview.rows[1]!.errors[0]).toMatch(/^Row 5, column "fixture"/)
  })

  test('an unterminated quote is a row error, not a crash', () => {
    const preview = previewFixtureCsv(csv(HEADER, '"WC,Ground,lavatory,1,'), doc)
    expect(preview.rows.every((r) => r.status === 'error')).toBe(true)
    expect(preview.rows[0]!.errors.join(' ')).toMatch(/Row 2: .*[Qq]uote/)
  })

  test.each([
    ['', 'The file is empty'],
    ['room,fixture,count\n', 'The header lacks column "level"'],
    [
      'name,level,kind,qty\nWC,Ground,lavatory,1\n',
      'The header lacks columns "room", "fixture", "count"',
    ],
    [HEADER + '\n', 'The file has a header but no fixture rows.'],
    [
      'room,level,fixture,count,Room\nWC,Ground,lavatory,1,WC\n',
      'Column "room" appears twice in the header.',
    ],
  ])('file-level error for %j', (text, message) => {
    const preview = previewFixtureCsv(text, doc)
    expect(preview.fileErrors.join(' ')).toContain(message)
    expect(preview.accepted).toBe(0)
  })

  test('a file above the row limit is refused as a whole', () => {
    const rows = Array.from(
      { length: MAX_IMPORT_ROWS + 1 },
      (_, i) => `Room ${i},Ground,lavatory,1,`,
    )
    const preview = previewFixtureCsv(csv(HEADER, ...rows), doc)
    expect(preview.fileErrors[0]).toContain(`one import takes at most ${MAX_IMPORT_ROWS}`)
    expect(preview.rows).toEqual([])
  })
})
