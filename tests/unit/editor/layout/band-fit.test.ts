import { describe, expect, it } from 'vitest'
import { LEVEL_BAND_HEIGHT } from '../../../../shared/document/levels'
import { emptyDiagram, type Diagram } from '../../../../shared/document/model'
import { fitIntoBands } from '../../../../src/features/editor/layout/band-fit'

const doc: Diagram = {
  ...emptyDiagram('t'),
  levels: [
    { id: 'g', name: 'Ground', elevationM: 0 },
    { id: 'u', name: 'Upper', elevationM: 4 },
  ],
  nodes: [
    { id: 'S1', kind: 'supply', label: '', elevationM: 0, pressureKPa: 400, levelId: 'g' },
    { id: 'J1', kind: 'junction', label: '', elevationM: 0, levelId: 'g' },
    { id: 'J2', kind: 'junction', label: '', elevationM: 4, levelId: 'u' },
    { id: 'J3', kind: 'junction', label: '', elevationM: 4, levelId: 'u' },
  ],
}

describe('fitting a free layout into level bands', () => {
  it('keeps x, keeps order, and puts every node inside its own level band', () => {
    const free = new Map([
      ['S1', { x: 0, y: 900 }],
      ['J1', { x: 200, y: 700 }],
      ['J2', { x: 200, y: 300 }],
      ['J3', { x: 400, y: 100 }],
    ])
    const placed = fitIntoBands(doc, free)
    expect(placed.get('J3')!.x).toBe(400)
    // Upper is the top band, ground the second.
    for (const id of ['J2', 'J3']) expect(placed.get(id)!.y).toBeLessThan(LEVEL_BAND_HEIGHT)
    for (const id of ['S1', 'J1']) {
      expect(placed.get(id)!.y).toBeGreaterThanOrEqual(LEVEL_BAND_HEIGHT)
      expect(placed.get(id)!.y).toBeLessThan(2 * LEVEL_BAND_HEIGHT)
    }
    expect(placed.get('J1')!.y).toBeLessThan(placed.get('S1')!.y)
    expect(placed.get('J3')!.y).toBeLessThan(placed.get('J2')!.y)
  })
})

describe('placing a clicked palette item', async () => {
  const { placeNear } = await import('../../../../src/features/editor/composables/useCanvasIntents')
  const parent = { ...doc.nodes[1]!, position: { x: 400, y: 500 } }
  const base: Diagram = { ...doc, nodes: [doc.nodes[0]!, parent], pipes: [] }

  it('puts a fixture above its branch and the next one beside it', () => {
    expect(placeNear(base, parent, 'fixture', { x: 0, y: 0 })).toEqual({ x: 400, y: 360 })
    const withOne: Diagram = {
      ...base,
      pipes: [{ id: 'P1', from: 'J1', to: 'F1', system: 'cold', lengthM: 2 }],
    }
    expect(placeNear(withOne, parent, 'fixture', { x: 0, y: 0 })).toEqual({ x: 590, y: 360 })
  })

  it('puts a junction further along the main, and never on top of another node', () => {
    expect(placeNear(base, parent, 'junction', { x: 0, y: 0 })).toEqual({ x: 600, y: 500 })
    expect(placeNear(base, undefined, 'junction', { x: 410, y: 510 })).toEqual({ x: 490, y: 590 })
  })
})
