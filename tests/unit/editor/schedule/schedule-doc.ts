/** A small real diagram for the schedule and inspector tests: cold and hot, a flush valve battery. */
import { diagramSchema, type Diagram } from '@shared/document/model.ts'

/** Street supply → meter → riser junction → a battery of 4 flush valve closets, lavatories, heater. */
export function scheduleDiagram(name = 'Fernbrook Clinic, east wing'): Diagram {
  return diagramSchema.parse({
    format: 'tributary-diagram',
    version: 1,
    name,
    // Stated, not defaulted: the series basis is what the battery tests are about.
    settings: { loadBasis: 'flush-valve-series', occupancy: 'public' },
    nodes: [
      { id: 's', kind: 'supply', label: 'Street main', pressureKPa: 450 },
      { id: 'm', kind: 'meter', label: 'Meter', lossKPa: 20 },
      { id: 'j1', kind: 'junction', label: 'Riser A, level 1', elevationM: 3 },
      {
        id: 'wc',
        kind: 'fixture',
        label: 'WC battery',
        fixture: 'water-closet-flush-valve',
        count: 4,
        elevationM: 3,
      },
      {
        id: 'lav',
        kind: 'fixture',
        label: 'Lavatories',
        fixture: 'lavatory',
        count: 3,
        elevationM: 3,
      },
      { id: 'wh', kind: 'water-heater', label: 'Heater', elevationM: 3 },
    ],
    pipes: [
      { id: 'p1', from: 's', to: 'm', system: 'cold', lengthM: 10 },
      { id: 'p2', from: 'm', to: 'j1', system: 'cold', lengthM: 15 },
      { id: 'p3', from: 'j1', to: 'wc', system: 'cold', lengthM: 6 },
      { id: 'p4', from: 'j1', to: 'lav', system: 'cold', lengthM: 4, nominal: '3/8' },
      { id: 'p5', from: 'j1', to: 'wh', system: 'cold', lengthM: 3 },
      { id: 'p10', from: 'wh', to: 'lav', system: 'hot', lengthM: 5, nominal: '3/4' },
    ],
  })
}
