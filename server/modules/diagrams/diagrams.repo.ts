import type { Diagram } from '../../../shared/document/model.ts'
import type { Db } from '../../db/knex.ts'

export interface DiagramRow {
  id: string
  project_id: string
  name: string
  document: Diagram
  revision: number
  created_by: string | null
  updated_by: string | null
  created_at: Date
  updated_at: Date
  updated_by_name: string | null
}

const withEditor = (db: Db) =>
  db('diagrams as d')
    .leftJoin('users as u', 'u.id', 'd.updated_by')
    .select('d.*', 'u.name as updated_by_name')

export const listDiagramRows = (db: Db, projectId: string) =>
  withEditor(db)
    .where('d.project_id', projectId)
    .orderBy('d.updated_at', 'desc')
    .select<DiagramRow[]>()

export const findDiagramRow = (db: Db, projectId: string, id: string) =>
  withEditor(db).where({ 'd.project_id': projectId, 'd.id': id }).first<DiagramRow | undefined>()

export async function insertDiagramRow(
  db: Db,
  row: { project_id: string; name: string; document: Diagram; created_by: string },
): Promise<string> {
  const [inserted] = await db('diagrams')
    .insert({ ...row, document: JSON.stringify(row.document), updated_by: row.created_by })
    .returning<{ id: string }[]>('id')
  return inserted!.id
}

/** Writes a new document only if the stored revision is still `baseRevision`. */
export async function saveDocumentIfRevision(
  db: Db,
  id: string,
  baseRevision: number,
  document: Diagram,
  userId: string,
): Promise<{ revision: number; updated_at: Date } | undefined> {
  const [row] = await db('diagrams')
    .where({ id, revision: baseRevision })
    .update({
      document: JSON.stringify(document),
      revision: baseRevision + 1,
      updated_by: userId,
      updated_at: db.fn.now(),
    })
    .returning<{ revision: number; updated_at: Date }[]>(['revision', 'updated_at'])
  return row
}

export const renameDiagramRow = (db: Db, id: string, name: string, userId: string) =>
  db('diagrams').where({ id }).update({ name, updated_by: userId, updated_at: db.fn.now() })

export const deleteDiagramRow = (db: Db, projectId: string, id: string) =>
  db('diagrams').where({ project_id: projectId, id }).delete()

export const touchProject = (db: Db, projectId: string) =>
  db('projects').where({ id: projectId }).update({ updated_at: db.fn.now() })
