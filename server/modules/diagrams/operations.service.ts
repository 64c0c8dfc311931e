/**
 * The authoritative op path. For a group of submissions to one diagram, in one transaction:
 * decide each op (role, schema, ids, graph rules) against the current document, give each
 * accepted op the next revision, append them to `diagram_ops`, write the new document and
 * revision, commit. Only the caller, after this returns, acknowledges and broadcasts.
 *
 * Two ways to get there. While this process holds the latest document, the optimistic commit
 * (operations.fast-path.ts) does it in one conditional statement. Otherwise, or when that
 * statement finds the revision or a role moved on, a resend, or a refusal to explain, the
 * locked path below locks the diagram row (`FOR UPDATE`, which serialises every server
 * process), reads roles and the log's answer to resends, and decides afresh.
 */
import type { ProjectRole } from '../../../shared/auth/roles.ts'
import type { Db } from '../../db/knex.ts'
import { applyGroup, withApplied } from './operations.apply.ts'
import { DocumentCache } from './operations.cache.ts'
import { commitIfCurrent } from './operations.fast-path.ts'
import { appendOpsAndState, insertSnapshot, lockDiagramState } from './operations.repo.ts'
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
  const fast = await commitIfCurrent(db, diagramId, items, cache, SNAPSHOT_EVERY)
  if (fast) return fast
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
    cache.forget(diagramId)
    return items.map(() => ({ kind: 'reject', code: 'not-found', reason: 'no such diagram' }))
  }
  const start = { doc: row.document ?? cached!.doc, revision: row.revision }
  const roles = rolesAfterRead(cached?.roles, authors, row.roles)
  const seen = new Map(row.seen.map((r) => [r.client_op_id, r.revision]))
  const { outcomes, rows, doc, revision } = applyGroup(diagramId, start, items, roles, seen)
  if (!rows.length) {
    // Nothing written, but what was read is the committed state: keep it for the next group.
    cache.set(diagramId, start.revision, start.doc, roles)
    return outcomes
  }

  const lastAuthor = rows[rows.length - 1]!.author_id
  const renamed = doc.name.trim() && doc.name !== row.name ? doc.name.trim() : undefined
  const state = { document: doc, revision, userId: lastAuthor, name: renamed }
  const at = (await appendOpsAndState(trx, diagramId, rows, state)).toISOString()
  if (Math.floor(revision / SNAPSHOT_EVERY) > Math.floor(start.revision / SNAPSHOT_EVERY)) {
    await insertSnapshot(trx, diagramId, revision, doc)
  }
  cache.set(diagramId, revision, doc, roles)
  return withApplied(outcomes, items, rows, at)
}

/** The cached roles, with the authors just read replaced by what the database says now. */
function rolesAfterRead(
  cached: ReadonlyMap<string, ProjectRole> | undefined,
  authors: string[],
  read: { user_id: string; role: ProjectRole }[],
): Map<string, ProjectRole> {
  const roles = new Map(cached)
  for (const id of authors) roles.delete(id)
  for (const r of read) roles.set(r.user_id, r.role)
  return roles
}
