// Runs pending Knex migrations on DATABASE_URL.
import { readEnv } from '../server/config/env.ts'
import { openDb } from '../server/db/knex.ts'

const db = openDb(readEnv().DATABASE_URL)
try {
  const [, applied] = await db.migrate.latest()
  console.log(applied.length ? `Migrated: ${applied.join(', ')}` : 'Database schema is up to date')
} finally {
  await db.destroy()
}
