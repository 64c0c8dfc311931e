import type { ProjectRole } from '../../../shared/auth/roles.ts'
import type { Db } from '../../db/knex.ts'

export interface MemberRow {
  user_id: string
  name: string
  email: string
  color: string
  role: ProjectRole
  created_at: Date
}

export const listProjectMembers = (db: Db, projectId: string) =>
  db('project_members as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where('m.project_id', projectId)
    .orderByRaw(
      `CASE m.role WHEN 'owner' THEN 0 WHEN 'editor' THEN 1 WHEN 'reviewer' THEN 2 ELSE 3 END`,
    )
    .orderBy('u.name')
    .select<MemberRow[]>('m.user_id', 'u.name', 'u.email', 'u.color', 'm.role', 'm.created_at')

/** Every member's role, locked until the transaction ends, so two owners cannot both step down. */
export const lockProjectRoles = (db: Db, projectId: string) =>
  db('project_members')
    .where({ project_id: projectId })
    .forUpdate()
    .select<{ user_id: string; role: ProjectRole }[]>('user_id', 'role')

export const updateMemberRole = (db: Db, projectId: string, userId: string, role: ProjectRole) =>
  db('project_members').where({ project_id: projectId, user_id: userId }).update({ role })

export const deleteMember = (db: Db, projectId: string, userId: string) =>
  db('project_members').where({ project_id: projectId, user_id: userId }).delete()

export const isMemberByEmail = async (db: Db, projectId: string, email: string) =>
  !!(await db('project_members as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where('m.project_id', projectId)
    .whereRaw('lower(u.email) = lower(?)', [email])
    .first('m.user_id'))
