import { describe, expect, test } from 'vitest'
import { computeDiagram } from '@shared/calc/compute'
import { applyWithInverse } from '@shared/document/history'
import { levelBands } from '@shared/document/levels'
import { applyOperation, OperationError } from '@shared/document/operations'
import { fixtureImportOperation } from '@shared/import/fixture-batch'
import { previewFixtureCsv } from '@shared/import/fixture-csv'
import { feedOptions, suggestFeeds } from '@shared/import/room-feeds'
import { expectSound } from '../document/arbitraries'
import { sampleDiagram } from '../document/sample'

const doc = sampleDiagram()
const HEADER = 'room,level,fixture,count,occupancy'
const preview = previewFixtureCsv(
  [
    HEADER,
    'Washroom 2.01,First,water-closet-flush-valve,3,public',
    'Washroom 2.01,First,lavatory,2,',
    'Washroom 2.01,First,lav,2,',
    'Tea point,Ground,dishwasher,1,',
    'Tea point,Ground,kitchen-sink,1,private',
  ].join('\n'),
  doc,
)
const [washroom, teaPoint] = preview.rooms
const feeds = {
  [washroom!.key]: { cold: 'J2', hot: null },
  [teaPoint!.key]: { cold: 'J1', hot: 'J9' },
}
// J9: a hot junction fed from the water heater, so hot fixtures can be piped.
const withHot = applyOperation(doc, {
  type: 'batch',
  ops: [
    {
      type: 'node.add',
      node: {
        id: 'J9',
        kind: 'junction',
        label: 'Hot header',
        levelId: 'L1',
        elevationM: 0,
        position: { x: 300, y: 600 },
      },
    },
    { type: 'pipe.add', pipe: { id: 'P9', from: 'WH1', to: 'J9', system: 'hot', lengthM: 2 } },
  ],
})

describe('fixtureImportOperation', () => {
  test('one batch: a fixture per accepted row under its room junction, bad rows left out and listed', () => {
    const plan = fixtureImportOperation(withHot, preview, feeds)
    expect(plan.op.type).toBe('batch')
    expect(plan.imported).toEqual([2, 3, 5, 6])
    expect(plan.skipped).toEqual([4])
    const after = applyOperation(withHot, plan.op)
    expectSound(after)
    expect(plan.fixtureIds).toEqual(['F2', 'F3', 'F4', 'F5'])
    const added = after.nodes.filter((n) => plan.fixtureIds.includes(n.id))
    expect(
      added.map(
        (n) =>
          n.kind === 'fixture' && [
            n.label,
            n.fixture,
            n.count,
            n.levelId,
            n.elevationM,
            n.occupancy,
          ],
      ),
    ).toEqual([
      ['Washroom 2.01', 'water-closet-flush-valve', 3, 'L2', 4.2, 'public'],
      ['Washroom 2.01', 'lavatory', 2, 'L2', 4.2, undefined],
      ['Tea point', 'dishwasher', 1, 'L1', 1, undefined],
      ['Tea point', 'kitchen-sink', 1, 'L1', 1, 'private'],
    ])
    const into = (id: string) =>
      after.pipes.filter((p) => p.to === id).map((p) => [p.from, p.system, p.lengthM])
    expect(into('F2')).toEqual([['J2', 'cold', 1.5]])
    // Lavatory takes hot water but the washroom has no hot feed: cold only, and said so.
    expect(into('F3')).toEqual([['J2', 'cold', 1.5]])
    expect(plan.withoutHot).toEqual([3])
    expect(into('F4')).toEqual([['J9', 'hot', 1.5]])
    expect(into('F5')).toEqual([
      ['J1', 'cold', 1.5],
      ['J9', 'hot', 1.5],
    ])
    expect(computeDiagram(after).issues.filter((i) => i.severity === 'error')).toEqual([])
  })

  test('fixtures sit in their level band, clear of each other and of existing nodes', () => {
    const after = applyOperation(withHot, fixtureImportOperation(withHot, preview, feeds).op)
    const bands = levelBands(after.levels)
    const added = after.nodes.filter((n) => ['F2', 'F3', 'F4', 'F5'].includes(n.id))
    for (const node of added) {
      const band = bands.find((b) => b.level.id === node.levelId)!
      expect(node.position!.y).toBeGreaterThanOrEqual(band.top)
      expect(node.position!.y).toBeLessThan(band.bottom)
    }
    const positions = after.nodes.map((n) => n.position!)
    for (const a of added) {
      const close = positions.filter(
        (p) => Math.abs(p.x - a.position!.x) < 60 && Math.abs(p.y - a.position!.y) < 50,
      )
      expect(close).toHaveLength(1)
    }
  })

  test('in a drawn band the new row goes under the nodes already there while it fits', () => {
    // First is the middle band (360-720 px); F1 sits low in it.
    const low = applyOperation(doc, {
      type: 'node.move',
      id: 'F1',
      position: { x: 100, y: 600 },
      levelId: 'L2',
    })
    const one = previewFixtureCsv(`${HEADER}\nCafe,First,bar-sink,1,\n`, low)
    const plan = fixtureImportOperation(low, one, {
      [one.rooms[0]!.key]: { cold: 'J2', hot: null },
    })
    const added = applyOperation(low, plan.op).nodes.find((n) => n.id === plan.fixtureIds[0])!
    expect(added.position).toEqual({ x: 0, y: 670 })
    // A band already full to its floor: the row stays inside the band, clear of what is there.
    const full = applyOperation(low, {
      type: 'node.move',
      id: 'F1',
      position: { x: 0, y: 700 },
      levelId: 'L2',
    })
    const plan2 = fixtureImportOperation(full, one, {
      [one.rooms[0]!.key]: { cold: 'J2', hot: null },
    })
    const added2 = applyOperation(full, plan2.op).nodes.find((n) => n.id === plan2.fixtureIds[0])!
    expect(added2.position).toEqual({ x: 130, y: 680 })
  })

  test('a feed on another floor gets the rise added to the drop', () => {
    const one = previewFixtureCsv(`${HEADER}\nRoof plant,Roof,hose-bibb,1,\n`, doc)
    const plan = fixtureImportOperation(doc, one, {
      [one.rooms[0]!.key]: { cold: 'J1', hot: null },
    })
    const after = applyOperation(doc, plan.op)
    // Roof at 6.4 m, connection 1 m above it, junction J1 at 0 m: 7.4 m rise + 1.5 m drop.
    expect(after.pipes.at(-1)).toMatchObject({ from: 'J1', to: 'F2', lengthM: 8.9 })
  })

  test('the import is one undo step', () => {
    const { doc: after, inverse } = applyWithInverse(
      withHot,
      fixtureImportOperation(withHot, preview, feeds).op,
    )
    expect(after.nodes.length).toBe(withHot.nodes.length + 4)
    expect(applyOperation(after, inverse)).toEqual(withHot)
  })

  test.each([
    [
      { cold: null, hot: null },
      'Room "Washroom 2.01" (First): choose the junction that feeds it cold water (row 2)',
    ],
    [{ cold: 'J404', hot: null }, 'Room "Washroom 2.01" (First): cold feed J404 does not exist'],
    [
      { cold: 'M1', hot: null },
      'Room "Washroom 2.01" (First): cold feed M1 is a meter, not a junction',
    ],
    [{ cold: 'J9', hot: null }, 'Room "Washroom 2.01" (First): cold feed J9 is on the hot system'],
  ])('refuses feed %j naming the room', (feed, message) => {
    const bad = { ...feeds, [washroom!.key]: feed }
    expect(() => fixtureImportOperation(withHot, preview, bad)).toThrow(OperationError)
    expect(() => fixtureImportOperation(withHot, preview, bad)).toThrow(message)
  })

  test('a hot-only fixture needs a hot feed', () => {
    const bad = { ...feeds, [teaPoint!.key]: { cold: 'J1', hot: null } }
    expect(() => fixtureImportOperation(withHot, preview, bad)).toThrow(
      'Room "Tea point" (Ground): row 5 (Dishwasher) takes hot water only; choose a hot feed',
    )
  })

  test('a file with file-level errors or no accepted rows builds nothing', () => {
    expect(() => fixtureImportOperation(doc, previewFixtureCsv('room\nWC\n', doc), {})).toThrow(
      /header lacks/,
    )
    const none = previewFixtureCsv(`${HEADER}\nWC,Ground,lav,1,\n`, doc)
    expect(() => fixtureImportOperation(doc, none, {})).toThrow('no accepted rows')
  })
})

describe('room feeds', () => {
  test("cold and hot options follow the junction's pipes; unconnected junctions are offered for both", () => {
    const loose = applyOperation(withHot, {
      type: 'node.add',
      node: { id: 'J7', kind: 'junction', label: '', elevationM: 0 },
    })
    expect(feedOptions(loose, 'cold').map((o) => o.id)).toEqual(['J1', 'J2', 'J7'])
    expect(feedOptions(loose, 'hot').map((o) => [o.id, o.text])).toEqual([
      ['J9', 'J9 Hot header (Ground)'],
      ['J7', 'J7'],
    ])
  })

  test('a junction whose label names the room on its level is suggested; otherwise nothing is guessed', () => {
    const labelled = applyOperation(withHot, {
      type: 'node.update',
      id: 'J2',
      patch: { label: 'Washroom 2.01 header' },
    })
    expect(suggestFeeds(labelled, preview.rooms)).toEqual({
      [washroom!.key]: { cold: 'J2', hot: null },
      [teaPoint!.key]: { cold: null, hot: null },
    })
  })
})
