/**
 * The calculation report of one diagram: read the project and the diagram, compute, build the
 * report model and render it. The review status comes from a provider so the review feature can
 * plug in later without touching this file.
 */
import { computeDiagram } from '../../../shared/calc/compute.ts'
import { parseDiagram } from '../../../shared/calc/validate.ts'
import { diagramFileName } from '../../../shared/import/diagram-json.ts'
import { buildReportModel } from '../../../shared/report/report-model.ts'
import { NOT_SUBMITTED, type ReviewStatus } from '../../../shared/report/review-status.ts'
import type { Db } from '../../db/knex.ts'
import { HttpError } from '../../errors.ts'
import { getDiagram } from '../diagrams/diagrams.service.ts'
import { getProject } from '../projects/projects.service.ts'
import { renderReportPdf } from './pdf/report-pdf.ts'

export interface ReportRef {
  projectId: string
  diagramId: string
  userId: string
}

/** The review state of a diagram revision; null when there is none yet. */
export type ReviewStatusProvider = (
  db: Db,
  ref: { projectId: string; diagramId: string; revision: number },
) => Promise<ReviewStatus | null>

/** Until review decisions exist, every diagram is not yet submitted. */
export const noReviewYet: ReviewStatusProvider = async () => null

export async function diagramReport(
  db: Db,
  ref: ReportRef,
  reviewStatus: ReviewStatusProvider = noReviewYet,
  now: () => Date = () => new Date(),
): Promise<{ pdf: Buffer; fileName: string }> {
  const [project, record] = await Promise.all([
    getProject(db, ref.projectId, ref.userId),
    getDiagram(db, ref.projectId, ref.diagramId),
  ])
  const parsed = parseDiagram(record.document)
  if (!parsed.ok) {
    throw new HttpError(
      422,
      'invalid_document',
      `The stored diagram is not valid: ${parsed.issues[0]!.message}`,
    )
  }
  const review = (await reviewStatus(db, { ...ref, revision: record.revision })) ?? NOT_SUBMITTED
  const model = buildReportModel({
    doc: parsed.doc,
    result: computeDiagram(parsed.doc),
    project,
    diagram: {
      name: record.name,
      revision: record.revision,
      updatedAt: record.updatedAt,
      updatedBy: record.updatedBy?.name ?? null,
    },
    review,
    generatedAt: now().toISOString(),
  })
  const pdf = await renderReportPdf(model)
  return { pdf, fileName: diagramFileName(`${record.name} r${record.revision} report`, 'pdf') }
}
