import fc from 'fast-check'
import { describe, expect, test } from 'vitest'
import {
  applyWithInverse,
  canRedo,
  canUndo,
  createHistory,
  invertOperation,
  MOVE_COALESCE_MS,
  record,
  redo,
  undo,
  type History,
} from '@shared/document/history'
import type { Diagram } from '@shared/document/model'
import { applyOperation, type Operation } from '@shared/document/operations'
import { anyOpArb, diagramArb, realizeAny } from './arbitraries'
import { sampleDiagram } from './sample'

/** Applies and records, the way the store does. */
function edit(state: { doc: Diagram; history: History }, op: Operation, at = 0) {
  const { doc, inverse } = applyWithInverse(state.doc, op)
  return { doc, history: record(state.history, op, inverse, at) }
}

const move = (
  id: string,
  x: number,
  extra: Partial<{ levelId: string; elevationM: number }> = {},
): Operation => ({
  type: 'node.move',
  id,
  position: { x, y: x },
  ...extra,
})

describe('invertOperation', () => {
  test('inverse of node.remove restores the node and its pipes in their old places', () => {
    const doc = sampleDiagram()
    const inverse = invertOperation(doc, { type: 'node.remove', id: 'J2' })
    expect(inverse).toEqual({
      type: 'batch',
      ops: [
        { type: 'node.add', node: doc.nodes[4], index: 4 },
        { type: 'pipe.add', pipe: doc.pipes[3], index: 3 },
        { type: 'pipe.add', pipe: doc.pipes[4], index: 4 },
      ],
    })
  })

  test('inverse of a patch clears with null what the item did not have', () => {
    const doc = sampleDiagram()
    const inverse = invertOperation(doc, {
      type: 'pipe.update',
      id: 'P4',
      patch: { nominal: '1', lengthM: 9 },
    })
    expect(inverse).toEqual({ type: 'pipe.update', id: 'P4', patch: { nominal: null, lengthM: 4 } })
  })

  test('inverse of a batch undoes its steps in reverse order', () => {
    const doc = sampleDiagram()
    const op: Operation = {
      type: 'batch',
      ops: [
        { type: 'node.add', node: { id: 'J3', kind: 'junction', label: '', elevationM: 0 } },
        { type: 'pipe.add', pipe: { id: 'P7', from: 'J2', to: 'J3', system: 'cold', lengthM: 2 } },
      ],
    }
    expect(invertOperation(doc, op)).toEqual({
      type: 'batch',
      ops: [
        { type: 'pipe.remove', id: 'P7' },
        { type: 'node.remove', id: 'J3' },
      ],
    })
  })

  test('an op that cannot apply cannot be inverted either', () => {
    expect(() => invertOperation(sampleDiagram(), { type: 'pipe.remove', id: 'P9' })).toThrow(
      /no pipe with id P9/,
    )
  })
})

describe('undo/redo stack', () => {
  test('undo and redo walk back and forth', () => {
    let state = { doc: sampleDiagram(), history: createHistory() }
    const start = state.doc
    state = edit(state, { type: 'diagram.rename', name: 'B' })
    state = edit(state, { type: 'node.remove', id: 'F1' })
    const end = state.doc

    const first = undo(state.history, state.doc)!
    expect(first.ok).toBe(true)
    if (!first.ok) return
    const second = undo(first.history, first.doc)!
    if (!second.ok) throw second.error
    expect(second.doc).toEqual(start)
    expect(canUndo(second.history)).toBe(false)
    expect(undo(second.history, second.doc)).toBeNull()

    const again = redo(second.history, second.doc)!
    if (!again.ok) throw again.error
    const twice = redo(again.history, again.doc)!
    if (!twice.ok) throw twice.error
    expect(twice.doc).toEqual(end)
    expect(canRedo(twice.history)).toBe(false)
    expect(twice.op).toEqual({ type: 'node.remove', id: 'F1' })
  })

  test('a new edit clears redo', () => {
    let state = { doc: sampleDiagram(), history: createHistory() }
    state = edit(state, { type: 'diagram.rename', name: 'B' })
    const undone = undo(state.history, state.doc)!
    if (!undone.ok) throw undone.error
    expect(canRedo(undone.history)).toBe(true)
    const next = edit(
      { doc: undone.doc, history: undone.history },
      { type: 'diagram.rename', name: 'C' },
    )
    expect(canRedo(next.history)).toBe(false)
  })

  test('the stack is capped; the oldest steps fall off', () => {
    let state = { doc: sampleDiagram(), history: createHistory(3) }
    for (const name of ['a', 'b', 'c', 'd', 'e'])
      state = edit(state, { type: 'diagram.rename', name })
    expect(state.history.past).toHaveLength(3)
    expect(state.history.past[0]!.inverse).toEqual({ type: 'diagram.rename', name: 'b' })
  })

  test('quick moves of one node merge into one step; slow ones or other nodes do not', () => {
    let state = { doc: sampleDiagram(), history: createHistory() }
    const start = state.doc
    state = edit(state, move('J1', 10), 0)
    state = edit(state, move('J1', 20), 300)
    state = edit(state, move('J1', 30), 600)
    expect(state.history.past).toHaveLength(1)
    state = edit(state, move('J2', 5), 700)
    state = edit(state, move('J2', 6), 700 + MOVE_COALESCE_MS)
    expect(state.history.past).toHaveLength(3)

    let result = { doc: state.doc, history: state.history }
    for (let i = 0; i < 3; i++) {
      const step = undo(result.history, result.doc)!
      if (!step.ok) throw step.error
      result = step
    }
    expect(result.doc).toEqual(start)
  })

  test('a move that changes the level does not merge into a plain move', () => {
    let state = { doc: sampleDiagram(), history: createHistory() }
    state = edit(state, move('J2', 10), 0)
    state = edit(state, move('J2', 20, { levelId: 'L3' }), 10)
    expect(state.history.past).toHaveLength(2)
  })

  test('a step that no longer applies is dropped and reported', () => {
    let state = { doc: sampleDiagram(), history: createHistory() }
    state = edit(state, { type: 'node.update', id: 'F1', patch: { count: 3 } })
    // A collaborator removed F1 meanwhile.
    const remote = applyOperation(state.doc, { type: 'node.remove', id: 'F1' })
    const step = undo(state.history, remote)!
    expect(step.ok).toBe(false)
    if (step.ok) return
    expect(step.error.message).toMatch(/no node with id F1/)
    expect(canUndo(step.history)).toBe(false)
  })

  test('property: undoing every step restores the start, redoing every step restores the end', () => {
    fc.assert(
      fc.property(
        diagramArb,
        fc.array(anyOpArb, { minLength: 1, maxLength: 5 }),
        (start, seedList) => {
          let state = { doc: start, history: createHistory() }
          seedList.forEach((seeds, i) => {
            state = edit(state, realizeAny(state.doc, seeds), i * 10_000)
          })
          const end = state.doc
          let cursor = { doc: state.doc, history: state.history }
          while (canUndo(cursor.history)) {
            const step = undo(cursor.history, cursor.doc)!
            if (!step.ok) throw step.error
            cursor = step
          }
          expect(cursor.doc).toEqual(start)
          while (canRedo(cursor.history)) {
            const step = redo(cursor.history, cursor.doc)!
            if (!step.ok) throw step.error
            cursor = step
          }
          expect(cursor.doc).toEqual(end)
        },
      ),
      { numRuns: 150 },
    )
  })
})
