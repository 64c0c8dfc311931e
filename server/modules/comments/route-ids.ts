import type { Request } from 'express'
import { notFound } from '../../errors.ts'
import type { DiagramRef } from './review-deps.ts'

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i

/** `:projectId`/`:diagramId` of the route; a malformed diagram id is simply not found. */
export function diagramRef(req: Request): DiagramRef {
  const diagramId = String(req.params.diagramId)
  if (!UUID.test(diagramId)) throw notFound('No such diagram in this project')
  return { projectId: String(req.params.projectId), diagramId }
}

/** A uuid route parameter, or 404 with `what`. */
export function uuidParam(req: Request, name: string, what: string): string {
  const value = String(req.params[name])
  if (!UUID.test(value)) throw notFound(what)
  return value
}
