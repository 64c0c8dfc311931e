import { Router } from 'express'
import type { Db } from '../../db/knex.ts'
import { notFound } from '../../errors.ts'
import { requireProjectAction } from '../../middleware/require-project-role.ts'
import { requireUser, userId } from '../../middleware/require-user.ts'
import { diagramReport, noReviewYet, type ReviewStatusProvider } from './reports.service.ts'

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i

/** `filename` for old clients (ASCII only) and `filename*` with the real name. */
const disposition = (name: string) =>
  `attachment; filename="${name.replace(/[^\x20-\x7e]|"/g, '_')}"; filename*=UTF-8''${encodeURIComponent(name)}`

export interface ReportsRouterOptions {
  reviewStatus?: ReviewStatusProvider
}

/** Mounted at /api/projects/:projectId/diagrams: GET /:diagramId/report.pdf (project.read). */
export function reportsRouter(db: Db, options: ReportsRouterOptions = {}): Router {
  const router = Router({ mergeParams: true })
  router.get(
    '/:diagramId/report.pdf',
    requireUser,
    requireProjectAction(db, 'project.read'),
    async (req, res) => {
      const diagramId = String(req.params.diagramId)
      if (!UUID.test(diagramId)) throw notFound('No such diagram in this project')
      const ref = { projectId: String(req.params.projectId), diagramId, userId: userId(req) }
      const { pdf, fileName } = await diagramReport(db, ref, options.reviewStatus ?? noReviewYet)
      res
        .set({
          'Content-Type': 'application/pdf',
          'Content-Disposition': disposition(fileName),
          'Content-Length': String(pdf.length),
          'Cache-Control': 'no-store',
        })
        .send(pdf)
    },
  )
  return router
}
