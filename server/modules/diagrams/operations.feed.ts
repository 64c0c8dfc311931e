import type { OpApplied } from '../../../shared/protocol/server-messages.ts'

/**
 * Ops committed through HTTP (whole-document save, restore), for the realtime layer to broadcast
 * to the diagram's room. One feed per app, so several apps in one test process stay apart.
 */
export interface OpFeed {
  publish(applied: OpApplied): void
  /** Returns the unsubscribe function. */
  subscribe(listener: (applied: OpApplied) => void): () => void
}

/**
 * @example
 * const feed = createOpFeed()
 * const stop = feed.subscribe((applied) => io.to(room(applied.diagramId)).emit('op:applied', applied))
 */
export function createOpFeed(): OpFeed {
  const listeners = new Set<(applied: OpApplied) => void>()
  return {
    publish(applied) {
      for (const listener of listeners) listener(applied)
    },
    subscribe(listener) {
      listeners.add(listener)
      return () => listeners.delete(listener)
    },
  }
}
