import type { RequestHandler } from 'express'
import { can, type ProjectAction, type ProjectRole } from '../../shared/auth/roles.ts'
import type { Db } from '../db/knex.ts'
import { forbidden, notFound, unauthorized } from '../errors.ts'
import { findMemberRole } from '../modules/projects/projects.repo.ts'

declare module 'express-serve-static-core' {
  interface Request {
    projectRole?: ProjectRole
  }
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i

/**
 * Guards a route with `:projectId`: non-members get 404 (the project's existence is not
 * revealed), members whose role lacks `action` get 403.
 */
export function requireProjectAction(db: Db, action: ProjectAction): RequestHandler {
  return async (req, _res, next) => {
    if (!req.user) throw unauthorized()
    const projectId = String(req.params.projectId)
    if (!UUID.test(projectId)) throw notFound('No such project')
    const role = await findMemberRole(db, projectId, req.user.id)
    if (!role) throw notFound('No such project')
    if (!can(role, action)) throw forbidden(`A ${role} may not do that on this project`)
    req.projectRole = role
    next()
  }
}
