import type { Project } from '@shared/api/schemas'
import { acceptHMRUpdate, defineStore } from 'pinia'
import { computed, ref } from 'vue'
import * as api from '@/api/projects'

/** Projects the signed-in user belongs to, normalised by id. */
export const useProjectsStore = defineStore('projects', () => {
  const byId = ref<Record<string, Project>>({})
  const loading = ref(false)
  const error = ref<string | null>(null)

  const list = computed(() =>
    Object.values(byId.value).sort((a, b) => b.updatedAt.localeCompare(a.updatedAt)),
  )

  async function fetchAll() {
    loading.value = true
    error.value = null
    try {
      const projects = await api.listProjects()
      byId.value = Object.fromEntries(projects.map((p) => [p.id, p]))
    } catch (e) {
      error.value = (e as Error).message
    } finally {
      loading.value = false
    }
  }

  async function fetchOne(id: string) {
    const project = await api.getProject(id)
    byId.value = { ...byId.value, [id]: project }
    return project
  }

  async function create(input: { name: string; description?: string; units?: 'si' | 'us' }) {
    const project = await api.createProject(input)
    byId.value = { ...byId.value, [project.id]: project }
    return project
  }

  async function update(
    id: string,
    patch: { name?: string; description?: string; units?: 'si' | 'us' },
  ) {
    const project = await api.updateProject(id, patch)
    byId.value = { ...byId.value, [id]: project }
    return project
  }

  function dehydrate() {
    byId.value = {}
  }

  return { byId, list, loading, error, fetchAll, fetchOne, create, update, dehydrate }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useProjectsStore, import.meta.hot))
