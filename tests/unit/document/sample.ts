/** A small two-storey riser used across the document tests (our own invented scenario). */
import {
  DIAGRAM_FORMAT,
  DIAGRAM_FORMAT_VERSION,
  diagramSchema,
  type Diagram,
} from '@shared/document/model'

export function sampleDiagram(): Diagram {
  return diagramSchema.parse({
    format: DIAGRAM_FORMAT,
    version: DIAGRAM_FORMAT_VERSION,
    name: 'Block A',
    levels: [
      { id: 'L1', name: 'Ground', elevationM: 0 },
      { id: 'L2', name: 'First', elevationM: 3.2 },
      { id: 'L3', name: 'Roof', elevationM: 6.4 },
    ],
    nodes: [
      { id: 'S1', kind: 'supply', pressureKPa: 450, position: { x: 0, y: 0 } },
      { id: 'M1', kind: 'meter', lossKPa: 20, position: { x: 0, y: 100 } },
      { id: 'J1', kind: 'junction', levelId: 'L1', position: { x: 0, y: 200 } },
      { id: 'WH1', kind: 'water-heater', levelId: 'L1', position: { x: 200, y: 200 } },
      { id: 'J2', kind: 'junction', levelId: 'L2', elevationM: 3.2, position: { x: 0, y: 300 } },
      {
        id: 'F1',
        kind: 'fixture',
        fixture: 'lavatory',
        levelId: 'L2',
        elevationM: 3.2,
        position: { x: 100, y: 400 },
      },
    ],
    pipes: [
      { id: 'P1', from: 'S1', to: 'M1', system: 'cold', lengthM: 10 },
      { id: 'P2', from: 'M1', to: 'J1', system: 'cold', lengthM: 3 },
      { id: 'P3', from: 'J1', to: 'WH1', system: 'cold', lengthM: 2 },
      { id: 'P4', from: 'J1', to: 'J2', system: 'cold', lengthM: 4 },
      { id: 'P5', from: 'J2', to: 'F1', system: 'cold', lengthM: 1.5 },
      { id: 'P6', from: 'WH1', to: 'F1', system: 'hot', lengthM: 6 },
    ],
  })
}
