// Knex CLI configuration (npm run db:rollback). The app itself migrates through scripts/migrate.ts.
import { knexConfig } from './server/db/knex-config.ts'

export default knexConfig(
  process.env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/tributary',
)
