/**
 * Random valid documents and random valid operations for property tests. Operations are realised
 * from plain random seeds against the document they will meet, so a batch can be built step by
 * step on the evolving document.
 */
import fc from 'fast-check'
import { expect } from 'vitest'
import { nextId } from '@shared/document/ids'
import {
  DIAGRAM_FORMAT,
  DIAGRAM_FORMAT_VERSION,
  diagramSchema,
  NODE_KINDS,
  type Diagram,
  type DiagramNode,
  type NodeKind,
} from '@shared/document/model'
import { applyOperation, type Operation } from '@shared/document/operations'

const FIXTURE_KEYS = ['lavatory', 'kitchen-sink', 'shower', 'water-closet-valve']

export const nodeSeed = fc.record({
  kind: fc.nat(),
  a: fc.integer({ min: -5000, max: 5000 }),
  b: fc.integer({ min: 0, max: 9000 }),
  n: fc.integer({ min: 1, max: 40 }),
  flag: fc.boolean(),
  other: fc.boolean(),
  level: fc.nat(),
  text: fc.string({ maxLength: 12 }),
})
export interface NodeSeed {
  kind: number
  a: number
  b: number
  n: number
  flag: boolean
  other: boolean
  level: number
  text: string
}

const pick = <T>(items: readonly T[], i: number): T => items[i % items.length]!

/** A node of `kind` whose optional fields come and go with the seed. */
export function makeNode(kind: NodeKind, id: string, s: NodeSeed, levelIds: string[]): DiagramNode {
  const base = {
    id,
    label: s.text,
    elevationM: s.a / 100,
    ...(s.flag ? { position: { x: s.a, y: s.b } } : {}),
    ...(levelIds.length && s.other ? { levelId: pick(levelIds, s.level) } : {}),
  }
  switch (kind) {
    case 'supply':
      return { ...base, kind, pressureKPa: s.b / 10 }
    case 'junction':
      return { ...base, kind }
    case 'meter':
    case 'backflow-preventer':
    case 'water-heater':
      return { ...base, kind, lossKPa: s.b / 100 }
    case 'pressure-reducing-valve':
      return { ...base, kind, setKPa: s.b / 20 }
    case 'fixture':
      return {
        ...base,
        kind,
        fixture: pick(FIXTURE_KEYS, s.level),
        count: s.n,
        ...(s.other ? { occupancy: 'private' as const } : {}),
        ...(s.flag ? { load: { cold: s.n / 4, hot: s.n / 8, total: s.n / 3 } } : {}),
      }
    case 'equipment':
      return { ...base, kind, flowLps: s.b / 1000, ...(s.other ? { minPressureKPa: s.n } : {}) }
  }
}

const pipeSeed = fc.record({
  a: fc.nat(),
  b: fc.nat(),
  hot: fc.boolean(),
  len: fc.integer({ min: 1, max: 900 }),
})

/** Random documents that pass `diagramSchema`, with unique ids and no dangling pipes. */
export const diagramArb = fc
  .record({
    levels: fc.array(fc.integer({ min: -10, max: 60 }), { maxLength: 3 }),
    nodes: fc.array(nodeSeed, { minLength: 1, maxLength: 9 }),
    pipes: fc.array(pipeSeed, { maxLength: 10 }),
    name: fc.string({ maxLength: 20 }),
  })
  .map(({ levels, nodes, pipes, name }): Diagram => {
    const levelList = levels.map((elevationM, i) => ({
      id: `L${i + 1}`,
      name: `Floor ${i + 1}`,
      elevationM,
    }))
    const levelIds = levelList.map((level) => level.id)
    const nodeList = nodes.map((s, i) =>
      makeNode(pick(NODE_KINDS, s.kind), `N${i + 1}`, s, levelIds),
    )
    const pipeList = pipes
      .map((s, i) => ({
        id: `P${i + 1}`,
        from: pick(nodeList, s.a).id,
        to: pick(nodeList, s.b).id,
        system: s.hot ? ('hot' as const) : ('cold' as const),
        lengthM: s.len / 10,
        ...(s.hot ? { material: 'pex' } : {}),
      }))
      .filter((pipe) => pipe.from !== pipe.to)
    return diagramSchema.parse({
      format: DIAGRAM_FORMAT,
      version: DIAGRAM_FORMAT_VERSION,
      name,
      levels: levelList,
      nodes: nodeList,
      pipes: pipeList,
    })
  })

export const opSeed = fc.record({
  pick: fc.nat(),
  i: fc.nat(),
  j: fc.nat(),
  node: nodeSeed,
  x: fc.integer({ min: -2000, max: 2000 }),
  flag: fc.boolean(),
  text: fc.string({ maxLength: 12 }),
})
export interface OpSeed {
  pick: number
  i: number
  j: number
  node: NodeSeed
  x: number
  flag: boolean
  text: string
}

/** One valid, non-batch operation for `doc`, chosen by the seed. */
export function realizeOp(doc: Diagram, s: OpSeed): Operation {
  const levelIds = doc.levels.map((level) => level.id)
  const unusedLevels = levelIds.filter((id) => !doc.nodes.some((node) => node.levelId === id))
  const choices = [
    'node.add',
    'diagram.rename',
    'settings.update',
    'level.add',
    ...(doc.nodes.length ? ['node.update', 'node.move', 'node.remove'] : []),
    ...(doc.nodes.length > 1 ? ['pipe.add'] : []),
    ...(doc.pipes.length ? ['pipe.update', 'pipe.remove'] : []),
    ...(doc.levels.length ? ['level.update'] : []),
    ...(unusedLevels.length ? ['level.remove'] : []),
  ]
  const node = doc.nodes.length ? pick(doc.nodes, s.i) : undefined
  const pipe = doc.pipes.length ? pick(doc.pipes, s.i) : undefined
  switch (pick(choices, s.pick)) {
    case 'node.add': {
      const kind = pick(NODE_KINDS, s.node.kind)
      return { type: 'node.add', node: makeNode(kind, nextId(doc, kind), s.node, levelIds) }
    }
    case 'node.update': {
      const fresh = makeNode(node!.kind, node!.id, s.node, levelIds)
      const { id: _id, kind: _kind, ...fields } = fresh
      const patch: Record<string, unknown> = { ...fields }
      // Clear what the fresh node lacks, so removal of optional fields is exercised too.
      for (const key of ['position', 'levelId', 'occupancy', 'load', 'minPressureKPa']) {
        if (!(key in fields) && key in node!) patch[key] = null
      }
      if (s.flag) delete patch.label
      return { type: 'node.update', id: node!.id, patch }
    }
    case 'node.move':
      return {
        type: 'node.move',
        id: node!.id,
        position: { x: s.x, y: -s.x },
        ...(s.flag ? { levelId: levelIds.length ? pick(levelIds, s.j) : null } : {}),
        ...(s.node.flag ? { elevationM: s.x / 50 } : {}),
      }
    case 'node.remove':
      return { type: 'node.remove', id: node!.id }
    case 'pipe.add': {
      const from = pick(doc.nodes, s.i)
      const to = pick(
        doc.nodes.filter((other) => other.id !== from.id),
        s.j,
      )
      const system = s.flag ? ('hot' as const) : ('cold' as const)
      return {
        type: 'pipe.add',
        pipe: {
          id: nextId(doc, 'pipe'),
          from: from.id,
          to: to.id,
          system,
          lengthM: 1 + (s.j % 30),
        },
      }
    }
    case 'pipe.update':
      return {
        type: 'pipe.update',
        id: pipe!.id,
        patch: {
          lengthM: 0.5 + (s.j % 40),
          ...(s.flag
            ? { nominal: '3/4', material: null }
            : { nominal: null, system: 'hot' as const }),
        },
      }
    case 'pipe.remove':
      return { type: 'pipe.remove', id: pipe!.id }
    case 'settings.update':
      return {
        type: 'settings.update',
        patch: s.flag
          ? { fittingAllowance: (s.j % 30) / 10, occupancy: 'private' }
          : { velocityLimits: { cold: 2, hot: 1.2 }, material: 'pex' },
      }
    case 'level.add':
      return {
        type: 'level.add',
        level: { id: nextId(doc, 'level'), name: `Level ${s.text}`, elevationM: s.x / 10 },
        ...(s.flag ? { index: s.j % 4 } : {}),
      }
    case 'level.update':
      return {
        type: 'level.update',
        id: pick(doc.levels, s.i).id,
        patch: { name: `Deck ${s.j % 9}`, elevationM: s.x / 4 },
      }
    case 'level.remove':
      return { type: 'level.remove', id: pick(unusedLevels, s.i) }
    default:
      return { type: 'diagram.rename', name: s.text }
  }
}

/** A single op or a batch of up to 6 ops realised one after another. */
export const anyOpArb = fc.record({
  seeds: fc.array(opSeed, { minLength: 1, maxLength: 6 }),
  batch: fc.boolean(),
})

export function realizeAny(
  doc: Diagram,
  { seeds, batch }: { seeds: OpSeed[]; batch: boolean },
): Operation {
  if (!batch) return realizeOp(doc, seeds[0]!)
  const ops: Operation[] = []
  let current = doc
  for (const seed of seeds) {
    const op = realizeOp(current, seed)
    ops.push(op)
    current = applyOperation(current, op)
  }
  return { type: 'batch', ops }
}

/** Every id unique within its collection and every pipe end a node of the document. */
export function expectSound(doc: Diagram) {
  expect(diagramSchema.safeParse(doc).success).toBe(true)
  const nodeIds = doc.nodes.map((node) => node.id)
  expect(new Set(nodeIds).size).toBe(nodeIds.length)
  expect(new Set(doc.pipes.map((pipe) => pipe.id)).size).toBe(doc.pipes.length)
  for (const pipe of doc.pipes) {
    expect(nodeIds).toContain(pipe.from)
    expect(nodeIds).toContain(pipe.to)
  }
}
