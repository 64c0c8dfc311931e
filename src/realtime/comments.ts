/**
 * Live comment threads and review state of one diagram. Comments are changed over HTTP; the
 * server sends every committed change to the diagram's room (server/realtime/comments-relay.ts).
 * This feed has its own socket so it works whether or not the co-editing channel is open; it
 * joins the room with the ordinary `diagram:join` and ignores the document messages.
 */
import { CLIENT_EVENTS, PROTOCOL_VERSION } from '@shared/protocol/events'
import { COMMENT_EVENTS, type CommentServerEvents } from '@shared/protocol/comments'
import type { Socket } from 'socket.io-client'
import { useCommentsStore } from '@/stores/comments'
import { useReviewsStore } from '@/stores/reviews'
import { createDiagramSocket, RECONNECT_DELAY_MS } from './socket'

export interface CommentsFeed {
  close(): void
}

/**
 * @example
 * const feed = openCommentsFeed(projectId, diagramId)
 * onBeforeUnmount(() => feed.close())
 */
export function openCommentsFeed(projectId: string, diagramId: string): CommentsFeed {
  const socket = createDiagramSocket()
  const live = socket as unknown as Socket<CommentServerEvents>
  const comments = useCommentsStore()
  const reviews = useReviewsStore()
  let closed = false
  let everConnected = false

  socket.on('connect', () => {
    socket.emit(CLIENT_EVENTS.diagramJoin, { diagramId, protocolVersion: PROTOCOL_VERSION })
    // Whatever changed while we were away is read again.
    if (everConnected) {
      void comments.load(projectId, diagramId)
      void reviews.load(projectId, diagramId).catch(() => undefined)
    }
    everConnected = true
  })
  socket.on('disconnect', (reason) => {
    if (!closed && reason === 'io server disconnect')
      setTimeout(() => socket.connect(), RECONNECT_DELAY_MS)
  })
  live.on(COMMENT_EVENTS.threadChanged, (message) => {
    if (message.diagramId === diagramId) comments.upsert(message.thread)
  })
  live.on(COMMENT_EVENTS.reviewChanged, (message) => {
    if (message.diagramId === diagramId) reviews.receive(message.review)
  })
  socket.connect()

  return {
    close() {
      if (closed) return
      closed = true
      if (socket.connected) socket.emit(CLIENT_EVENTS.diagramLeave, { diagramId })
      socket.disconnect()
    },
  }
}
