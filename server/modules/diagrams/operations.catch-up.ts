/**
 * What a (re)joining client receives: the ops it missed when the gap is small and the log has
 * them all, otherwise the whole document.
 */
import type { ProjectRole } from '../../../shared/auth/roles.ts'
import type { CatchUp, OpApplied } from '../../../shared/protocol/server-messages.ts'
import type { Db } from '../../db/knex.ts'
import { opsBetween, readDiagramState, type OpRowWithAuthor } from './operations.repo.ts'

/** An op log row as the message clients receive. */
export const toApplied = (row: OpRowWithAuthor): OpApplied => ({
  diagramId: row.diagram_id,
  revision: row.revision,
  op: row.op,
  clientOpId: row.client_op_id,
  author: { id: row.author_id, name: row.author_name ?? 'a former member' },
  at: row.created_at.toISOString(),
})

/**
 * The catch-up for a client at `sinceRevision` (none: a snapshot). Returns null when the diagram
 * does not exist.
 * @example
 * const answer = await catchUpFor(db, diagramId, 41, 200, 'editor')
 */
export async function catchUpFor(
  db: Db,
  diagramId: string,
  sinceRevision: number | undefined,
  maxOps: number,
  role: ProjectRole,
): Promise<CatchUp | null> {
  const rows =
    sinceRevision === undefined
      ? []
      : await opsBetween(db, diagramId, sinceRevision, 2 ** 31 - 1, maxOps + 1)
  // Read after the ops: anything committed in between reaches the client as a broadcast.
  const state = await readDiagramState(db, diagramId)
  if (!state) return null
  if (sinceRevision !== undefined && sinceRevision <= state.revision) {
    const contiguous = rows.every((row, i) => row.revision === sinceRevision + i + 1)
    // No rows is only complete when nothing was missed; older revisions may predate the log.
    const complete = rows.length > 0 || sinceRevision === state.revision
    if (contiguous && complete && rows.length <= maxOps) {
      const revision = rows.length ? rows[rows.length - 1]!.revision : sinceRevision
      const ops = rows.map(toApplied)
      return { kind: 'ops', diagramId, fromRevision: sinceRevision, revision, ops, role }
    }
  }
  return { kind: 'snapshot', diagramId, revision: state.revision, doc: state.document, role }
}
