/**
 * A co-editing client for tests and the benchmark: a real socket.io-client driving the pure
 * replica from shared/sync, the way the browser store does. Edits are applied at once, sent when
 * the socket is live, and replayed after a reconnect and catch-up.
 */
import { io, type Socket } from 'socket.io-client'
import type { Operation } from '../../../shared/document/operations.ts'
import type {
  ClientToServerEvents,
  ServerToClientEvents,
} from '../../../shared/protocol/event-maps.ts'
import { EVENTS, PROTOCOL_VERSION } from '../../../shared/protocol/events.ts'
import type {
  MessageRefused,
  OpReject,
  PresenceState,
} from '../../../shared/protocol/server-messages.ts'
import {
  acknowledge,
  catchUp,
  createWaitingReplica,
  isSynced,
  localApply,
  missingRevision,
  pendingForReplay,
  receiveRemote,
  reject,
  type Replica,
  type SyncNotice,
  type SyncResult,
} from '../../../shared/sync/replica.ts'

export type ClientSocket = Socket<ServerToClientEvents, ClientToServerEvents>

/** Opens a socket with a session cookie (and optionally another Origin). */
export function openSocket(url: string, cookie: string | null, extra: Record<string, string> = {}) {
  const socket: ClientSocket = io(url, {
    transports: ['websocket'],
    extraHeaders: { ...(cookie ? { cookie } : {}), ...extra },
    reconnectionDelay: 20,
    reconnectionDelayMax: 200,
    randomizationFactor: 0,
  })
  return socket
}

export class SyncClient {
  replica: Replica
  readonly socket: ClientSocket
  readonly notices: SyncNotice[] = []
  readonly rejects: OpReject[] = []
  readonly refusals: MessageRefused[] = []
  /** Every ack received: client op id → revision. */
  readonly acked = new Map<string, number>()
  presence: PresenceState | null = null
  /** True between a completed catch-up and the next disconnect. */
  live = false
  private gapTimer: NodeJS.Timeout | null = null

  constructor(
    readonly url: string,
    readonly cookie: string,
    readonly diagramId: string,
  ) {
    this.replica = createWaitingReplica(diagramId)
    this.socket = openSocket(url, cookie)
    const s = this.socket
    s.on('connect', () => this.join())
    s.on('disconnect', () => (this.live = false))
    s.on(EVENTS.diagramSnapshot, (m) =>
      this.caughtUp(catchUp(this.replica, { kind: 'snapshot', ...m })),
    )
    s.on(EVENTS.diagramOps, (m) => this.caughtUp(catchUp(this.replica, { kind: 'ops', ...m })))
    s.on(EVENTS.opApplied, (m) => this.update(receiveRemote(this.replica, m)))
    s.on(EVENTS.opAck, (m) => {
      this.acked.set(m.clientOpId, m.revision)
      this.update(acknowledge(this.replica, m))
    })
    s.on(EVENTS.opReject, (m) => {
      this.rejects.push(m)
      this.update(reject(this.replica, m))
    })
    s.on(EVENTS.presenceState, (m) => (this.presence = m))
    s.on(EVENTS.messageRefused, (m) => this.refusals.push(m))
  }

  private join(full = false) {
    const since = this.replica.stale || full ? undefined : this.replica.revision
    this.socket.emit(EVENTS.diagramJoin, {
      diagramId: this.diagramId,
      protocolVersion: PROTOCOL_VERSION,
      ...(since !== undefined ? { sinceRevision: since } : {}),
    })
  }

  private caughtUp(result: SyncResult) {
    this.update(result)
    if (this.replica.stale) return this.join(true)
    this.live = true
    for (const submit of pendingForReplay(this.replica)) this.socket.emit(EVENTS.opSubmit, submit)
  }

  private update(result: SyncResult) {
    this.replica = result.replica
    this.notices.push(...result.notices)
    if (this.replica.stale && this.live) {
      this.live = false
      this.join(true)
    }
    // A revision that stays missing (lost between processes) is fetched by re-joining.
    if (missingRevision(this.replica) !== null && !this.gapTimer) {
      this.gapTimer = setTimeout(() => {
        this.gapTimer = null
        if (missingRevision(this.replica) !== null && this.live) this.join()
      }, 500).unref()
    }
  }

  /** Applies an op locally and sends it when live; returns its client op id (throws if refused locally). */
  edit(op: Operation): string {
    const { replica, submit } = localApply(this.replica, op)
    this.replica = replica
    if (this.live) this.socket.emit(EVENTS.opSubmit, submit)
    return submit.clientOpId
  }

  get synced(): boolean {
    return this.live && isSynced(this.replica)
  }

  close() {
    if (this.gapTimer) clearTimeout(this.gapTimer)
    this.socket.close()
  }
}
