import type { ReviewChanged, ThreadChanged } from '../../../shared/protocol/comments.ts'

export type ReviewFeedMessage =
  ({ kind: 'thread' } & ThreadChanged) | ({ kind: 'review' } & ReviewChanged)

/**
 * Comment and review changes committed over HTTP, for the realtime layer to send to the
 * diagram's room (server/realtime/comments-relay.ts). One feed per app, like the op feed.
 */
export interface ReviewFeed {
  publish(message: ReviewFeedMessage): void
  /** Returns the unsubscribe function. */
  subscribe(listener: (message: ReviewFeedMessage) => void): () => void
}

export function createReviewFeed(): ReviewFeed {
  const listeners = new Set<(message: ReviewFeedMessage) => void>()
  return {
    publish(message) {
      for (const listener of listeners) listener(message)
    },
    subscribe(listener) {
      listeners.add(listener)
      return () => listeners.delete(listener)
    },
  }
}
