import type {
  AddOrganisationMemberBody,
  Organisation,
  OrganisationMember,
  OrganisationRole,
} from '../../../shared/api/organisations.ts'
import type { Db } from '../../db/knex.ts'
import { conflict, HttpError, notFound } from '../../errors.ts'
import { recordAudit } from '../audit/audit.service.ts'
import { findUserByEmail } from '../users/users.repo.ts'
import * as repo from './organisations.repo.ts'

export const toOrganisation = (row: repo.OrganisationWithRole): Organisation => ({
  id: row.id,
  name: row.name,
  role: row.role,
  memberCount: row.member_count,
  projectCount: row.project_count,
})

export const toOrganisationMember = (row: repo.OrganisationMemberRow): OrganisationMember => ({
  userId: row.user_id,
  name: row.name,
  email: row.email,
  color: row.color,
  role: row.role,
  joinedAt: row.created_at.toISOString(),
})

export async function listOrganisations(db: Db, userId: string): Promise<Organisation[]> {
  return (await repo.listOrganisationsForUser(db, userId)).map(toOrganisation)
}

export async function getOrganisation(db: Db, organisationId: string, userId: string) {
  const row = await repo.findOrganisationForUser(db, organisationId, userId)
  if (!row) throw notFound('No such organisation')
  return toOrganisation(row)
}

/** A new organisation with its creator as admin. Takes a transaction or the pool. */
export async function createOrganisation(db: Db, userId: string, name: string) {
  const org = await repo.insertOrganisation(db, { name, created_by: userId })
  await repo.addOrganisationMember(db, org.id, userId, 'admin')
  return org
}

/** The organisation new projects go to: the one joined first, or a new personal one. */
export async function defaultOrganisationId(db: Db, user: { id: string; name: string }) {
  const [first] = await repo.listOrganisationsForUser(db, user.id)
  return first?.id ?? (await createOrganisation(db, user.id, personalName(user.name))).id
}

export const personalName = (userName: string) => `${userName}'s practice`

export async function listMembers(db: Db, organisationId: string): Promise<OrganisationMember[]> {
  return (await repo.listOrganisationMembers(db, organisationId)).map(toOrganisationMember)
}

/** Admins add people who already have an account; everyone else joins through a project invitation. */
export async function addMember(
  db: Db,
  actorId: string,
  organisationId: string,
  body: AddOrganisationMemberBody,
): Promise<OrganisationMember> {
  const user = await findUserByEmail(db, body.email)
  if (!user) {
    throw new HttpError(
      404,
      'not_found',
      'email: no Tributary account uses this address; invite them to a project instead',
      [{ path: 'email', message: 'no Tributary account uses this address' }],
    )
  }
  await db.transaction(async (trx) => {
    if (await repo.findOrganisationRole(trx, organisationId, user.id)) {
      throw conflict('email: this person is already a member of the organisation')
    }
    await repo.addOrganisationMember(trx, organisationId, user.id, body.role)
    await recordAudit(trx, {
      actorId,
      organisationId,
      action: 'organisation.member_added',
      details: { userId: user.id, name: user.name, email: user.email, role: body.role },
    })
  })
  return memberOf(db, organisationId, user.id)
}

export async function changeRole(
  db: Db,
  actorId: string,
  organisationId: string,
  userId: string,
  role: OrganisationRole,
): Promise<OrganisationMember> {
  await db.transaction(async (trx) => {
    const roles = await repo.lockOrganisationRoles(trx, organisationId)
    const current = roles.find((r) => r.user_id === userId)
    if (!current) throw notFound('No such member of this organisation')
    if (current.role === role) return
    if (current.role === 'admin' && roles.filter((r) => r.role === 'admin').length === 1) {
      throw conflict('role: the last admin cannot be made a member; make someone else admin first')
    }
    await repo.updateOrganisationRole(trx, organisationId, userId, role)
    await recordAudit(trx, {
      actorId,
      organisationId,
      action: 'organisation.role_changed',
      details: { userId, from: current.role, to: role },
    })
  })
  return memberOf(db, organisationId, userId)
}

/**
 * Removes someone (or lets them leave): they also leave the organisation's projects, which is
 * refused while they are the last owner of one.
 */
export async function removeMember(
  db: Db,
  actorId: string,
  organisationId: string,
  userId: string,
) {
  await db.transaction(async (trx) => {
    const roles = await repo.lockOrganisationRoles(trx, organisationId)
    const current = roles.find((r) => r.user_id === userId)
    if (!current) throw notFound('No such member of this organisation')
    if (current.role === 'admin' && roles.filter((r) => r.role === 'admin').length === 1) {
      throw conflict('The last admin cannot leave the organisation; make someone else admin first')
    }
    const soleOwnerOf = await trx('projects as p')
      .join('project_members as m', 'm.project_id', 'p.id')
      .where({ 'p.organisation_id': organisationId, 'm.user_id': userId, 'm.role': 'owner' })
      .whereNotExists(
        trx('project_members as o')
          .whereRaw('o.project_id = p.id')
          .where('o.role', 'owner')
          .whereNot('o.user_id', userId),
      )
      .first<{ name: string } | undefined>('p.name')
    if (soleOwnerOf) {
      throw conflict(
        `They are the last owner of "${soleOwnerOf.name}"; make someone else owner first`,
      )
    }
    await trx('project_members')
      .where('user_id', userId)
      .whereIn('project_id', trx('projects').where('organisation_id', organisationId).select('id'))
      .delete()
    await repo.deleteOrganisationMember(trx, organisationId, userId)
    await recordAudit(trx, {
      actorId,
      organisationId,
      action: actorId === userId ? 'organisation.left' : 'organisation.member_removed',
      details: { userId, role: current.role },
    })
  })
}

async function memberOf(db: Db, organisationId: string, userId: string) {
  const row = (await repo.listOrganisationMembers(db, organisationId)).find(
    (m) => m.user_id === userId,
  )
  if (!row) throw notFound('No such member of this organisation')
  return toOrganisationMember(row)
}
