import type { Db } from '../db/knex.ts'

export interface PasswordResetRow {
  id: string
  user_id: string
  token_hash: string
  expires_at: Date
  used_at: Date | null
  created_at: Date
}

export const insertPasswordReset = (
  db: Db,
  row: Pick<PasswordResetRow, 'user_id' | 'token_hash' | 'expires_at'>,
) => db('password_resets').insert(row)

/** Takes back a link whose mail could not be sent. */
export const deletePasswordReset = (db: Db, tokenHash: string) =>
  db('password_resets').where({ token_hash: tokenHash }).delete()

export const findPasswordReset = (db: Db, tokenHash: string) =>
  db<PasswordResetRow>('password_resets').where({ token_hash: tokenHash }).first()

/** Marks the row used, but only if it still is usable; the caller checks that a row came back. */
export const claimPasswordReset = async (db: Db, id: string) =>
  (
    await db<PasswordResetRow>('password_resets')
      .where({ id, used_at: null })
      .where('expires_at', '>', db.fn.now())
      .update({ used_at: db.fn.now() })
      .returning('*')
  )[0]

/** A new password makes every other outstanding link of the user useless. */
export const retireUserResets = (db: Db, userId: string) =>
  db('password_resets').where({ user_id: userId, used_at: null }).update({ used_at: db.fn.now() })
