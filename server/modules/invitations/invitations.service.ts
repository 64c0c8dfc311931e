import type { InvitationPreview, InvitationSignUpBody } from '../../../shared/api/invitations.ts'
import type { InviteMemberBody, PendingInvitation } from '../../../shared/api/members.ts'
import type { ProjectRole } from '../../../shared/auth/roles.ts'
import type { Db } from '../../db/knex.ts'
import { conflict, forbidden, notFound } from '../../errors.ts'
import type { Mailer } from '../../mail/mailer.ts'
import { invitationMail } from '../../mail/templates/invitation.ts'
import {
  assertUsable,
  hashToken,
  INVITATION_LIFETIME_MS,
  newToken,
} from '../account/one-time-token.ts'
import { recordAudit } from '../audit/audit.service.ts'
import { isMemberByEmail } from '../members/members.repo.ts'
import { addOrganisationMember } from '../organisations/organisations.repo.ts'
import { addMember, findMemberRole } from '../projects/projects.repo.ts'
import { findUserByEmail, type UserRow } from '../users/users.repo.ts'
import { createUser } from '../users/users.service.ts'
import * as repo from './invitations.repo.ts'

export const toPending = (row: repo.InvitationDetail): PendingInvitation => ({
  id: row.id,
  email: row.email,
  role: row.role,
  invitedBy: row.inviter_name,
  createdAt: row.created_at.toISOString(),
  expiresAt: row.expires_at.toISOString(),
})

export async function listPending(db: Db, projectId: string): Promise<PendingInvitation[]> {
  return (await repo.listPendingInvitations(db, projectId)).map(toPending)
}

/**
 * Invites an address with a role and mails the link. Inviting the same address again withdraws
 * the earlier link. The invitation exists only if the e-mail was handed to the SMTP server.
 */
export async function invite(
  db: Db,
  mailer: Mailer,
  origin: string,
  actor: { id: string; name: string },
  projectId: string,
  body: InviteMemberBody,
): Promise<PendingInvitation> {
  if (await isMemberByEmail(db, projectId, body.email)) {
    throw conflict('email: this person is already a member of the project')
  }
  const { token, hash } = newToken()
  const expiresAt = new Date(Date.now() + INVITATION_LIFETIME_MS)
  const id = await db.transaction(async (trx) => {
    const replaced = await repo.revokePendingFor(trx, projectId, body.email)
    const row = await repo.insertInvitation(trx, {
      project_id: projectId,
      email: body.email,
      role: body.role,
      token_hash: hash,
      invited_by: actor.id,
      expires_at: expiresAt,
    })
    const saved = (await repo.findInvitationByHash(trx, hash))!
    await recordAudit(trx, {
      actorId: actor.id,
      projectId,
      action: 'member.invited',
      details: { email: body.email, role: body.role, replacedEarlier: replaced > 0 },
    })
    await mailer.send(
      invitationMail({
        to: body.email,
        inviterName: actor.name,
        projectName: saved.project_name,
        organisationName: saved.organisation_name,
        role: body.role,
        link: `${origin}/invitations/${token}`,
        expiresAt,
      }),
    )
    return row.id
  })
  const pending = (await listPending(db, projectId)).find((p) => p.id === id)
  if (!pending) throw notFound('No such invitation')
  return pending
}

export async function revoke(db: Db, actorId: string, projectId: string, invitationId: string) {
  await db.transaction(async (trx) => {
    const row = await repo.revokeInvitation(trx, projectId, invitationId)
    if (!row) throw notFound('No such pending invitation')
    await recordAudit(trx, {
      actorId,
      projectId,
      action: 'invitation.revoked',
      details: { email: row.email, role: row.role },
    })
  })
}

async function usableInvitation(db: Db, token: string) {
  const row = await repo.findInvitationByHash(db, hashToken(token))
  assertUsable(row && { ...row, used_at: row.accepted_at }, 'invitation')
  return row!
}

export async function preview(db: Db, token: string): Promise<InvitationPreview> {
  const row = await usableInvitation(db, token)
  return {
    projectId: row.project_id,
    projectName: row.project_name,
    organisationName: row.organisation_name,
    email: row.email,
    role: row.role,
    invitedBy: row.inviter_name,
    expiresAt: row.expires_at.toISOString(),
    accountExists: !!(await findUserByEmail(db, row.email)),
  }
}

/** The signed-in user accepts; the invitation was addressed to them, so the e-mails must match. */
export async function accept(db: Db, token: string, user: { id: string; email: string }) {
  const row = await usableInvitation(db, token)
  if (row.email.toLowerCase() !== user.email.toLowerCase()) {
    throw forbidden(
      `This invitation was sent to ${row.email}; sign in with that address to accept it`,
    )
  }
  return db.transaction((trx) => join(trx, row, user.id))
}

/** A new person creates their account (with the invited address) and joins in one step. */
export async function signUpAndAccept(
  db: Db,
  body: InvitationSignUpBody,
): Promise<{
  user: UserRow
  joined: { projectId: string; role: ProjectRole }
}> {
  const row = await usableInvitation(db, body.token)
  return db.transaction(async (trx) => {
    const user = await createUser(
      trx,
      { email: row.email, name: body.name, password: body.password },
      { personalOrganisation: false },
    )
    return { user, joined: await join(trx, row, user.id) }
  })
}

/** Uses the invitation once and makes the user a member of the project and its organisation. */
async function join(trx: Db, row: repo.InvitationDetail, userId: string) {
  const claimed = await repo.claimInvitation(trx, row.id, userId)
  if (!claimed) {
    const fresh = await repo.findInvitationByHash(trx, row.token_hash)
    assertUsable(fresh && { ...fresh, used_at: fresh.accepted_at ?? new Date() }, 'invitation')
  }
  // Someone already on the project keeps the role they have.
  const existing = await findMemberRole(trx, row.project_id, userId)
  if (!existing) await addMember(trx, row.project_id, userId, row.role)
  await addOrganisationMember(trx, row.organisation_id, userId, 'member')
  await recordAudit(trx, {
    actorId: userId,
    projectId: row.project_id,
    action: 'invitation.accepted',
    details: { email: row.email, role: existing ?? row.role },
  })
  return { projectId: row.project_id, role: existing ?? row.role }
}
