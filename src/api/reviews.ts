import { reviewStateBodySchema, type ReviewDecisionBody } from '@shared/api/reviews'
import { request } from './http'

const base = (projectId: string, diagramId: string) =>
  `/projects/${projectId}/diagrams/${diagramId}/review`

export const getReview = (projectId: string, diagramId: string) =>
  request(base(projectId, diagramId), reviewStateBodySchema).then((b) => b.review)
export const submitForReview = (projectId: string, diagramId: string, note = '') =>
  request(`${base(projectId, diagramId)}/submissions`, reviewStateBodySchema, {
    method: 'POST',
    body: { note },
  }).then((b) => b.review)
export const decide = (projectId: string, diagramId: string, body: ReviewDecisionBody) =>
  request(`${base(projectId, diagramId)}/decisions`, reviewStateBodySchema, {
    method: 'POST',
    body,
  }).then((b) => b.review)
