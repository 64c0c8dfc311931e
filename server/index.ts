import { createServer } from 'node:http'
import pg from 'pg'
import { createApp } from './app.ts'
import { readEnv } from './config/env.ts'
import { openDb } from './db/knex.ts'
import { attachRealtime } from './realtime/io.ts'
import { relayComments } from './realtime/comments-relay.ts'
import { startFakeSmtp } from './mail/fake-smtp.ts'
import { withFakeSmtp } from './mail/mailer.ts'

const env = readEnv()
const db = openDb(env.DATABASE_URL)
const pool = new pg.Pool({ connectionString: env.DATABASE_URL, max: 5 })
// Without a configured provider, mail goes to a local fake SMTP server (README, "Mail").
const fakeSmtp = env.SMTP_HOST ? null : await startFakeSmtp(db, env.FAKE_SMTP_PORT)
if (fakeSmtp) console.log(`Mail is captured by the local fake SMTP server on port ${fakeSmtp.port}`)
const { app, sessionHandlers, opFeed, reviewFeed } = createApp(
  fakeSmtp ? withFakeSmtp(env, fakeSmtp) : env,
  db,
  pool,
)
const server = createServer(app)
// Co-editing over socket.io on the same port (DEVELOPERS.md, "Co-editing").
const realtime = attachRealtime(server, { env, db, pool, sessionHandlers, opFeed })
relayComments(realtime.io, reviewFeed)

server.listen(env.PORT, env.HOST, () => {
  console.log(`Tributary is serving http://${env.HOST}:${env.PORT}`)
})

let closing = false
async function shutdown(signal: string) {
  if (closing) return
  closing = true
  console.log(`${signal}: closing the server`)
  await realtime.close()
  server.closeAllConnections()
  await new Promise<void>((resolve) => server.close(() => resolve()))
  await fakeSmtp?.close()
  await Promise.allSettled([db.destroy(), pool.end()])
  process.exit(0)
}
process.on('SIGINT', () => void shutdown('SIGINT'))
process.on('SIGTERM', () => void shutdown('SIGTERM'))
