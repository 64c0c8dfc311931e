import { hash, verify } from '@node-rs/argon2'
import type { SignUpBody, User } from '../../../shared/api/schemas.ts'
import type { Db } from '../../db/knex.ts'
import { conflict } from '../../errors.ts'
import { createOrganisation, personalName } from '../organisations/organisations.service.ts'
import { findUserByEmail, insertUser, type UserRow } from './users.repo.ts'

/** Avatar colours for presence; picked from the e-mail so a user keeps theirs. */
const AVATAR_COLORS = ['#3b6ea5', '#b4572e', '#2f7d5b', '#7a4fa3', '#a3743b', '#3f7f8c', '#a34a6d']

export function pickColor(email: string): string {
  let h = 0
  for (const ch of email) h = (h * 31 + ch.charCodeAt(0)) >>> 0
  return AVATAR_COLORS[h % AVATAR_COLORS.length]!
}

export function toUser(row: UserRow): User {
  return { id: row.id, email: row.email, name: row.name, color: row.color, units: row.units }
}

// argon2id is @node-rs/argon2's default algorithm.
export const hashPassword = (password: string) => hash(password)

/**
 * A new account. Someone signing up on their own gets a personal organisation to hold their
 * projects; someone joining through an invitation joins the inviting firm instead.
 */
export async function createUser(
  db: Db,
  body: SignUpBody,
  { personalOrganisation = true } = {},
): Promise<UserRow> {
  if (await findUserByEmail(db, body.email)) {
    throw conflict('email: an account with this e-mail address already exists')
  }
  const passwordHash = await hashPassword(body.password)
  return db.transaction(async (trx) => {
    const user = await insertUser(trx, {
      email: body.email,
      name: body.name,
      password_hash: passwordHash,
      color: pickColor(body.email),
    })
    if (personalOrganisation) await createOrganisation(trx, user.id, personalName(user.name))
    return user
  })
}

/** The user for these credentials, or null; same work either way so timing reveals little. */
export async function checkCredentials(
  db: Db,
  email: string,
  password: string,
): Promise<UserRow | null> {
  const row = await findUserByEmail(db, email)
  if (!row) {
    await verify(DUMMY_HASH, password).catch(() => false)
    return null
  }
  return (await verify(row.password_hash, password)) ? row : null
}

const DUMMY_HASH = await hash('tributary-timing-equaliser')
