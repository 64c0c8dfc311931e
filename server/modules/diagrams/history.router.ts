import { Router } from 'express'
import { restoreBodySchema, revisionListQuerySchema } from '../../../shared/protocol/history.ts'
import type { Db } from '../../db/knex.ts'
import { badRequest, notFound } from '../../errors.ts'
import { requireProjectAction } from '../../middleware/require-project-role.ts'
import { validateBody } from '../../middleware/validate.ts'
import * as history from './history.service.ts'
import type { OpFeed } from './operations.feed.ts'

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i

function ids(params: Record<string, string | string[] | undefined>) {
  if (!UUID.test(String(params.diagramId))) throw notFound('No such diagram in this project')
  return { projectId: String(params.projectId), diagramId: String(params.diagramId) }
}

/**
 * Revision history routes, mounted inside the diagrams router (which already requires a user):
 * `GET /:diagramId/revisions`, `GET /:diagramId/revisions/:revision`, `POST /:diagramId/restore`.
 */
export function historyRouter(db: Db, feed: OpFeed): Router {
  const router = Router({ mergeParams: true })
  const read = requireProjectAction(db, 'project.read')
  const edit = requireProjectAction(db, 'diagram.edit')

  router.get('/:diagramId/revisions', read, async (req, res) => {
    const { projectId, diagramId } = ids(req.params)
    const query = revisionListQuerySchema.safeParse(req.query)
    if (!query.success) {
      const issue = query.error.issues[0]!
      throw badRequest(`${issue.path.join('.')}: ${issue.message}`)
    }
    res.json(await history.listRevisions(db, projectId, diagramId, query.data))
  })

  router.get('/:diagramId/revisions/:revision', read, async (req, res) => {
    const { projectId, diagramId } = ids(req.params)
    const revision = Number(req.params.revision)
    if (!Number.isInteger(revision) || revision < 0) {
      throw badRequest('revision: must be a whole number ≥ 0')
    }
    const document = await history.documentAt(db, projectId, diagramId, revision)
    res.json({ revision, document })
  })

  router.post('/:diagramId/restore', edit, validateBody(restoreBodySchema), async (req, res) => {
    const { projectId, diagramId } = ids(req.params)
    const author = { id: req.user!.id, name: req.user!.name }
    res.json(
      await history.restoreRevision(db, feed, projectId, diagramId, req.body.revision, author),
    )
  })

  return router
}
