import { Router } from 'express'
import type { Db } from '../../db/knex.ts'
import { requireProjectAction } from '../../middleware/require-project-role.ts'
import { requireUser } from '../../middleware/require-user.ts'
import { readAttachment } from './attachments.service.ts'
import { uuidParam } from './route-ids.ts'

/** Mounted at /api/projects/:projectId/attachments: GET /:attachmentId (any member). */
export function attachmentsRouter(db: Db): Router {
  const router = Router({ mergeParams: true })
  router.get(
    '/:attachmentId',
    requireUser,
    requireProjectAction(db, 'project.read'),
    async (req, res) => {
      const id = uuidParam(req, 'attachmentId', 'No such attachment in this project')
      const file = await readAttachment(db, String(req.params.projectId), id)
      const inline = file.mime_type.startsWith('image/') || file.mime_type === 'application/pdf'
      res
        .set({
          'Content-Type': file.mime_type,
          'Content-Disposition': `${inline ? 'inline' : 'attachment'}; filename*=UTF-8''${encodeURIComponent(file.file_name)}`,
          'Content-Security-Policy': "default-src 'none'; sandbox",
          'X-Content-Type-Options': 'nosniff',
          'Cache-Control': 'private, no-store',
        })
        .send(file.data)
    },
  )
  return router
}
