/**
 * The transport of one open diagram: joins its room, turns socket events into calls on the
 * stores (which run the pure replica from shared/sync) and sends what the stores queue. Protocol
 * decisions live here — when to re-join, when to replay pending ops, when to resend — the
 * document logic does not. Components never see the socket.
 */
import { CLIENT_EVENTS, PROTOCOL_VERSION, SERVER_EVENTS } from '@shared/protocol/events'
import { watch } from 'vue'
import { useConnectionStore } from '@/stores/connection'
import { useDocumentStore } from '@/stores/document'
import { usePresenceStore } from '@/stores/presence'
import { createDiagramSocket, RECONNECT_DELAY_MS, type DiagramSocket } from './socket'

/** A revision that stays missing this long (lost between server processes) is fetched again. */
export const GAP_WAIT_MS = 1_000
/** Selection changes are shared after this quiet time (a rubber-band selection moves a lot). */
export const SELECTION_DEBOUNCE_MS = 120
/** First wait before resending ops the server refused as "too many" or "unavailable". */
export const RESEND_BASE_MS = 1_000
const RESEND_MAX_MS = 10_000

export interface DiagramChannel {
  /** The channel's socket, joined to the diagram's room (the comments feed listens on it). */
  readonly socket: DiagramSocket
  /** Leaves the room and closes the socket; pending ops stay in the document store. */
  close(): void
}

export interface ChannelOptions {
  /** The signed-in user, so their own presence is not drawn as someone else's. */
  selfId: string | null
  /** A socket to use instead of a new same-origin one (tests point it at their server). */
  socket?: DiagramSocket
}

/**
 * @example
 * const channel = openDiagramChannel(diagramId, { selfId: auth.user?.id ?? null })
 * onBeforeUnmount(() => channel.close())
 */
export function openDiagramChannel(diagramId: string, options: ChannelOptions): DiagramChannel {
  const socket = options.socket ?? createDiagramSocket()
  const doc = useDocumentStore()
  const presence = usePresenceStore()
  const connection = useConnectionStore()
  type Timer = ReturnType<typeof setTimeout> | undefined
  const timers: Record<'gap' | 'selection' | 'resend' | 'reconnect', Timer> = {
    gap: undefined,
    selection: undefined,
    resend: undefined,
    reconnect: undefined,
  }
  let everSynced = false
  let resends = 0
  let closed = false

  const clear = (key: keyof typeof timers) => {
    clearTimeout(timers[key])
    timers[key] = undefined
  }

  function join(full = false) {
    const since = full || doc.needsSnapshot ? undefined : doc.revision
    socket.emit(CLIENT_EVENTS.diagramJoin, {
      diagramId,
      protocolVersion: PROTOCOL_VERSION,
      ...(since === undefined ? {} : { sinceRevision: since }),
    })
  }

  function sendPending() {
    for (const submit of doc.replayable()) socket.emit(CLIENT_EVENTS.opSubmit, submit)
  }

  function shareSelection() {
    if (!connection.live) return
    const selection = { nodes: [...doc.selectedNodeIds], pipes: [...doc.selectedPipeIds] }
    socket.emit(CLIENT_EVENTS.presenceUpdate, { diagramId, selection })
  }

  /** After every sync step: re-join when the replica needs a snapshot or a revision is missing. */
  function afterStep() {
    if (doc.needsSnapshot) return join(true)
    if (doc.missingRevision === null || timers.gap) return
    timers.gap = setTimeout(() => {
      timers.gap = undefined
      if (doc.missingRevision !== null && socket.connected) join()
    }, GAP_WAIT_MS)
  }

  function caughtUp() {
    if (doc.needsSnapshot) return join(true)
    everSynced = true
    resends = 0
    connection.set('synced')
    sendPending()
    shareSelection()
    afterStep()
  }

  socket.on('connect', () => {
    connection.set(everSynced ? 'reconnecting' : 'connecting', 'Catching up with the server')
    join()
  })
  socket.on('disconnect', (reason) => {
    clear('gap')
    if (closed) return
    presence.disconnected()
    connection.set('offline', 'The connection to the server was lost')
    // The server closed us on purpose (a restart): socket.io leaves reconnecting to us.
    if (reason === 'io server disconnect') {
      timers.reconnect = setTimeout(() => socket.connect(), RECONNECT_DELAY_MS)
    }
  })
  socket.on('connect_error', (error) => {
    // An inactive socket was refused by the server (not signed in, wrong origin): no retry.
    if (!socket.active) connection.set('refused', error.message)
    else connection.set('offline', `The server cannot be reached (${error.message})`)
  })
  socket.io.on('reconnect_attempt', (attempt) => {
    connection.set('reconnecting', 'Trying to reach the server again')
    connection.attempt = attempt
  })

  socket.on(SERVER_EVENTS.diagramSnapshot, (message) => {
    if (message.diagramId !== diagramId) return
    doc.caughtUp({ kind: 'snapshot', ...message })
    caughtUp()
  })
  socket.on(SERVER_EVENTS.diagramOps, (message) => {
    if (message.diagramId !== diagramId) return
    doc.caughtUp({ kind: 'ops', ...message })
    caughtUp()
  })
  socket.on(SERVER_EVENTS.opApplied, (message) => {
    doc.remoteApplied(message)
    afterStep()
  })
  socket.on(SERVER_EVENTS.opAck, (message) => {
    doc.acknowledged(message)
    afterStep()
  })
  socket.on(SERVER_EVENTS.opReject, (message) => {
    if (message.diagramId !== diagramId && message.diagramId !== '') return
    if (doc.rejected(message) !== 'retry' || timers.resend) return
    const wait = Math.min(RESEND_BASE_MS * 2 ** resends, RESEND_MAX_MS)
    resends += 1
    timers.resend = setTimeout(() => {
      timers.resend = undefined
      if (connection.live) sendPending()
    }, wait)
  })
  socket.on(SERVER_EVENTS.presenceState, (message) =>
    presence.setMembers(message.diagramId, message.members),
  )
  socket.on(SERVER_EVENTS.presenceCursor, (message) => presence.moveCursor(message))
  socket.on(SERVER_EVENTS.messageRefused, (message) => {
    if (message.event === CLIENT_EVENTS.diagramJoin) connection.set('refused', message.reason)
    else if (message.event !== CLIENT_EVENTS.presenceCursor)
      console.warn('refused:', message.reason)
  })

  doc.attachOutbox((submit) => socket.emit(CLIENT_EVENTS.opSubmit, submit))
  presence.attach({
    cursor: (x, y) => {
      if (connection.live) socket.volatile.emit(CLIENT_EVENTS.presenceCursor, { diagramId, x, y })
    },
  })
  connection.attach(() => {
    if (socket.connected) join()
    else socket.connect()
  })
  const stopSelection = watch([() => doc.selectedNodeIds, () => doc.selectedPipeIds], () => {
    clear('selection')
    timers.selection = setTimeout(shareSelection, SELECTION_DEBOUNCE_MS)
  })

  presence.open(diagramId, options.selfId)
  connection.set('connecting', 'Connecting to the server')
  socket.connect()

  return {
    socket,
    close() {
      if (closed) return
      closed = true
      for (const key of Object.keys(timers) as (keyof typeof timers)[]) clear(key)
      stopSelection()
      if (socket.connected) socket.emit(CLIENT_EVENTS.diagramLeave, { diagramId })
      socket.disconnect()
      doc.attachOutbox(null)
      presence.reset()
      connection.reset()
    },
  }
}
