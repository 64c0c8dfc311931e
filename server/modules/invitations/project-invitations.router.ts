import { Router } from 'express'
import { inviteMemberBodySchema } from '../../../shared/api/members.ts'
import type { Db } from '../../db/knex.ts'
import { notFound } from '../../errors.ts'
import type { Mailer } from '../../mail/mailer.ts'
import { requireProjectAction } from '../../middleware/require-project-role.ts'
import { requireUser, userId } from '../../middleware/require-user.ts'
import { validateBody } from '../../middleware/validate.ts'
import * as invitations from './invitations.service.ts'

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i

/** Mounted at /api/projects/:projectId/invitations; owners only (members.manage). */
export function projectInvitationsRouter(db: Db, mailer: Mailer, origin: string): Router {
  const router = Router({ mergeParams: true })
  router.use(requireUser)
  const manage = requireProjectAction(db, 'members.manage')

  router.get('/', manage, async (req, res) => {
    res.json({ invitations: await invitations.listPending(db, String(req.params.projectId)) })
  })

  router.post('/', manage, validateBody(inviteMemberBodySchema), async (req, res) => {
    const projectId = String(req.params.projectId)
    const invitation = await invitations.invite(db, mailer, origin, req.user!, projectId, req.body)
    res.status(201).json({ invitation })
  })

  router.delete('/:invitationId', manage, async (req, res) => {
    const invitationId = String(req.params.invitationId)
    if (!UUID.test(invitationId)) throw notFound('No such pending invitation')
    await invitations.revoke(db, userId(req), String(req.params.projectId), invitationId)
    res.status(204).end()
  })

  return router
}
