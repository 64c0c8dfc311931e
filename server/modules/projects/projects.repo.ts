import type { ProjectRole } from '../../../shared/auth/roles.ts'
import type { Db } from '../../db/knex.ts'

export interface ProjectRow {
  id: string
  name: string
  description: string
  units: 'si' | 'us'
  organisation_id: string
  created_by: string | null
  created_at: Date
  updated_at: Date
}

export interface ProjectWithRole extends ProjectRow {
  role: ProjectRole
  diagram_count: number
  organisation_name: string
}

const withRole = (db: Db, userId: string) =>
  db('projects as p')
    .join('project_members as m', 'm.project_id', 'p.id')
    .join('organisations as o', 'o.id', 'p.organisation_id')
    .where('m.user_id', userId)
    .select<ProjectWithRole[]>(
      'p.*',
      'm.role',
      'o.name as organisation_name',
      db.raw(`(SELECT count(*)::int FROM diagrams d WHERE d.project_id = p.id) AS diagram_count`),
    )

export const listProjectsForUser = (db: Db, userId: string) =>
  withRole(db, userId).orderBy('p.updated_at', 'desc')

export const findProjectForUser = (db: Db, projectId: string, userId: string) =>
  withRole(db, userId).where('p.id', projectId).first()

export const findMemberRole = async (db: Db, projectId: string, userId: string) =>
  (
    await db('project_members')
      .where({ project_id: projectId, user_id: userId })
      .first<{ role: ProjectRole } | undefined>('role')
  )?.role ?? null

export async function insertProject(
  db: Db,
  project: Pick<ProjectRow, 'name' | 'description' | 'units' | 'created_by' | 'organisation_id'>,
): Promise<ProjectRow> {
  const [row] = await db<ProjectRow>('projects').insert(project).returning('*')
  return row!
}

export const addMember = (db: Db, projectId: string, userId: string, role: ProjectRole) =>
  db('project_members').insert({ project_id: projectId, user_id: userId, role })

export const updateProjectRow = (
  db: Db,
  id: string,
  patch: Partial<Pick<ProjectRow, 'name' | 'description' | 'units'>>,
) =>
  db('projects')
    .where({ id })
    .update({ ...patch, updated_at: db.fn.now() })

export const deleteProjectRow = (db: Db, id: string) => db('projects').where({ id }).delete()
