import type { CommentTarget, CommentThread } from '@shared/api/comments'
import { defineStore } from 'pinia'
import { computed, ref } from 'vue'
import * as api from '@/api/comments'

/** Comment threads of the open diagram: loaded over HTTP, kept current by the realtime feed. */
export const useCommentsStore = defineStore('comments', () => {
  const ref_ = ref<{ projectId: string; diagramId: string } | null>(null)
  const threads = ref<CommentThread[]>([])
  /** The thread open in the side panel, or null for the list. */
  const openThreadId = ref<string | null>(null)
  const showResolved = ref(false)
  const loadError = ref<string | null>(null)

  const openThread = computed(() => threads.value.find((t) => t.id === openThreadId.value) ?? null)
  const visible = computed(() => threads.value.filter((t) => showResolved.value || !t.resolvedAt))
  const openCount = computed(() => threads.value.filter((t) => !t.resolvedAt).length)

  function where() {
    if (!ref_.value) throw new Error('No diagram is open for comments')
    return ref_.value
  }

  async function load(projectId: string, diagramId: string) {
    ref_.value = { projectId, diagramId }
    loadError.value = null
    try {
      threads.value = await api.listThreads(projectId, diagramId)
    } catch (e) {
      loadError.value = (e as Error).message
    }
  }

  /** A created or changed thread (own answer or live from someone else), in creation order. */
  function upsert(thread: CommentThread) {
    if (ref_.value && thread.diagramId !== ref_.value.diagramId) return
    const i = threads.value.findIndex((t) => t.id === thread.id)
    if (i < 0) threads.value = [...threads.value, thread]
    else threads.value = threads.value.map((t) => (t.id === thread.id ? thread : t))
  }

  async function start(target: CommentTarget, body: string, mentions: string[]) {
    const { projectId, diagramId } = where()
    const thread = await api.createThread(projectId, diagramId, { target, body, mentions })
    upsert(thread)
    openThreadId.value = thread.id
    return thread
  }

  async function reply(threadId: string, body: string, mentions: string[]) {
    const { projectId, diagramId } = where()
    upsert(await api.reply(projectId, diagramId, threadId, { body, mentions }))
  }

  async function attach(threadId: string, file: File, body = '') {
    const { projectId, diagramId } = where()
    upsert(await api.attach(projectId, diagramId, threadId, file, body))
  }

  async function setResolved(threadId: string, resolved: boolean) {
    const { projectId, diagramId } = where()
    upsert(await api.setResolved(projectId, diagramId, threadId, resolved))
  }

  const threadsOn = (kind: CommentTarget['kind'], id: string) =>
    threads.value.filter((t) => t.target.kind === kind && t.target.id === id)

  function reset() {
    ref_.value = null
    threads.value = []
    openThreadId.value = null
    loadError.value = null
  }

  return {
    threads,
    openThreadId,
    openThread,
    showResolved,
    visible,
    openCount,
    loadError,
    load,
    upsert,
    start,
    reply,
    attach,
    setResolved,
    threadsOn,
    reset,
  }
})
