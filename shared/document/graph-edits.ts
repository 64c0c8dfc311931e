/**
 * Early checks for the editor, so a connection can be refused with a message before it is applied.
 * The calculation's validator remains the authority; these only look at the pipes.
 */
import type { Diagram, Pipe } from './model.ts'
import { OPS, type BatchOperation, type Operation } from './operations.ts'

/**
 * True when a pipe `from` → `to` would close a loop: `to` already feeds `from` (through any
 * system, since a water heater turns a cold path into a hot one), or both ends are the same node.
 * @example
 * wouldCreateCycle(doc, 'J4', 'J1') // true when J1 → … → J4 already exists
 */
export function wouldCreateCycle(doc: Diagram, from: string, to: string): boolean {
  if (from === to) return true
  const downstream = new Map<string, string[]>()
  for (const pipe of doc.pipes)
    downstream.set(pipe.from, [...(downstream.get(pipe.from) ?? []), pipe.to])
  const seen = new Set([to])
  const queue = [to]
  while (queue.length) {
    for (const next of downstream.get(queue.pop()!) ?? []) {
      if (next === from) return true
      if (!seen.has(next)) {
        seen.add(next)
        queue.push(next)
      }
    }
  }
  return false
}

export interface InletConflict {
  /** The pipe that already feeds the node in that system. */
  pipeId: string
  message: string
}

/**
 * The existing pipe that already feeds `pipe.to` in the same system, if any. A node takes one
 * inlet per system (a fixture may have one cold and one hot). Pass `pipe.id` when re-routing an
 * existing pipe so it does not conflict with itself.
 * @example
 * inletConflict(doc, { to: 'F2', system: 'cold' }) // { pipeId: 'P5', message: '…' } or null
 */
export function inletConflict(
  doc: Diagram,
  pipe: Pick<Pipe, 'to' | 'system'> & { id?: string },
): InletConflict | null {
  const existing = doc.pipes.find(
    (other) => other.to === pipe.to && other.system === pipe.system && other.id !== pipe.id,
  )
  if (!existing) return null
  return {
    pipeId: existing.id,
    message: `${pipe.to} already has a ${pipe.system} inlet (pipe ${existing.id} from ${existing.from}); a node takes one inlet per system`,
  }
}

/**
 * Why a new connection should be refused, or null when it may be drawn.
 * @example
 * const problem = connectionProblem(doc, { from: 'J1', to: 'F2', system: 'hot' })
 * if (problem) toast(problem)
 */
export function connectionProblem(
  doc: Diagram,
  pipe: Pick<Pipe, 'from' | 'to' | 'system'> & { id?: string },
): string | null {
  const missing = [pipe.from, pipe.to].filter((id) => !doc.nodes.some((node) => node.id === id))
  if (missing.length) return `node ${missing.join(', ')} does not exist`
  if (pipe.from === pipe.to) return `a pipe cannot start and end at ${pipe.from}`
  if (wouldCreateCycle(doc, pipe.from, pipe.to)) {
    return `connecting ${pipe.from} → ${pipe.to} would close a loop: ${pipe.to} already feeds ${pipe.from}`
  }
  return inletConflict(doc, pipe)?.message ?? null
}

/**
 * One batch that deletes a multi-selection: the chosen pipes first, then the nodes (which take
 * their remaining pipes with them). Unknown ids are skipped, so a stale selection still works.
 * @example
 * removalOperation(doc, ['J2', 'F3'], ['P9'])
 */
export function removalOperation(
  doc: Diagram,
  nodeIds: readonly string[],
  pipeIds: readonly string[],
): BatchOperation {
  const nodes = new Set(nodeIds.filter((id) => doc.nodes.some((node) => node.id === id)))
  const pipeOps: Operation[] = doc.pipes
    .filter((pipe) => pipeIds.includes(pipe.id) && !nodes.has(pipe.from) && !nodes.has(pipe.to))
    .map((pipe) => ({ type: OPS.pipeRemove, id: pipe.id }))
  const nodeOps: Operation[] = [...nodes].map((id) => ({ type: OPS.nodeRemove, id }))
  return { type: OPS.batch, ops: [...pipeOps, ...nodeOps] }
}
