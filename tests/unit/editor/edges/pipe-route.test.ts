import { describe, expect, test } from 'vitest'
import { Position } from '@vue-flow/core'
import { facingSide, labelAnchor, pipeSides } from '@/features/editor/edges/pipe-route.ts'

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

describe('pipe label placement', () => {
  const centre = { x: 100, y: 500 }
  const ends = { source: { x: 0, y: 560 }, target: { x: 200, y: 430 }, targetIsPoint: false }

  test('a pipe rising into a fixture is labelled on its final vertical run, hot and cold apart', () => {
    const cold = labelAnchor(ends, centre, 'cold')
    const hot = labelAnchor(ends, centre, 'hot')
    expect(cold.x).toBe(200)
    expect(hot.x).toBe(200)
    expect(cold.y).toBeGreaterThan(430)
    expect(cold.y).toBeLessThan(500)
    expect(Math.abs(hot.y - cold.y)).toBeGreaterThan(20)
  })

  test('mains between junctions and short drops keep the centre', () => {
    expect(labelAnchor({ ...ends, targetIsPoint: true }, centre, 'cold')).toEqual(centre)
    expect(labelAnchor({ ...ends, target: { x: 200, y: 540 } }, centre, 'cold')).toEqual(centre)
  })
})
