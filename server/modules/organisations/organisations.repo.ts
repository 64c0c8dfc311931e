import type { OrganisationRole } from '../../../shared/api/organisations.ts'
import type { Db } from '../../db/knex.ts'

export interface OrganisationRow {
  id: string
  name: string
  created_by: string | null
  created_at: Date
  updated_at: Date
}

export interface OrganisationWithRole extends OrganisationRow {
  role: OrganisationRole
  member_count: number
  project_count: number
}

export interface OrganisationMemberRow {
  user_id: string
  name: string
  email: string
  color: string
  role: OrganisationRole
  created_at: Date
}

const withRole = (db: Db, userId: string) =>
  db('organisations as o')
    .join('organisation_members as m', 'm.organisation_id', 'o.id')
    .where('m.user_id', userId)
    .select<OrganisationWithRole[]>(
      'o.*',
      'm.role',
      db.raw(
        '(SELECT count(*)::int FROM organisation_members x WHERE x.organisation_id = o.id) AS member_count',
      ),
      db.raw(
        '(SELECT count(*)::int FROM projects p WHERE p.organisation_id = o.id) AS project_count',
      ),
    )

/** The user's organisations, the one joined first leading (it is the default for new projects). */
export const listOrganisationsForUser = (db: Db, userId: string) =>
  withRole(db, userId).orderBy([{ column: 'm.created_at' }, { column: 'o.name' }])

export const findOrganisationForUser = (db: Db, organisationId: string, userId: string) =>
  withRole(db, userId).where('o.id', organisationId).first()

export const findOrganisationRole = async (db: Db, organisationId: string, userId: string) =>
  (
    await db('organisation_members')
      .where({ organisation_id: organisationId, user_id: userId })
      .first<{ role: OrganisationRole } | undefined>('role')
  )?.role ?? null

export const isAdminAnywhere = async (db: Db, userId: string) =>
  !!(await db('organisation_members').where({ user_id: userId, role: 'admin' }).first('user_id'))

export async function insertOrganisation(
  db: Db,
  org: { name: string; created_by: string | null },
): Promise<OrganisationRow> {
  const [row] = await db<OrganisationRow>('organisations').insert(org).returning('*')
  return row!
}

/** Adds the user; an existing membership is left as it is. */
export const addOrganisationMember = (
  db: Db,
  organisationId: string,
  userId: string,
  role: OrganisationRole,
) =>
  db('organisation_members')
    .insert({ organisation_id: organisationId, user_id: userId, role })
    .onConflict(['organisation_id', 'user_id'])
    .ignore()

export const listOrganisationMembers = (db: Db, organisationId: string) =>
  db('organisation_members as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where('m.organisation_id', organisationId)
    .orderBy('u.name')
    .select<OrganisationMemberRow[]>(
      'm.user_id',
      'u.name',
      'u.email',
      'u.color',
      'm.role',
      'm.created_at',
    )

/** Roles of every member, locked until the transaction ends (last-admin checks). */
export const lockOrganisationRoles = (db: Db, organisationId: string) =>
  db('organisation_members')
    .where({ organisation_id: organisationId })
    .forUpdate()
    .select<{ user_id: string; role: OrganisationRole }[]>('user_id', 'role')

export const updateOrganisationRole = (
  db: Db,
  organisationId: string,
  userId: string,
  role: OrganisationRole,
) =>
  db('organisation_members')
    .where({ organisation_id: organisationId, user_id: userId })
    .update({ role })

export const deleteOrganisationMember = (db: Db, organisationId: string, userId: string) =>
  db('organisation_members').where({ organisation_id: organisationId, user_id: userId }).delete()
