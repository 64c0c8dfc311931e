import { existsSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import express, { type Express, type RequestHandler } from 'express'
import helmet from 'helmet'
import type pg from 'pg'
import { authRouter } from './auth/auth.router.ts'
import { createPassport } from './auth/passport.ts'
import { sessionMiddleware } from './auth/session.ts'
import type { Env } from './config/env.ts'
import type { Db } from './db/knex.ts'
import { apiNotFound, errorHandler } from './middleware/error-handler.ts'
import { diagramsRouter } from './modules/diagrams/diagrams.router.ts'
import { projectsRouter } from './modules/projects/projects.router.ts'

const distDir = fileURLToPath(new URL('../dist', import.meta.url))

export interface AppParts {
  app: Express
  /** express-session + passport, for socket.io to share the HTTP session. */
  sessionHandlers: RequestHandler[]
}

/** Builds the Express app without listening; index.ts and the tests own the HTTP server. */
export function createApp(env: Env, db: Db, pool: pg.Pool): AppParts {
  const app = express()
  app.disable('x-powered-by')
  app.set('trust proxy', 'loopback')
  app.use(helmet())
  app.use(express.json({ limit: '5mb' }))

  const passport = createPassport(db)
  const sessionHandlers: RequestHandler[] = [
    sessionMiddleware(pool, env.SESSION_SECRET, env.NODE_ENV === 'production' && !!env.APP_ORIGIN?.startsWith('https')),
    passport.session(),
  ]
  app.use('/api', ...sessionHandlers)

  app.get('/api/health', async (_req, res) => {
    try {
      await db.raw('select 1')
      res.json({ ok: true })
    } catch {
      res.status(503).json({ ok: false })
    }
  })
  app.use('/api/auth', authRouter(db, passport, env.SIGN_IN_LIMIT))
  app.use('/api/projects/:projectId/diagrams', diagramsRouter(db))
  app.use('/api/projects', projectsRouter(db))
  app.use('/api', apiNotFound)

  if (existsSync(distDir)) {
    app.use(express.static(distDir, { index: false, maxAge: '1h' }))
    app.get('/{*splat}', (_req, res) => res.sendFile('index.html', { root: distDir, maxAge: 0 }))
  }
  app.use(errorHandler)
  return { app, sessionHandlers }
}
