import { Router } from 'express'
import {
  createThreadBodySchema,
  replyBodySchema,
  threadStateBodySchema,
} from '../../../shared/api/comments.ts'
import { requireProjectAction } from '../../middleware/require-project-role.ts'
import { requireUser, userId } from '../../middleware/require-user.ts'
import { validateBody } from '../../middleware/validate.ts'
import { attachmentUpload } from './attachments.upload.ts'
import * as attachments from './attachments.service.ts'
import * as comments from './comments.service.ts'
import type { ReviewDeps } from './review-deps.ts'
import { diagramRef, uuidParam } from './route-ids.ts'

const NO_THREAD = 'No such comment thread on this diagram'

/**
 * Mounted at /api/projects/:projectId/diagrams/:diagramId/comments. Every member reads;
 * reviewers, editors and owners (comment.write) start threads, reply, resolve and attach files.
 */
export function commentsRouter(deps: ReviewDeps): Router {
  const router = Router({ mergeParams: true })
  router.use(requireUser)
  const read = requireProjectAction(deps.db, 'project.read')
  const write = requireProjectAction(deps.db, 'comment.write')

  router.get('/', read, async (req, res) => {
    res.json({ threads: await comments.listThreads(deps.db, diagramRef(req)) })
  })

  router.post('/', write, validateBody(createThreadBodySchema), async (req, res) => {
    const thread = await comments.createThread(deps, diagramRef(req), userId(req), req.body)
    res.status(201).json({ thread })
  })

  router.post('/:threadId/replies', write, validateBody(replyBodySchema), async (req, res) => {
    const threadId = uuidParam(req, 'threadId', NO_THREAD)
    const { thread } = await comments.reply(deps, diagramRef(req), threadId, userId(req), req.body)
    res.status(201).json({ thread })
  })

  router.patch('/:threadId', write, validateBody(threadStateBodySchema), async (req, res) => {
    const threadId = uuidParam(req, 'threadId', NO_THREAD)
    const thread = await comments.setThreadResolved(
      deps,
      diagramRef(req),
      threadId,
      userId(req),
      req.body.resolved,
    )
    res.json({ thread })
  })

  // multipart: `file` (image or PDF) and an optional `body`; adds one comment carrying the file.
  router.post('/:threadId/attachments', write, attachmentUpload, async (req, res) => {
    const threadId = uuidParam(req, 'threadId', NO_THREAD)
    const thread = await attachments.attach(deps, diagramRef(req), threadId, userId(req), {
      file: req.file,
      body: req.body?.body,
    })
    res.status(201).json({ thread })
  })

  return router
}
