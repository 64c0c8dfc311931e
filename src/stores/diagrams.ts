import type { DiagramSummary } from '@shared/api/diagrams'
import { acceptHMRUpdate, defineStore } from 'pinia'
import { computed, ref } from 'vue'
import * as api from '@/api/diagrams'

/** The diagrams of the open project (summaries only; the open document lives in `document`). */
export const useDiagramsStore = defineStore('diagrams', () => {
  const projectId = ref<string | null>(null)
  const byId = ref<Record<string, DiagramSummary>>({})
  const loading = ref(false)
  const list = computed(() =>
    Object.values(byId.value).sort((a, b) => b.updatedAt.localeCompare(a.updatedAt)),
  )

  function put(summary: DiagramSummary) {
    byId.value = { ...byId.value, [summary.id]: summary }
  }

  async function fetchForProject(id: string) {
    if (projectId.value !== id) byId.value = {}
    projectId.value = id
    loading.value = true
    try {
      byId.value = Object.fromEntries((await api.listDiagrams(id)).map((d) => [d.id, d]))
    } finally {
      loading.value = false
    }
  }

  async function create(project: string, name: string) {
    const record = await api.createDiagram(project, { name })
    put(record)
    return record
  }

  async function rename(project: string, id: string, name: string) {
    put(await api.renameDiagram(project, id, name))
  }

  async function duplicate(project: string, id: string) {
    const record = await api.duplicateDiagram(project, id)
    put(record)
    return record
  }

  async function remove(project: string, id: string) {
    await api.deleteDiagram(project, id)
    const { [id]: _gone, ...rest } = byId.value
    byId.value = rest
  }

  return { projectId, byId, list, loading, fetchForProject, create, rename, duplicate, remove }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useDiagramsStore, import.meta.hot))
