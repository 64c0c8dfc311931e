import { Router } from 'express'
import { createProjectBodySchema, updateProjectBodySchema } from '../../../shared/api/schemas.ts'
import type { Db } from '../../db/knex.ts'
import { requireProjectAction } from '../../middleware/require-project-role.ts'
import { requireUser, userId } from '../../middleware/require-user.ts'
import { validateBody } from '../../middleware/validate.ts'
import { deleteProjectRow, updateProjectRow } from './projects.repo.ts'
import { createProject, getProject, listProjects } from './projects.service.ts'

export function projectsRouter(db: Db): Router {
  const router = Router()
  router.use(requireUser)

  router.get('/', async (req, res) => {
    res.json({ projects: await listProjects(db, userId(req)) })
  })

  router.post('/', validateBody(createProjectBodySchema), async (req, res) => {
    res.status(201).json({ project: await createProject(db, req.user!, req.body) })
  })

  router.get('/:projectId', requireProjectAction(db, 'project.read'), async (req, res) => {
    res.json({ project: await getProject(db, String(req.params.projectId), userId(req)) })
  })

  router.patch(
    '/:projectId',
    requireProjectAction(db, 'project.update'),
    validateBody(updateProjectBodySchema),
    async (req, res) => {
      const projectId = String(req.params.projectId)
      await updateProjectRow(db, projectId, req.body)
      res.json({ project: await getProject(db, projectId, userId(req)) })
    },
  )

  router.delete('/:projectId', requireProjectAction(db, 'project.delete'), async (req, res) => {
    await deleteProjectRow(db, String(req.params.projectId))
    res.status(204).end()
  })

  return router
}
