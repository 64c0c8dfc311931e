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
