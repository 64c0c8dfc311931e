import type { AuditEvent } from '../../../shared/api/audit.ts'
import type { Db } from '../../db/knex.ts'
import { insertAuditEvent, listProjectEvents, type AuditEventRow } from './audit.repo.ts'

export interface AuditEntry {
  /** Who did it; null for the system (or an anonymous request such as a password reset). */
  actorId: string | null
  projectId?: string | null
  organisationId?: string | null
  /** `noun.verb`, e.g. `member.role_changed`; see shared/api/audit.ts. */
  action: string
  /** The facts a reader needs later (names and e-mails as they were at the time). */
  details?: Record<string, unknown>
}

/**
 * Appends one entry to the audit log. Pass the transaction that made the change, so the entry
 * exists exactly when the change does.
 */
export async function recordAudit(db: Db, entry: AuditEntry): Promise<void> {
  await insertAuditEvent(db, {
    actor_id: entry.actorId,
    project_id: entry.projectId ?? null,
    organisation_id: entry.organisationId ?? null,
    action: entry.action,
    details: entry.details ?? {},
  })
}

export function toAuditEvent(row: AuditEventRow): AuditEvent {
  return {
    id: String(row.id),
    action: row.action,
    actor: row.actor_id ? { id: row.actor_id, name: row.actor_name ?? 'Former user' } : null,
    details: row.details,
    createdAt: row.created_at.toISOString(),
  }
}

/** Newest first. */
export async function projectActivity(
  db: Db,
  projectId: string,
  limit = 200,
): Promise<AuditEvent[]> {
  return (await listProjectEvents(db, projectId, limit)).map(toAuditEvent)
}
