import type { ProjectRole } from '../../../shared/auth/roles.ts'
import type { Db } from '../../db/knex.ts'

export interface InvitationRow {
  id: string
  project_id: string
  email: string
  role: ProjectRole
  token_hash: string
  invited_by: string | null
  expires_at: Date
  accepted_at: Date | null
  accepted_by: string | null
  revoked_at: Date | null
  created_at: Date
}

export interface InvitationDetail extends InvitationRow {
  project_name: string
  organisation_id: string
  organisation_name: string
  inviter_name: string | null
}

export async function insertInvitation(
  db: Db,
  row: Pick<
    InvitationRow,
    'project_id' | 'email' | 'role' | 'token_hash' | 'invited_by' | 'expires_at'
  >,
): Promise<InvitationRow> {
  const [inserted] = await db<InvitationRow>('invitations').insert(row).returning('*')
  return inserted!
}

const detail = (db: Db) =>
  db('invitations as i')
    .join('projects as p', 'p.id', 'i.project_id')
    .join('organisations as o', 'o.id', 'p.organisation_id')
    .leftJoin('users as u', 'u.id', 'i.invited_by')
    .select<InvitationDetail[]>(
      'i.*',
      'p.name as project_name',
      'p.organisation_id',
      'o.name as organisation_name',
      'u.name as inviter_name',
    )

export const findInvitationByHash = (db: Db, tokenHash: string) =>
  detail(db).where('i.token_hash', tokenHash).first()

/** Invitations not yet accepted, withdrawn or expired, newest first. */
export const listPendingInvitations = (db: Db, projectId: string) =>
  detail(db)
    .where('i.project_id', projectId)
    .whereNull('i.accepted_at')
    .whereNull('i.revoked_at')
    .where('i.expires_at', '>', db.fn.now())
    .orderBy('i.created_at', 'desc')

/** Withdraws the pending invitations of one address (a new one replaces them). */
export const revokePendingFor = (db: Db, projectId: string, email: string) =>
  db('invitations')
    .where({ project_id: projectId })
    .whereRaw('lower(email) = lower(?)', [email])
    .whereNull('accepted_at')
    .whereNull('revoked_at')
    .update({ revoked_at: db.fn.now() })

export const revokeInvitation = async (db: Db, projectId: string, id: string) =>
  (
    await db<InvitationRow>('invitations')
      .where({ project_id: projectId, id, accepted_at: null, revoked_at: null })
      .update({ revoked_at: db.fn.now() })
      .returning('*')
  )[0]

/** Uses the invitation once; no row comes back when it was used, withdrawn or expired meanwhile. */
export const claimInvitation = async (db: Db, id: string, userId: string) =>
  (
    await db<InvitationRow>('invitations')
      .where({ id, accepted_at: null, revoked_at: null })
      .where('expires_at', '>', db.fn.now())
      .update({ accepted_at: db.fn.now(), accepted_by: userId })
      .returning('*')
  )[0]
