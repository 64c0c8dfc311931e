/**
 * The optimistic commit: when this process committed the diagram's latest revision itself, the
 * group is decided against the cached document and written by one conditional statement (no
 * BEGIN, no row lock, no document re-read, no COMMIT round trip). It answers only when the
 * database agreed on everything; null sends the group down the locked path, which decides it
 * afresh.
 * The statement is its own transaction, so an op is still acknowledged only after it commits.
 */
import { can } from '../../../shared/auth/roles.ts'
import type { Db } from '../../db/knex.ts'
import { applyGroup, withApplied } from './operations.apply.ts'
import type { DocumentCache } from './operations.cache.ts'
import { appendIfCurrent } from './operations.repo.ts'
import type { OpOutcome, OpSubmission } from './operations.types.ts'

export async function commitIfCurrent(
  db: Db,
  diagramId: string,
  items: readonly OpSubmission[],
  cache: DocumentCache,
  snapshotEvery: number,
): Promise<OpOutcome[] | null> {
  const cached = cache.latest(diagramId)
  if (!cached) return null
  const authors = [...new Set(items.filter((i) => i.checkRole).map((i) => i.author.id))]
  const roles = authors.flatMap((id) => {
    const role = cached.roles.get(id)
    return role && can(role, 'diagram.edit') ? [{ user_id: id, role }] : []
  })
  // A refusal (here, a missing or read-only role) must come from fresh data: locked path.
  if (roles.length !== authors.length) return null
  const group = applyGroup(diagramId, cached, items, cached.roles, new Map())
  if (!group.outcomes.every((o) => o.kind === 'ack')) return null

  const { doc, revision, rows } = group
  const snapshot =
    Math.floor(revision / snapshotEvery) > Math.floor(cached.revision / snapshotEvery)
  const state = { document: doc, revision, userId: rows[rows.length - 1]!.author_id }
  let at: Date | null
  try {
    at = await appendIfCurrent(db, diagramId, cached.revision, roles, rows, state, snapshot)
  } catch (error) {
    // A resend of an op already in the log: the locked path answers it from there.
    if ((error as { code?: string }).code === '23505') return null
    throw error
  }
  if (!at) return null
  cache.set(diagramId, revision, doc, cached.roles)
  return withApplied(group.outcomes, items, rows, at.toISOString())
}
