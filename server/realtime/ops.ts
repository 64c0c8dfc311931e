/**
 * `op:submit`: parse the envelope, make sure the socket joined the diagram, hand the op to the
 * diagram's commit queue (synchronously, so a socket's ops keep their order), and only after the
 * commit acknowledge the sender and broadcast to the room (other processes through the adapter).
 */
import { describeMessageError, opSubmitSchema } from '../../shared/protocol/client-messages.ts'
import { CLIENT_EVENTS, SERVER_EVENTS } from '../../shared/protocol/events.ts'
import type { OpAck, OpReject } from '../../shared/protocol/server-messages.ts'
import { handle, refuse, roomOf, type RealtimeContext, type SocketState } from './context.ts'

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
    if (outcome.applied) socket.to(roomOf(diagramId)).emit(SERVER_EVENTS.opApplied, outcome.applied)
  })
}
