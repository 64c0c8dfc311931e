/**
 * The revision list of the open diagram, paged newest first, plus viewing a past revision
 * (read-only, through the document store) and restoring one (a new revision made by the server,
 * which reaches every open editor as an ordinary op).
 */
import type { RevisionEntry } from '@shared/protocol/history'
import { ref, shallowRef } from 'vue'
import * as historyApi from '@/api/history'
import { useDocumentStore } from '@/stores/document'

const PAGE = 50
const messageOf = (error: unknown) => (error instanceof Error ? error.message : String(error))

export function useRevisionHistory(projectId: () => string, diagramId: () => string) {
  const store = useDocumentStore()
  const revisions = shallowRef<RevisionEntry[]>([])
  const earliest = ref<number | null>(null)
  const loading = ref(false)
  const error = ref<string | null>(null)
  const busyRevision = ref<number | null>(null)

  const hasOlder = () => {
    const oldest = revisions.value.at(-1)?.revision
    return oldest !== undefined && earliest.value !== null && oldest > Math.max(earliest.value, 1)
  }

  async function refresh() {
    loading.value = true
    try {
      const page = await historyApi.listRevisions(projectId(), diagramId(), { limit: PAGE })
      revisions.value = page.revisions
      earliest.value = page.earliest
      error.value = null
    } catch (e) {
      error.value = `The history could not be loaded: ${messageOf(e)}`
    } finally {
      loading.value = false
    }
  }

  async function loadOlder() {
    const before = revisions.value.at(-1)?.revision
    if (before === undefined) return
    loading.value = true
    try {
      const page = await historyApi.listRevisions(projectId(), diagramId(), { before, limit: PAGE })
      revisions.value = [...revisions.value, ...page.revisions]
      error.value = null
    } catch (e) {
      error.value = `Older revisions could not be loaded: ${messageOf(e)}`
    } finally {
      loading.value = false
    }
  }

  /** Shows the diagram as of `revision`, read-only. Returns an error message or null. */
  async function view(revision: number): Promise<string | null> {
    busyRevision.value = revision
    try {
      const answer = await historyApi.getRevisionDocument(projectId(), diagramId(), revision)
      store.showRevision(answer.revision, answer.document)
      return null
    } catch (e) {
      return `Revision ${revision} could not be opened: ${messageOf(e)}`
    } finally {
      busyRevision.value = null
    }
  }

  /** Brings back `revision` as a new revision. Returns the new revision, or an error message. */
  async function restore(
    revision: number,
  ): Promise<{ ok: true; revision: number } | { ok: false; error: string }> {
    busyRevision.value = revision
    try {
      const answer = await historyApi.restoreRevision(projectId(), diagramId(), revision)
      store.closeRevision()
      void refresh()
      return { ok: true, revision: answer.revision }
    } catch (e) {
      return { ok: false, error: `Revision ${revision} could not be restored: ${messageOf(e)}` }
    } finally {
      busyRevision.value = null
    }
  }

  return {
    revisions,
    earliest,
    loading,
    error,
    busyRevision,
    hasOlder,
    refresh,
    loadOlder,
    view,
    restore,
  }
}
