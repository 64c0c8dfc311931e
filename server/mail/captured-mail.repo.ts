import type { Db } from '../db/knex.ts'

export interface CapturedMailRow {
  id: string
  mail_from: string
  recipients: string[]
  subject: string
  text: string
  html: string
  raw: string
  received_at: Date
}

export async function insertCapturedMail(
  db: Db,
  mail: Omit<CapturedMailRow, 'id' | 'received_at'>,
): Promise<CapturedMailRow> {
  const [row] = await db<CapturedMailRow>('captured_mail').insert(mail).returning('*')
  return row!
}

/**
 * Addresses whose mail `viewerId` may read: their own, and for each organisation they administer
 * its members, the members of its projects and the addresses invited to them. A self-registered
 * user administers only a personal organisation, so they read only their own mail.
 */
const REACH = `
  WITH admin_orgs AS (
    SELECT organisation_id FROM organisation_members WHERE user_id = :viewer AND role = 'admin'
  ), org_projects AS (
    SELECT id FROM projects WHERE organisation_id IN (SELECT organisation_id FROM admin_orgs)
  )
  SELECT lower(email) FROM users WHERE id = :viewer
  UNION SELECT lower(u.email) FROM organisation_members m JOIN users u ON u.id = m.user_id
    WHERE m.organisation_id IN (SELECT organisation_id FROM admin_orgs)
  UNION SELECT lower(u.email) FROM project_members m JOIN users u ON u.id = m.user_id
    WHERE m.project_id IN (SELECT id FROM org_projects)
  UNION SELECT lower(i.email) FROM invitations i WHERE i.project_id IN (SELECT id FROM org_projects)`

/**
 * Newest first, only messages with a recipient within `viewerId`'s reach (above); `to` narrows
 * to messages with that recipient (any case).
 */
export function listCapturedMail(
  db: Db,
  { viewerId, to, limit = 50 }: { viewerId: string; to?: string; limit?: number },
) {
  const query = db<CapturedMailRow>('captured_mail')
    .whereRaw(`EXISTS (SELECT 1 FROM unnest(recipients) r WHERE lower(r) IN (${REACH}))`, {
      viewer: viewerId,
    })
    .orderBy('id', 'desc')
    .limit(limit)
  if (to) query.whereRaw('lower(?) = ANY (SELECT lower(r) FROM unnest(recipients) r)', [to])
  return query
}
