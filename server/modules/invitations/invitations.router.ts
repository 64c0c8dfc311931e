import { Router, type Request } from 'express'
import {
  acceptInvitationBodySchema,
  invitationSignUpBodySchema,
  tokenSchema,
} from '../../../shared/api/invitations.ts'
import type { Db } from '../../db/knex.ts'
import { badRequest, unauthorized } from '../../errors.ts'
import { requireUser } from '../../middleware/require-user.ts'
import { validateBody } from '../../middleware/validate.ts'
import { toUser } from '../users/users.service.ts'
import * as invitations from './invitations.service.ts'

const logIn = (req: Request, user: Express.User) =>
  new Promise<void>((resolve, reject) => req.logIn(user, (err) => (err ? reject(err) : resolve())))

/** Mounted at /api/invitations: following the link from the e-mail (public, token-guarded). */
export function invitationsRouter(db: Db): Router {
  const router = Router()

  router.get('/:token', async (req, res) => {
    const token = tokenSchema.safeParse(req.params.token)
    if (!token.success) {
      const message = token.error.issues[0]!.message
      throw badRequest(`token: ${message}`, [{ path: 'token', message }])
    }
    res.json({ invitation: await invitations.preview(db, token.data) })
  })

  router.post(
    '/accept',
    requireUser,
    validateBody(acceptInvitationBodySchema),
    async (req, res) => {
      if (!req.user) throw unauthorized()
      res.json(await invitations.accept(db, req.body.token, req.user))
    },
  )

  router.post('/sign-up', validateBody(invitationSignUpBodySchema), async (req, res) => {
    const { user, joined } = await invitations.signUpAndAccept(db, req.body)
    await logIn(req, toUser(user))
    res.status(201).json({ user: toUser(user), ...joined })
  })

  return router
}
