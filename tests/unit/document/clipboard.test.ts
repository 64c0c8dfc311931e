import fc from 'fast-check'
import { describe, expect, test } from 'vitest'
import {
  copySelection,
  FRAGMENT_FORMAT,
  parseFragment,
  pasteFragment,
} from '@shared/document/clipboard'
import { emptyDiagram } from '@shared/document/model'
import { applyOperation, OperationError } from '@shared/document/operations'
import { diagramArb, expectSound } from './arbitraries'
import { sampleDiagram } from './sample'

describe('copySelection', () => {
  test('keeps the chosen nodes and only the pipes between two of them', () => {
    const fragment = copySelection(sampleDiagram(), ['J1', 'J2', 'F1', 'missing'])
    expect(fragment.format).toBe(FRAGMENT_FORMAT)
    expect(fragment.nodes.map((node) => node.id)).toEqual(['J1', 'J2', 'F1'])
    expect(fragment.pipes.map((pipe) => pipe.id)).toEqual(['P4', 'P5'])
  })
})

describe('pasteFragment', () => {
  test('adds copies with fresh ids, re-wired pipes and positions moved by (+40, +40)', () => {
    const doc = sampleDiagram()
    const result = pasteFragment(doc, copySelection(doc, ['J2', 'F1']))
    expect(result.nodeIds).toEqual(['J3', 'F2'])
    expect(result.pipeIds).toEqual(['P7'])
    const after = applyOperation(doc, result.op)
    expect(after.nodes.find((node) => node.id === 'F2')).toMatchObject({
      kind: 'fixture',
      fixture: 'lavatory',
      position: { x: 140, y: 440 },
      levelId: 'L2',
    })
    expect(after.pipes.at(-1)).toEqual({
      id: 'P7',
      from: 'J3',
      to: 'F2',
      system: 'cold',
      lengthM: 1.5,
    })
  })

  test('into another diagram, unknown levels are dropped instead of refusing the paste', () => {
    const source = sampleDiagram()
    const target = emptyDiagram('Block C')
    const { op } = pasteFragment(target, copySelection(source, ['J2', 'F1']), { x: 0, y: 0 })
    const after = applyOperation(target, op)
    expect(after.nodes.map((node) => node.levelId)).toEqual([undefined, undefined])
    expect(after.nodes.map((node) => node.id)).toEqual(['J1', 'F1'])
  })

  test.each([
    ['not a fragment', { nodes: [] }, /clipboard: format: /],
    [
      'a pipe to a node outside',
      {
        format: FRAGMENT_FORMAT,
        nodes: [],
        pipes: [{ id: 'P1', from: 'J1', to: 'J2', system: 'cold', lengthM: 1 }],
      },
      /pipe P1 connects J1, J2, which is not in the fragment/,
    ],
    [
      'a node twice',
      {
        format: FRAGMENT_FORMAT,
        nodes: [
          { id: 'J1', kind: 'junction' },
          { id: 'J1', kind: 'junction' },
        ],
        pipes: [],
      },
      /node J1 appears twice/,
    ],
  ])('refuses %s with a clear error', (_name, input, message) => {
    expect(() => parseFragment(input)).toThrow(OperationError)
    expect(() => parseFragment(input)).toThrow(message)
  })

  test('property: pasting any selection keeps the document valid, with no dangling pipes', () => {
    fc.assert(
      fc.property(diagramArb, fc.array(fc.boolean(), { maxLength: 12 }), (doc, picks) => {
        const chosen = doc.nodes.filter((_, i) => picks[i]).map((node) => node.id)
        const fragment = parseFragment(JSON.parse(JSON.stringify(copySelection(doc, chosen))))
        const { op, nodeIds } = pasteFragment(doc, fragment)
        const after = applyOperation(doc, op)
        expectSound(after)
        expect(after.nodes).toHaveLength(doc.nodes.length + chosen.length)
        expect(nodeIds.every((id) => !doc.nodes.some((node) => node.id === id))).toBe(true)
        // A second paste of the same fragment also fits.
        expectSound(applyOperation(after, pasteFragment(after, fragment).op))
      }),
      { numRuns: 200 },
    )
  })
})
