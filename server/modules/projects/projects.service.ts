import type { Project } from '../../../shared/api/schemas.ts'
import type { Db } from '../../db/knex.ts'
import { HttpError, notFound } from '../../errors.ts'
import { recordAudit } from '../audit/audit.service.ts'
import { findOrganisationRole } from '../organisations/organisations.repo.ts'
import { defaultOrganisationId } from '../organisations/organisations.service.ts'
import {
  addMember,
  findProjectForUser,
  insertProject,
  listProjectsForUser,
  type ProjectWithRole,
} from './projects.repo.ts'

export function toProject(row: ProjectWithRole): Project {
  return {
    id: row.id,
    name: row.name,
    description: row.description,
    units: row.units,
    role: row.role,
    createdAt: row.created_at.toISOString(),
    updatedAt: row.updated_at.toISOString(),
    diagramCount: row.diagram_count,
    organisationId: row.organisation_id,
    organisationName: row.organisation_name,
  }
}

export async function listProjects(db: Db, userId: string): Promise<Project[]> {
  return (await listProjectsForUser(db, userId)).map(toProject)
}

export async function getProject(db: Db, projectId: string, userId: string): Promise<Project> {
  const row = await findProjectForUser(db, projectId, userId)
  if (!row) throw notFound('No such project')
  return toProject(row)
}

/**
 * Creates a project with its creator as owner, in one transaction, in the given organisation
 * (which the creator must belong to) or the creator's first one.
 */
export async function createProject(
  db: Db,
  user: { id: string; name: string },
  { organisationId, ...input }: CreateProjectInput,
): Promise<Project> {
  const id = await db.transaction(async (trx) => {
    if (organisationId && !(await findOrganisationRole(trx, organisationId, user.id))) {
      throw new HttpError(404, 'not_found', 'organisationId: no such organisation', [
        { path: 'organisationId', message: 'you are not a member of this organisation' },
      ])
    }
    const orgId = organisationId ?? (await defaultOrganisationId(trx, user))
    const row = await insertProject(trx, { ...input, organisation_id: orgId, created_by: user.id })
    await addMember(trx, row.id, user.id, 'owner')
    await recordAudit(trx, {
      actorId: user.id,
      projectId: row.id,
      organisationId: orgId,
      action: 'project.created',
      details: { name: row.name },
    })
    return row.id
  })
  return getProject(db, id, user.id)
}

interface CreateProjectInput {
  name: string
  description: string
  units: 'si' | 'us'
  organisationId?: string
}
