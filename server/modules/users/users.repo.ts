import type { Db } from '../../db/knex.ts'

export interface UserRow {
  id: string
  email: string
  name: string
  password_hash: string
  color: string
  units: 'si' | 'us'
  notify_mentions: boolean
  notify_reviews: boolean
  created_at: Date
  updated_at: Date
}

export const findUserByEmail = (db: Db, email: string) =>
  db<UserRow>('users').whereRaw('lower(email) = lower(?)', [email]).first()

export const findUserById = (db: Db, id: string) => db<UserRow>('users').where({ id }).first()

export async function insertUser(
  db: Db,
  user: Pick<UserRow, 'email' | 'name' | 'password_hash'> & Partial<Pick<UserRow, 'color'>>,
): Promise<UserRow> {
  const [row] = await db<UserRow>('users').insert(user).returning('*')
  return row!
}

export const updateUserRow = (
  db: Db,
  id: string,
  patch: Partial<
    Pick<
      UserRow,
      'name' | 'color' | 'units' | 'notify_mentions' | 'notify_reviews' | 'password_hash'
    >
  >,
) =>
  db('users')
    .where({ id })
    .update({ ...patch, updated_at: db.fn.now() })
