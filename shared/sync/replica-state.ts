/**
 * The client replica's state and its internal helpers. A replica keeps the document as the
 * server confirmed it (`confirmed` at `revision`), the local ops the server has not answered yet
 * (`pending`, in order), and the `view` the user sees: pending replayed on top of confirmed.
 * Every function returns a new replica; nothing is mutated. See replica.ts for the API.
 */
import type { Diagram } from '../document/model.ts'
import { OperationError, applyOperation, type Operation } from '../document/operations.ts'
import { applyChecked } from './graph-rules.ts'

/** A local op not yet acknowledged or refused by the server. */
export interface PendingOp {
  clientOpId: string
  op: Operation
  /** The confirmed revision when the op was made. */
  baseRevision: number
}

/** A committed op as the replica needs it (a subset of `OpApplied`). */
export interface CommittedOp {
  revision: number
  op: Operation
  clientOpId: string
}

/** Something the user should be told after a sync step. */
export interface SyncNotice {
  /**
   * `rejected`: the server refused a local op, which was rolled back. `conflict`: after others'
   * edits a pending op no longer applies locally and is hidden (the server will decide).
   * `resync`: a committed op did not apply; ask for a snapshot (`diagram:join` without
   * `sinceRevision`).
   */
  kind: 'rejected' | 'conflict' | 'resync'
  clientOpId: string
  op: Operation
  reason: string
  ids: string[]
}

export interface Replica {
  readonly diagramId: string
  /** The document in server order, up to `revision`. */
  readonly confirmed: Diagram
  readonly revision: number
  /** Local ops awaiting the server, oldest first. */
  readonly pending: readonly PendingOp[]
  /** What the user sees: pending ops that still apply, replayed on `confirmed`. */
  readonly view: Diagram
  /** Pending ops currently skipped in `view`, with why. */
  readonly blocked: readonly { clientOpId: string; reason: string }[]
  /** Committed ops (others' or acknowledged own) received ahead of `revision + 1`. */
  readonly early: readonly CommittedOp[]
  /** True when a committed op failed to apply: the replica needs a snapshot. */
  readonly stale: boolean
}

/** The result of every sync step: the new replica and what to tell the user. */
export interface SyncResult {
  replica: Replica
  notices: SyncNotice[]
}

const reasonOf = (error: unknown) =>
  error instanceof OperationError
    ? { reason: error.message, ids: error.ids }
    : { reason: String(error), ids: [] }

/** Replays pending on confirmed; reports ops that newly stopped applying as conflicts. */
export function withView(replica: Replica, notices: SyncNotice[] = []): SyncResult {
  let view = replica.confirmed
  const blocked: { clientOpId: string; reason: string }[] = []
  const wasBlocked = new Set(replica.blocked.map((b) => b.clientOpId))
  for (const pending of replica.pending) {
    try {
      view = applyChecked(view, pending.op)
    } catch (error) {
      const { reason, ids } = reasonOf(error)
      blocked.push({ clientOpId: pending.clientOpId, reason })
      if (!wasBlocked.has(pending.clientOpId)) {
        notices.push({
          kind: 'conflict',
          clientOpId: pending.clientOpId,
          op: pending.op,
          reason,
          ids,
        })
      }
    }
  }
  return { replica: { ...replica, view, blocked }, notices }
}

/**
 * Applies buffered committed ops that are next in line, in revision order. A pending op with the
 * same client op id is now confirmed and leaves `pending`.
 */
export function drain(replica: Replica, notices: SyncNotice[]): Replica {
  let { confirmed, revision, pending, early, stale } = replica
  for (;;) {
    const next = stale ? undefined : early.find((c) => c.revision === revision + 1)
    if (!next) break
    early = early.filter((c) => c.revision > next.revision)
    try {
      confirmed = applyOperation(confirmed, next.op)
    } catch (error) {
      stale = true
      notices.push({ kind: 'resync', clientOpId: next.clientOpId, op: next.op, ...reasonOf(error) })
    }
    revision = next.revision
    pending = pending.filter((p) => p.clientOpId !== next.clientOpId)
  }
  return { ...replica, confirmed, revision, pending, early, stale }
}

/** Adds committed ops to the buffer (ignoring ones already confirmed or buffered) and drains. */
export function receiveCommitted(
  replica: Replica,
  ops: readonly CommittedOp[],
  notices: SyncNotice[],
): Replica {
  const known = new Set(replica.early.map((c) => c.revision))
  const fresh = ops.filter((c) => c.revision > replica.revision && !known.has(c.revision))
  if (!fresh.length) return replica
  return drain({ ...replica, early: [...replica.early, ...fresh] }, notices)
}
