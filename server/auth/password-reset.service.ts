import type { Db } from '../db/knex.ts'
import type { Mailer } from '../mail/mailer.ts'
import { passwordResetMail } from '../mail/templates/password-reset.ts'
import { setPassword } from '../modules/account/account.service.ts'
import {
  assertUsable,
  hashToken,
  newToken,
  PASSWORD_RESET_LIFETIME_MS,
} from '../modules/account/one-time-token.ts'
import { recordAudit } from '../modules/audit/audit.service.ts'
import { findUserByEmail, findUserById } from '../modules/users/users.repo.ts'
import * as repo from './password-reset.repo.ts'

/**
 * Mails a reset link when an account uses this address. Unknown addresses get the same answer
 * (and no e-mail), so the form cannot be used to find out who has an account.
 */
export async function requestPasswordReset(db: Db, mailer: Mailer, origin: string, email: string) {
  const user = await findUserByEmail(db, email)
  if (!user) return
  const { token, hash } = newToken()
  const expiresAt = new Date(Date.now() + PASSWORD_RESET_LIFETIME_MS)
  // Stored before the mail goes out, so the link works the moment the mail exists; taken back if
  // the mail cannot be sent.
  await repo.insertPasswordReset(db, { user_id: user.id, token_hash: hash, expires_at: expiresAt })
  const link = `${origin}/reset-password/${token}`
  try {
    await mailer.send(passwordResetMail({ to: user.email, name: user.name, link, expiresAt }))
  } catch (error) {
    await repo.deletePasswordReset(db, hash)
    throw error
  }
}

/** The account a still-usable link belongs to (for the "choose a new password" page). */
export async function previewPasswordReset(db: Db, token: string) {
  const row = await repo.findPasswordReset(db, hashToken(token))
  assertUsable(row, 'reset link')
  const user = await findUserById(db, row!.user_id)
  return { email: user?.email ?? '' }
}

/** Uses the link once: sets the password and ends every session but the caller's own. */
export async function completePasswordReset(
  db: Db,
  token: string,
  password: string,
  keepSid: string | undefined,
) {
  const row = await repo.findPasswordReset(db, hashToken(token))
  assertUsable(row, 'reset link')
  const claimed = await repo.claimPasswordReset(db, row!.id)
  // Someone else used it between the check and the claim: report it as used.
  if (!claimed) assertUsable({ ...row!, used_at: new Date() }, 'reset link')
  await setPassword(db, row!.user_id, password, keepSid)
  await repo.retireUserResets(db, row!.user_id)
  await recordAudit(db, { actorId: row!.user_id, action: 'account.password_reset' })
}
