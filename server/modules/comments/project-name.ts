import type { Db } from '../../db/knex.ts'

export async function findProjectName(db: Db, projectId: string): Promise<string> {
  const row = await db('projects')
    .where({ id: projectId })
    .first<{ name: string } | undefined>('name')
  return row?.name ?? 'a project'
}
