/**
 * Fernhollow Community Hall: an invented two-storey community hall used as the demo diagram and
 * as a regression case. City main → meter → backflow preventer → mechanical-room junction; a
 * washroom core with flush valve batteries on the ground floor and flush-tank washrooms upstairs
 * fed by a cold riser; a kitchenette, a janitor's sink, two hose bibbs and a water heater whose
 * hot pipes run to the lavatories, the kitchenette and the service sink. The mains run as one
 * chain along each floor (mechanical room → washrooms → riser → service corridor), as drawn. SI units; positions are
 * canvas pixels laid out as a riser diagram (upper level above, i.e. smaller y).
 */
import { FERNHOLLOW_POSITIONS } from './fernhollow-layout.ts'
import { diagramSchema, type Diagram, type DiagramInput } from '../document/model.ts'

const GROUND = { levelId: 'ground', y: 470, z: 0 }
const UPPER = { levelId: 'upper', y: 170, z: 4.2 }
type Level = typeof GROUND

// Fixture connections sit about 1 m above their floor (common practice, no source).
const at = (level: Level, x: number, dy = 0, dz = 0) => ({
  levelId: level.levelId,
  elevationM: level.z + dz,
  position: { x, y: level.y + dy },
})
const fixture = (id: string, label: string, key: string, level: Level, x: number, count = 1) => ({
  id,
  kind: 'fixture' as const,
  label,
  fixture: key,
  count,
  ...at(level, x, 90, 1.0),
})
const junction = (id: string, label: string, level: Level, x: number, dy = 0) => ({
  id,
  kind: 'junction' as const,
  label,
  ...at(level, x, dy),
})
const cold = (id: string, from: string, to: string, lengthM: number) => ({
  id,
  from,
  to,
  system: 'cold' as const,
  lengthM,
})
const hot = (id: string, from: string, to: string, lengthM: number) => ({
  id,
  from,
  to,
  system: 'hot' as const,
  lengthM,
})

const input: DiagramInput = {
  format: 'tributary-diagram',
  version: 1,
  name: 'Fernhollow Community Hall',
  settings: {
    loadBasis: 'flush-valve-series',
    occupancy: 'public',
    velocityLimits: { cold: 2.4, hot: 1.5 },
    fittingAllowance: 0.25,
    minPressureKPa: 100,
    material: 'copper-l',
  },
  levels: [
    { id: 'ground', name: 'Ground', elevationM: 0 },
    { id: 'upper', name: 'Upper', elevationM: 4.2 },
  ],
  nodes: [
    {
      id: 'supply',
      kind: 'supply',
      label: 'City main',
      pressureKPa: 380,
      ...at(GROUND, 40, 60, -0.9),
    },
    { id: 'meter', kind: 'meter', label: 'Water meter', lossKPa: 15, ...at(GROUND, 120, 60) },
    {
      id: 'backflow',
      kind: 'backflow-preventer',
      label: 'Backflow preventer',
      lossKPa: 40,
      ...at(GROUND, 200, 60),
    },
    junction('j-mech', 'Mechanical room', GROUND, 280, 60),
    fixture('hb-north', 'Hose bibb, north wall', 'hose-bibb', GROUND, 260),
    {
      id: 'heater',
      kind: 'water-heater',
      label: 'Water heater',
      lossKPa: 10,
      ...at(GROUND, 340, 120),
    },
    junction('j-core', 'Washroom core', GROUND, 420),
    junction('j-g-men', 'Men, ground', GROUND, 460, 30),
    fixture('wc-g-men', 'Water closets, men', 'water-closet-flush-valve', GROUND, 440, 3),
    fixture('ur-g-men', 'Urinals, men', 'urinal-flush-valve', GROUND, 490, 2),
    fixture('lav-g-men', 'Lavatories, men', 'lavatory', GROUND, 540, 3),
    junction('j-g-women', 'Women, ground', GROUND, 600, 30),
    fixture('wc-g-women', 'Water closets, women', 'water-closet-flush-valve', GROUND, 590, 4),
    fixture('lav-g-women', 'Lavatories, women', 'lavatory', GROUND, 640, 3),
    fixture('df-lobby', 'Drinking fountain, lobby', 'drinking-fountain', GROUND, 700),
    junction('riser-c-base', 'Cold riser, base', GROUND, 760),
    junction('riser-c-top', 'Cold riser, top', UPPER, 760),
    junction('j-u-men', 'Men, upper', UPPER, 700, 30),
    fixture('wc-u-men', 'Water closets, men', 'water-closet-tank', UPPER, 660, 2),
    fixture('lav-u-men', 'Lavatories, men', 'lavatory', UPPER, 720, 2),
    junction('j-u-women', 'Women, upper', UPPER, 840, 30),
    fixture('wc-u-women', 'Water closets, women', 'water-closet-tank', UPPER, 820, 2),
    fixture('lav-u-women', 'Lavatories, women', 'lavatory', UPPER, 880, 2),
    junction('j-service', 'Service corridor', GROUND, 960),
    fixture('ks-kitchen', 'Kitchenette sink', 'kitchen-sink', GROUND, 940),
    fixture('dw-kitchen', 'Kitchenette dishwasher', 'dishwasher', GROUND, 990),
    fixture('ss-janitor', "Janitor's service sink", 'service-sink', GROUND, 1050),
    fixture('hb-south', 'Hose bibb, south wall', 'hose-bibb', GROUND, 1120),
    junction('jh-mech', 'Hot main', GROUND, 380, 150),
    junction('jh-core', 'Hot, washroom core', GROUND, 560, 150),
    junction('jh-g-women', 'Hot, women ground', GROUND, 640, 150),
    junction('riser-h-base', 'Hot riser, base', GROUND, 790, 150),
    junction('riser-h-top', 'Hot riser, top', UPPER, 790, 150),
    junction('jh-service', 'Hot, service corridor', GROUND, 1000, 150),
  ],
  pipes: [
    cold('c-service', 'supply', 'meter', 12),
    cold('c-meter', 'meter', 'backflow', 1.5),
    cold('c-mech', 'backflow', 'j-mech', 3),
    cold('c-hb-north', 'j-mech', 'hb-north', 8),
    cold('c-heater', 'j-mech', 'heater', 2.5),
    cold('c-core', 'j-mech', 'j-core', 6),
    cold('c-g-men', 'j-core', 'j-g-men', 3),
    cold('c-wc-g-men', 'j-g-men', 'wc-g-men', 4),
    cold('c-ur-g-men', 'j-g-men', 'ur-g-men', 3),
    cold('c-lav-g-men', 'j-g-men', 'lav-g-men', 3),
    cold('c-g-women', 'j-g-men', 'j-g-women', 4),
    cold('c-wc-g-women', 'j-g-women', 'wc-g-women', 5),
    cold('c-lav-g-women', 'j-g-women', 'lav-g-women', 3),
    cold('c-df-lobby', 'j-core', 'df-lobby', 5),
    cold('c-riser-feed', 'j-g-women', 'riser-c-base', 3),
    cold('c-riser', 'riser-c-base', 'riser-c-top', 4.2),
    cold('c-u-men', 'riser-c-top', 'j-u-men', 3),
    cold('c-wc-u-men', 'j-u-men', 'wc-u-men', 3),
    cold('c-lav-u-men', 'j-u-men', 'lav-u-men', 2.5),
    cold('c-u-women', 'riser-c-top', 'j-u-women', 4),
    cold('c-wc-u-women', 'j-u-women', 'wc-u-women', 3),
    cold('c-lav-u-women', 'j-u-women', 'lav-u-women', 2.5),
    cold('c-service-run', 'riser-c-base', 'j-service', 6),
    cold('c-kitchen', 'j-service', 'ks-kitchen', 4),
    cold('c-janitor', 'j-service', 'ss-janitor', 3),
    cold('c-hb-south', 'j-service', 'hb-south', 9),
    hot('h-main', 'heater', 'jh-mech', 2),
    hot('h-core', 'jh-mech', 'jh-core', 6),
    hot('h-lav-g-men', 'jh-core', 'lav-g-men', 4),
    hot('h-g-women', 'jh-core', 'jh-g-women', 4),
    hot('h-lav-g-women', 'jh-g-women', 'lav-g-women', 2),
    hot('h-riser-feed', 'jh-g-women', 'riser-h-base', 3),
    hot('h-riser', 'riser-h-base', 'riser-h-top', 4.2),
    hot('h-lav-u-men', 'riser-h-top', 'lav-u-men', 4),
    hot('h-lav-u-women', 'riser-h-top', 'lav-u-women', 5),
    hot('h-service-run', 'riser-h-base', 'jh-service', 6),
    hot('h-kitchen', 'jh-service', 'ks-kitchen', 4),
    hot('h-dw-kitchen', 'jh-service', 'dw-kitchen', 4.5),
    hot('h-janitor', 'jh-service', 'ss-janitor', 3),
  ],
}

/** The Fernhollow Community Hall demo diagram (parsed, defaults filled in). */
export const fernhollowHallDiagram: Diagram = diagramSchema.parse({
  ...input,
  nodes: input.nodes.map((node) => ({
    ...node,
    position: FERNHOLLOW_POSITIONS[node.id] ?? node.position,
  })),
})
