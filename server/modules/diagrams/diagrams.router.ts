import { Router } from 'express'
import {
  createDiagramBodySchema,
  renameDiagramBodySchema,
  saveDiagramBodySchema,
} from '../../../shared/api/diagrams.ts'
import type { Db } from '../../db/knex.ts'
import { notFound } from '../../errors.ts'
import { requireProjectAction } from '../../middleware/require-project-role.ts'
import { requireUser, userId } from '../../middleware/require-user.ts'
import { validateBody } from '../../middleware/validate.ts'
import * as diagrams from './diagrams.service.ts'
import { historyRouter } from './history.router.ts'
import { createOpFeed, type OpFeed } from './operations.feed.ts'

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i

/** Mounted at /api/projects/:projectId/diagrams. */
export function diagramsRouter(db: Db, feed: OpFeed = createOpFeed()): Router {
  const router = Router({ mergeParams: true })
  router.use(requireUser)
  const read = requireProjectAction(db, 'project.read')
  const edit = requireProjectAction(db, 'diagram.edit')
  const ids = (params: Record<string, string | string[] | undefined>) => {
    if (params.diagramId !== undefined && !UUID.test(String(params.diagramId))) {
      throw notFound('No such diagram in this project')
    }
    return { projectId: String(params.projectId), diagramId: String(params.diagramId) }
  }

  router.get('/', read, async (req, res) => {
    res.json({ diagrams: await diagrams.listDiagrams(db, ids(req.params).projectId) })
  })

  router.post('/', edit, validateBody(createDiagramBodySchema), async (req, res) => {
    const { projectId } = ids(req.params)
    res
      .status(201)
      .json({ diagram: await diagrams.createDiagram(db, projectId, userId(req), req.body) })
  })

  router.get('/:diagramId', read, async (req, res) => {
    const { projectId, diagramId } = ids(req.params)
    res.json({ diagram: await diagrams.getDiagram(db, projectId, diagramId) })
  })

  router.put(
    '/:diagramId/document',
    edit,
    validateBody(saveDiagramBodySchema),
    async (req, res) => {
      const { projectId, diagramId } = ids(req.params)
      const author = { id: userId(req), name: req.user!.name }
      res.json(await diagrams.saveDocument(db, projectId, diagramId, author, req.body, feed))
    },
  )

  router.patch('/:diagramId', edit, validateBody(renameDiagramBodySchema), async (req, res) => {
    const { projectId, diagramId } = ids(req.params)
    const author = { id: userId(req), name: req.user!.name }
    res.json({
      diagram: await diagrams.renameDiagram(db, projectId, diagramId, author, req.body.name, feed),
    })
  })

  router.post('/:diagramId/duplicate', edit, async (req, res) => {
    const { projectId, diagramId } = ids(req.params)
    res
      .status(201)
      .json({ diagram: await diagrams.duplicateDiagram(db, projectId, diagramId, userId(req)) })
  })

  router.use(historyRouter(db, feed))

  router.delete('/:diagramId', edit, async (req, res) => {
    const { projectId, diagramId } = ids(req.params)
    await diagrams.deleteDiagram(db, projectId, diagramId)
    res.status(204).end()
  })

  return router
}
