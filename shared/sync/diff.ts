/**
 * Turns one document into another with ordinary operations, so a restore (or a whole-document
 * save) is recorded in the operation log like any edit and replays on every replica. The diagram
 * name is left alone: it belongs to the diagram record, not to a revision.
 */
import type { Diagram, DiagramNode, Level, Pipe } from '../document/model.ts'
import {
  OPS,
  type BatchOperation,
  type Operation,
  type SettingsPatch,
} from '../document/operations.ts'

/** Structural equality of plain JSON values (key order ignored). */
export function sameValue(a: unknown, b: unknown): boolean {
  if (a === b) return true
  if (typeof a !== 'object' || typeof b !== 'object' || a === null || b === null) return false
  if (Array.isArray(a) !== Array.isArray(b)) return false
  const ra = a as Record<string, unknown>
  const rb = b as Record<string, unknown>
  const keys = new Set([...Object.keys(ra), ...Object.keys(rb)])
  for (const key of keys) if (!sameValue(ra[key], rb[key])) return false
  return true
}

/** The fields of `to` that differ from `from`; a field `to` lacks is cleared with `null`. */
function patchBetween(from: object, to: object, skip: readonly string[]): Record<string, unknown> {
  const a = from as Record<string, unknown>
  const b = to as Record<string, unknown>
  const patch: Record<string, unknown> = {}
  for (const key of new Set([...Object.keys(a), ...Object.keys(b)])) {
    if (skip.includes(key) || sameValue(a[key], b[key])) continue
    patch[key] = b[key] === undefined ? null : b[key]
  }
  return patch
}

const byId = <T extends { id: string }>(items: readonly T[]) =>
  new Map(items.map((item) => [item.id, item]))
const isEmpty = (patch: object) => Object.keys(patch).length === 0

/**
 * One batch that turns `from` into `to` (empty when they are equal). Items are added at their
 * index in `to`; items present in both keep their relative order.
 * @example
 * const op = diffDocuments(current, asOfRevision12)
 * applyOperation(current, op) // same nodes, pipes, levels and settings as asOfRevision12
 */
export function diffDocuments(from: Diagram, to: Diagram): BatchOperation {
  const oldNodes = byId(from.nodes)
  const newNodes = byId(to.nodes)
  // A node that changed kind is removed and added again, and so are all of its pipes.
  const rekinded = new Set(
    to.nodes
      .filter((n) => oldNodes.has(n.id) && oldNodes.get(n.id)!.kind !== n.kind)
      .map((n) => n.id),
  )
  const survives = (node: DiagramNode | undefined) =>
    !!node && newNodes.has(node.id) && !rekinded.has(node.id)
  const oldPipes = new Map(
    from.pipes
      .filter((p) => survives(oldNodes.get(p.from)) && survives(oldNodes.get(p.to)))
      .map((p) => [p.id, p]),
  )
  const newPipes = byId(to.pipes)
  const oldLevels = byId(from.levels)
  const newLevels = byId(to.levels)

  const ops: Operation[] = []
  for (const pipe of from.pipes) {
    if (oldPipes.has(pipe.id) && !newPipes.has(pipe.id))
      ops.push({ type: OPS.pipeRemove, id: pipe.id })
  }
  to.levels.forEach((level: Level, index) => {
    if (!oldLevels.has(level.id)) ops.push({ type: OPS.levelAdd, level, index })
  })
  for (const node of from.nodes) {
    if (!newNodes.has(node.id) || rekinded.has(node.id))
      ops.push({ type: OPS.nodeRemove, id: node.id })
  }
  to.nodes.forEach((node, index) => {
    const old = oldNodes.get(node.id)
    if (!old || rekinded.has(node.id)) return void ops.push({ type: OPS.nodeAdd, node, index })
    const patch = patchBetween(old, node, ['id', 'kind'])
    if (!isEmpty(patch)) ops.push({ type: OPS.nodeUpdate, id: node.id, patch })
  })
  to.pipes.forEach((pipe: Pipe, index) => {
    const old = oldPipes.get(pipe.id)
    if (!old) return void ops.push({ type: OPS.pipeAdd, pipe, index })
    const patch = patchBetween(old, pipe, ['id'])
    if (!isEmpty(patch)) ops.push({ type: OPS.pipeUpdate, id: pipe.id, patch })
  })
  for (const level of to.levels) {
    const old = oldLevels.get(level.id)
    const patch = old ? patchBetween(old, level, ['id']) : {}
    if (!isEmpty(patch)) ops.push({ type: OPS.levelUpdate, id: level.id, patch })
  }
  for (const level of from.levels) {
    if (!newLevels.has(level.id)) ops.push({ type: OPS.levelRemove, id: level.id })
  }
  const settings = patchBetween(from.settings, to.settings, []) as SettingsPatch
  if (!isEmpty(settings)) ops.push({ type: OPS.settingsUpdate, patch: settings })
  return { type: OPS.batch, ops }
}
