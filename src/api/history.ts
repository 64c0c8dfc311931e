import {
  restoreResultSchema,
  revisionDocumentBodySchema,
  revisionListBodySchema,
} from '@shared/protocol/history'
import { request } from './http'

const base = (projectId: string, diagramId: string) =>
  `/projects/${projectId}/diagrams/${diagramId}`

/** Newest first; `before` pages back to older revisions. */
export const listRevisions = (
  projectId: string,
  diagramId: string,
  page: { before?: number; limit?: number } = {},
) => {
  const query = new URLSearchParams()
  if (page.before !== undefined) query.set('before', String(page.before))
  if (page.limit !== undefined) query.set('limit', String(page.limit))
  const suffix = query.size ? `?${query}` : ''
  return request(`${base(projectId, diagramId)}/revisions${suffix}`, revisionListBodySchema)
}
export const getRevisionDocument = (projectId: string, diagramId: string, revision: number) =>
  request(`${base(projectId, diagramId)}/revisions/${revision}`, revisionDocumentBodySchema)
export const restoreRevision = (projectId: string, diagramId: string, revision: number) =>
  request(`${base(projectId, diagramId)}/restore`, restoreResultSchema, {
    method: 'POST',
    body: { revision },
  })
