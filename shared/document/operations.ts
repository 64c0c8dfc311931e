/**
 * The closed set of document operations and the one pure function that applies them.
 * The editor, undo/redo and (later) the socket protocol all speak these ops, so every payload is
 * plain JSON: a patch clears an optional field with `null`, never with `undefined`.
 * Graph rules (loops, second inlets) belong to the calculation's validator; see graph-edits.ts for
 * the editor's early refusal.
 */
import { z } from 'zod'
import {
  equipmentNodeSchema,
  fixtureNodeSchema,
  levelSchema,
  meterNodeSchema,
  nodeSchema,
  pipeSchema,
  positionSchema,
  pressureReducingValveNodeSchema,
  settingsSchema,
  supplyNodeSchema,
  systemSchema,
  type Diagram,
  type DiagramNode,
  type Level,
  type NodeKind,
  type Pipe,
  type Settings,
} from './model.ts'

/** Operation names; the same strings travel over the socket. */
export const OPS = {
  nodeAdd: 'node.add',
  nodeUpdate: 'node.update',
  nodeMove: 'node.move',
  nodeRemove: 'node.remove',
  pipeAdd: 'pipe.add',
  pipeUpdate: 'pipe.update',
  pipeRemove: 'pipe.remove',
  settingsUpdate: 'settings.update',
  levelAdd: 'level.add',
  levelUpdate: 'level.update',
  levelRemove: 'level.remove',
  diagramRename: 'diagram.rename',
  batch: 'batch',
} as const
export type OperationType = (typeof OPS)[keyof typeof OPS]

/** Upper bound on one batch, so a single message cannot ask the server for unbounded work. */
export const MAX_BATCH_OPS = 10_000

const ref = () => z.string().trim().min(1, 'an id is required').max(64)
/** Optional insertion point; undo uses it to put a removed item back where it was. */
const index = () => z.number().int().nonnegative().optional()
const clearable = <T extends z.ZodType>(schema: T) => schema.nullable().optional()

/** Fields a `node.update` may touch: every kind field, never `id` or `kind`. `null` clears. */
export const nodePatchSchema = z.strictObject({
  label: clearable(fixtureNodeSchema.shape.label.unwrap()),
  elevationM: clearable(fixtureNodeSchema.shape.elevationM.unwrap()),
  position: clearable(positionSchema),
  levelId: clearable(z.string()),
  pressureKPa: clearable(supplyNodeSchema.shape.pressureKPa),
  lossKPa: clearable(meterNodeSchema.shape.lossKPa.unwrap()),
  setKPa: clearable(pressureReducingValveNodeSchema.shape.setKPa),
  fixture: clearable(fixtureNodeSchema.shape.fixture),
  count: clearable(fixtureNodeSchema.shape.count.unwrap()),
  occupancy: clearable(fixtureNodeSchema.shape.occupancy.unwrap()),
  load: clearable(fixtureNodeSchema.shape.load.unwrap()),
  minPressureKPa: clearable(fixtureNodeSchema.shape.minPressureKPa.unwrap()),
  flowLps: clearable(equipmentNodeSchema.shape.flowLps),
})
export type NodePatch = z.infer<typeof nodePatchSchema>

export const pipePatchSchema = z.strictObject({
  from: pipeSchema.shape.from.optional(),
  to: pipeSchema.shape.to.optional(),
  system: systemSchema.optional(),
  lengthM: pipeSchema.shape.lengthM.optional(),
  material: clearable(pipeSchema.shape.material.unwrap()),
  nominal: clearable(pipeSchema.shape.nominal.unwrap()),
})
export type PipePatch = z.infer<typeof pipePatchSchema>

export const levelPatchSchema = z.strictObject({
  name: levelSchema.shape.name.optional(),
  elevationM: levelSchema.shape.elevationM.optional(),
})
export type LevelPatch = z.infer<typeof levelPatchSchema>

// Built from the settings shape so a new setting is patchable without touching this file;
// `.partial()` would fill in defaults and silently reset settings the user never touched.
const settingsPatchShape = Object.fromEntries(
  Object.entries(settingsSchema.shape).map(([key, field]) => [key, field.unwrap().optional()]),
)
export const settingsPatchSchema: z.ZodType<Partial<Settings>> = z.strictObject(settingsPatchShape)
export type SettingsPatch = Partial<Settings>

export const nodeAddSchema = z.object({
  type: z.literal(OPS.nodeAdd),
  node: nodeSchema,
  index: index(),
})
export const nodeUpdateSchema = z.object({
  type: z.literal(OPS.nodeUpdate),
  id: ref(),
  patch: nodePatchSchema,
})
export const nodeMoveSchema = z.object({
  type: z.literal(OPS.nodeMove),
  id: ref(),
  position: positionSchema,
  levelId: clearable(z.string()),
  elevationM: fixtureNodeSchema.shape.elevationM.unwrap().optional(),
})
export const nodeRemoveSchema = z.object({ type: z.literal(OPS.nodeRemove), id: ref() })
export const pipeAddSchema = z.object({
  type: z.literal(OPS.pipeAdd),
  pipe: pipeSchema,
  index: index(),
})
export const pipeUpdateSchema = z.object({
  type: z.literal(OPS.pipeUpdate),
  id: ref(),
  patch: pipePatchSchema,
})
export const pipeRemoveSchema = z.object({ type: z.literal(OPS.pipeRemove), id: ref() })
export const settingsUpdateSchema = z.object({
  type: z.literal(OPS.settingsUpdate),
  patch: settingsPatchSchema,
})
export const levelAddSchema = z.object({
  type: z.literal(OPS.levelAdd),
  level: levelSchema,
  index: index(),
})
export const levelUpdateSchema = z.object({
  type: z.literal(OPS.levelUpdate),
  id: ref(),
  patch: levelPatchSchema,
})
export const levelRemoveSchema = z.object({ type: z.literal(OPS.levelRemove), id: ref() })
export const diagramRenameSchema = z.object({
  type: z.literal(OPS.diagramRename),
  name: z.string().max(120),
})

/** Ordered ops applied all-or-nothing (paste, battery, layout, multi-delete). */
export const batchSchema = z.object({
  type: z.literal(OPS.batch),
  // A getter keeps the recursive type inferable (zod 4 recursive objects).
  get ops(): z.ZodArray<typeof operationSchema> {
    return z.array(operationSchema).max(MAX_BATCH_OPS)
  },
})

/**
 * Any document operation. Parse untrusted input (socket, clipboard) with {@link parseOperation}.
 * @example
 * operationSchema.parse({ type: 'node.move', id: 'J3', position: { x: 120, y: 40 } })
 */
export const operationSchema = z.discriminatedUnion('type', [
  nodeAddSchema,
  nodeUpdateSchema,
  nodeMoveSchema,
  nodeRemoveSchema,
  pipeAddSchema,
  pipeUpdateSchema,
  pipeRemoveSchema,
  settingsUpdateSchema,
  levelAddSchema,
  levelUpdateSchema,
  levelRemoveSchema,
  diagramRenameSchema,
  batchSchema,
])
export type Operation = z.infer<typeof operationSchema>
export type OperationOf<T extends OperationType> = Extract<Operation, { type: T }>
export type BatchOperation = OperationOf<'batch'>

export type OperationErrorCode = 'invalid' | 'not-found' | 'duplicate-id' | 'in-use'

/**
 * Why an operation cannot apply. `ids` names the nodes, pipes or levels involved so the editor
 * can highlight them; the message names them too.
 * @example
 * try { applyOperation(doc, op) } catch (e) { if (e instanceof OperationError) show(e.message) }
 */
export class OperationError extends Error {
  override readonly name = 'OperationError'
  constructor(
    readonly code: OperationErrorCode,
    message: string,
    readonly ids: string[] = [],
  ) {
    super(message)
  }
}

const isRecord = (value: unknown): value is Record<string, unknown> =>
  typeof value === 'object' && value !== null && !Array.isArray(value)

/** The id an op is about, for messages: `J3` in `node.update J3`. */
function subjectOf(op: Record<string, unknown>): string | undefined {
  for (const key of ['id', 'node', 'pipe', 'level']) {
    const value = op[key]
    if (typeof value === 'string') return value
    if (isRecord(value) && typeof value.id === 'string') return value.id
  }
  return undefined
}

/** One zod issue as "batch step 2: pipe.add P7: lengthM: expected number", and the id it is about. */
function describeIssue(input: unknown, issue: z.core.$ZodIssue) {
  const steps: string[] = []
  let op: Record<string, unknown> | undefined = isRecord(input) ? input : undefined
  let field: PropertyKey[] = []
  let at: unknown = input
  for (const key of issue.path) {
    const parent = at
    at = isRecord(at) || Array.isArray(at) ? (at as Record<PropertyKey, unknown>)[key] : undefined
    field.push(key)
    if (isRecord(parent) && parent.type === OPS.batch && key === 'ops') field = []
    if (Array.isArray(parent) && isRecord(at) && typeof at.type === 'string') {
      steps.push(`batch step ${Number(key) + 1}`)
      op = at
      field = []
    }
  }
  const type = op && typeof op.type === 'string' ? op.type : 'operation'
  const subject = op ? subjectOf(op) : undefined
  const where = field.length ? `${field.map(String).join('.')}: ` : ''
  const message =
    issue.code === 'invalid_union' && !Object.values(OPS).includes(type as OperationType)
      ? `unknown operation type "${type}" (expected one of ${Object.values(OPS).join(', ')})`
      : issue.message
  const text =
    [...steps, `${type}${subject ? ` ${subject}` : ''}`].join(': ') + `: ${where}${message}`
  return { text, subject }
}

/**
 * Checks untrusted input against {@link operationSchema}; throws an {@link OperationError} whose
 * message names the op, the id it is about and the bad field.
 * @example
 * parseOperation({ type: 'pipe.remove', id: 'P4' }) // → the typed op
 */
export function parseOperation(input: unknown): Operation {
  const parsed = operationSchema.safeParse(input)
  if (parsed.success) return parsed.data
  const { text, subject } = describeIssue(input, parsed.error.issues[0]!)
  throw new OperationError('invalid', text, subject ? [subject] : [])
}

const NODE_FIELDS = new Map<NodeKind, ReadonlySet<string>>(
  nodeSchema.options.map((kind) => [kind.shape.kind.value, new Set(Object.keys(kind.shape))]),
)

const fail = (code: OperationErrorCode, message: string, ids: string[]): never => {
  throw new OperationError(code, message, ids)
}

/** Lists ids in a message without letting a huge selection flood it. */
const listIds = (ids: readonly string[], max = 8) =>
  ids.length > max ? `${ids.slice(0, max).join(', ')} and ${ids.length - max} more` : ids.join(', ')

function validated<S extends z.ZodType>(schema: S, value: unknown, where: string, id: string) {
  const parsed = schema.safeParse(value)
  if (parsed.success) return parsed.data as z.output<S>
  const detail = parsed.error.issues
    .map((issue) => `${issue.path.length ? `${issue.path.join('.')}: ` : ''}${issue.message}`)
    .join('; ')
  return fail('invalid', `${where}: ${detail}`, [id])
}

const insertAt = <T>(items: readonly T[], item: T, at = items.length) => {
  const next = items.slice()
  next.splice(Math.min(at, items.length), 0, item)
  return next
}
const replaceAt = <T>(items: readonly T[], at: number, item: T) =>
  items.map((existing, i) => (i === at ? item : existing))
const removeAt = <T>(items: readonly T[], at: number) => items.filter((_, i) => i !== at)

/** Applies a patch: `undefined` leaves a field alone, `null` removes it (defaults then refill). */
function patched(item: object, patch: object): Record<string, unknown> {
  const next: Record<string, unknown> = { ...item }
  for (const [key, value] of Object.entries(patch)) {
    if (value === null) delete next[key]
    else if (value !== undefined) next[key] = value
  }
  return next
}

function findIndex(items: readonly { id: string }[], id: string, what: string, op: string) {
  const at = items.findIndex((item) => item.id === id)
  return at >= 0 ? at : fail('not-found', `${op}: no ${what} with id ${id}`, [id])
}

function checkLevel(doc: Diagram, levelId: unknown, nodeId: string, op: string) {
  if (typeof levelId === 'string' && !doc.levels.some((level) => level.id === levelId)) {
    fail('not-found', `${op} ${nodeId}: level ${levelId} does not exist`, [nodeId, levelId])
  }
}

function checkEnds(doc: Diagram, pipe: Pipe, op: string) {
  const missing = [pipe.from, pipe.to].filter((id) => !doc.nodes.some((node) => node.id === id))
  if (missing.length) {
    fail('not-found', `${op} ${pipe.id}: node ${listIds(missing)} does not exist`, [
      pipe.id,
      ...missing,
    ])
  }
}

function addNode(doc: Diagram, node: DiagramNode, at?: number): Diagram {
  if (doc.nodes.some((existing) => existing.id === node.id)) {
    fail('duplicate-id', `node.add: a node with id ${node.id} already exists`, [node.id])
  }
  checkLevel(doc, node.levelId, node.id, OPS.nodeAdd)
  return { ...doc, nodes: insertAt(doc.nodes, node, at) }
}

function updateNode(doc: Diagram, id: string, patch: NodePatch, op: string): Diagram {
  const at = findIndex(doc.nodes, id, 'node', op)
  const node = doc.nodes[at]!
  const fields = NODE_FIELDS.get(node.kind)!
  for (const [key, value] of Object.entries(patch)) {
    if (value !== undefined && !fields.has(key)) {
      fail('invalid', `${op} ${id}: a ${node.kind} node has no field "${key}"`, [id])
    }
  }
  checkLevel(doc, patch.levelId, id, op)
  const next = validated(nodeSchema, patched(node, patch), `${op} ${id}`, id)
  return { ...doc, nodes: replaceAt(doc.nodes, at, next) }
}

function removeNode(doc: Diagram, id: string): Diagram {
  const at = findIndex(doc.nodes, id, 'node', OPS.nodeRemove)
  return {
    ...doc,
    nodes: removeAt(doc.nodes, at),
    pipes: doc.pipes.filter((pipe) => pipe.from !== id && pipe.to !== id),
  }
}

function addPipe(doc: Diagram, pipe: Pipe, at?: number): Diagram {
  if (doc.pipes.some((existing) => existing.id === pipe.id)) {
    fail('duplicate-id', `pipe.add: a pipe with id ${pipe.id} already exists`, [pipe.id])
  }
  checkEnds(doc, pipe, OPS.pipeAdd)
  return { ...doc, pipes: insertAt(doc.pipes, pipe, at) }
}

function updatePipe(doc: Diagram, id: string, patch: PipePatch): Diagram {
  const at = findIndex(doc.pipes, id, 'pipe', OPS.pipeUpdate)
  const next = validated(pipeSchema, patched(doc.pipes[at]!, patch), `pipe.update ${id}`, id)
  checkEnds(doc, next, OPS.pipeUpdate)
  return { ...doc, pipes: replaceAt(doc.pipes, at, next) }
}

function addLevel(doc: Diagram, level: Level, at?: number): Diagram {
  if (doc.levels.some((existing) => existing.id === level.id)) {
    fail('duplicate-id', `level.add: a level with id ${level.id} already exists`, [level.id])
  }
  return { ...doc, levels: insertAt(doc.levels, level, at) }
}

function updateLevel(doc: Diagram, id: string, patch: LevelPatch): Diagram {
  const at = findIndex(doc.levels, id, 'level', OPS.levelUpdate)
  const next = validated(levelSchema, patched(doc.levels[at]!, patch), `level.update ${id}`, id)
  return { ...doc, levels: replaceAt(doc.levels, at, next) }
}

function removeLevel(doc: Diagram, id: string): Diagram {
  const at = findIndex(doc.levels, id, 'level', OPS.levelRemove)
  const users = doc.nodes.filter((node) => node.levelId === id).map((node) => node.id)
  if (users.length) {
    fail('in-use', `level.remove ${id}: still used by node ${listIds(users)}; move them first`, [
      id,
      ...users,
    ])
  }
  return { ...doc, levels: removeAt(doc.levels, at) }
}

function applyBatch(doc: Diagram, ops: readonly Operation[]): Diagram {
  return ops.reduce((current, op, i) => {
    try {
      return applyParsed(current, op)
    } catch (error) {
      if (!(error instanceof OperationError)) throw error
      throw new OperationError(error.code, `batch step ${i + 1}: ${error.message}`, error.ids)
    }
  }, doc)
}

function applyParsed(doc: Diagram, op: Operation): Diagram {
  switch (op.type) {
    case OPS.nodeAdd:
      return addNode(doc, op.node, op.index)
    case OPS.nodeUpdate:
      return updateNode(doc, op.id, op.patch, op.type)
    case OPS.nodeMove: {
      const { id, position, levelId, elevationM } = op
      return updateNode(doc, id, { position, levelId, elevationM }, op.type)
    }
    case OPS.nodeRemove:
      return removeNode(doc, op.id)
    case OPS.pipeAdd:
      return addPipe(doc, op.pipe, op.index)
    case OPS.pipeUpdate:
      return updatePipe(doc, op.id, op.patch)
    case OPS.pipeRemove:
      return { ...doc, pipes: removeAt(doc.pipes, findIndex(doc.pipes, op.id, 'pipe', op.type)) }
    case OPS.settingsUpdate: {
      const settings = { ...doc.settings, ...patched({}, op.patch) }
      return { ...doc, settings: validated(settingsSchema, settings, op.type, 'settings') }
    }
    case OPS.levelAdd:
      return addLevel(doc, op.level, op.index)
    case OPS.levelUpdate:
      return updateLevel(doc, op.id, op.patch)
    case OPS.levelRemove:
      return removeLevel(doc, op.id)
    case OPS.diagramRename:
      return { ...doc, name: op.name }
    case OPS.batch:
      return applyBatch(doc, op.ops)
  }
}

/**
 * Applies one operation and returns a new document; the input is never mutated (untouched
 * nodes, pipes and levels are shared). Throws {@link OperationError} when the op cannot apply,
 * naming the ids; a batch applies all of its steps or none.
 * @example
 * const next = applyOperation(doc, { type: 'node.update', id: 'F7', patch: { count: 4 } })
 */
export function applyOperation(doc: Diagram, op: Operation): Diagram {
  return applyParsed(doc, parseOperation(op))
}
