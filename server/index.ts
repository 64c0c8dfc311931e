import { createServer } from 'node:http'
import pg from 'pg'
import { createApp } from './app.ts'
import { readEnv } from './config/env.ts'
import { openDb } from './db/knex.ts'

const env = readEnv()
const db = openDb(env.DATABASE_URL)
const pool = new pg.Pool({ connectionString: env.DATABASE_URL, max: 5 })
const { app } = createApp(env, db, pool)
const server = createServer(app)

server.listen(env.PORT, env.HOST, () => {
  console.log(`Tributary is serving http://${env.HOST}:${env.PORT}`)
})

let closing = false
async function shutdown(signal: string) {
  if (closing) return
  closing = true
  console.log(`${signal}: closing the server`)
  server.closeAllConnections()
  await new Promise<void>((resolve) => server.close(() => resolve()))
  await Promise.allSettled([db.destroy(), pool.end()])
  process.exit(0)
}
process.on('SIGINT', () => void shutdown('SIGINT'))
process.on('SIGTERM', () => void shutdown('SIGTERM'))
