import { can, type ProjectRole } from '../../../shared/auth/roles.ts'
import type { Diagram } from '../../../shared/document/model.ts'
import {
  applyOperation,
  OperationError,
  type Operation,
} from '../../../shared/document/operations.ts'
import { applyChecked, GraphRuleError } from '../../../shared/sync/graph-rules.ts'
import type { OpOutcome, OpSubmission } from './operations.types.ts'

export type Decision =
  | { ok: true; op: Operation; doc: Diagram }
  | { ok: false; outcome: Extract<OpOutcome, { kind: 'reject' }> }

const refuse = (
  code: Extract<OpOutcome, { kind: 'reject' }>['code'],
  reason: string,
  ids?: string[],
): Decision => ({ ok: false, outcome: { kind: 'reject', code, reason, ids } })

/**
 * Whether one submission may be applied to `doc` at `revision`, and the document after it. Role,
 * then expected revision, then the op itself (schema, ids, graph rules); every refusal has a
 * reason that names what is wrong.
 */
export function decide(
  doc: Diagram,
  revision: number,
  item: OpSubmission,
  role: ProjectRole | null,
): Decision {
  if (item.checkRole && !role) return refuse('forbidden', 'you are not a member of this project')
  if (item.checkRole && !can(role, 'diagram.edit')) {
    return refuse('forbidden', `a ${role} may view this diagram but not edit it`)
  }
  if (item.expectRevision !== undefined && item.expectRevision !== revision) {
    return refuse(
      'conflict',
      `baseRevision: the diagram is at revision ${revision}, not ${item.expectRevision}; reload to get the latest version`,
    )
  }
  try {
    const op = typeof item.op === 'function' ? item.op(doc) : item.op
    const next = item.checkGraphRules ? applyChecked(doc, op) : applyOperation(doc, op)
    return { ok: true, op, doc: next }
  } catch (error) {
    if (error instanceof GraphRuleError) return refuse('graph-rule', error.message, error.ids)
    if (error instanceof OperationError) {
      return refuse(error.code === 'invalid' ? 'invalid' : 'conflict', error.message, error.ids)
    }
    throw error
  }
}
