/** Request and response shapes of the diagrams API (under /api/projects/:projectId/diagrams). */
import { z } from 'zod'
import { diagramSchema } from '../document/model.ts'

export const diagramSummarySchema = z.object({
  id: z.string(),
  projectId: z.string(),
  name: z.string(),
  revision: z.number().int().nonnegative(),
  createdAt: z.string(),
  updatedAt: z.string(),
  updatedBy: z.object({ id: z.string(), name: z.string() }).nullable(),
})
export type DiagramSummary = z.infer<typeof diagramSummarySchema>

export const diagramRecordSchema = diagramSummarySchema.extend({ document: diagramSchema })
export type DiagramRecord = z.infer<typeof diagramRecordSchema>

export const diagramListBodySchema = z.object({ diagrams: z.array(diagramSummarySchema) })
export const diagramRecordBodySchema = z.object({ diagram: diagramRecordSchema })

const name = () =>
  z.string().trim().min(1, 'is required').max(120, 'must be at most 120 characters')

export const createDiagramBodySchema = z.object({
  name: name(),
  /** Start from this document (an import); an empty diagram when absent. */
  document: diagramSchema.optional(),
})
export const renameDiagramBodySchema = z.object({ name: name() })

export const saveDiagramBodySchema = z.object({
  /** The revision the client's edits were made on; a stale one is refused with 409. */
  baseRevision: z.number().int().nonnegative(),
  document: diagramSchema,
})
export type SaveDiagramBody = z.infer<typeof saveDiagramBodySchema>
export const saveDiagramResultSchema = z.object({
  revision: z.number().int().nonnegative(),
  updatedAt: z.string(),
})
