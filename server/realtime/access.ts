/**
 * Who may see a diagram over the socket: a member of its project, in any role. Editing is
 * decided per op inside the commit transaction (operations.service.ts).
 */
import type { ProjectRole } from '../../shared/auth/roles.ts'
import type { Db } from '../db/knex.ts'
import { roomOf, type Joined, type SocketState } from './context.ts'

/** The diagram's project and the user's role there, or null (no diagram, or not a member). */
export async function diagramAccess(db: Db, diagramId: string, userId: string) {
  const row = await db('diagrams as d')
    .join('project_members as m', 'm.project_id', 'd.project_id')
    .where({ 'd.id': diagramId, 'm.user_id': userId })
    .first<{ project_id: string; role: ProjectRole } | undefined>('d.project_id', 'm.role')
  return row ? { projectId: row.project_id, role: row.role } : null
}

/** Membership is re-read from the database when older than this (presence events). */
export const ACCESS_MAX_AGE_MS = 2_000

/**
 * The socket's joined entry for a diagram, re-checked in the database when stale; a socket
 * that lost access leaves the room. Null when not joined or no longer allowed.
 */
export async function joinedAccess(
  db: Db,
  state: SocketState,
  diagramId: string,
  maxAgeMs = ACCESS_MAX_AGE_MS,
): Promise<Joined | null> {
  const joined = state.joined.get(diagramId)
  if (!joined) return null
  if (Date.now() - joined.checkedAt <= maxAgeMs) return joined
  const access = await diagramAccess(db, diagramId, state.socket.data.userId)
  if (!access) {
    state.joined.delete(diagramId)
    delete state.socket.data.presence[diagramId]
    await state.socket.leave(roomOf(diagramId))
    return null
  }
  const fresh = { ...access, checkedAt: Date.now() }
  state.joined.set(diagramId, fresh)
  return fresh
}
