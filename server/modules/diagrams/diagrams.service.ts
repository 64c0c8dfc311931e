import { randomUUID } from 'node:crypto'
import type {
  DiagramRecord,
  DiagramSummary,
  SaveDiagramBody,
} from '../../../shared/api/diagrams.ts'
import { emptyDiagram, type Diagram } from '../../../shared/document/model.ts'
import { OPS } from '../../../shared/document/operations.ts'
import { diffDocuments } from '../../../shared/sync/diff.ts'
import type { Db } from '../../db/knex.ts'
import { conflict, notFound } from '../../errors.ts'
import {
  deleteDiagramRow,
  findDiagramRow,
  insertDiagramRow,
  listDiagramRows,
  renameDiagramRow,
  touchProject,
  type DiagramRow,
} from './diagrams.repo.ts'
import type { OpFeed } from './operations.feed.ts'
import { commitOps } from './operations.service.ts'

function toSummary(row: DiagramRow): DiagramSummary {
  return {
    id: row.id,
    projectId: row.project_id,
    name: row.name,
    revision: row.revision,
    createdAt: row.created_at.toISOString(),
    updatedAt: row.updated_at.toISOString(),
    updatedBy: row.updated_by ? { id: row.updated_by, name: row.updated_by_name ?? '' } : null,
  }
}

// The row's name is the diagram's name; the document carries a copy for exports.
const toRecord = (row: DiagramRow): DiagramRecord => ({
  ...toSummary(row),
  document: { ...row.document, name: row.name },
})

export async function listDiagrams(db: Db, projectId: string): Promise<DiagramSummary[]> {
  return (await listDiagramRows(db, projectId)).map(toSummary)
}

export async function getDiagram(db: Db, projectId: string, id: string): Promise<DiagramRecord> {
  const row = await findDiagramRow(db, projectId, id)
  if (!row) throw notFound('No such diagram in this project')
  return toRecord(row)
}

export async function createDiagram(
  db: Db,
  projectId: string,
  userId: string,
  input: { name: string; document?: Diagram },
): Promise<DiagramRecord> {
  const document = { ...(input.document ?? emptyDiagram()), name: input.name }
  const id = await db.transaction(async (trx) => {
    const newId = await insertDiagramRow(trx, {
      project_id: projectId,
      name: input.name,
      document,
      created_by: userId,
    })
    await touchProject(trx, projectId)
    return newId
  })
  return getDiagram(db, projectId, id)
}

export async function duplicateDiagram(
  db: Db,
  projectId: string,
  id: string,
  userId: string,
): Promise<DiagramRecord> {
  const source = await getDiagram(db, projectId, id)
  return createDiagram(db, projectId, userId, {
    name: `${source.name} (copy)`.slice(0, 120),
    document: source.document,
  })
}

/**
 * Stores a whole document edited on `baseRevision`. A save made on an older revision is refused
 * (409) rather than silently overwriting someone else's work. The save goes through the op log
 * like a live edit: its op is the difference from the stored document (source `save`), so the
 * revision, the history and every connected replica stay coherent; `feed` broadcasts it.
 */
export async function saveDocument(
  db: Db,
  projectId: string,
  id: string,
  author: { id: string; name: string },
  body: SaveDiagramBody,
  feed?: OpFeed,
): Promise<{ revision: number; updatedAt: string }> {
  const current = await findDiagramRow(db, projectId, id)
  if (!current) throw notFound('No such diagram in this project')
  const [outcome] = await commitOps(db, id, [
    {
      clientOpId: randomUUID(),
      author,
      // The name is changed only by a rename; a whole-document save keeps the current one.
      op: (stored) => diffDocuments(stored, { ...body.document, name: stored.name }),
      source: 'save',
      checkRole: false,
      checkGraphRules: false,
      expectRevision: body.baseRevision,
    },
  ])
  if (outcome!.kind === 'reject') {
    if (outcome!.code === 'not-found') throw notFound('No such diagram in this project')
    throw conflict(outcome!.reason)
  }
  if (outcome!.applied) feed?.publish(outcome!.applied)
  await touchProject(db, projectId)
  return {
    revision: outcome!.revision,
    updatedAt: outcome!.applied?.at ?? new Date().toISOString(),
  }
}

/**
 * Renames a diagram through the operation log (a `diagram.rename` op), so every open editor sees
 * the new name and a later edit cannot write the old one back.
 */
export async function renameDiagram(
  db: Db,
  projectId: string,
  id: string,
  author: { id: string; name: string },
  name: string,
  feed?: OpFeed,
): Promise<DiagramRecord> {
  await getDiagram(db, projectId, id)
  const [outcome] = await commitOps(db, id, [
    {
      clientOpId: randomUUID(),
      author,
      op: () => ({ type: OPS.diagramRename, name }),
      source: 'edit',
      checkRole: false,
      checkGraphRules: false,
    },
  ])
  if (outcome!.kind === 'reject') throw conflict(`name: ${outcome!.reason}`)
  if (outcome!.applied) feed?.publish(outcome!.applied)
  await renameDiagramRow(db, id, name, author.id)
  return getDiagram(db, projectId, id)
}

export async function deleteDiagram(db: Db, projectId: string, id: string): Promise<void> {
  if (!(await deleteDiagramRow(db, projectId, id)))
    throw notFound('No such diagram in this project')
}
