// @vitest-environment node
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import type { Diagram } from '../../../shared/document/model.ts'
import { applyOperation, OperationError } from '../../../shared/document/operations.ts'
import { diffDocuments, sameValue } from '../../../shared/sync/diff.ts'
import { graphRuleProblem } from '../../../shared/sync/graph-rules.ts'
import { colorFor, initialsOf, mergeSelections } from '../../../shared/sync/presence.ts'
import { summarizeOperation } from '../../../shared/sync/summary.ts'
import { prng, randomOperation, seedDiagram } from '../../integration/helpers/realtime-random.ts'

const byId = (doc: Diagram) => ({
  ...doc,
  nodes: [...doc.nodes].sort((a, b) => a.id.localeCompare(b.id)),
  pipes: [...doc.pipes].sort((a, b) => a.id.localeCompare(b.id)),
})

/** A document reached by `count` random edits from the seed riser. */
function evolve(seed: number, count: number): Diagram {
  const rand = prng(seed)
  let doc = seedDiagram()
  for (let i = 0; i < count; i++) {
    try {
      doc = applyOperation(doc, randomOperation(doc, rand, 'x', i))
    } catch (error) {
      if (!(error instanceof OperationError)) throw error
    }
  }
  return doc
}

describe('diffDocuments', () => {
  it('turns any document into any other (a restore), with ordinary ops', () => {
    fc.assert(
      fc.property(fc.integer(), fc.integer(), fc.nat(40), fc.nat(40), (s1, s2, n1, n2) => {
        const from = evolve(s1, n1)
        const to = { ...evolve(s2, n2), name: from.name }
        const op = diffDocuments(from, to)
        expect(byId(applyOperation(from, op))).toEqual(byId(to))
      }),
      { numRuns: 150 },
    )
  })

  it('is empty between equal documents and handles a node that changed kind', () => {
    const doc = seedDiagram()
    expect(diffDocuments(doc, doc).ops).toEqual([])
    const to = {
      ...doc,
      nodes: doc.nodes.map((n) =>
        n.id === 'J2'
          ? { id: 'J2', kind: 'meter' as const, label: '', elevationM: 0, lossKPa: 20 }
          : n,
      ),
    }
    expect(applyOperation(doc, diffDocuments(doc, to))).toEqual(to)
  })

  it('compares JSON values regardless of key order', () => {
    expect(sameValue({ a: 1, b: [1, { c: 2 }] }, { b: [1, { c: 2 }], a: 1 })).toBe(true)
    expect(sameValue({ a: 1 }, { a: 1, b: undefined })).toBe(true)
    expect(sameValue([1, 2], [2, 1])).toBe(false)
  })
})

describe('graph rules and presence helpers', () => {
  it('names the pipe and nodes of a loop or a second inlet, and ignores untouched problems', () => {
    const doc = seedDiagram()
    const loop = applyOperation(doc, { type: 'pipe.update', id: 'P1', patch: { from: 'F1' } })
    expect(graphRuleProblem(doc, loop)).toMatchObject({
      message: /P1.*close a loop/,
      ids: ['P1', 'F1', 'J1'],
    })
    const extra = { id: 'P9', from: 'S1', to: 'J2', system: 'cold' as const, lengthM: 2 }
    const twice = applyOperation(doc, { type: 'pipe.add', pipe: extra })
    expect(graphRuleProblem(doc, twice)?.message).toMatch(/J2 already has a cold inlet/)
    expect(
      graphRuleProblem(
        twice,
        applyOperation(twice, { type: 'node.update', id: 'F1', patch: { count: 2 } }),
      ),
    ).toBeNull()
  })

  it('gives initials, a stable colour and merged selections; summarises ops', () => {
    expect(initialsOf('Ada  Ng Lovelace')).toBe('AL')
    expect(initialsOf(' ')).toBe('?')
    expect(colorFor('user-1')).toBe(colorFor('user-1'))
    expect(
      mergeSelections([
        { nodes: ['J1'], pipes: [] },
        { nodes: ['J1', 'F2'], pipes: ['P3'] },
      ]),
    ).toEqual({
      nodes: ['J1', 'F2'],
      pipes: ['P3'],
    })
    expect(summarizeOperation({ type: 'node.move', id: 'J2', position: { x: 0, y: 0 } })).toBe(
      'moved J2',
    )
    expect(
      summarizeOperation({
        type: 'settings.update',
        patch: { minPressureKPa: 380, material: 'pex' },
      }),
    ).toBe('changed settings: minimum pressure, material')
    expect(
      summarizeOperation({ type: 'pipe.update', id: 'P4', patch: { lengthM: 3, nominal: '1' } }),
    ).toBe('changed length, locked size of pipe P4')
    expect(
      summarizeOperation({
        type: 'batch',
        ops: [
          { type: 'node.remove', id: 'A' },
          { type: 'node.remove', id: 'B' },
        ],
      }),
    ).toBe('2 changes')
  })
})
