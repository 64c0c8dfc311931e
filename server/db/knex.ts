import knex, { type Knex } from 'knex'
import { knexConfig } from './knex-config.ts'

export type Db = Knex

/** Opens a Knex pool on the given database. Callers own it and must `destroy()` it. */
export function openDb(connectionString: string): Db {
  return knex(knexConfig(connectionString))
}
