/** Project members and pending invitations: shapes of /api/projects/:projectId/members. */
import { z } from 'zod'
import { projectRoleSchema } from '../auth/roles.ts'

export const projectMemberSchema = z.object({
  userId: z.string(),
  name: z.string(),
  email: z.string(),
  color: z.string(),
  role: projectRoleSchema,
  joinedAt: z.string(),
})
export type ProjectMember = z.infer<typeof projectMemberSchema>
export const projectMemberListBodySchema = z.object({ members: z.array(projectMemberSchema) })
export const projectMemberBodySchema = z.object({ member: projectMemberSchema })

export const pendingInvitationSchema = z.object({
  id: z.string(),
  email: z.string(),
  role: projectRoleSchema,
  invitedBy: z.string().nullable(),
  createdAt: z.string(),
  expiresAt: z.string(),
})
export type PendingInvitation = z.infer<typeof pendingInvitationSchema>
export const pendingInvitationListBodySchema = z.object({
  invitations: z.array(pendingInvitationSchema),
})
export const pendingInvitationBodySchema = z.object({ invitation: pendingInvitationSchema })

export const inviteMemberBodySchema = z.object({
  email: z.string().trim().toLowerCase().max(254).pipe(z.email('must be a valid e-mail address')),
  role: projectRoleSchema,
})
export type InviteMemberBody = z.infer<typeof inviteMemberBodySchema>

export const changeMemberRoleBodySchema = z.object({ role: projectRoleSchema })
