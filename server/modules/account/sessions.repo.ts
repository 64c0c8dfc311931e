import type { Db } from '../../db/knex.ts'

/**
 * Ends every session of the user except `keepSid` (the one making the change), so a changed
 * password locks out whoever else was signed in.
 */
export const deleteOtherSessions = (db: Db, userId: string, keepSid: string | undefined) =>
  db('sessions')
    .whereRaw(`sess::jsonb -> 'passport' ->> 'user' = ?`, [userId])
    .whereNot('sid', keepSid ?? '')
    .delete()
