import { describe, expect, test } from 'vitest'
import type { Diagram } from '@shared/document/model'
import { NODE_KINDS, nodeSchema } from '@shared/document/model'
import {
  applyOperation,
  nodePatchSchema,
  OPS,
  OperationError,
  operationSchema,
  parseOperation,
  type Operation,
} from '@shared/document/operations'
import { sampleDiagram } from './sample'

const node = (doc: Diagram, id: string) => doc.nodes.find((item) => item.id === id)
const pipe = (doc: Diagram, id: string) => doc.pipes.find((item) => item.id === id)

describe('applyOperation: each op applies', () => {
  test.each<[string, Operation, (after: Diagram) => void]>([
    [
      'node.add fills defaults and appends',
      { type: 'node.add', node: { id: 'J3', kind: 'junction', label: '', elevationM: 0 } },
      (after) =>
        expect(after.nodes.at(-1)).toEqual({
          id: 'J3',
          kind: 'junction',
          label: '',
          elevationM: 0,
        }),
    ],
    [
      'node.add at an index',
      {
        type: 'node.add',
        node: { id: 'E1', kind: 'equipment', label: 'Boiler fill', elevationM: 0, flowLps: 0.2 },
        index: 0,
      },
      (after) => expect(after.nodes[0]!.id).toBe('E1'),
    ],
    [
      'node.update changes kind fields and label',
      { type: 'node.update', id: 'F1', patch: { count: 4, label: 'Washroom' } },
      (after) =>
        expect(node(after, 'F1')).toMatchObject({
          count: 4,
          label: 'Washroom',
          fixture: 'lavatory',
        }),
    ],
    [
      'node.update with null clears an optional field',
      { type: 'node.update', id: 'J2', patch: { levelId: null } },
      (after) => expect(node(after, 'J2')).not.toHaveProperty('levelId'),
    ],
    [
      'node.update with null on a defaulted field restores the default',
      { type: 'node.update', id: 'M1', patch: { lossKPa: null } },
      (after) => expect(node(after, 'M1')).toMatchObject({ lossKPa: 0 }),
    ],
    [
      'node.move sets position, level and elevation',
      { type: 'node.move', id: 'J2', position: { x: 40, y: 80 }, levelId: 'L3', elevationM: 6.4 },
      (after) =>
        expect(node(after, 'J2')).toMatchObject({
          position: { x: 40, y: 80 },
          levelId: 'L3',
          elevationM: 6.4,
        }),
    ],
    [
      'node.move leaves level and elevation alone when not given',
      { type: 'node.move', id: 'J2', position: { x: 1, y: 2 } },
      (after) => expect(node(after, 'J2')).toMatchObject({ levelId: 'L2', elevationM: 3.2 }),
    ],
    [
      'node.remove takes its pipes with it',
      { type: 'node.remove', id: 'J2' },
      (after) => {
        expect(node(after, 'J2')).toBeUndefined()
        expect(after.pipes.map((item) => item.id)).toEqual(['P1', 'P2', 'P3', 'P6'])
      },
    ],
    [
      'pipe.add',
      { type: 'pipe.add', pipe: { id: 'P7', from: 'WH1', to: 'J2', system: 'hot', lengthM: 5 } },
      (after) => expect(pipe(after, 'P7')).toMatchObject({ from: 'WH1', to: 'J2' }),
    ],
    [
      'pipe.update locks a size and clears it again with null',
      {
        type: 'batch',
        ops: [
          { type: 'pipe.update', id: 'P4', patch: { nominal: '1-1/4', material: 'pex' } },
          { type: 'pipe.update', id: 'P4', patch: { nominal: null } },
        ],
      },
      (after) =>
        expect(pipe(after, 'P4')).toEqual({
          id: 'P4',
          from: 'J1',
          to: 'J2',
          system: 'cold',
          lengthM: 4,
          material: 'pex',
        }),
    ],
    [
      'pipe.update re-routes a pipe',
      { type: 'pipe.update', id: 'P5', patch: { from: 'J1' } },
      (after) => expect(pipe(after, 'P5')!.from).toBe('J1'),
    ],
    [
      'pipe.remove',
      { type: 'pipe.remove', id: 'P6' },
      (after) => expect(pipe(after, 'P6')).toBeUndefined(),
    ],
    [
      'settings.update changes only the named settings',
      { type: 'settings.update', patch: { fittingAllowance: 0.4, loadBasis: 'per-fixture' } },
      (after) =>
        expect(after.settings).toMatchObject({
          fittingAllowance: 0.4,
          loadBasis: 'per-fixture',
          material: 'copper-l',
        }),
    ],
    [
      'level.add',
      { type: 'level.add', level: { id: 'L4', name: 'Basement', elevationM: -3 }, index: 0 },
      (after) => expect(after.levels[0]).toEqual({ id: 'L4', name: 'Basement', elevationM: -3 }),
    ],
    [
      'level.update',
      { type: 'level.update', id: 'L2', patch: { name: 'Level 1' } },
      (after) => expect(after.levels[1]).toEqual({ id: 'L2', name: 'Level 1', elevationM: 3.2 }),
    ],
    [
      'level.remove of an unused level',
      { type: 'level.remove', id: 'L3' },
      (after) => expect(after.levels).toHaveLength(2),
    ],
    [
      'diagram.rename',
      { type: 'diagram.rename', name: 'Block B' },
      (after) => expect(after.name).toBe('Block B'),
    ],
    [
      'batch applies its steps in order',
      {
        type: 'batch',
        ops: [
          { type: 'node.add', node: { id: 'J3', kind: 'junction', label: '', elevationM: 0 } },
          {
            type: 'pipe.add',
            pipe: { id: 'P7', from: 'J2', to: 'J3', system: 'cold', lengthM: 2 },
          },
          {
            type: 'batch',
            ops: [{ type: 'node.update', id: 'J3', patch: { label: 'Riser top' } }],
          },
        ],
      },
      (after) => {
        expect(node(after, 'J3')!.label).toBe('Riser top')
        expect(pipe(after, 'P7')!.to).toBe('J3')
      },
    ],
  ])('%s', (_name, op, check) => {
    const doc = sampleDiagram()
    const before = structuredClone(doc)
    check(applyOperation(doc, op))
    expect(doc).toEqual(before)
  })

  test('untouched items are shared, not copied', () => {
    const doc = sampleDiagram()
    const after = applyOperation(doc, { type: 'node.update', id: 'F1', patch: { count: 2 } })
    expect(after.nodes[0]).toBe(doc.nodes[0])
    expect(after.pipes).toBe(doc.pipes)
  })
})

describe('applyOperation: refusals name the ids and fields', () => {
  test.each<[string, unknown, string, RegExp, string[]]>([
    [
      'duplicate node',
      { type: 'node.add', node: { id: 'J1', kind: 'junction' } },
      'duplicate-id',
      /^node\.add: a node with id J1 already exists$/,
      ['J1'],
    ],
    [
      'bad node value',
      { type: 'node.add', node: { id: 'F9', kind: 'fixture', fixture: 'shower', count: 0 } },
      'invalid',
      /^node\.add F9: node\.count: Too small/,
      ['F9'],
    ],
    [
      'node on an unknown level',
      { type: 'node.add', node: { id: 'J9', kind: 'junction', levelId: 'L9' } },
      'not-found',
      /^node\.add J9: level L9 does not exist$/,
      ['J9', 'L9'],
    ],
    [
      'update of a missing node',
      { type: 'node.update', id: 'J9', patch: { label: 'x' } },
      'not-found',
      /^node\.update: no node with id J9$/,
      ['J9'],
    ],
    [
      'patch touching kind',
      { type: 'node.update', id: 'J1', patch: { kind: 'fixture' } },
      'invalid',
      /^node\.update J1: patch: Unrecognized key: "kind"$/,
      ['J1'],
    ],
    [
      'patch touching id',
      { type: 'node.update', id: 'J1', patch: { id: 'J7' } },
      'invalid',
      /^node\.update J1: patch: Unrecognized key: "id"$/,
      ['J1'],
    ],
    [
      'field of another kind',
      { type: 'node.update', id: 'J1', patch: { pressureKPa: 300 } },
      'invalid',
      /^node\.update J1: a junction node has no field "pressureKPa"$/,
      ['J1'],
    ],
    [
      'out-of-range value',
      { type: 'node.update', id: 'F1', patch: { count: 501 } },
      'invalid',
      /^node\.update F1: patch\.count: Too big/,
      ['F1'],
    ],
    [
      'clearing a required field',
      { type: 'node.update', id: 'S1', patch: { pressureKPa: null } },
      'invalid',
      /^node\.update S1: pressureKPa: /,
      ['S1'],
    ],
    [
      'move of a missing node',
      { type: 'node.move', id: 'F9', position: { x: 0, y: 0 } },
      'not-found',
      /^node\.move: no node with id F9$/,
      ['F9'],
    ],
    [
      'move to a non-number',
      { type: 'node.move', id: 'F1', position: { x: Number.NaN, y: 0 } },
      'invalid',
      /^node\.move F1: position\.x: /,
      ['F1'],
    ],
    [
      'move to an unknown level',
      { type: 'node.move', id: 'F1', position: { x: 0, y: 0 }, levelId: 'L8' },
      'not-found',
      /^node\.move F1: level L8 does not exist$/,
      ['F1', 'L8'],
    ],
    [
      'remove of a missing node',
      { type: 'node.remove', id: 'J9' },
      'not-found',
      /^node\.remove: no node with id J9$/,
      ['J9'],
    ],
    [
      'duplicate pipe',
      { type: 'pipe.add', pipe: { id: 'P1', from: 'J1', to: 'J2', system: 'cold', lengthM: 1 } },
      'duplicate-id',
      /^pipe\.add: a pipe with id P1 already exists$/,
      ['P1'],
    ],
    [
      'pipe to missing nodes',
      { type: 'pipe.add', pipe: { id: 'P9', from: 'J7', to: 'J8', system: 'cold', lengthM: 1 } },
      'not-found',
      /^pipe\.add P9: node J7, J8 does not exist$/,
      ['P9', 'J7', 'J8'],
    ],
    [
      'pipe with an unknown system',
      { type: 'pipe.add', pipe: { id: 'P9', from: 'J1', to: 'J2', system: 'warm', lengthM: 1 } },
      'invalid',
      /^pipe\.add P9: pipe\.system: /,
      ['P9'],
    ],
    [
      'update of a missing pipe',
      { type: 'pipe.update', id: 'P9', patch: { lengthM: 2 } },
      'not-found',
      /^pipe\.update: no pipe with id P9$/,
      ['P9'],
    ],
    [
      're-route to a missing node',
      { type: 'pipe.update', id: 'P4', patch: { to: 'F8' } },
      'not-found',
      /^pipe\.update P4: node F8 does not exist$/,
      ['P4', 'F8'],
    ],
    [
      'pipe length as text',
      { type: 'pipe.update', id: 'P4', patch: { lengthM: '4 m' } },
      'invalid',
      /^pipe\.update P4: patch\.lengthM: /,
      ['P4'],
    ],
    [
      'remove of a missing pipe',
      { type: 'pipe.remove', id: 'P9' },
      'not-found',
      /^pipe\.remove: no pipe with id P9$/,
      ['P9'],
    ],
    [
      'setting out of range',
      { type: 'settings.update', patch: { fittingAllowance: 5 } },
      'invalid',
      /^settings\.update: patch\.fittingAllowance: Too big/,
      [],
    ],
    [
      'unknown setting',
      { type: 'settings.update', patch: { colour: 'blue' } },
      'invalid',
      /^settings\.update: patch: Unrecognized key: "colour"$/,
      [],
    ],
    [
      'duplicate level',
      { type: 'level.add', level: { id: 'L1', name: 'Again', elevationM: 0 } },
      'duplicate-id',
      /^level\.add: a level with id L1 already exists$/,
      ['L1'],
    ],
    [
      'update of a missing level',
      { type: 'level.update', id: 'L9', patch: { name: 'x' } },
      'not-found',
      /^level\.update: no level with id L9$/,
      ['L9'],
    ],
    [
      'blank level name',
      { type: 'level.update', id: 'L1', patch: { name: '   ' } },
      'invalid',
      /^level\.update L1: patch\.name: /,
      ['L1'],
    ],
    [
      'remove of a level in use',
      { type: 'level.remove', id: 'L2' },
      'in-use',
      /^level\.remove L2: still used by node J2, F1; move them first$/,
      ['L2', 'J2', 'F1'],
    ],
    [
      'over-long name',
      { type: 'diagram.rename', name: 'x'.repeat(121) },
      'invalid',
      /^diagram\.rename: name: Too big/,
      [],
    ],
    [
      'unknown op type',
      { type: 'node.paint', id: 'J1' },
      'invalid',
      /^node\.paint J1: type: unknown operation type "node\.paint"/,
      ['J1'],
    ],
    ['not an object', null, 'invalid', /^operation: /, []],
    [
      'failing batch step',
      {
        type: 'batch',
        ops: [
          { type: 'pipe.remove', id: 'P6' },
          {
            type: 'pipe.add',
            pipe: { id: 'P1', from: 'J1', to: 'J2', system: 'cold', lengthM: 1 },
          },
        ],
      },
      'duplicate-id',
      /^batch step 2: pipe\.add: a pipe with id P1 already exists$/,
      ['P1'],
    ],
    [
      'malformed op inside a batch',
      {
        type: 'batch',
        ops: [
          { type: 'pipe.remove', id: 'P6' },
          { type: 'node.update', id: 'F1', patch: { count: 'many' } },
        ],
      },
      'invalid',
      /^batch step 2: node\.update F1: patch\.count: /,
      ['F1'],
    ],
  ])('%s', (_name, op, code, message, ids) => {
    const doc = sampleDiagram()
    const before = structuredClone(doc)
    let caught: unknown
    try {
      applyOperation(doc, op as Operation)
    } catch (error) {
      caught = error
    }
    expect(caught).toBeInstanceOf(OperationError)
    const error = caught as OperationError
    expect(error.message).toMatch(message)
    expect(error.code).toBe(code)
    expect(error.ids).toEqual(expect.arrayContaining(ids))
    expect(doc).toEqual(before)
  })
})

describe('operation schema', () => {
  test('every op type is listed in OPS and parses', () => {
    const parsed = Object.values(OPS).map(
      (type) => operationSchema.safeParse({ type }).error?.issues[0]?.path,
    )
    // Each fails on a payload field, never on the discriminator.
    for (const path of parsed) expect(path).not.toEqual(['type'])
  })

  test('a node patch can reach every field of every kind except id and kind', () => {
    const patchable = new Set(Object.keys(nodePatchSchema.shape))
    for (const kind of nodeSchema.options) {
      for (const field of Object.keys(kind.shape)) {
        if (field !== 'id' && field !== 'kind')
          expect(patchable, `${kind.shape.kind.value}.${field}`).toContain(field)
      }
    }
    expect(NODE_KINDS).toHaveLength(nodeSchema.options.length)
  })

  test('parseOperation returns a JSON round-trippable op', () => {
    const op = parseOperation({
      type: 'node.move',
      id: ' J1 ',
      position: { x: 1, y: 2 },
      levelId: null,
    })
    expect(op).toEqual({ type: 'node.move', id: 'J1', position: { x: 1, y: 2 }, levelId: null })
    expect(JSON.parse(JSON.stringify(op))).toEqual(op)
  })
})
