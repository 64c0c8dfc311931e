/**
 * Replacing the open document with an imported one as a single `batch` (one undo step), so a
 * wrong import is one Ctrl+Z away. The name stays: a diagram's name belongs to its record.
 */
import type { Diagram } from '../document/model.ts'
import {
  MAX_BATCH_OPS,
  OPS,
  OperationError,
  type BatchOperation,
  type Operation,
} from '../document/operations.ts'

/**
 * The batch that turns `current` into `next` (except the name): remove everything, then add the
 * imported levels, nodes and pipes in their order and set every setting.
 * @example applyOperation(current, replaceDocumentOperation(current, next)) // next, with current.name
 */
export function replaceDocumentOperation(current: Diagram, next: Diagram): BatchOperation {
  const ops: Operation[] = [
    ...current.pipes.map((p): Operation => ({ type: OPS.pipeRemove, id: p.id })),
    ...current.nodes.map((n): Operation => ({ type: OPS.nodeRemove, id: n.id })),
    ...current.levels.map((l): Operation => ({ type: OPS.levelRemove, id: l.id })),
    ...next.levels.map((level): Operation => ({ type: OPS.levelAdd, level })),
    ...next.nodes.map((node): Operation => ({ type: OPS.nodeAdd, node })),
    ...next.pipes.map((pipe): Operation => ({ type: OPS.pipeAdd, pipe })),
    { type: OPS.settingsUpdate, patch: next.settings },
  ]
  if (ops.length > MAX_BATCH_OPS) {
    throw new OperationError(
      'invalid',
      `replacing this diagram takes ${ops.length} steps, more than one undoable step may hold ` +
        `(${MAX_BATCH_OPS}); open the file as a new diagram instead`,
    )
  }
  return { type: OPS.batch, ops }
}
