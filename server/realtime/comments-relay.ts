/**
 * Sends comment and review changes (committed over HTTP) to everyone in the diagram's room, on
 * every server process through the adapter. Server → client only: nothing here reads a client
 * message, so there is nothing to validate.
 */
import { COMMENT_EVENTS, type CommentServerEvents } from '../../shared/protocol/comments.ts'
import type { ReviewFeed } from '../modules/comments/review-feed.ts'
import { roomOf, type RealtimeServer } from './context.ts'

/** Returns the unsubscribe function. */
export function relayComments(io: RealtimeServer, feed: ReviewFeed): () => void {
  return feed.subscribe((message) => {
    // The co-editing event map (event-maps.ts) does not list review events; they are typed by
    // CommentServerEvents in shared/protocol/comments.ts instead.
    const room = io.to(roomOf(message.diagramId)) as unknown as {
      emit<E extends keyof CommentServerEvents>(
        event: E,
        ...args: Parameters<CommentServerEvents[E]>
      ): boolean
    }
    if (message.kind === 'thread') {
      room.emit(COMMENT_EVENTS.threadChanged, {
        diagramId: message.diagramId,
        thread: message.thread,
      })
    } else {
      room.emit(COMMENT_EVENTS.reviewChanged, {
        diagramId: message.diagramId,
        review: message.review,
      })
    }
  })
}
