/**
 * Accepted fixture rows → one `batch` operation (one undo step): a fixture node per row, with the
 * row's count, on the row's level, and a pipe from the room's cold (and hot) junction.
 */
import { FIXTURES } from '../calc/fixtures.ts'
import { BATTERY_DEFAULTS } from '../document/battery.ts'
import { createIdAllocator } from '../document/ids.ts'
import { levelBands } from '../document/levels.ts'
import type { Diagram, DiagramNode, Pipe, System } from '../document/model.ts'
import { OPS, OperationError, type BatchOperation, type Operation } from '../document/operations.ts'
import { FIXTURE_HEIGHT_M } from './fixture-columns.ts'
import type { FixturePreview, RoomGroup } from './fixture-csv.ts'
import type { FixtureRow } from './fixture-row.ts'
import { junctionSystem, type RoomFeed } from './room-feeds.ts'

/** What the import adds, and which rows it leaves out. */
export interface FixtureImportPlan {
  op: BatchOperation
  fixtureIds: string[]
  /** Lines imported, and lines left out because they have errors. */
  imported: number[]
  skipped: number[]
  /** Lines of fixtures taking hot water that got no hot pipe (no hot feed chosen). */
  withoutHot: number[]
}

/**
 * Canvas layout of imported fixtures, px: a row at least this far below the band top, below what
 * the band already holds while there is room; spacing along the row; clearance around nodes.
 */
const ROW_FROM_BAND_TOP = 230
const ROW_BELOW_EXISTING = 70
const ROW_ABOVE_BAND_BOTTOM = 40
const STEP_PX = 130
const CLEAR_X = 60
const CLEAR_Y = 50

const where = (room: RoomGroup) =>
  `Room "${room.room}"${room.levelName ? ` (${room.levelName})` : ''}`
const round2 = (value: number) => Math.round(value * 100) / 100

function feedNode(doc: Diagram, room: RoomGroup, id: string, system: System): DiagramNode {
  const node = doc.nodes.find((n) => n.id === id)
  const fail = (why: string) => {
    throw new OperationError('invalid', `${where(room)}: ${system} feed ${id} ${why}`, [id])
  }
  if (!node) return fail('does not exist')
  if (node.kind !== 'junction') return fail(`is a ${node.kind}, not a junction`)
  const own = junctionSystem(doc, id)
  if (own !== null && own !== system) return fail(`is on the ${own} system`)
  return node
}

/** Finds a free slot along a row, left to right, clear of the nodes already there. */
function placer(doc: Diagram) {
  const taken = doc.nodes.flatMap((n) => (n.position ? [n.position] : []))
  return (x0: number, y: number) => {
    let x = x0
    while (taken.some((p) => Math.abs(p.x - x) < CLEAR_X && Math.abs(p.y - y) < CLEAR_Y))
      x += STEP_PX
    const position = { x, y }
    taken.push(position)
    return position
  }
}

/**
 * Builds the batch for the accepted rows of `preview`, each room fed by `feeds[room.key]`.
 * Throws an {@link OperationError} naming the room when a feed is missing or unfit.
 * @example
 * const plan = fixtureImportOperation(doc, preview, { [room.key]: { cold: 'J3', hot: 'J9' } })
 * store.apply(plan.op)
 */
export function fixtureImportOperation(
  doc: Diagram,
  preview: FixturePreview,
  feeds: Readonly<Record<string, RoomFeed>>,
): FixtureImportPlan {
  if (preview.fileErrors.length) {
    throw new OperationError('invalid', `fixture import: ${preview.fileErrors[0]}`)
  }
  const rows = preview.rows.flatMap((r) => (r.row ? [r.row] : []))
  if (rows.length === 0) throw new OperationError('invalid', 'fixture import: no accepted rows')
  const allocate = createIdAllocator(doc)
  const place = placer(doc)
  const bands = levelBands(doc.levels)
  const nodes: DiagramNode[] = []
  const pipes: Pipe[] = []
  const withoutHot: number[] = []

  for (const room of preview.rooms) {
    const feed = feeds[room.key] ?? { cold: null, hot: null }
    const cold = feed.cold ? feedNode(doc, room, feed.cold, 'cold') : null
    const hot = feed.hot ? feedNode(doc, room, feed.hot, 'hot') : null
    if (cold && hot && cold.id === hot.id) {
      throw new OperationError(
        'invalid',
        `${where(room)}: one junction cannot feed both cold and hot`,
        [cold.id],
      )
    }
    const level = doc.levels.find((l) => l.id === room.levelId)
    const band = bands.find((b) => b.level.id === room.levelId)
    const anchor = cold ?? hot
    const y = band ? rowInBand(doc, band) : (anchor?.position?.y ?? 0) + 2 * STEP_PX
    let x = anchor?.position?.x ?? 0
    for (const row of rows.filter((r) => room.lines.includes(r.line))) {
      const spec = FIXTURES[row.fixture]!
      if (spec.supplies.cold && !cold) {
        throw new OperationError(
          'invalid',
          `${where(room)}: choose the junction that feeds it cold water (row ${row.line})`,
        )
      }
      if (!spec.supplies.cold && !hot) {
        throw new OperationError(
          'invalid',
          `${where(room)}: row ${row.line} (${spec.label}) takes hot water only; choose a hot feed`,
        )
      }
      const position = place(x, y)
      x = position.x + STEP_PX
      const node = fixtureNode(allocate('fixture'), row, position, level?.elevationM, anchor!)
      nodes.push(node)
      const pipe = (from: DiagramNode, system: System) =>
        pipes.push({
          id: allocate('pipe'),
          from: from.id,
          to: node.id,
          system,
          lengthM: dropLength(from, node),
        })
      if (spec.supplies.cold) pipe(cold!, 'cold')
      if (spec.supplies.hot && hot) pipe(hot, 'hot')
      else if (spec.supplies.hot) withoutHot.push(row.line)
    }
  }
  const ops: Operation[] = [
    ...nodes.map((node): Operation => ({ type: OPS.nodeAdd, node })),
    ...pipes.map((pipe): Operation => ({ type: OPS.pipeAdd, pipe })),
  ]
  return {
    op: { type: OPS.batch, ops },
    fixtureIds: nodes.map((n) => n.id),
    imported: rows.map((r) => r.line),
    skipped: preview.rows.filter((r) => r.status === 'error').map((r) => r.line),
    withoutHot,
  }
}

/** The y of the imported row in a level band: under the band's lowest node when it fits. */
function rowInBand(doc: Diagram, band: { top: number; bottom: number }): number {
  const inBand = doc.nodes.flatMap((n) =>
    n.position && n.position.y >= band.top && n.position.y < band.bottom ? [n.position.y] : [],
  )
  const below = Math.max(band.top + ROW_FROM_BAND_TOP, ...inBand.map((y) => y + ROW_BELOW_EXISTING))
  return Math.min(below, band.bottom - ROW_ABOVE_BAND_BOTTOM)
}

function fixtureNode(
  id: string,
  row: FixtureRow,
  position: { x: number; y: number },
  floorM: number | undefined,
  feed: DiagramNode,
): DiagramNode {
  return {
    id,
    kind: 'fixture',
    label: row.room,
    fixture: row.fixture,
    count: row.count,
    ...(row.occupancy ? { occupancy: row.occupancy } : {}),
    elevationM: floorM === undefined ? feed.elevationM : round2(floorM + FIXTURE_HEIGHT_M),
    position,
    ...(row.levelId ? { levelId: row.levelId } : {}),
  }
}

/**
 * Developed length of a drop: the battery default, or the height difference plus that default
 * when the feed is on another floor. Common practice, no source; the designer edits per pipe.
 */
function dropLength(from: DiagramNode, to: DiagramNode): number {
  const rise = Math.abs(to.elevationM - from.elevationM)
  return rise > BATTERY_DEFAULTS.dropM
    ? round2(rise + BATTERY_DEFAULTS.dropM)
    : BATTERY_DEFAULTS.dropM
}
