import { describe, expect, it } from 'vitest'
import {
  elevationOnLevel,
  LEVEL_BAND_HEIGHT,
  levelAtY,
  levelBands,
} from '../../../shared/document/levels'

const levels = [
  { id: 'g', name: 'Ground', elevationM: 0 },
  { id: 'r', name: 'Roof', elevationM: 8.4 },
  { id: 'u', name: 'Upper', elevationM: 4.2 },
]

describe('level bands', () => {
  it('stacks levels with the highest on top', () => {
    expect(levelBands(levels).map((b) => [b.level.id, b.top])).toEqual([
      ['r', 0],
      ['u', LEVEL_BAND_HEIGHT],
      ['g', 2 * LEVEL_BAND_HEIGHT],
    ])
  })

  it.each([
    [-50, 'r'],
    [10, 'r'],
    [LEVEL_BAND_HEIGHT + 1, 'u'],
    [2 * LEVEL_BAND_HEIGHT, 'g'],
    [99_999, 'g'],
  ])('finds the level at y = %d', (y, id) => {
    expect(levelAtY(levels, y)?.id).toBe(id)
  })

  it('has no level when the diagram has none', () => {
    expect(levelAtY([], 100)).toBeNull()
  })

  it('keeps the height above the floor when a node changes level', () => {
    expect(elevationOnLevel(1.0, levels[0], levels[2]!)).toBe(5.2)
    expect(elevationOnLevel(9.4, levels[1], levels[0]!)).toBe(1)
    expect(elevationOnLevel(3, null, levels[2]!)).toBe(4.2)
  })
})

describe('a node placed from the palette', async () => {
  const { newNode } = await import('../../../shared/document/new-node')
  const { emptyDiagram } = await import('../../../shared/document/model')
  const doc = { ...emptyDiagram('t'), levels }

  it('lands on the level under it, fixtures 1 m above the floor', () => {
    const node = newNode(
      doc,
      { kind: 'fixture', fixture: 'lavatory' },
      { x: 10.4, y: LEVEL_BAND_HEIGHT + 20 },
    )
    expect(node).toMatchObject({
      id: 'F1',
      kind: 'fixture',
      levelId: 'u',
      elevationM: 5.2,
      position: { x: 10, y: 380 },
    })
  })

  it('gives devices a visible placeholder value', () => {
    expect(newNode(doc, { kind: 'backflow-preventer' }, { x: 0, y: 0 })).toMatchObject({
      id: 'BP1',
      lossKPa: 70,
      elevationM: 8.4,
    })
  })
})
