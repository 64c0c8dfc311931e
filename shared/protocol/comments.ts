/**
 * Realtime events of review: the server sends them to everyone in a diagram's room after a
 * comment or review change has been committed over HTTP. Server → client only; clients change
 * comments through the REST API, where every body is validated.
 */
import type { CommentThread } from '../api/comments.ts'
import type { ReviewState } from '../api/reviews.ts'

export const COMMENT_EVENTS = {
  /** A thread was created or changed (reply, resolve, reopen): `{ diagramId, thread }`. */
  threadChanged: 'comment:thread',
  /** The review state changed (submission or decision): `{ diagramId, review }`. */
  reviewChanged: 'review:state',
} as const

export interface ThreadChanged {
  diagramId: string
  thread: CommentThread
}
export interface ReviewChanged {
  diagramId: string
  review: ReviewState
}

export interface CommentServerEvents {
  [COMMENT_EVENTS.threadChanged]: (message: ThreadChanged) => void
  [COMMENT_EVENTS.reviewChanged]: (message: ReviewChanged) => void
}
