/**
 * Request and response shapes of the revision history API, under
 * /api/projects/:projectId/diagrams/:diagramId.
 */
import { z } from 'zod'
import { diagramSchema } from '../document/model.ts'

/** `GET …/revisions?before=&limit=`: newest first, pages with `before`. */
export const revisionListQuerySchema = z.object({
  before: z.coerce.number().int().positive().optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
})

export const revisionEntrySchema = z.object({
  /** 0 is the diagram as created (its author is the creator). */
  revision: z.number().int().nonnegative(),
  author: z.object({ id: z.string().nullable(), name: z.string() }),
  /** ISO 8601 commit time. */
  at: z.string(),
  /** `edit` (live op), `save` (whole-document save), `restore`, or `create` (revision 0). */
  source: z.enum(['edit', 'save', 'restore', 'create']),
  /** For a restore: the revision whose state was brought back. */
  restoredFrom: z.number().int().nonnegative().nullable(),
  summary: z.string(),
})
export type RevisionEntry = z.infer<typeof revisionEntrySchema>

export const revisionListBodySchema = z.object({
  revisions: z.array(revisionEntrySchema),
  /** The diagram's current revision. */
  current: z.number().int().nonnegative(),
  /** The oldest revision that can be viewed or restored (null: none). */
  earliest: z.number().int().nonnegative().nullable(),
})
export type RevisionListBody = z.infer<typeof revisionListBodySchema>

/** `GET …/revisions/:revision`: the document as it was at that revision. */
export const revisionDocumentBodySchema = z.object({
  revision: z.number().int().nonnegative(),
  document: diagramSchema,
})
export type RevisionDocumentBody = z.infer<typeof revisionDocumentBodySchema>

/** `POST …/restore`: bring back a revision's state as a new revision. */
export const restoreBodySchema = z.object({ revision: z.number().int().nonnegative() })
export const restoreResultSchema = z.object({
  /** The new revision that holds the restored state. */
  revision: z.number().int().positive(),
  restoredFrom: z.number().int().nonnegative(),
})
export type RestoreResult = z.infer<typeof restoreResultSchema>
