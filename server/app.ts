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
import { createOpFeed, type OpFeed } from './modules/diagrams/operations.feed.ts'
import { projectsRouter } from './modules/projects/projects.router.ts'
import { reportsRouter } from './modules/reports/reports.router.ts'
import { passwordResetRouter } from './auth/password-reset.router.ts'
import { mailboxRouter } from './mail/mailbox.router.ts'
import { appOrigin, createMailer } from './mail/mailer.ts'
import { accountRouter } from './modules/account/account.router.ts'
import { activityRouter } from './modules/audit/activity.router.ts'
import { invitationsRouter } from './modules/invitations/invitations.router.ts'
import { projectInvitationsRouter } from './modules/invitations/project-invitations.router.ts'
import { membersRouter } from './modules/members/members.router.ts'
import { organisationsRouter } from './modules/organisations/organisations.router.ts'
import { attachmentsRouter } from './modules/comments/attachments.router.ts'
import { commentsRouter } from './modules/comments/comments.router.ts'
import { createReviewFeed, type ReviewFeed } from './modules/comments/review-feed.ts'
import { reviewsRouter } from './modules/reviews/reviews.router.ts'
import { reportReviewStatus } from './modules/reviews/reviews.service.ts'

const distDir = fileURLToPath(new URL('../dist', import.meta.url))

export interface AppParts {
  app: Express
  /** express-session + passport, for socket.io to share the HTTP session. */
  sessionHandlers: RequestHandler[]
  /** Ops committed over HTTP (save, restore), for the realtime layer to broadcast. */
  opFeed: OpFeed
  /** Comment and review changes, for the realtime layer to broadcast (comments-relay.ts). */
  reviewFeed: ReviewFeed
}

/** Builds the Express app without listening; index.ts and the tests own the HTTP server. */
export function createApp(env: Env, db: Db, pool: pg.Pool): AppParts {
  const app = express()
  app.disable('x-powered-by')
  app.set('trust proxy', 'loopback')
  app.use(helmet())
  app.use(express.json({ limit: '5mb' }))

  const passport = createPassport(db)
  const opFeed = createOpFeed()
  const reviewFeed = createReviewFeed()
  const sessionHandlers: RequestHandler[] = [
    sessionMiddleware(
      pool,
      env.SESSION_SECRET,
      env.NODE_ENV === 'production' && !!env.APP_ORIGIN?.startsWith('https'),
    ),
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
  const mailer = createMailer(env)
  const origin = appOrigin(env)
  app.use('/api/auth/password-reset', passwordResetRouter(db, mailer, origin, env.SIGN_IN_LIMIT))
  app.use('/api/auth', authRouter(db, passport, env.SIGN_IN_LIMIT))
  app.use('/api/account', accountRouter(db))
  app.use('/api/organisations', organisationsRouter(db))
  app.use('/api/invitations', invitationsRouter(db))
  app.use('/api/dev/mail', mailboxRouter(db, env.NODE_ENV === 'production'))
  app.use('/api/projects/:projectId/members', membersRouter(db))
  app.use('/api/projects/:projectId/invitations', projectInvitationsRouter(db, mailer, origin))
  app.use('/api/projects/:projectId/activity', activityRouter(db))
  const reviewDeps = { db, mailer, origin, feed: reviewFeed }
  app.use('/api/projects/:projectId/diagrams/:diagramId/comments', commentsRouter(reviewDeps))
  app.use('/api/projects/:projectId/diagrams/:diagramId/review', reviewsRouter(reviewDeps))
  app.use('/api/projects/:projectId/attachments', attachmentsRouter(db))
  app.use('/api/projects/:projectId/diagrams', diagramsRouter(db, opFeed))
  app.use(
    '/api/projects/:projectId/diagrams',
    reportsRouter(db, { reviewStatus: reportReviewStatus }),
  )
  app.use('/api/projects', projectsRouter(db))
  app.use('/api', apiNotFound)

  if (existsSync(distDir)) {
    app.use(express.static(distDir, { index: false, maxAge: '1h' }))
    app.get('/{*splat}', (_req, res) => res.sendFile('index.html', { root: distDir, maxAge: 0 }))
  }
  app.use(errorHandler)
  return { app, sessionHandlers, opFeed, reviewFeed }
}
