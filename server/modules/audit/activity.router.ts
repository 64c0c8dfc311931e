import { Router } from 'express'
import type { Db } from '../../db/knex.ts'
import { requireProjectAction } from '../../middleware/require-project-role.ts'
import { requireUser } from '../../middleware/require-user.ts'
import { projectActivity } from './audit.service.ts'

/** Mounted at /api/projects/:projectId/activity; every member may read the log. */
export function activityRouter(db: Db): Router {
  const router = Router({ mergeParams: true })
  router.use(requireUser)
  router.get('/', requireProjectAction(db, 'project.read'), async (req, res) => {
    res.json({ events: await projectActivity(db, String(req.params.projectId)) })
  })
  return router
}
