/**
 * Live comment threads and review state of one diagram. Comments are changed over HTTP; the
 * server sends every committed change to the diagram's room (server/realtime/comments-relay.ts).
 * The feed listens on the co-editing channel's socket, which has joined that room; after a
 * reconnect it reads threads and review state again, since changes made meanwhile were missed.
 */
import { COMMENT_EVENTS, type CommentServerEvents } from '@shared/protocol/comments'
import type { Socket } from 'socket.io-client'
import { useCommentsStore } from '@/stores/comments'
import { useReviewsStore } from '@/stores/reviews'
import type { DiagramSocket } from './socket'

export interface CommentsFeed {
  close(): void
}

/**
 * @example
 * const feed = openCommentsFeed(projectId, diagramId, channel.socket)
 * onBeforeUnmount(() => feed.close())
 */
export function openCommentsFeed(
  projectId: string,
  diagramId: string,
  socket: DiagramSocket,
): CommentsFeed {
  const live = socket as unknown as Socket<CommentServerEvents>
  const comments = useCommentsStore()
  const reviews = useReviewsStore()
  let connectedBefore = socket.connected

  const onConnect = () => {
    if (connectedBefore) {
      void comments.load(projectId, diagramId)
      void reviews.load(projectId, diagramId).catch(() => undefined)
    }
    connectedBefore = true
  }
  const onThread: CommentServerEvents[typeof COMMENT_EVENTS.threadChanged] = (message) => {
    if (message.diagramId === diagramId) comments.upsert(message.thread)
  }
  const onReview: CommentServerEvents[typeof COMMENT_EVENTS.reviewChanged] = (message) => {
    if (message.diagramId === diagramId) reviews.receive(message.review)
  }
  socket.on('connect', onConnect)
  live.on(COMMENT_EVENTS.threadChanged, onThread)
  live.on(COMMENT_EVENTS.reviewChanged, onReview)

  return {
    close() {
      socket.off('connect', onConnect)
      live.off(COMMENT_EVENTS.threadChanged, onThread)
      live.off(COMMENT_EVENTS.reviewChanged, onReview)
    },
  }
}
