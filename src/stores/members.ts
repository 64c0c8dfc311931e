import type { AuditEvent } from '@shared/api/audit'
import type { InviteMemberBody, PendingInvitation, ProjectMember } from '@shared/api/members'
import type { ProjectRole } from '@shared/auth/roles'
import { acceptHMRUpdate, defineStore } from 'pinia'
import { ref } from 'vue'
import * as audit from '@/api/audit'
import * as invitationsApi from '@/api/invitations'
import * as api from '@/api/members'

/** The team of the open project: members, pending invitations and the activity log. */
export const useMembersStore = defineStore('members', () => {
  const projectId = ref<string | null>(null)
  const members = ref<ProjectMember[]>([])
  const invitations = ref<PendingInvitation[]>([])
  const activity = ref<AuditEvent[]>([])
  const loading = ref(false)

  async function fetchMembers(id: string, { withInvitations = false } = {}) {
    if (projectId.value !== id) dehydrate()
    projectId.value = id
    loading.value = true
    try {
      members.value = await api.listMembers(id)
      invitations.value = withInvitations ? await api.listInvitations(id) : []
    } finally {
      loading.value = false
    }
  }

  async function fetchActivity(id: string) {
    activity.value = await audit.listActivity(id)
  }

  async function invite(id: string, body: InviteMemberBody) {
    const invitation = await api.inviteMember(id, body)
    invitations.value = [
      invitation,
      ...invitations.value.filter((i) => i.email !== invitation.email),
    ]
    return invitation
  }

  async function revoke(id: string, invitationId: string) {
    await api.revokeInvitation(id, invitationId)
    invitations.value = invitations.value.filter((i) => i.id !== invitationId)
  }

  async function changeRole(id: string, userId: string, role: ProjectRole) {
    const member = await api.changeMemberRole(id, userId, role)
    members.value = members.value.map((m) => (m.userId === userId ? member : m))
  }

  async function remove(id: string, userId: string) {
    await api.removeMember(id, userId)
    members.value = members.value.filter((m) => m.userId !== userId)
  }

  async function leave(id: string) {
    await api.leaveProject(id)
    dehydrate()
  }

  /** Accepts an invitation as the signed-in user; answers the project joined. */
  const accept = (token: string) => invitationsApi.acceptInvitation(token)

  function dehydrate() {
    projectId.value = null
    members.value = []
    invitations.value = []
    activity.value = []
  }

  return {
    projectId,
    members,
    invitations,
    activity,
    loading,
    fetchMembers,
    fetchActivity,
    invite,
    revoke,
    changeRole,
    remove,
    leave,
    accept,
    dehydrate,
  }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useMembersStore, import.meta.hot))
