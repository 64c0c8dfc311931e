import { createServer, type Server } from 'node:http'
import type { AddressInfo } from 'node:net'
import pg from 'pg'
import { createApp } from '../../../server/app.ts'
import { readEnv, type Env } from '../../../server/config/env.ts'
import { openDb, type Db } from '../../../server/db/knex.ts'
import { attachRealtime, type Realtime } from '../../../server/realtime/io.ts'

/** A real HTTP + socket.io server on the test database, on a free port. */
export interface RealtimeTestServer {
  url: string
  env: Env
  db: Db
  server: Server
  realtime: Realtime
  close(): Promise<void>
}

export async function startRealtimeServer(
  overrides: Partial<Record<keyof Env, string>> = {},
): Promise<RealtimeTestServer> {
  if (!process.env.DATABASE_URL) {
    throw new Error('DATABASE_URL is not set: run integration tests through `npm test`')
  }
  const env = readEnv({ ...process.env, SIGN_IN_LIMIT: '1000', ...overrides })
  const db = openDb(env.DATABASE_URL)
  const pool = new pg.Pool({ connectionString: env.DATABASE_URL, max: 5 })
  const { app, sessionHandlers, opFeed } = createApp(env, db, pool)
  const server = createServer(app)
  const realtime = attachRealtime(server, { env, db, pool, sessionHandlers, opFeed })
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve))
  const { port } = server.address() as AddressInfo
  return {
    url: `http://127.0.0.1:${port}`,
    env,
    db,
    server,
    realtime,
    async close() {
      await realtime.close()
      server.closeAllConnections()
      await Promise.allSettled([db.destroy(), pool.end()])
    },
  }
}
