/**
 * `op:submit`: parse the envelope, make sure the socket joined the diagram, hand the op to the
 * diagram's commit queue (synchronously, so a socket's ops keep their order), and only after the
 * commit acknowledge the sender and broadcast to the room: at once to this process's sockets,
 * and to other processes in one adapter message per tick (`relayOps`), because the adapter
 * awaits a NOTIFY (its own commit, its own WAL flush) before delivering even locally.
 */
import { describeMessageError, opSubmitSchema } from '../../shared/protocol/client-messages.ts'
import { CLIENT_EVENTS, SERVER_EVENTS } from '../../shared/protocol/events.ts'
import type { OpAck, OpApplied, OpReject } from '../../shared/protocol/server-messages.ts'
import {
  handle,
  refuse,
  roomOf,
  type RealtimeContext,
  type RealtimeServer,
  type SocketState,
} from './context.ts'

const RELAYED = 'ops:committed'
/**
 * Ops per adapter message: keeps a message under the adapter's NOTIFY threshold (8,000 bytes),
 * above which it is first written to a table.
 */
const RELAY_CHUNK = 16

export function opHandlers(ctx: RealtimeContext, state: SocketState): void {
  const { socket } = state
  const event = CLIENT_EVENTS.opSubmit

  handle(ctx, socket, event, async (payload) => {
    const parsed = opSubmitSchema.safeParse(payload)
    if (!parsed.success) {
      return refuse(socket, event, payload, {
        code: 'invalid',
        ...describeMessageError(parsed.error),
      })
    }
    const { diagramId, clientOpId, op } = parsed.data
    if (!state.joined.has(diagramId)) {
      return refuse(socket, event, payload, {
        code: 'unavailable',
        reason: 'diagramId: join the diagram (diagram:join) before sending edits',
        field: 'diagramId',
      })
    }
    const author = { id: socket.data.userId, name: socket.data.name }
    const outcome = await ctx.queue.submit(diagramId, {
      clientOpId,
      author,
      op,
      source: 'edit',
      checkRole: true,
      checkGraphRules: true,
    })
    if (outcome.kind === 'reject') {
      const { code, reason, ids } = outcome
      const reject: OpReject = { diagramId, clientOpId, code, reason, ...(ids ? { ids } : {}) }
      return void socket.emit(SERVER_EVENTS.opReject, reject)
    }
    const ack: OpAck = { diagramId, clientOpId, revision: outcome.revision }
    if (outcome.duplicate) ack.duplicate = true
    socket.emit(SERVER_EVENTS.opAck, ack)
    if (outcome.applied) {
      socket.to(roomOf(diagramId)).local.emit(SERVER_EVENTS.opApplied, outcome.applied)
      ctx.relay(outcome.applied)
    }
  })
}

/**
 * Collects committed ops and sends them to the other server processes once per tick: a group
 * commit resolves all its ops in one tick, so it becomes one adapter message. A process with no
 * other process in sight sends nothing: each message is a NOTIFY that PostgreSQL hands back to
 * this very process, and that round trip lengthened every edit's slowest deliveries by half.
 * A process that starts announces itself through the adapter at once, long before its first
 * client can sign in, join and read the diagram, so it is counted before it has anyone to tell;
 * should one still miss an op, its clients see the gap in revisions and catch up from the log.
 * Returns the function that takes one op.
 */
export function relayOps(io: RealtimeServer): (applied: OpApplied) => void {
  let batch: OpApplied[] = []
  const flush = async () => {
    const sending = batch
    batch = []
    if ((await io.of('/').adapter.serverCount()) <= 1) return
    for (let i = 0; i < sending.length; i += RELAY_CHUNK) {
      io.serverSideEmit(RELAYED, sending.slice(i, i + RELAY_CHUNK))
    }
  }
  return (applied) => {
    if (!batch.length) setImmediate(() => void flush())
    batch.push(applied)
  }
}

/**
 * Delivers ops committed by another process to this process's sockets in their rooms. The batch
 * comes from a server process through PostgreSQL, not from a client; it is still checked for
 * shape so a malformed message is dropped rather than half-delivered.
 */
export function receiveRelayedOps(io: RealtimeServer): void {
  io.on(RELAYED, (batch: unknown) => {
    if (!Array.isArray(batch)) return
    for (const applied of batch as OpApplied[]) {
      if (typeof applied?.diagramId !== 'string' || typeof applied.revision !== 'number') continue
      io.local.to(roomOf(applied.diagramId)).emit(SERVER_EVENTS.opApplied, applied)
    }
  })
}
