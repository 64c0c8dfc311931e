/** Review decisions on a diagram: shapes of /api/projects/:p/diagrams/:d/review. */
import { z } from 'zod'

export const reviewKindSchema = z.enum(['submitted', 'approved', 'changes_requested'])
export type ReviewKind = z.infer<typeof reviewKindSchema>

export const submitReviewBodySchema = z.object({
  note: z.string().trim().max(2000).default(''),
})
export const reviewDecisionBodySchema = z
  .object({
    decision: z.enum(['approved', 'changes_requested']),
    /** The revision the reviewer looked at; refused when the diagram has moved on. */
    revision: z.number().int().min(0),
    note: z.string().trim().max(2000).default(''),
  })
  .refine((b) => b.decision !== 'changes_requested' || b.note.length > 0, {
    path: ['note'],
    message: 'say what should change',
  })
export type ReviewDecisionBody = z.input<typeof reviewDecisionBodySchema>

export const reviewEntrySchema = z.object({
  id: z.string(),
  kind: reviewKindSchema,
  revision: z.number(),
  note: z.string(),
  actor: z.object({ id: z.string(), name: z.string() }).nullable(),
  createdAt: z.string(),
})
export type ReviewEntry = z.infer<typeof reviewEntrySchema>

export const reviewStateSchema = z.object({
  diagramId: z.string(),
  status: z.enum(['not_submitted', 'submitted', 'approved', 'changes_requested']),
  /** The latest entry (submission or decision), or null. */
  latest: reviewEntrySchema.nullable(),
  currentRevision: z.number(),
  /** Approved, and the diagram has been edited after the approved revision. */
  changedSinceApproval: z.boolean(),
  history: z.array(reviewEntrySchema),
})
export type ReviewState = z.infer<typeof reviewStateSchema>
export const reviewStateBodySchema = z.object({ review: reviewStateSchema })

/** The badge text for a review state at the diagram's current revision. */
export function reviewBadge(
  state: Pick<ReviewState, 'status' | 'latest'>,
  currentRevision: number,
) {
  const rev = state.latest?.revision ?? 0
  switch (state.status) {
    case 'approved':
      return rev === currentRevision
        ? `Approved at revision ${rev}`
        : `Changed since approval (revision ${rev})`
    case 'changes_requested':
      return `Changes requested at revision ${rev}`
    case 'submitted':
      return `Submitted for review at revision ${rev}`
    default:
      return 'Not yet submitted for review'
  }
}
