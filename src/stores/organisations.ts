import type { Organisation, OrganisationMember, OrganisationRole } from '@shared/api/organisations'
import { acceptHMRUpdate, defineStore } from 'pinia'
import { computed, ref } from 'vue'
import * as api from '@/api/organisations'

/** The user's organisations (design firms) and the members of the one being looked at. */
export const useOrganisationsStore = defineStore('organisations', () => {
  const list = ref<Organisation[]>([])
  const members = ref<OrganisationMember[]>([])
  const isAdminAnywhere = computed(() => list.value.some((o) => o.role === 'admin'))

  async function fetchAll() {
    list.value = await api.listOrganisations()
  }

  async function create(name: string) {
    const org = await api.createOrganisation(name)
    list.value = [...list.value, org]
    return org
  }

  async function fetchMembers(id: string) {
    members.value = await api.listOrganisationMembers(id)
  }

  async function addMember(id: string, email: string, role: OrganisationRole) {
    members.value = [...members.value, await api.addOrganisationMember(id, { email, role })]
  }

  async function changeRole(id: string, userId: string, role: OrganisationRole) {
    const member = await api.changeOrganisationRole(id, userId, role)
    members.value = members.value.map((m) => (m.userId === userId ? member : m))
    await fetchAll()
  }

  async function removeMember(id: string, userId: string) {
    await api.removeOrganisationMember(id, userId)
    members.value = members.value.filter((m) => m.userId !== userId)
  }

  function dehydrate() {
    list.value = []
    members.value = []
  }

  return {
    list,
    members,
    isAdminAnywhere,
    fetchAll,
    create,
    fetchMembers,
    addMember,
    changeRole,
    removeMember,
    dehydrate,
  }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useOrganisationsStore, import.meta.hot))
