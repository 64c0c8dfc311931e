/**
 * Deciding a whole group in memory, shared by the optimistic and the locked commit: each item in
 * order against the document so far, resends answered with their first revision, accepted ops
 * numbered from `revision + 1`. Pure; the caller writes the rows.
 */
import type { ProjectRole } from '../../../shared/auth/roles.ts'
import type { Diagram } from '../../../shared/document/model.ts'
import type { OpApplied } from '../../../shared/protocol/server-messages.ts'
import { decide } from './operations.decide.ts'
import type { OpRow } from './operations.repo.ts'
import type { OpOutcome, OpSubmission } from './operations.types.ts'

export interface GroupResult {
  outcomes: OpOutcome[]
  rows: Omit<OpRow, 'created_at'>[]
  doc: Diagram
  revision: number
}

export function applyGroup(
  diagramId: string,
  start: { doc: Diagram; revision: number },
  items: readonly OpSubmission[],
  roles: ReadonlyMap<string, ProjectRole>,
  alreadySeen: ReadonlyMap<string, number>,
): GroupResult {
  const seen = new Map(alreadySeen)
  let { doc, revision } = start
  const rows: Omit<OpRow, 'created_at'>[] = []
  const outcomes: OpOutcome[] = items.map((item) => {
    const earlier = seen.get(item.clientOpId)
    if (earlier !== undefined) return { kind: 'ack', revision: earlier, duplicate: true }
    const decision = decide(doc, revision, item, roles.get(item.author.id) ?? null)
    if (!decision.ok) return { ...decision.outcome, revision }
    doc = decision.doc
    revision += 1
    seen.set(item.clientOpId, revision)
    rows.push({
      diagram_id: diagramId,
      revision,
      client_op_id: item.clientOpId,
      author_id: item.author.id,
      source: item.source,
      restored_from: item.restoredFrom ?? null,
      op: decision.op,
    })
    return { kind: 'ack', revision, duplicate: false }
  })
  return { outcomes, rows, doc, revision }
}

/** Attaches the broadcast message to each accepted outcome. */
export function withApplied(
  outcomes: OpOutcome[],
  items: readonly OpSubmission[],
  rows: Omit<OpRow, 'created_at'>[],
  at: string,
): OpOutcome[] {
  const byOpId = new Map(rows.map((r) => [r.client_op_id, r]))
  return outcomes.map((outcome, i) => {
    const row = byOpId.get(items[i]!.clientOpId)
    if (outcome.kind !== 'ack' || outcome.duplicate || !row) return outcome
    const applied: OpApplied = {
      diagramId: row.diagram_id,
      revision: row.revision,
      op: row.op,
      clientOpId: row.client_op_id,
      author: { id: items[i]!.author.id, name: items[i]!.author.name },
      at,
    }
    return { ...outcome, applied }
  })
}
