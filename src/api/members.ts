import {
  pendingInvitationBodySchema,
  pendingInvitationListBodySchema,
  projectMemberBodySchema,
  projectMemberListBodySchema,
  type InviteMemberBody,
} from '@shared/api/members'
import type { ProjectRole } from '@shared/auth/roles'
import { request, requestVoid } from './http'

const base = (projectId: string) => `/projects/${projectId}`

export const listMembers = (projectId: string) =>
  request(`${base(projectId)}/members`, projectMemberListBodySchema).then((b) => b.members)
export const changeMemberRole = (projectId: string, userId: string, role: ProjectRole) =>
  request(`${base(projectId)}/members/${userId}`, projectMemberBodySchema, {
    method: 'PATCH',
    body: { role },
  }).then((b) => b.member)
export const removeMember = (projectId: string, userId: string) =>
  requestVoid(`${base(projectId)}/members/${userId}`, { method: 'DELETE' })
export const leaveProject = (projectId: string) =>
  requestVoid(`${base(projectId)}/members/me`, { method: 'DELETE' })
export const listInvitations = (projectId: string) =>
  request(`${base(projectId)}/invitations`, pendingInvitationListBodySchema).then(
    (b) => b.invitations,
  )
export const inviteMember = (projectId: string, body: InviteMemberBody) =>
  request(`${base(projectId)}/invitations`, pendingInvitationBodySchema, {
    method: 'POST',
    body,
  }).then((b) => b.invitation)
export const revokeInvitation = (projectId: string, invitationId: string) =>
  requestVoid(`${base(projectId)}/invitations/${invitationId}`, { method: 'DELETE' })
