import { createHash, randomBytes } from 'node:crypto'
import { HttpError } from '../../errors.ts'

/** Invitation links stay valid for a week: long enough to be read after a site visit. */
export const INVITATION_LIFETIME_MS = 7 * 24 * 3600 * 1000
/** Reset links are short-lived (1 hour): they hand over an account, and are asked for on demand. */
export const PASSWORD_RESET_LIFETIME_MS = 3600 * 1000

/** A link token (32 random bytes, base64url: 43 characters) and the sha256 that is stored. */
export function newToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url')
  return { token, hash: hashToken(token) }
}

export const hashToken = (token: string) => createHash('sha256').update(token).digest('hex')

export interface TokenState {
  expires_at: Date
  /** When it was used (accepted / reset), or null. */
  used_at: Date | null
  revoked_at?: Date | null
}

/** Throws the clear error for a link that cannot be used; returns when it can. */
export function assertUsable(row: TokenState | undefined, what: 'invitation' | 'reset link'): void {
  if (!row) {
    throw new HttpError(
      404,
      'link_unknown',
      `This ${what} is not valid; check that you copied the whole link`,
    )
  }
  if (row.used_at) throw new HttpError(410, 'link_used', `This ${what} has already been used`)
  if (row.revoked_at) throw new HttpError(410, 'link_revoked', `This ${what} was withdrawn`)
  if (row.expires_at.getTime() <= Date.now()) {
    throw new HttpError(410, 'link_expired', `This ${what} has expired`)
  }
}
