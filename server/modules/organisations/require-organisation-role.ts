import type { RequestHandler } from 'express'
import type { OrganisationRole } from '../../../shared/api/organisations.ts'
import type { Db } from '../../db/knex.ts'
import { forbidden, notFound, unauthorized } from '../../errors.ts'
import { findOrganisationRole } from './organisations.repo.ts'

declare module 'express-serve-static-core' {
  interface Request {
    organisationRole?: OrganisationRole
  }
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i

/**
 * Guards a route with `:organisationId`, like requireProjectAction: 404 for people outside the
 * organisation, 403 for members when the route needs an admin.
 */
export function requireOrganisationRole(db: Db, needed: OrganisationRole): RequestHandler {
  return async (req, _res, next) => {
    if (!req.user) throw unauthorized()
    const organisationId = String(req.params.organisationId)
    if (!UUID.test(organisationId)) throw notFound('No such organisation')
    const role = await findOrganisationRole(db, organisationId, req.user.id)
    if (!role) throw notFound('No such organisation')
    if (needed === 'admin' && role !== 'admin') {
      throw forbidden('Only organisation admins may manage its members')
    }
    req.organisationRole = role
    next()
  }
}
