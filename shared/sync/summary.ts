import { OPS, type Operation } from '../document/operations.ts'

// What a designer calls the fields an op changes; a key not listed is shown as it is.
const FIELD_WORDS: Record<string, string> = {
  label: 'label',
  elevationM: 'elevation',
  levelId: 'level',
  position: 'position',
  pressureKPa: 'supply pressure',
  lossKPa: 'pressure loss',
  setKPa: 'set pressure',
  fixture: 'fixture type',
  count: 'count',
  occupancy: 'occupancy',
  load: 'load override',
  minPressureKPa: 'minimum pressure',
  flowLps: 'flow',
  lengthM: 'length',
  material: 'material',
  nominal: 'locked size',
  system: 'system',
  loadBasis: 'load basis',
  velocityLimits: 'velocity limits',
  fittingAllowance: 'fitting allowance',
  frictionMethod: 'friction method',
  maxStaticKPa: 'maximum static pressure',
  waterTempC: 'water temperature',
}

const fields = (patch: object) =>
  Object.keys(patch)
    .map((key) => FIELD_WORDS[key] ?? key)
    .join(', ')

/**
 * A short plain-language line for an op, for the revision list.
 * @example
 * summarizeOperation({ type: 'node.move', id: 'J2', position: { x: 0, y: 0 } }) // 'moved J2'
 * summarizeOperation({ type: 'batch', ops: [a, b, c] }) // '3 changes'
 */
export function summarizeOperation(op: Operation): string {
  switch (op.type) {
    case OPS.nodeAdd:
      return `added ${op.node.id}`
    case OPS.nodeUpdate:
      return `changed ${fields(op.patch)} of ${op.id}`
    case OPS.nodeMove:
      return `moved ${op.id}`
    case OPS.nodeRemove:
      return `removed ${op.id}`
    case OPS.pipeAdd:
      return `added pipe ${op.pipe.id} (${op.pipe.from} → ${op.pipe.to})`
    case OPS.pipeUpdate:
      return `changed ${fields(op.patch)} of pipe ${op.id}`
    case OPS.pipeRemove:
      return `removed pipe ${op.id}`
    case OPS.settingsUpdate:
      return `changed settings: ${fields(op.patch)}`
    case OPS.levelAdd:
      return `added level ${op.level.name}`
    case OPS.levelUpdate:
      return `changed level ${op.id}`
    case OPS.levelRemove:
      return `removed level ${op.id}`
    case OPS.diagramRename:
      return `renamed the diagram to "${op.name}"`
    case OPS.batch:
      return op.ops.length === 1 ? summarizeOperation(op.ops[0]!) : `${op.ops.length} changes`
  }
}
