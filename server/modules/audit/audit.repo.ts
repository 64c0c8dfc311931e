import type { Db } from '../../db/knex.ts'

export interface AuditEventRow {
  id: string
  actor_id: string | null
  actor_name: string | null
  project_id: string | null
  organisation_id: string | null
  action: string
  details: Record<string, unknown>
  created_at: Date
}

export const insertAuditEvent = (
  db: Db,
  event: Pick<AuditEventRow, 'actor_id' | 'project_id' | 'organisation_id' | 'action' | 'details'>,
) => db('audit_events').insert({ ...event, details: JSON.stringify(event.details) })

const withActor = (db: Db) =>
  db('audit_events as a')
    .leftJoin('users as u', 'u.id', 'a.actor_id')
    .select<AuditEventRow[]>('a.*', 'u.name as actor_name')
    .orderBy('a.id', 'desc')

export const listProjectEvents = (db: Db, projectId: string, limit: number) =>
  withActor(db).where('a.project_id', projectId).limit(limit)

export const listOrganisationEvents = (db: Db, organisationId: string, limit: number) =>
  withActor(db).where('a.organisation_id', organisationId).limit(limit)
