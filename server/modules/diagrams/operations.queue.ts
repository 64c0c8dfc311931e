/**
 * Group commit: submissions to one diagram queue up while a commit is running and then go to
 * the database together (one transaction, one row lock, consecutive revisions). Order is kept,
 * so a client's pipelined ops are applied in the order they arrived. Different diagrams commit
 * in parallel.
 */
import type { Db } from '../../db/knex.ts'
import { DocumentCache } from './operations.cache.ts'
import { commitOps } from './operations.service.ts'
import type { OpOutcome, OpSubmission } from './operations.types.ts'

interface Waiting {
  item: OpSubmission
  resolve: (outcome: OpOutcome) => void
}

/** Largest group in one transaction, so one commit never holds the lock for long. */
const MAX_GROUP = 500

/**
 * After a group of several ops, how long to let the authors' next ops arrive before forming the
 * next group. Their answers to the acks just sent come back together a moment later; without
 * this pause the first of them forms a group of one and the rest wait a whole commit for it,
 * so groups alternate between large and single. A lone edit (light load) never waits.
 */
const GATHER_MS = 2

export interface OpQueue {
  /** Resolves once the op is committed or refused; never rejects. */
  submit(diagramId: string, item: OpSubmission): Promise<OpOutcome>
  /** Resolves when nothing is queued or committing. */
  idle(): Promise<void>
}

/**
 * @example
 * const queue = createOpQueue(db)
 * const outcome = await queue.submit(diagramId, submission)
 */
export function createOpQueue(db: Db, cache = new DocumentCache()): OpQueue {
  const queues = new Map<string, Waiting[]>()
  const running = new Map<string, Promise<void>>()

  async function run(diagramId: string): Promise<void> {
    for (;;) {
      const waiting = queues.get(diagramId) ?? []
      if (!waiting.length) break
      const group = waiting.splice(0, MAX_GROUP)
      try {
        const outcomes = await commitOps(
          db,
          diagramId,
          group.map((w) => w.item),
          cache,
        )
        group.forEach((w, i) => w.resolve(outcomes[i]!))
        if (group.length > 1) await new Promise((resolve) => setTimeout(resolve, GATHER_MS))
      } catch (error) {
        console.error(`commit to diagram ${diagramId} failed:`, error)
        for (const w of group) {
          w.resolve({
            kind: 'reject',
            code: 'unavailable',
            reason: 'the server could not store this edit; it was not saved, send it again',
          })
        }
      }
    }
    queues.delete(diagramId)
    running.delete(diagramId)
  }

  return {
    submit(diagramId, item) {
      return new Promise<OpOutcome>((resolve) => {
        const waiting = queues.get(diagramId) ?? []
        waiting.push({ item, resolve })
        queues.set(diagramId, waiting)
        if (!running.has(diagramId)) running.set(diagramId, run(diagramId))
      })
    },
    async idle() {
      while (running.size) await Promise.all(running.values())
    },
  }
}
