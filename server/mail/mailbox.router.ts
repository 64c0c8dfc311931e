import { Router } from 'express'
import type { CapturedMail } from '../../shared/api/mail.ts'
import type { Db } from '../db/knex.ts'
import { forbidden, notFound } from '../errors.ts'
import { requireUser, userId } from '../middleware/require-user.ts'
import { isAdminAnywhere } from '../modules/organisations/organisations.repo.ts'
import { listCapturedMail, type CapturedMailRow } from './captured-mail.repo.ts'

const toCapturedMail = (row: CapturedMailRow): CapturedMail => ({
  id: String(row.id),
  from: row.mail_from,
  to: row.recipients,
  subject: row.subject,
  text: row.text,
  html: row.html,
  receivedAt: row.received_at.toISOString(),
})

/**
 * Mounted at /api/dev/mail: what the local fake SMTP server received, for organisation admins,
 * each seeing only mail to people of their organisations (captured-mail.repo.ts). Outside
 * production only; in production every route but `access` answers 404.
 */
export function mailboxRouter(db: Db, production: boolean): Router {
  const router = Router()
  router.use(requireUser)

  // Always 200, so the client can decide whether to show the Mailbox link without an error.
  router.get('/access', async (req, res) => {
    res.json({ available: !production && (await isAdminAnywhere(db, userId(req))) })
  })

  router.get('/', async (req, res) => {
    if (production) throw notFound('No such API route')
    if (!(await isAdminAnywhere(db, userId(req)))) {
      throw forbidden('Only organisation admins may read captured mail')
    }
    const to = typeof req.query.to === 'string' ? req.query.to : undefined
    const messages = await listCapturedMail(db, { viewerId: userId(req), to })
    res.json({ messages: messages.map(toCapturedMail) })
  })

  return router
}
