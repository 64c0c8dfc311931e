import { Router } from 'express'
import { reviewDecisionBodySchema, submitReviewBodySchema } from '../../../shared/api/reviews.ts'
import { requireProjectAction } from '../../middleware/require-project-role.ts'
import { requireUser, userId } from '../../middleware/require-user.ts'
import { validateBody } from '../../middleware/validate.ts'
import type { ReviewDeps } from '../comments/review-deps.ts'
import { diagramRef } from '../comments/route-ids.ts'
import * as reviews from './reviews.service.ts'

/**
 * Mounted at /api/projects/:projectId/diagrams/:diagramId/review. Every member reads the
 * state; editors and owners (diagram.edit) submit; reviewers and owners (diagram.review) decide.
 */
export function reviewsRouter(deps: ReviewDeps): Router {
  const router = Router({ mergeParams: true })
  router.use(requireUser)

  router.get('/', requireProjectAction(deps.db, 'project.read'), async (req, res) => {
    res.json({ review: await reviews.getReviewState(deps.db, diagramRef(req)) })
  })

  router.post(
    '/submissions',
    requireProjectAction(deps.db, 'diagram.edit'),
    validateBody(submitReviewBodySchema),
    async (req, res) => {
      const review = await reviews.submitForReview(
        deps,
        diagramRef(req),
        userId(req),
        req.body.note,
      )
      res.status(201).json({ review })
    },
  )

  router.post(
    '/decisions',
    requireProjectAction(deps.db, 'diagram.review'),
    validateBody(reviewDecisionBodySchema),
    async (req, res) => {
      const review = await reviews.decide(deps, diagramRef(req), userId(req), req.body)
      res.status(201).json({ review })
    },
  )

  return router
}
