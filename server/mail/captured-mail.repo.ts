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

/** Newest first; `to` narrows to messages with that recipient (any case). */
export function listCapturedMail(db: Db, { to, limit = 50 }: { to?: string; limit?: number } = {}) {
  const query = db<CapturedMailRow>('captured_mail').orderBy('id', 'desc').limit(limit)
  if (to) query.whereRaw('lower(?) = ANY (SELECT lower(r) FROM unnest(recipients) r)', [to])
  return query
}
