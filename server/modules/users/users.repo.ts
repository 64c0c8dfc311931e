import type { Db } from '../../db/knex.ts'

export interface UserRow {
  id: string
  email: string
  name: string
  password_hash: string
  color: string
  units: 'si' | 'us'
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
