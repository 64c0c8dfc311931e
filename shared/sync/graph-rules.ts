/**
 * The graph rules an edit must keep, checked after applying it: no pipe may close a loop and a
 * node takes one inlet per system. Only the pipes the edit added or re-routed are checked, so a
 * document imported with an old problem can still be edited elsewhere. The server refuses an op
 * that breaks a rule; the client replica uses the same check to keep its local view consistent.
 */
import { inletConflict, wouldCreateCycle } from '../document/graph-edits.ts'
import type { Diagram, Pipe } from '../document/model.ts'
import { applyOperation, OperationError, OPS, type Operation } from '../document/operations.ts'

/** True when an op of this type can add or re-route a pipe. */
const touchesPipes = (op: Operation): boolean =>
  op.type === OPS.pipeAdd || op.type === OPS.pipeUpdate || op.type === OPS.batch

/** Pipes of `after` that are new or whose ends or system differ from `before`. */
export function changedPipes(before: Diagram, after: Diagram): Pipe[] {
  if (before.pipes === after.pipes) return []
  const old = new Map(before.pipes.map((pipe) => [pipe.id, pipe]))
  return after.pipes.filter((pipe) => {
    const was = old.get(pipe.id)
    return !was || was.from !== pipe.from || was.to !== pipe.to || was.system !== pipe.system
  })
}

/**
 * The first graph rule `after` breaks through a pipe changed since `before`, or null.
 * @example
 * graphRuleProblem(doc, applyOperation(doc, op)) // { message: 'pipe P9: … would close a loop …', ids }
 */
export function graphRuleProblem(
  before: Diagram,
  after: Diagram,
): { message: string; ids: string[] } | null {
  for (const pipe of changedPipes(before, after)) {
    if (wouldCreateCycle(after, pipe.from, pipe.to)) {
      const loop =
        pipe.from === pipe.to
          ? `a pipe cannot start and end at ${pipe.from}`
          : `connecting ${pipe.from} → ${pipe.to} would close a loop: ${pipe.to} already feeds ${pipe.from}`
      return { message: `pipe ${pipe.id}: ${loop}`, ids: [pipe.id, pipe.from, pipe.to] }
    }
    const inlet = inletConflict(after, pipe)
    if (inlet) {
      return { message: `pipe ${pipe.id}: ${inlet.message}`, ids: [pipe.id, inlet.pipeId, pipe.to] }
    }
  }
  return null
}

/** Thrown by {@link applyChecked} when an op applies but breaks a graph rule. */
export class GraphRuleError extends OperationError {
  constructor(message: string, ids: string[]) {
    super('invalid', message, ids)
  }
}

/**
 * {@link applyOperation} plus the graph rules: the one function both the server and the client
 * use to decide whether an edit is acceptable. Throws {@link OperationError} (or its subclass
 * {@link GraphRuleError}) naming the ids.
 * @example
 * const next = applyChecked(doc, { type: 'pipe.add', pipe: { id: 'P9', from: 'J4', to: 'J1', system: 'cold', lengthM: 3 } })
 */
export function applyChecked(doc: Diagram, op: Operation): Diagram {
  const next = applyOperation(doc, op)
  if (!touchesPipes(op)) return next
  const problem = graphRuleProblem(doc, next)
  if (problem) throw new GraphRuleError(problem.message, problem.ids)
  return next
}
