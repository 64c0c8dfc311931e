import { Router } from 'express'
import { changeMemberRoleBodySchema } from '../../../shared/api/members.ts'
import type { Db } from '../../db/knex.ts'
import { notFound } from '../../errors.ts'
import { requireProjectAction } from '../../middleware/require-project-role.ts'
import { requireUser, userId } from '../../middleware/require-user.ts'
import { validateBody } from '../../middleware/validate.ts'
import * as members from './members.service.ts'

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i

/**
 * Mounted at /api/projects/:projectId/members. Every member reads the list and may leave;
 * only owners (members.manage) change roles or remove others.
 */
export function membersRouter(db: Db): Router {
  const router = Router({ mergeParams: true })
  router.use(requireUser)
  const read = requireProjectAction(db, 'project.read')
  const manage = requireProjectAction(db, 'members.manage')
  const ids = (params: Record<string, string | string[] | undefined>) => {
    const memberId = String(params.userId)
    if (params.userId !== undefined && !UUID.test(memberId))
      throw notFound('No such member of this project')
    return { projectId: String(params.projectId), memberId }
  }

  router.get('/', read, async (req, res) => {
    res.json({ members: await members.listMembers(db, ids(req.params).projectId) })
  })

  // Registered before '/:userId' routes; "me" is not a user id.
  router.delete('/me', read, async (req, res) => {
    await members.removeMember(db, userId(req), ids(req.params).projectId, userId(req))
    res.status(204).end()
  })

  router.patch('/:userId', manage, validateBody(changeMemberRoleBodySchema), async (req, res) => {
    const { projectId, memberId } = ids(req.params)
    res.json({
      member: await members.changeRole(db, userId(req), projectId, memberId, req.body.role),
    })
  })

  router.delete('/:userId', manage, async (req, res) => {
    const { projectId, memberId } = ids(req.params)
    await members.removeMember(db, userId(req), projectId, memberId)
    res.status(204).end()
  })

  return router
}
