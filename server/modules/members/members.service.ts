import type { ProjectMember } from '../../../shared/api/members.ts'
import type { ProjectRole } from '../../../shared/auth/roles.ts'
import type { Db } from '../../db/knex.ts'
import { conflict, notFound } from '../../errors.ts'
import { recordAudit } from '../audit/audit.service.ts'
import * as repo from './members.repo.ts'

export const toMember = (row: repo.MemberRow): ProjectMember => ({
  userId: row.user_id,
  name: row.name,
  email: row.email,
  color: row.color,
  role: row.role,
  joinedAt: row.created_at.toISOString(),
})

export async function listMembers(db: Db, projectId: string): Promise<ProjectMember[]> {
  return (await repo.listProjectMembers(db, projectId)).map(toMember)
}

const LAST_OWNER = 'the last owner cannot be demoted or leave; make someone else owner first'

/** Owners change roles; the project always keeps at least one owner. */
export async function changeRole(
  db: Db,
  actorId: string,
  projectId: string,
  userId: string,
  role: ProjectRole,
): Promise<ProjectMember> {
  await db.transaction(async (trx) => {
    const current = await lockedMember(trx, projectId, userId)
    if (current.role === role) return
    if (current.role === 'owner' && current.owners === 1) throw conflict(`role: ${LAST_OWNER}`)
    await repo.updateMemberRole(trx, projectId, userId, role)
    await recordAudit(trx, {
      actorId,
      projectId,
      action: 'member.role_changed',
      details: { userId, name: current.name, email: current.email, from: current.role, to: role },
    })
  })
  const member = (await listMembers(db, projectId)).find((m) => m.userId === userId)
  if (!member) throw notFound('No such member of this project')
  return member
}

/** An owner removes someone, or a member leaves (actor === user). */
export async function removeMember(db: Db, actorId: string, projectId: string, userId: string) {
  await db.transaction(async (trx) => {
    const current = await lockedMember(trx, projectId, userId)
    if (current.role === 'owner' && current.owners === 1) {
      throw conflict(`The ${LAST_OWNER}`)
    }
    await repo.deleteMember(trx, projectId, userId)
    await recordAudit(trx, {
      actorId,
      projectId,
      action: actorId === userId ? 'member.left' : 'member.removed',
      details: { userId, name: current.name, email: current.email, role: current.role },
    })
  })
}

async function lockedMember(db: Db, projectId: string, userId: string) {
  const roles = await repo.lockProjectRoles(db, projectId)
  const mine = roles.find((r) => r.user_id === userId)
  if (!mine) throw notFound('No such member of this project')
  const user = await db('users')
    .where({ id: userId })
    .first<{ name: string; email: string }>('name', 'email')
  return {
    role: mine.role,
    owners: roles.filter((r) => r.role === 'owner').length,
    name: user.name,
    email: user.email,
  }
}
