import { describe, expect, test } from 'vitest'
import { Position } from '@vue-flow/core'
import { facingSide, pipeSides } from '@/features/editor/edges/pipe-route.ts'

describe('pipe routing sides', () => {
  test.each([
    [{ x: 0, y: -100 }, Position.Top],
    [{ x: 0, y: 100 }, Position.Bottom],
    [{ x: 30, y: -100 }, Position.Top],
    [{ x: 100, y: 0 }, Position.Right],
    [{ x: -100, y: 20 }, Position.Left],
    [{ x: 50, y: -50 }, Position.Top],
  ])('from the origin, a point at %j is faced by %s', (to, side) => {
    expect(facingSide({ x: 0, y: 0 }, to)).toBe(side)
  })

  test('only point ends change their side', () => {
    const ends = {
      source: { x: 0, y: 0 },
      target: { x: 0, y: -200 },
      sourcePosition: Position.Top,
      targetPosition: Position.Bottom,
    }
    expect(pipeSides({ ...ends, sourceIsPoint: false, targetIsPoint: false })).toEqual({
      sourcePosition: Position.Top,
      targetPosition: Position.Bottom,
    })
    const across = { ...ends, target: { x: 300, y: 0 }, targetPosition: Position.Left }
    expect(pipeSides({ ...across, sourceIsPoint: true, targetIsPoint: true })).toEqual({
      sourcePosition: Position.Right,
      targetPosition: Position.Left,
    })
    expect(pipeSides({ ...across, sourceIsPoint: true, targetIsPoint: false })).toEqual({
      sourcePosition: Position.Right,
      targetPosition: Position.Left,
    })
  })
})
