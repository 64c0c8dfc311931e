/**
 * Revision history from the operation log: the list of revisions with author and time, the
 * document as of any kept revision (nearest snapshot, then the ops after it replayed), and
 * restore, which commits the difference to the current document as one new op.
 */
import { randomUUID } from 'node:crypto'
import type { Diagram } from '../../../shared/document/model.ts'
import { applyOperation } from '../../../shared/document/operations.ts'
import type { RestoreResult, RevisionListBody } from '../../../shared/protocol/history.ts'
import { diffDocuments } from '../../../shared/sync/diff.ts'
import { summarizeOperation } from '../../../shared/sync/summary.ts'
import type { Db } from '../../db/knex.ts'
import { conflict, HttpError, notFound } from '../../errors.ts'
import { findDiagramRow } from './diagrams.repo.ts'
import type { OpFeed } from './operations.feed.ts'
import {
  earliestSnapshotRevision,
  opsBetween,
  opsDescending,
  snapshotAtOrBefore,
} from './operations.repo.ts'
import { commitOps } from './operations.service.ts'

async function currentRevision(db: Db, projectId: string, diagramId: string) {
  const row = await findDiagramRow(db, projectId, diagramId)
  if (!row) throw notFound('No such diagram in this project')
  return row.revision
}

export async function listRevisions(
  db: Db,
  projectId: string,
  diagramId: string,
  page: { before?: number; limit: number },
): Promise<RevisionListBody> {
  const current = await currentRevision(db, projectId, diagramId)
  const rows = await opsDescending(db, diagramId, page.before ?? current + 1, page.limit)
  const revisions = rows.map((row) => ({
    revision: row.revision,
    author: { id: row.author_id, name: row.author_name ?? 'a former member' },
    at: row.created_at.toISOString(),
    source: row.source,
    restoredFrom: row.restored_from,
    summary: summarizeOperation(row.op),
  }))
  return { revisions, current, earliest: await earliestSnapshotRevision(db, diagramId) }
}

/** The document at `revision`, rebuilt from the nearest snapshot at or before it. */
export async function documentAt(
  db: Db,
  projectId: string,
  diagramId: string,
  revision: number,
): Promise<Diagram> {
  const current = await currentRevision(db, projectId, diagramId)
  if (revision > current) throw notFound(`revision: the diagram is only at revision ${current}`)
  const snapshot = await snapshotAtOrBefore(db, diagramId, revision)
  const earliest = await earliestSnapshotRevision(db, diagramId)
  const tooOld = notFound(
    `revision: ${revision} is older than the kept history (earliest ${earliest ?? current})`,
  )
  if (!snapshot) throw tooOld
  const gap = revision - snapshot.revision
  const rows = await opsBetween(db, diagramId, snapshot.revision, revision, gap)
  if (rows.length !== gap) throw tooOld
  return rows.reduce((doc, row) => applyOperation(doc, row.op), snapshot.document)
}

/**
 * Brings back the state of `revision` as a new revision (its op is the difference, so every
 * connected replica applies it like any edit). The diagram keeps its current name.
 */
export async function restoreRevision(
  db: Db,
  feed: OpFeed,
  projectId: string,
  diagramId: string,
  revision: number,
  author: { id: string; name: string },
): Promise<RestoreResult> {
  const target = await documentAt(db, projectId, diagramId, revision)
  const [outcome] = await commitOps(db, diagramId, [
    {
      clientOpId: randomUUID(),
      author,
      op: (current) => diffDocuments(current, target),
      source: 'restore',
      restoredFrom: revision,
      checkRole: false,
      checkGraphRules: false,
    },
  ])
  if (outcome!.kind === 'reject') {
    if (outcome!.code === 'not-found') throw notFound('No such diagram in this project')
    throw conflict(`revision: could not restore ${revision}: ${outcome!.reason}`)
  }
  if (!outcome!.applied) throw new HttpError(500, 'internal', 'restore was not recorded')
  feed.publish(outcome!.applied)
  return { revision: outcome!.revision, restoredFrom: revision }
}
