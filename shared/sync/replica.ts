/**
 * The pure client replica of a diagram under co-editing. The client applies its own ops at once
 * (optimistic), keeps them pending until the server answers, and rebases them on ops from
 * others: the confirmed document follows server order, and the view is the pending ops replayed
 * on top of it. An op the server refuses is rolled back; a pending op that no longer applies is
 * hidden from the view and reported. Nothing here touches the network.
 * @example
 * let r = createReplica(diagramId, doc, 12)
 * const { replica, submit } = localApply(r, { type: 'node.move', id: 'J2', position: { x: 40, y: 80 } })
 * socket.emit('op:submit', submit)
 * r = replica
 * socket.on('op:ack', (ack) => { r = acknowledge(r, ack).replica })
 */
import { emptyDiagram, type Diagram } from '../document/model.ts'
import type { Operation } from '../document/operations.ts'
import type { OpSubmit } from '../protocol/client-messages.ts'
import type { CatchUp, OpAck, OpApplied, OpReject } from '../protocol/server-messages.ts'
import { applyChecked } from './graph-rules.ts'
import {
  drain,
  receiveCommitted,
  withView,
  type Replica,
  type SyncNotice,
  type SyncResult,
} from './replica-state.ts'

export type { CommittedOp, PendingOp, Replica, SyncNotice, SyncResult } from './replica-state.ts'

/**
 * A replica of the document as the server sent it at `revision`, with nothing pending.
 * @example
 * const r = createReplica(snapshot.diagramId, snapshot.doc, snapshot.revision)
 */
export function createReplica(diagramId: string, doc: Diagram, revision: number): Replica {
  return {
    diagramId,
    confirmed: doc,
    revision,
    pending: [],
    view: doc,
    blocked: [],
    early: [],
    stale: false,
  }
}

/**
 * A replica that has no document yet: it buffers whatever arrives until the `diagram:snapshot`
 * answering its first join (ops broadcast to the room may overtake it), then applies the
 * buffered ops newer than the snapshot. `view` is an empty diagram until then.
 * @example
 * let r = createWaitingReplica(diagramId)
 * socket.emit('diagram:join', { diagramId })
 * socket.on('diagram:snapshot', (s) => { r = catchUp(r, { kind: 'snapshot', ...s }).replica })
 */
export function createWaitingReplica(diagramId: string): Replica {
  return { ...createReplica(diagramId, emptyDiagram(), -1), stale: true }
}

const newOpId = () => globalThis.crypto.randomUUID()

/**
 * Applies a local op to the view at once and queues it. Throws `OperationError` (naming the ids)
 * when the op does not apply or breaks a graph rule, so the editor can refuse it before sending.
 * @example
 * const { replica, submit } = localApply(r, { type: 'node.update', id: 'F3', patch: { count: 2 } })
 * socket.emit(EVENTS.opSubmit, submit)
 */
export function localApply(
  replica: Replica,
  op: Operation,
  clientOpId: string = newOpId(),
): { replica: Replica; submit: OpSubmit } {
  const view = applyChecked(replica.view, op)
  const pending = { clientOpId, op, baseRevision: replica.revision }
  return {
    replica: { ...replica, view, pending: [...replica.pending, pending] },
    submit: { diagramId: replica.diagramId, ...pending },
  }
}

/**
 * Takes an op committed by someone else (`op:applied`). Ops may arrive out of order (several
 * server processes) or twice; they are applied to `confirmed` strictly by revision.
 * @example
 * socket.on('op:applied', (applied) => { ({ replica: r, notices } = receiveRemote(r, applied)) })
 */
export function receiveRemote(replica: Replica, applied: OpApplied): SyncResult {
  const notices: SyncNotice[] = []
  return withView(receiveCommitted(replica, [applied], notices), notices)
}

/**
 * The server committed a pending op as `ack.revision`. A revision the replica already has
 * (e.g. a resend answered after a snapshot) only removes the op from `pending`.
 * @example
 * socket.on('op:ack', (ack) => { r = acknowledge(r, ack).replica })
 */
export function acknowledge(replica: Replica, ack: OpAck): SyncResult {
  const pending = replica.pending.find((p) => p.clientOpId === ack.clientOpId)
  if (!pending) return { replica, notices: [] }
  if (ack.revision <= replica.revision) {
    const rest = replica.pending.filter((p) => p !== pending)
    return withView({ ...replica, pending: rest })
  }
  const notices: SyncNotice[] = []
  const committed = { revision: ack.revision, op: pending.op, clientOpId: ack.clientOpId }
  return withView(receiveCommitted(replica, [committed], notices), notices)
}

/**
 * The server refused a pending op: it is rolled back from the view and reported as `rejected`
 * with the server's reason. Later pending ops that depended on it show up as conflicts.
 * @example
 * socket.on('op:reject', (rej) => { const { replica, notices } = reject(r, rej); toast(notices[0].reason) })
 */
export function reject(replica: Replica, rejection: OpReject): SyncResult {
  const pending = replica.pending.find((p) => p.clientOpId === rejection.clientOpId)
  if (!pending) return { replica, notices: [] }
  const notices: SyncNotice[] = [
    {
      kind: 'rejected',
      clientOpId: pending.clientOpId,
      op: pending.op,
      reason: rejection.reason,
      ids: rejection.ids ?? [],
    },
  ]
  const rest = replica.pending.filter((p) => p !== pending)
  const blocked = replica.blocked.filter((b) => b.clientOpId !== pending.clientOpId)
  return withView({ ...replica, pending: rest, blocked }, notices)
}

/**
 * Catches up after (re)joining: a snapshot replaces `confirmed`; a list of ops is applied in
 * order (ops that were this client's own leave `pending`). Pending ops are kept either way;
 * send {@link pendingForReplay} next.
 * @example
 * socket.on('diagram:snapshot', (s) => { r = catchUp(r, { kind: 'snapshot', ...s }).replica })
 * socket.on('diagram:ops', (o) => { r = catchUp(r, { kind: 'ops', ...o }).replica })
 */
export function catchUp(replica: Replica, update: CatchUp): SyncResult {
  const notices: SyncNotice[] = []
  if (update.kind === 'snapshot') {
    const early = replica.early.filter((c) => c.revision > update.revision)
    const reset = {
      ...replica,
      confirmed: update.doc,
      revision: update.revision,
      early,
      stale: false,
    }
    return withView(drain(reset, notices), notices)
  }
  if (update.fromRevision > replica.revision) {
    // The server skipped revisions this replica never saw: only a snapshot can fix that.
    return withView({ ...replica, stale: true }, notices)
  }
  return withView(receiveCommitted(replica, update.ops, notices), notices)
}

/**
 * The pending ops to send again after a reconnect and catch-up, oldest first, rebased on the
 * current revision. The server never applies an op twice (same `clientOpId`), so resending ops
 * it already committed is safe: it acknowledges them again.
 * @example
 * for (const submit of pendingForReplay(r)) socket.emit(EVENTS.opSubmit, submit)
 */
export function pendingForReplay(replica: Replica): OpSubmit[] {
  return replica.pending.map((p) => ({
    diagramId: replica.diagramId,
    clientOpId: p.clientOpId,
    baseRevision: replica.revision,
    op: p.op,
  }))
}

/**
 * The first revision the replica is waiting for while later ones are buffered, or null. If it
 * stays missing, re-join with `sinceRevision: replica.revision` to fetch it.
 * @example
 * if (missingRevision(r) !== null) socket.emit('diagram:join', { diagramId, sinceRevision: r.revision })
 */
export function missingRevision(replica: Replica): number | null {
  return replica.early.length ? replica.revision + 1 : null
}

/**
 * True when everything local is confirmed and nothing is buffered: the "synced" state.
 * @example
 * banner.value = isSynced(r) ? 'synced' : 'saving'
 */
export function isSynced(replica: Replica): boolean {
  return !replica.pending.length && !replica.early.length && !replica.stale
}
