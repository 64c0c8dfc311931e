/**
 * Revision history from the operation log: the list of revisions with author and time, the
 * document as of any kept revision (nearest snapshot, then the ops after it replayed), and
 * restore, which commits the difference to the current document as one new op.
 */
import { randomUUID } from 'node:crypto'
import type { Diagram } from '../../../shared/document/model.ts'
import { applyOperation } from '../../../shared/document/operations.ts'
import type {
  RestoreResult,
  RevisionEntry,
  RevisionListBody,
} from '../../../shared/protocol/history.ts'
import { diffDocuments } from '../../../shared/sync/diff.ts'
import { summarizeOperation } from '../../../shared/sync/summary.ts'
import type { Db } from '../../db/knex.ts'
import { conflict, HttpError, notFound } from '../../errors.ts'
import { findUserById } from '../users/users.repo.ts'
import { findDiagramRow } from './diagrams.repo.ts'
import type { OpFeed } from './operations.feed.ts'
import {
  earliestSnapshotRevision,
  opsBetween,
  opsDescending,
  snapshotAtOrBefore,
} from './operations.repo.ts'
import { commitOps } from './operations.service.ts'

async function diagramRow(db: Db, projectId: string, diagramId: string) {
  const row = await findDiagramRow(db, projectId, diagramId)
  if (!row) throw notFound('No such diagram in this project')
  return row
}

async function currentRevision(db: Db, projectId: string, diagramId: string) {
  return (await diagramRow(db, projectId, diagramId)).revision
}

export async function listRevisions(
  db: Db,
  projectId: string,
  diagramId: string,
  page: { before?: number; limit: number },
): Promise<RevisionListBody> {
  const diagram = await diagramRow(db, projectId, diagramId)
  const current = diagram.revision
  const before = page.before ?? current + 1
  const rows = await opsDescending(db, diagramId, before, page.limit)
  const revisions: RevisionEntry[] = rows.map((row) => ({
    revision: row.revision,
    author: { id: row.author_id, name: row.author_name ?? 'a former member' },
    at: row.created_at.toISOString(),
    source: row.source,
    restoredFrom: row.restored_from,
    summary: summarizeOperation(row.op),
  }))
  const earliest = await earliestSnapshotRevision(db, diagramId)
  // The page that reaches revision 1 ends with the diagram as created (one entry over the limit),
  // while that state is still kept.
  if (earliest === 0 && (rows.at(-1)?.revision ?? before) === 1) {
    const creator = diagram.created_by ? await findUserById(db, diagram.created_by) : undefined
    revisions.push({
      revision: 0,
      author: { id: diagram.created_by, name: creator?.name ?? 'a former member' },
      at: diagram.created_at.toISOString(),
      source: 'create',
      restoredFrom: null,
      summary: 'Created the diagram',
    })
  }
  return { revisions, current, earliest }
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
