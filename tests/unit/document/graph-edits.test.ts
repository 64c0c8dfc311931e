import { describe, expect, test } from 'vitest'
import {
  connectionProblem,
  inletConflict,
  removalOperation,
  wouldCreateCycle,
} from '@shared/document/graph-edits'
import { applyOperation } from '@shared/document/operations'
import { sampleDiagram } from './sample'

describe('wouldCreateCycle', () => {
  test.each([
    ['J2', 'J1', true], // J1 → J2 exists
    ['F1', 'S1', true], // S1 feeds F1 through the meter and J1
    ['F1', 'WH1', true], // through the heater: cold in, hot out
    ['J1', 'J1', true],
    ['J2', 'WH1', false],
    ['WH1', 'J2', false],
  ])('%s → %s: %s', (from, to, expected) => {
    expect(wouldCreateCycle(sampleDiagram(), from, to)).toBe(expected)
  })
})

describe('inletConflict', () => {
  test('a second inlet of the same system names the existing pipe', () => {
    const conflict = inletConflict(sampleDiagram(), { to: 'F1', system: 'cold' })
    expect(conflict?.pipeId).toBe('P5')
    expect(conflict?.message).toMatch(/F1 already has a cold inlet \(pipe P5 from J2\)/)
  })

  test('the other system is free', () => {
    expect(inletConflict(sampleDiagram(), { to: 'J2', system: 'hot' })).toBeNull()
  })

  test('a pipe being re-routed does not conflict with itself', () => {
    expect(inletConflict(sampleDiagram(), { id: 'P5', to: 'F1', system: 'cold' })).toBeNull()
  })
})

describe('connectionProblem', () => {
  test.each([
    [{ from: 'J2', to: 'J9', system: 'cold' as const }, /node J9 does not exist/],
    [{ from: 'J2', to: 'J2', system: 'cold' as const }, /cannot start and end at J2/],
    [{ from: 'J2', to: 'J1', system: 'hot' as const }, /would close a loop: J1 already feeds J2/],
    [{ from: 'WH1', to: 'J2', system: 'cold' as const }, /J2 already has a cold inlet/],
  ])('%o is refused', (pipe, message) => {
    expect(connectionProblem(sampleDiagram(), pipe)).toMatch(message)
  })

  test('a sound connection passes', () => {
    expect(connectionProblem(sampleDiagram(), { from: 'WH1', to: 'J2', system: 'hot' })).toBeNull()
  })
})

describe('removalOperation', () => {
  test('removes chosen pipes and nodes in one batch, skipping pipes the nodes take along', () => {
    const doc = sampleDiagram()
    const op = removalOperation(doc, ['F1', 'gone'], ['P5', 'P3'])
    expect(op).toEqual({
      type: 'batch',
      ops: [
        { type: 'pipe.remove', id: 'P3' },
        { type: 'node.remove', id: 'F1' },
      ],
    })
    const after = applyOperation(doc, op)
    expect(after.pipes.map((pipe) => pipe.id)).toEqual(['P1', 'P2', 'P4'])
  })
})
