import { Router } from 'express'
import {
  completePasswordResetBodySchema,
  requestPasswordResetBodySchema,
} from '../../shared/api/account.ts'
import { tokenSchema } from '../../shared/api/invitations.ts'
import type { Db } from '../db/knex.ts'
import { badRequest } from '../errors.ts'
import type { Mailer } from '../mail/mailer.ts'
import { attemptLimit } from '../middleware/attempt-limit.ts'
import { validateBody } from '../middleware/validate.ts'
import * as resets from './password-reset.service.ts'

/** Mounted at /api/auth/password-reset; public (the user has forgotten the password). */
export function passwordResetRouter(db: Db, mailer: Mailer, origin: string, limit: number): Router {
  const router = Router()
  const limiter = attemptLimit(limit, 'Too many reset requests; wait a few minutes')

  router.post('/request', limiter, validateBody(requestPasswordResetBodySchema), (req, res) => {
    // The answer goes out before any lookup or mail, so its timing says nothing about whether the
    // address has an account (an SMTP conversation takes long enough to be measured).
    res.status(202).json({ ok: true })
    resets.requestPasswordReset(db, mailer, origin, req.body.email).catch((error: unknown) => {
      console.error('password reset mail failed:', error)
    })
  })

  router.get('/:token', async (req, res) => {
    const token = tokenSchema.safeParse(req.params.token)
    if (!token.success)
      throw badRequest(`token: ${token.error.issues[0]!.message}`, [
        { path: 'token', message: token.error.issues[0]!.message },
      ])
    res.json(await resets.previewPasswordReset(db, token.data))
  })

  router.post(
    '/complete',
    limiter,
    validateBody(completePasswordResetBodySchema),
    async (req, res) => {
      await resets.completePasswordReset(db, req.body.token, req.body.password, req.sessionID)
      res.status(204).end()
    },
  )

  return router
}
