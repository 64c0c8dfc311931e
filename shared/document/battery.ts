/**
 * "Add a battery of N fixtures" in one undoable step. Two layouts:
 * - grouped: one fixture node with `count: N` on one connection per system (compact; the branch
 *   shows the battery's total load);
 * - individual: a new branch header with a junction per fixture, so every header segment shows
 *   the load downstream of it.
 * Which systems the fixture draws is the caller's knowledge (the catalogue), passed as `usesHot`
 * (and `usesCold: false` for a hot-only appliance); flush valve fixtures are cold only.
 */
import { z } from 'zod'
import { createIdAllocator } from './ids.ts'
import type { Diagram, DiagramNode, Pipe, System } from './model.ts'
import { OPS, OperationError, type BatchOperation, type Operation } from './operations.ts'

/** Default developed lengths, m. Common practice, no source; the designer edits them per pipe. */
export const BATTERY_DEFAULTS = {
  /** Between neighbouring fixtures along the header. */
  spacingM: 1.0,
  /** From the header (or parent) down to each fixture. */
  dropM: 1.5,
} as const

/** Canvas spacing of the generated nodes, px; auto-layout may rearrange them later. */
const STEP_PX = 120

export const batteryOptionsSchema = z.object({
  /** The node feeding the battery on the cold system: a junction or a branch end. */
  parentId: z.string().min(1),
  /** Fixture catalogue key. */
  fixture: z.string().min(1),
  count: z.number().int().min(1).max(500),
  usesHot: z.boolean(),
  /** False for a hot-only appliance; `parentId` then feeds the hot side unless `hotParentId` is given. */
  usesCold: z.boolean().default(true),
  /** The node on the hot system feeding the battery; required when both systems are used. */
  hotParentId: z.string().min(1).optional(),
  layout: z.enum(['grouped', 'individual']).default('grouped'),
  spacingM: z.number().positive().max(1000).default(BATTERY_DEFAULTS.spacingM),
  dropM: z.number().positive().max(1000).default(BATTERY_DEFAULTS.dropM),
  label: z.string().max(120).default(''),
})
export type BatteryOptions = z.input<typeof batteryOptionsSchema>

export interface BatteryResult {
  op: BatchOperation
  fixtureIds: string[]
  /** Every node added (fixtures and header junctions). */
  nodeIds: string[]
  pipeIds: string[]
}

const TERMINALS = new Set<DiagramNode['kind']>(['fixture', 'equipment'])

function feeder(doc: Diagram, id: string, field: string): DiagramNode {
  const node = doc.nodes.find((candidate) => candidate.id === id)
  if (!node) throw new OperationError('not-found', `battery: ${field}: no node with id ${id}`, [id])
  if (TERMINALS.has(node.kind)) {
    throw new OperationError(
      'invalid',
      `battery: ${field}: ${id} is a ${node.kind} and cannot feed other fixtures`,
      [id],
    )
  }
  return node
}

/**
 * Builds the batch that adds a battery; apply it with `applyOperation`.
 * @example
 * const { op } = batteryOperation(doc, { parentId: 'J3', fixture: 'lavatory', count: 6, usesHot: true, hotParentId: 'J9' })
 */
export function batteryOperation(doc: Diagram, options: BatteryOptions): BatteryResult {
  const parsed = batteryOptionsSchema.safeParse(options)
  if (!parsed.success) {
    const issue = parsed.error.issues[0]!
    throw new OperationError('invalid', `battery: ${issue.path.join('.')}: ${issue.message}`)
  }
  const o = parsed.data
  if (!o.usesCold && !o.usesHot) {
    throw new OperationError('invalid', 'battery: usesHot: a fixture must draw cold or hot water')
  }
  const hotParentId = o.usesCold ? o.hotParentId : (o.hotParentId ?? o.parentId)
  if (o.usesHot && !hotParentId) {
    throw new OperationError(
      'invalid',
      'battery: hotParentId: a fixture using hot water needs a hot parent',
    )
  }
  const feeds: [System, DiagramNode][] = []
  if (o.usesCold) feeds.push(['cold', feeder(doc, o.parentId, 'parentId')])
  if (o.usesHot)
    feeds.push(['hot', feeder(doc, hotParentId!, o.hotParentId ? 'hotParentId' : 'parentId')])
  const parent = feeds[0]![1]

  const allocate = createIdAllocator(doc)
  const origin = parent.position ?? { x: 0, y: 0 }
  const placed = {
    elevationM: parent.elevationM,
    ...(parent.levelId ? { levelId: parent.levelId } : {}),
  }
  const nodes: DiagramNode[] = []
  const pipes: Pipe[] = []
  const pipe = (from: string, to: string, system: System, lengthM: number) =>
    pipes.push({ id: allocate('pipe'), from, to, system, lengthM })
  const fixture = (column: number, count: number): DiagramNode => {
    const node: DiagramNode = {
      id: allocate('fixture'),
      kind: 'fixture',
      label: o.label,
      fixture: o.fixture,
      count,
      position: { x: origin.x + column * STEP_PX, y: origin.y + 2 * STEP_PX },
      ...placed,
    }
    nodes.push(node)
    return node
  }

  if (o.layout === 'grouped') {
    const target = fixture(0, o.count)
    for (const [system, from] of feeds) pipe(from.id, target.id, system, o.dropM)
  } else {
    const fixtures = Array.from({ length: o.count }, (_, i) => fixture(i + 1, 1))
    feeds.forEach(([system, from], row) => {
      let upstream = from.id
      fixtures.forEach((target, i) => {
        const y = origin.y + STEP_PX / 2 + row * (STEP_PX / 2)
        const junction: DiagramNode = {
          id: allocate('junction'),
          kind: 'junction',
          label: '',
          position: { x: origin.x + (i + 1) * STEP_PX, y },
          ...placed,
        }
        nodes.push(junction)
        pipe(upstream, junction.id, system, o.spacingM)
        pipe(junction.id, target.id, system, o.dropM)
        upstream = junction.id
      })
    })
  }

  const ops: Operation[] = [
    ...nodes.map((node): Operation => ({ type: OPS.nodeAdd, node })),
    ...pipes.map((item): Operation => ({ type: OPS.pipeAdd, pipe: item })),
  ]
  return {
    op: { type: OPS.batch, ops },
    fixtureIds: nodes.filter((node) => node.kind === 'fixture').map((node) => node.id),
    nodeIds: nodes.map((node) => node.id),
    pipeIds: pipes.map((item) => item.id),
  }
}
