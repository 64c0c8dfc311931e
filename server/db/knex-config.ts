import { fileURLToPath } from 'node:url'
import type { Knex } from 'knex'

const migrationsDir = fileURLToPath(new URL('../../migrations', import.meta.url))

/** Knex settings for one PostgreSQL database; migrations are TypeScript files run under tsx. */
export function knexConfig(connectionString: string): Knex.Config {
  return {
    client: 'pg',
    connection: connectionString,
    pool: { min: 0, max: 10 },
    migrations: { directory: migrationsDir, loadExtensions: ['.ts'], tableName: 'knex_migrations' },
  }
}
