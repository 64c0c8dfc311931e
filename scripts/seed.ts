// Seeds the demo scenario. With --if-empty it does nothing when any user exists.
import { readEnv } from '../server/config/env.ts'
import { openDb } from '../server/db/knex.ts'
import { DEMO_ACCOUNTS, DEMO_PASSWORD, isEmpty, seedDemo } from '../server/seed/demo.ts'

const db = openDb(readEnv().DATABASE_URL)
try {
  if (process.argv.includes('--if-empty') && !(await isEmpty(db))) {
    console.log('Database already holds data; demo not seeded again')
  } else {
    await seedDemo(db)
    console.log(
      `Seeded the demo: ${DEMO_ACCOUNTS.map((a) => `${a.email} (${a.role})`).join(', ')}; ` +
        `password "${DEMO_PASSWORD}"`,
    )
  }
} finally {
  await db.destroy()
}
