import type { ReviewKind } from '../../../shared/api/reviews.ts'
import type { Db } from '../../db/knex.ts'

export interface ReviewRow {
  id: string
  kind: ReviewKind
  revision: number
  note: string
  actor_id: string | null
  actor_name: string | null
  created_at: Date
}

/** Newest first. */
export const listReviewRows = (db: Db, diagramId: string, limit = 50) =>
  db('review_decisions as r')
    .leftJoin('users as u', 'u.id', 'r.actor_id')
    .where('r.diagram_id', diagramId)
    .orderBy('r.id', 'desc')
    .limit(limit)
    .select<ReviewRow[]>(
      'r.id',
      'r.kind',
      'r.revision',
      'r.note',
      'r.actor_id',
      'u.name as actor_name',
      'r.created_at',
    )

export const insertReviewRow = (
  db: Db,
  row: {
    project_id: string
    diagram_id: string
    kind: ReviewKind
    revision: number
    note: string
    actor_id: string
  },
) => db('review_decisions').insert(row)

/** The diagram's revision, locked until the transaction ends so a decision sees a settled one. */
export const lockDiagramRevision = (db: Db, projectId: string, diagramId: string) =>
  db('diagrams')
    .where({ id: diagramId, project_id: projectId })
    .forUpdate()
    .first<{ revision: number; name: string } | undefined>('revision', 'name')

/** Editors and owners of the project, who hear about review decisions. */
export const projectEditors = (db: Db, projectId: string) =>
  db('project_members as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where('m.project_id', projectId)
    .whereIn('m.role', ['owner', 'editor'])
    .select<{ id: string; name: string; email: string }[]>('u.id', 'u.name', 'u.email')
