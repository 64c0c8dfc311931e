import type { Project } from '../../../shared/api/schemas.ts'
import type { Db } from '../../db/knex.ts'
import { notFound } from '../../errors.ts'
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

/** Creates a project with its creator as owner, in one transaction. */
export async function createProject(
  db: Db,
  userId: string,
  input: { name: string; description: string; units: 'si' | 'us' },
): Promise<Project> {
  const id = await db.transaction(async (trx) => {
    const row = await insertProject(trx, { ...input, created_by: userId })
    await addMember(trx, row.id, userId, 'owner')
    return row.id
  })
  return getProject(db, id, userId)
}
