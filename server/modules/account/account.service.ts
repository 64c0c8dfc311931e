import { verify } from '@node-rs/argon2'
import type { Account, ChangePasswordBody, UpdateAccountBody } from '../../../shared/api/account.ts'
import type { Db } from '../../db/knex.ts'
import { HttpError, notFound } from '../../errors.ts'
import { recordAudit } from '../audit/audit.service.ts'
import { findUserById, updateUserRow, type UserRow } from '../users/users.repo.ts'
import { hashPassword } from '../users/users.service.ts'
import { deleteOtherSessions } from './sessions.repo.ts'

export const toAccount = (row: UserRow): Account => ({
  id: row.id,
  email: row.email,
  name: row.name,
  color: row.color,
  units: row.units,
  notifications: { mentions: row.notify_mentions, reviews: row.notify_reviews },
})

export async function getAccount(db: Db, userId: string): Promise<Account> {
  const row = await findUserById(db, userId)
  if (!row) throw notFound('No such account')
  return toAccount(row)
}

export async function updateAccount(db: Db, userId: string, body: UpdateAccountBody) {
  await updateUserRow(db, userId, {
    name: body.name,
    color: body.color?.toLowerCase(),
    units: body.units,
    notify_mentions: body.notifications?.mentions,
    notify_reviews: body.notifications?.reviews,
  })
  return getAccount(db, userId)
}

/** Sets a new password and signs the account out of every other session. */
export async function setPassword(
  db: Db,
  userId: string,
  password: string,
  keepSid: string | undefined,
) {
  const passwordHash = await hashPassword(password)
  await db.transaction(async (trx) => {
    await updateUserRow(trx, userId, { password_hash: passwordHash })
    await deleteOtherSessions(trx, userId, keepSid)
  })
}

export async function changePassword(
  db: Db,
  userId: string,
  body: ChangePasswordBody,
  keepSid: string | undefined,
) {
  const row = await findUserById(db, userId)
  if (!row) throw notFound('No such account')
  if (!(await verify(row.password_hash, body.currentPassword))) {
    throw new HttpError(400, 'invalid_request', 'currentPassword: is not your current password', [
      { path: 'currentPassword', message: 'is not your current password' },
    ])
  }
  await setPassword(db, userId, body.newPassword, keepSid)
  await recordAudit(db, { actorId: userId, action: 'account.password_changed' })
}
