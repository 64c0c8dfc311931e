/**
 * The authoritative op path. For a group of submissions to one diagram, in one transaction:
 * lock the diagram row (`FOR UPDATE`, which serialises every server process), answer resends
 * from the log, check each op (role, schema, ids, graph rules), give each accepted op the next
 * revision, append them to `diagram_ops`, write the new document and revision, commit. Only the
 * caller, after this returns, acknowledges and broadcasts.
 */
import type { Diagram } from '../../../shared/document/model.ts'
import type { OpApplied } from '../../../shared/protocol/server-messages.ts'
import type { Db } from '../../db/knex.ts'
import { DocumentCache } from './operations.cache.ts'
import { decide } from './operations.decide.ts'
import {
  appendOpsAndState,
  insertSnapshot,
  lockDiagramState,
  type OpRow,
} from './operations.repo.ts'
import type { OpOutcome, OpSubmission } from './operations.types.ts'

/** A snapshot of the whole document is kept at least every this many revisions. */
export const SNAPSHOT_EVERY = 100

const shared = new DocumentCache()

/**
 * Commits what it can of `items` (in order) to one diagram; returns one outcome per item, in
 * the same order. Accepted ops carry the `OpApplied` to broadcast.
 * @example
 * const [outcome] = await commitOps(db, diagramId, [{ clientOpId, author, op, source: 'edit', checkRole: true, checkGraphRules: true }])
 */
export async function commitOps(
  db: Db,
  diagramId: string,
  items: readonly OpSubmission[],
  cache: DocumentCache = shared,
): Promise<OpOutcome[]> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await db.transaction((trx) => commitInTransaction(trx, diagramId, items, cache))
    } catch (error) {
      cache.forget(diagramId)
      const resendRace = (error as { code?: string }).code === '23505' && attempt === 1
      if (!resendRace) throw error
    }
  }
}

async function commitInTransaction(
  trx: Db,
  diagramId: string,
  items: readonly OpSubmission[],
  cache: DocumentCache,
): Promise<OpOutcome[]> {
  const authors = [...new Set(items.filter((i) => i.checkRole).map((i) => i.author.id))]
  const clientOpIds = items.map((i) => i.clientOpId)
  const cached = cache.latest(diagramId)
  const row = await lockDiagramState(trx, diagramId, cached?.revision ?? -1, authors, clientOpIds)
  if (!row) {
    return items.map(() => ({ kind: 'reject', code: 'not-found', reason: 'no such diagram' }))
  }
  const startRevision = row.revision
  let doc: Diagram = row.document ?? cached!.doc
  const roles = new Map(row.roles.map((r) => [r.user_id, r.role]))
  const seen = new Map(row.seen.map((r) => [r.client_op_id, r.revision]))

  let revision = startRevision
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
  if (!rows.length) return outcomes

  const lastAuthor = rows[rows.length - 1]!.author_id
  const renamed = doc.name.trim() && doc.name !== row.name ? doc.name.trim() : undefined
  const state = { document: doc, revision, userId: lastAuthor, name: renamed }
  const at = (await appendOpsAndState(trx, diagramId, rows, state)).toISOString()
  if (Math.floor(revision / SNAPSHOT_EVERY) > Math.floor(startRevision / SNAPSHOT_EVERY)) {
    await insertSnapshot(trx, diagramId, revision, doc)
  }
  cache.set(diagramId, revision, doc)
  return withApplied(outcomes, items, rows, at)
}

/** Attaches the broadcast message to each accepted outcome. */
function withApplied(
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
