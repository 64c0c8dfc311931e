/**
 * A fresh node of a kind, as the palette places it. Device values are placeholders the designer
 * replaces with the manufacturer's data (common practice, no source); they are chosen so that a
 * new device shows a visible, plausible loss rather than silently none.
 */
import { createIdAllocator } from './ids.ts'
import { levelAtY } from './levels.ts'
import { nodeSchema, type Diagram, type DiagramNode, type NodeKind } from './model.ts'

const KIND_DEFAULTS: Record<NodeKind, Record<string, unknown>> = {
  supply: { label: 'Water service', pressureKPa: 400 },
  meter: { label: 'Meter', lossKPa: 20 },
  'backflow-preventer': { label: 'Backflow preventer', lossKPa: 70 },
  'pressure-reducing-valve': { label: 'Pressure-reducing valve', setKPa: 380 },
  'water-heater': { label: 'Water heater', lossKPa: 15 },
  junction: { label: '' },
  fixture: { count: 1 },
  equipment: { label: 'Equipment', flowLps: 0.1 },
}

/** Fixture and equipment connections sit this far above their floor (common practice, no source). */
const OUTLET_HEIGHT_M = 1.0

/**
 * Builds a node of `kind` at canvas `position`, on the level whose band holds it.
 * @example newNode(doc, { kind: 'fixture', fixture: 'lavatory' }, { x: 400, y: 520 })
 */
export function newNode(
  doc: Diagram,
  item: { kind: NodeKind; fixture?: string; label?: string },
  position: { x: number; y: number },
): DiagramNode {
  const level = levelAtY(doc.levels, position.y)
  const aboveFloor = item.kind === 'fixture' || item.kind === 'equipment' ? OUTLET_HEIGHT_M : 0
  const elevationM = (level?.elevationM ?? 0) + aboveFloor
  return nodeSchema.parse({
    ...KIND_DEFAULTS[item.kind],
    ...(item.fixture ? { fixture: item.fixture } : {}),
    ...(item.label ? { label: item.label } : {}),
    id: createIdAllocator(doc)(item.kind),
    kind: item.kind,
    elevationM,
    position: { x: Math.round(position.x), y: Math.round(position.y) },
    levelId: level?.id,
  })
}
