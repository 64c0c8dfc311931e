import { Router } from 'express'
import { changePasswordBodySchema, updateAccountBodySchema } from '../../../shared/api/account.ts'
import type { Db } from '../../db/knex.ts'
import { requireUser, userId } from '../../middleware/require-user.ts'
import { validateBody } from '../../middleware/validate.ts'
import { changePassword, getAccount, updateAccount } from './account.service.ts'

/** Mounted at /api/account: the signed-in user's own settings. */
export function accountRouter(db: Db): Router {
  const router = Router()
  router.use(requireUser)

  router.get('/', async (req, res) => {
    res.json({ account: await getAccount(db, userId(req)) })
  })

  router.patch('/', validateBody(updateAccountBodySchema), async (req, res) => {
    res.json({ account: await updateAccount(db, userId(req), req.body) })
  })

  router.post('/password', validateBody(changePasswordBodySchema), async (req, res) => {
    await changePassword(db, userId(req), req.body, req.sessionID)
    res.status(204).end()
  })

  return router
}
