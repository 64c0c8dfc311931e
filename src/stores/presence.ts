/**
 * Who else is in the open diagram: members with initials, colours and selections (from
 * `presence:state`) and their live cursors (volatile, never stored). Outgoing selection and
 * cursor messages go through an outbox the realtime channel attaches; components only call
 * `sendCursor` and read the getters.
 */
import type { PresenceCursorRelay, PresenceMember } from '@shared/protocol/server-messages'
import { acceptHMRUpdate, defineStore } from 'pinia'
import { computed, ref, shallowRef } from 'vue'
import type { RemoteSelection } from '@/features/editor/canvas-data'

export interface RemoteCursor {
  userId: string
  name: string
  color: string
  x: number
  y: number
  /** When it last moved (ms, `Date.now()`), to fade idle cursors. */
  at: number
}

export interface PresenceOutbox {
  cursor(x: number, y: number): void
}

export const usePresenceStore = defineStore('presence', () => {
  const diagramId = ref<string | null>(null)
  /** The signed-in user's id; their own entry is not drawn as someone else. */
  const selfId = ref<string | null>(null)
  const members = shallowRef<readonly PresenceMember[]>([])
  const cursors = shallowRef<ReadonlyMap<string, RemoteCursor>>(new Map())
  let outbox: PresenceOutbox | null = null

  const others = computed(() => members.value.filter((m) => m.userId !== selfId.value))

  /** Id → the people (other than me) who have that node or pipe selected. */
  function selectedByOthers(part: 'nodes' | 'pipes'): ReadonlyMap<string, RemoteSelection[]> {
    const byId = new Map<string, RemoteSelection[]>()
    for (const member of others.value) {
      for (const id of member.selection[part]) {
        const list = byId.get(id) ?? []
        list.push({ name: member.name, color: member.color })
        byId.set(id, list)
      }
    }
    return byId
  }
  /** Node id → the people (other than me) who have it selected, for the canvas rings. */
  const remoteSelections = computed(() => selectedByOthers('nodes'))
  /** Pipe id → the people (other than me) who have it selected, for the pipe halos. */
  const remotePipeSelections = computed(() => selectedByOthers('pipes'))

  function open(id: string, self: string | null) {
    diagramId.value = id
    selfId.value = self
    members.value = []
    cursors.value = new Map()
  }

  function setMembers(id: string, next: readonly PresenceMember[]) {
    if (id !== diagramId.value) return
    members.value = next
    // Someone who left takes their cursor with them.
    const present = new Set(next.map((m) => m.userId))
    if ([...cursors.value.keys()].some((userId) => !present.has(userId))) {
      cursors.value = new Map([...cursors.value].filter(([userId]) => present.has(userId)))
    }
  }

  function moveCursor(relay: PresenceCursorRelay, at = Date.now()) {
    if (relay.diagramId !== diagramId.value || relay.userId === selfId.value) return
    const member = members.value.find((m) => m.userId === relay.userId)
    const name = member?.name ?? 'Someone'
    const next = new Map(cursors.value)
    next.set(relay.userId, {
      userId: relay.userId,
      name,
      color: relay.color,
      x: relay.x,
      y: relay.y,
      at,
    })
    cursors.value = next
  }

  /** Offline we cannot know who is here or where they point: show no one rather than stale data. */
  function disconnected() {
    members.value = []
    cursors.value = new Map()
  }

  function attach(next: PresenceOutbox | null) {
    outbox = next
  }

  /** My pointer in diagram coordinates; dropped when offline (cursors are never queued). */
  function sendCursor(x: number, y: number) {
    if (Number.isFinite(x) && Number.isFinite(y)) outbox?.cursor(x, y)
  }

  function reset() {
    diagramId.value = null
    members.value = []
    cursors.value = new Map()
    outbox = null
  }

  return {
    diagramId,
    selfId,
    members,
    others,
    cursors,
    remoteSelections,
    remotePipeSelections,
    open,
    setMembers,
    moveCursor,
    disconnected,
    attach,
    sendCursor,
    reset,
  }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(usePresenceStore, import.meta.hot))
