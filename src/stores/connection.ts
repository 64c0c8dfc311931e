/**
 * The co-editing link of the open diagram as the user should understand it: connecting, synced,
 * offline, reconnecting, or refused. The realtime channel (src/realtime) reports what the socket
 * does; the banner and the save indicator read it. Nothing here touches the socket itself.
 */
import { acceptHMRUpdate, defineStore } from 'pinia'
import { computed, ref } from 'vue'

export type LinkStatus =
  /** No diagram open. */
  | 'idle'
  /** First connection and catch-up of this visit. */
  | 'connecting'
  /** Caught up: edits go out as they are made. */
  | 'synced'
  /** The connection dropped; edits are kept and wait. */
  | 'offline'
  /** Trying again (socket.io's backoff), or connected and catching up after a drop. */
  | 'reconnecting'
  /** The server will not let us in (signed out, not a member, other protocol version). */
  | 'refused'

export const useConnectionStore = defineStore('connection', () => {
  const status = ref<LinkStatus>('idle')
  /** Why the link is not synced, in words for the banner (null when there is nothing to say). */
  const reason = ref<string | null>(null)
  /** Reconnection attempts since the last drop. */
  const attempt = ref(0)
  /** True from a drop until the next sync, so the banner can say "back in sync". */
  const recovered = ref(false)
  const live = computed(() => status.value === 'synced')

  let reconnect: (() => void) | null = null

  function set(next: LinkStatus, why: string | null = null) {
    if (next === 'synced') {
      recovered.value = status.value === 'offline' || status.value === 'reconnecting'
      attempt.value = 0
    }
    status.value = next
    reason.value = why
  }

  /** The channel registers how to reconnect at once instead of waiting for its backoff. */
  function attach(fn: (() => void) | null) {
    reconnect = fn
  }
  const retryNow = () => reconnect?.()

  function reset() {
    status.value = 'idle'
    reason.value = null
    attempt.value = 0
    recovered.value = false
    reconnect = null
  }

  return { status, reason, attempt, recovered, live, set, attach, retryNow, reset }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useConnectionStore, import.meta.hot))
