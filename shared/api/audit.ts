/** The activity log of a project: shapes of /api/projects/:projectId/activity. */
import { z } from 'zod'

/**
 * Actions written by teams and sharing. Other features add their own names; the client shows an
 * unknown action by its name, so the schema accepts any string.
 */
export const TEAM_AUDIT_ACTIONS = [
  'project.created',
  'member.invited',
  'invitation.revoked',
  'invitation.accepted',
  'member.role_changed',
  'member.removed',
  'member.left',
] as const
export type TeamAuditAction = (typeof TEAM_AUDIT_ACTIONS)[number]

export const auditEventSchema = z.object({
  id: z.string(),
  action: z.string(),
  actor: z.object({ id: z.string(), name: z.string() }).nullable(),
  details: z.record(z.string(), z.unknown()),
  createdAt: z.string(),
})
export type AuditEvent = z.infer<typeof auditEventSchema>
export const auditEventListBodySchema = z.object({ events: z.array(auditEventSchema) })
