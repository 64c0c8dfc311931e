import {
  diagramListBodySchema,
  diagramRecordBodySchema,
  saveDiagramResultSchema,
} from '@shared/api/diagrams'
import type { Diagram } from '@shared/document/model'
import { request, requestVoid } from './http'

const base = (projectId: string) => `/projects/${projectId}/diagrams`

export const listDiagrams = (projectId: string) =>
  request(base(projectId), diagramListBodySchema).then((b) => b.diagrams)
export const getDiagram = (projectId: string, id: string) =>
  request(`${base(projectId)}/${id}`, diagramRecordBodySchema).then((b) => b.diagram)
export const createDiagram = (projectId: string, body: { name: string; document?: Diagram }) =>
  request(base(projectId), diagramRecordBodySchema, { method: 'POST', body }).then((b) => b.diagram)
export const renameDiagram = (projectId: string, id: string, name: string) =>
  request(`${base(projectId)}/${id}`, diagramRecordBodySchema, {
    method: 'PATCH',
    body: { name },
  }).then((b) => b.diagram)
export const duplicateDiagram = (projectId: string, id: string) =>
  request(`${base(projectId)}/${id}/duplicate`, diagramRecordBodySchema, { method: 'POST' }).then(
    (b) => b.diagram,
  )
export const deleteDiagram = (projectId: string, id: string) =>
  requestVoid(`${base(projectId)}/${id}`, { method: 'DELETE' })
export const saveDiagramDocument = (
  projectId: string,
  id: string,
  body: { baseRevision: number; document: Diagram },
) => request(`${base(projectId)}/${id}/document`, saveDiagramResultSchema, { method: 'PUT', body })
