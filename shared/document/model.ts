/**
 * The diagram document: interchange format v1 (see docs/diagram-format.md).
 * Always SI: metres, kPa, L/s, m/s. Display units are a client concern.
 * Pure zod schemas; graph rules (cycles, inlets, unknown keys) live in shared/calc/validate.ts
 * so that their messages can name the ids involved.
 */
import { z } from 'zod'

export const DIAGRAM_FORMAT = 'tributary-diagram'
export const DIAGRAM_FORMAT_VERSION = 1

export const systemSchema = z.enum(['cold', 'hot'])
export type System = z.infer<typeof systemSchema>

export const occupancySchema = z.enum(['public', 'private'])
export type Occupancy = z.infer<typeof occupancySchema>

export const loadBasisSchema = z.enum(['per-fixture', 'flush-valve-series'])
export type LoadBasis = z.infer<typeof loadBasisSchema>

export const frictionMethodSchema = z.enum(['hazen-williams', 'darcy-weisbach'])
export type FrictionMethod = z.infer<typeof frictionMethodSchema>

const finite = () => z.number().finite()
const nonNegative = () => z.number().finite().nonnegative()
const id = () => z.string().trim().min(1, 'an id is required').max(64)

export const fixtureLoadSchema = z.object({
  cold: nonNegative(),
  hot: nonNegative(),
  total: nonNegative(),
})
export type FixtureLoad = z.infer<typeof fixtureLoadSchema>

export const settingsSchema = z.object({
  loadBasis: loadBasisSchema.default('per-fixture'),
  occupancy: occupancySchema.default('public'),
  velocityLimits: z
    .object({ cold: z.number().positive().max(10), hot: z.number().positive().max(10) })
    .default({ cold: 2.4, hot: 1.5 }),
  /** Fraction of developed length added for fittings and valves (0.25 = 25 %). */
  fittingAllowance: z.number().min(0).max(3).default(0.25),
  /** Default minimum residual pressure at a fixture, kPa. */
  minPressureKPa: nonNegative().default(100),
  /** Default pipe material key for pipes that name none. */
  material: z.string().min(1).default('copper-l'),
  frictionMethod: frictionMethodSchema.default('hazen-williams'),
  /** Static pressure above which a node is flagged, kPa. */
  maxStaticKPa: z.number().positive().default(550),
  /** Water temperature for Darcy-Weisbach viscosity, °C. */
  waterTempC: z.number().min(1).max(95).default(15),
})
export type Settings = z.infer<typeof settingsSchema>

/** Editor-only placement; the calculation ignores it. */
export const positionSchema = z.object({ x: finite(), y: finite() })

const nodeBase = {
  id: id(),
  label: z.string().max(120).default(''),
  elevationM: finite().default(0),
  position: positionSchema.optional(),
  /** Floor level the node is drawn on (editor). */
  levelId: z.string().optional(),
}

export const supplyNodeSchema = z.object({
  ...nodeBase,
  kind: z.literal('supply'),
  pressureKPa: nonNegative(),
})
export const junctionNodeSchema = z.object({ ...nodeBase, kind: z.literal('junction') })
export const meterNodeSchema = z.object({
  ...nodeBase,
  kind: z.literal('meter'),
  lossKPa: nonNegative().default(0),
})
export const backflowPreventerNodeSchema = z.object({
  ...nodeBase,
  kind: z.literal('backflow-preventer'),
  lossKPa: nonNegative().default(0),
})
export const pressureReducingValveNodeSchema = z.object({
  ...nodeBase,
  kind: z.literal('pressure-reducing-valve'),
  setKPa: nonNegative(),
})
export const waterHeaterNodeSchema = z.object({
  ...nodeBase,
  kind: z.literal('water-heater'),
  lossKPa: nonNegative().default(0),
})
export const fixtureNodeSchema = z.object({
  ...nodeBase,
  kind: z.literal('fixture'),
  /** Fixture catalogue key (shared/calc/fixtures.ts). */
  fixture: z.string().min(1),
  /** Identical fixtures on this connection (a battery). */
  count: z.number().int().min(1).max(500).default(1),
  occupancy: occupancySchema.optional(),
  /** Override for an unlisted fixture or an authority's ruling. */
  load: fixtureLoadSchema.optional(),
  minPressureKPa: nonNegative().optional(),
})
export const equipmentNodeSchema = z.object({
  ...nodeBase,
  kind: z.literal('equipment'),
  /** Continuous demand added to the probable flow, L/s. */
  flowLps: nonNegative(),
  minPressureKPa: nonNegative().optional(),
})

export const nodeSchema = z.discriminatedUnion('kind', [
  supplyNodeSchema,
  junctionNodeSchema,
  meterNodeSchema,
  backflowPreventerNodeSchema,
  pressureReducingValveNodeSchema,
  waterHeaterNodeSchema,
  fixtureNodeSchema,
  equipmentNodeSchema,
])
export type DiagramNode = z.infer<typeof nodeSchema>
export type NodeKind = DiagramNode['kind']
export type NodeOfKind<K extends NodeKind> = Extract<DiagramNode, { kind: K }>
export const NODE_KINDS = [
  'supply',
  'meter',
  'backflow-preventer',
  'pressure-reducing-valve',
  'water-heater',
  'junction',
  'fixture',
  'equipment',
] as const satisfies readonly NodeKind[]

export const pipeSchema = z.object({
  id: id(),
  from: id(),
  to: id(),
  system: systemSchema,
  /** Developed length, m; must be > 0 (checked with the ids by the calculation). */
  lengthM: finite(),
  /** Material key; falls back to settings.material. */
  material: z.string().min(1).optional(),
  /** Locked nominal size, e.g. "1-1/4"; sized automatically when absent. */
  nominal: z.string().min(1).optional(),
})
export type Pipe = z.infer<typeof pipeSchema>

export const levelSchema = z.object({
  id: id(),
  name: z.string().trim().min(1).max(60),
  elevationM: finite(),
})
export type Level = z.infer<typeof levelSchema>

export const diagramSchema = z.object({
  format: z.literal(DIAGRAM_FORMAT),
  version: z.literal(DIAGRAM_FORMAT_VERSION),
  name: z.string().max(120).default(''),
  settings: settingsSchema.default(() => settingsSchema.parse({})),
  levels: z.array(levelSchema).default([]),
  nodes: z.array(nodeSchema),
  pipes: z.array(pipeSchema),
})
export type Diagram = z.infer<typeof diagramSchema>
export type DiagramInput = z.input<typeof diagramSchema>

/** An empty, valid document. */
export function emptyDiagram(name = ''): Diagram {
  return diagramSchema.parse({
    format: DIAGRAM_FORMAT,
    version: DIAGRAM_FORMAT_VERSION,
    name,
    nodes: [],
    pipes: [],
  })
}
