import type { ReviewDecisionBody, ReviewState } from '@shared/api/reviews'
import { defineStore } from 'pinia'
import { ref } from 'vue'
import * as api from '@/api/reviews'

/** The review state of the open diagram (submission and decisions). */
export const useReviewsStore = defineStore('reviews', () => {
  const ref_ = ref<{ projectId: string; diagramId: string } | null>(null)
  const state = ref<ReviewState | null>(null)

  function where() {
    if (!ref_.value) throw new Error('No diagram is open for review')
    return ref_.value
  }

  async function load(projectId: string, diagramId: string) {
    ref_.value = { projectId, diagramId }
    state.value = await api.getReview(projectId, diagramId)
  }

  /** A newer state (own answer or live); ignored when it belongs to another diagram. */
  function receive(next: ReviewState) {
    if (ref_.value && next.diagramId !== ref_.value.diagramId) return
    state.value = next
  }

  async function submit(note = '') {
    const { projectId, diagramId } = where()
    receive(await api.submitForReview(projectId, diagramId, note))
  }

  async function decide(body: ReviewDecisionBody) {
    const { projectId, diagramId } = where()
    receive(await api.decide(projectId, diagramId, body))
  }

  function reset() {
    ref_.value = null
    state.value = null
  }

  return { state, load, receive, submit, decide, reset }
})
