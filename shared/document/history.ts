/**
 * Inverse operations and a pure undo/redo stack. Undo and redo apply ops like any other edit, so
 * the same ops can later be sent to the server. Redo re-derives its inverse from the document it
 * meets, which keeps the next undo correct after remote edits touched other parts.
 */
import type { Diagram, Level, Pipe } from './model.ts'
import {
  applyOperation,
  OPS,
  OperationError,
  parseOperation,
  type LevelPatch,
  type NodePatch,
  type Operation,
  type PipePatch,
  type SettingsPatch,
} from './operations.ts'

/** Before-values of the patched keys; a key the item lacked is cleared with `null`. */
function before<P extends object>(item: object, patch: P): P {
  const source = item as Record<string, unknown>
  const entries = Object.entries(patch)
    .filter(([, value]) => value !== undefined)
    .map(([key]) => [key, key in source && source[key] !== undefined ? source[key] : null])
  return Object.fromEntries(entries) as P
}

const byId = <T extends { id: string }>(items: readonly T[], id: string) =>
  items.find((item) => item.id === id)!

function invertOne(doc: Diagram, op: Exclude<Operation, { type: 'batch' }>): Operation {
  switch (op.type) {
    case OPS.nodeAdd:
      return { type: OPS.nodeRemove, id: op.node.id }
    case OPS.nodeUpdate:
      return {
        type: OPS.nodeUpdate,
        id: op.id,
        patch: before<NodePatch>(byId(doc.nodes, op.id), op.patch),
      }
    case OPS.nodeMove: {
      const { position, levelId, elevationM } = op
      const patch = before<NodePatch>(byId(doc.nodes, op.id), { position, levelId, elevationM })
      return { type: OPS.nodeUpdate, id: op.id, patch }
    }
    case OPS.nodeRemove: {
      const index = doc.nodes.findIndex((node) => node.id === op.id)
      // Ascending indexes: re-inserting in this order puts every pipe back in its old slot.
      const pipes = doc.pipes
        .map((pipe, at): [Pipe, number] => [pipe, at])
        .filter(([pipe]) => pipe.from === op.id || pipe.to === op.id)
        .map(([pipe, at]): Operation => ({ type: OPS.pipeAdd, pipe, index: at }))
      return {
        type: OPS.batch,
        ops: [{ type: OPS.nodeAdd, node: doc.nodes[index]!, index }, ...pipes],
      }
    }
    case OPS.pipeAdd:
      return { type: OPS.pipeRemove, id: op.pipe.id }
    case OPS.pipeUpdate:
      return {
        type: OPS.pipeUpdate,
        id: op.id,
        patch: before<PipePatch>(byId(doc.pipes, op.id), op.patch),
      }
    case OPS.pipeRemove: {
      const index = doc.pipes.findIndex((pipe) => pipe.id === op.id)
      return { type: OPS.pipeAdd, pipe: doc.pipes[index]!, index }
    }
    case OPS.settingsUpdate:
      return { type: OPS.settingsUpdate, patch: before<SettingsPatch>(doc.settings, op.patch) }
    case OPS.levelAdd:
      return { type: OPS.levelRemove, id: op.level.id }
    case OPS.levelUpdate:
      return {
        type: OPS.levelUpdate,
        id: op.id,
        patch: before<LevelPatch>(byId(doc.levels, op.id), op.patch),
      }
    case OPS.levelRemove: {
      const index = doc.levels.findIndex((level: Level) => level.id === op.id)
      return { type: OPS.levelAdd, level: doc.levels[index]!, index }
    }
    case OPS.diagramRename:
      return { type: OPS.diagramRename, name: doc.name }
  }
}

function step(doc: Diagram, op: Operation): { doc: Diagram; inverse: Operation } {
  if (op.type !== OPS.batch) return { doc: applyOperation(doc, op), inverse: invertOne(doc, op) }
  const inverses: Operation[] = []
  let current = doc
  op.ops.forEach((inner, i) => {
    try {
      const next = step(current, inner)
      inverses.unshift(next.inverse)
      current = next.doc
    } catch (error) {
      if (!(error instanceof OperationError)) throw error
      throw new OperationError(error.code, `batch step ${i + 1}: ${error.message}`, error.ids)
    }
  })
  return { doc: current, inverse: { type: OPS.batch, ops: inverses } }
}

/**
 * Applies `op` and returns the new document together with the op that undoes it, in one pass.
 * Throws {@link OperationError} exactly when {@link applyOperation} would.
 * @example
 * const { doc: next, inverse } = applyWithInverse(doc, { type: 'pipe.remove', id: 'P3' })
 * applyOperation(next, inverse) // deep-equals doc
 */
export function applyWithInverse(doc: Diagram, op: Operation) {
  return step(doc, parseOperation(op))
}

/**
 * The op that takes `applyOperation(docBefore, op)` back to `docBefore`.
 * @example
 * invertOperation(doc, { type: 'diagram.rename', name: 'Block B' }) // { type: 'diagram.rename', name: doc.name }
 */
export function invertOperation(docBefore: Diagram, op: Operation): Operation {
  return applyWithInverse(docBefore, op).inverse
}

/** One undoable edit: the op as applied and the op that reverts it. */
export interface HistoryEntry {
  forward: Operation
  inverse: Operation
  /** When it was recorded (ms); used only to merge a drag's moves into one step. */
  at: number
}

export interface History {
  past: HistoryEntry[]
  future: HistoryEntry[]
  limit: number
}

/** Enough for a working session; older steps fall off the bottom. */
export const HISTORY_LIMIT = 200
/** Moves of one node closer together than this are one undo step (a drag, arrow-key nudges). */
export const MOVE_COALESCE_MS = 1000

/**
 * An empty undo/redo stack.
 * @example
 * let history = createHistory()
 */
export function createHistory(limit = HISTORY_LIMIT): History {
  return { past: [], future: [], limit: Math.max(1, Math.floor(limit)) }
}

const MOVE_EXTRAS = ['levelId', 'elevationM'] as const

/** A later move may merge only if the earlier inverse restores every field it touches. */
function mergesInto(last: HistoryEntry, forward: Operation, at: number): boolean {
  const prev = last.forward
  return (
    forward.type === OPS.nodeMove &&
    prev.type === OPS.nodeMove &&
    prev.id === forward.id &&
    at - last.at < MOVE_COALESCE_MS &&
    MOVE_EXTRAS.every((key) => forward[key] === undefined || prev[key] !== undefined)
  )
}

/**
 * Records an applied op and its inverse; clears redo. Quick successive moves of the same node
 * merge into one step.
 * @example
 * const { doc: next, inverse } = applyWithInverse(doc, op)
 * history = record(history, op, inverse)
 */
export function record(
  history: History,
  forward: Operation,
  inverse: Operation,
  at = Date.now(),
): History {
  const last = history.past.at(-1)
  if (last && mergesInto(last, forward, at)) {
    return {
      ...history,
      past: [...history.past.slice(0, -1), { ...last, forward, at }],
      future: [],
    }
  }
  const past = [...history.past, { forward, inverse, at }].slice(-history.limit)
  return { ...history, past, future: [] }
}

export type HistoryStep =
  | { ok: true; history: History; doc: Diagram; op: Operation }
  | { ok: false; history: History; error: OperationError }

export const canUndo = (history: History) => history.past.length > 0
export const canRedo = (history: History) => history.future.length > 0

/**
 * Undoes the last step on `doc`. Returns the new document and the op applied (to send on), or,
 * when the step no longer applies (a collaborator removed what it touched), drops that step and
 * returns the error. Returns null when there is nothing to undo.
 * @example
 * const result = undo(history, doc)
 * if (result?.ok) { doc = result.doc; history = result.history }
 */
export function undo(history: History, doc: Diagram): HistoryStep | null {
  const entry = history.past.at(-1)
  if (!entry) return null
  const past = history.past.slice(0, -1)
  try {
    const next = applyOperation(doc, entry.inverse)
    // Redo replays the original intent; its inverse is re-derived when it runs.
    const future = [...history.future, entry]
    return { ok: true, history: { ...history, past, future }, doc: next, op: entry.inverse }
  } catch (error) {
    if (!(error instanceof OperationError)) throw error
    return { ok: false, history: { ...history, past }, error }
  }
}

/**
 * Redoes the last undone step on `doc`; same contract as {@link undo}.
 * @example
 * const result = redo(history, doc)
 */
export function redo(history: History, doc: Diagram): HistoryStep | null {
  const entry = history.future.at(-1)
  if (!entry) return null
  const future = history.future.slice(0, -1)
  try {
    const next = applyWithInverse(doc, entry.forward)
    const past = [...history.past, { forward: entry.forward, inverse: next.inverse, at: entry.at }]
    return { ok: true, history: { ...history, past, future }, doc: next.doc, op: entry.forward }
  } catch (error) {
    if (!(error instanceof OperationError)) throw error
    return { ok: false, history: { ...history, future }, error }
  }
}
