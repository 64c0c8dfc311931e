import { randomUUID } from 'node:crypto'
import pg from 'pg'
import type supertest from 'supertest'
import { createApp } from '../../../server/app.ts'
import { readEnv, type Env } from '../../../server/config/env.ts'
import { openDb, type Db } from '../../../server/db/knex.ts'

/** An app on the real test database (DATABASE_URL, set up by scripts/test.sh). */
export interface TestApp {
  env: Env
  db: Db
  pool: pg.Pool
  app: ReturnType<typeof createApp>['app']
  close(): Promise<void>
}

export function startTestApp(overrides: Partial<Record<keyof Env, string>> = {}): TestApp {
  if (!process.env.DATABASE_URL) {
    throw new Error('DATABASE_URL is not set: run integration tests through `npm test`')
  }
  const env = readEnv({ ...process.env, SIGN_IN_LIMIT: '1000', ...overrides })
  const db = openDb(env.DATABASE_URL)
  const pool = new pg.Pool({ connectionString: env.DATABASE_URL, max: 3 })
  const { app } = createApp(env, db, pool)
  return {
    env,
    db,
    pool,
    app,
    async close() {
      await Promise.allSettled([db.destroy(), pool.end()])
    },
  }
}

/** A unique e-mail address so tests never collide on the shared database. */
export const uniqueEmail = (who = 'user') => `${who}-${randomUUID().slice(0, 8)}@example.test`

export const PASSWORD = 'correct horse battery'

/** Signs up a fresh user on an agent (which keeps the session cookie) and returns the user. */
export async function signUp(agent: supertest.Agent, name = 'Test Designer') {
  const email = uniqueEmail(name.split(' ')[0]!.toLowerCase())
  const res = await agent.post('/api/auth/sign-up').send({ email, name, password: PASSWORD })
  if (res.status !== 201) throw new Error(`sign-up failed: ${res.status} ${res.text}`)
  return res.body.user as { id: string; email: string; name: string }
}
