import type { DiagramInput } from '../../../shared/document/model.ts'

/** Street main → two junctions → a basin: the small diagram the realtime tests edit. */
export const smallRiser: DiagramInput = {
  format: 'tributary-diagram',
  version: 1,
  name: 'Domestic water',
  nodes: [
    { id: 'S1', kind: 'supply', label: 'Street main', pressureKPa: 420 },
    { id: 'J1', kind: 'junction' },
    { id: 'J2', kind: 'junction' },
    { id: 'F1', kind: 'fixture', fixture: 'lavatory', label: 'Basin' },
  ],
  pipes: [
    { id: 'P1', from: 'S1', to: 'J1', system: 'cold', lengthM: 6 },
    { id: 'P2', from: 'J1', to: 'J2', system: 'cold', lengthM: 4 },
    { id: 'P3', from: 'J2', to: 'F1', system: 'cold', lengthM: 2 },
  ],
}
