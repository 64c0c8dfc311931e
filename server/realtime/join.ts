/**
 * Joining and leaving a diagram. The socket enters the room first and reads the catch-up
 * second, so nothing committed in between is missed (a replica ignores what it already has).
 */
import {
  describeMessageError,
  joinMessageSchema,
  leaveMessageSchema,
} from '../../shared/protocol/client-messages.ts'
import { CLIENT_EVENTS, PROTOCOL_VERSION, SERVER_EVENTS } from '../../shared/protocol/events.ts'
import { catchUpFor } from '../modules/diagrams/operations.catch-up.ts'
import { diagramAccess } from './access.ts'
import { handle, refuse, roomOf, type RealtimeContext, type SocketState } from './context.ts'
import { broadcastPresence } from './presence.ts'

const NO_DIAGRAM = 'diagramId: no such diagram, or you are not a member of its project'

export function joinHandlers(ctx: RealtimeContext, state: SocketState): void {
  const { socket } = state

  handle(ctx, socket, CLIENT_EVENTS.diagramJoin, async (payload) => {
    const event = CLIENT_EVENTS.diagramJoin
    const parsed = joinMessageSchema.safeParse(payload)
    if (!parsed.success) {
      const error = describeMessageError(parsed.error)
      const version = error.field === 'protocolVersion'
      const reason = version
        ? `protocolVersion: this server speaks version ${PROTOCOL_VERSION}; reload the page`
        : error.reason
      return refuse(socket, event, payload, { code: 'invalid', ...error, reason })
    }
    const { diagramId, sinceRevision } = parsed.data
    const access = await diagramAccess(ctx.db, diagramId, socket.data.userId)
    if (!access) return refuse(socket, event, payload, { code: 'not-found', reason: NO_DIAGRAM })

    state.joined.set(diagramId, { ...access, checkedAt: Date.now() })
    const previous = socket.data.presence[diagramId]?.selection
    socket.data.presence[diagramId] = {
      role: access.role,
      selection: previous ?? { nodes: [], pipes: [] },
    }
    await socket.join(roomOf(diagramId))
    const answer = await catchUpFor(
      ctx.db,
      diagramId,
      sinceRevision,
      ctx.limits.catchUpOps,
      access.role,
    )
    if (!answer) return refuse(socket, event, payload, { code: 'not-found', reason: NO_DIAGRAM })
    if (answer.kind === 'snapshot') {
      const { kind: _kind, ...snapshot } = answer
      socket.emit(SERVER_EVENTS.diagramSnapshot, snapshot)
    } else {
      const { kind: _kind, ...ops } = answer
      socket.emit(SERVER_EVENTS.diagramOps, ops)
    }
    await broadcastPresence(ctx, diagramId)
  })

  handle(ctx, socket, CLIENT_EVENTS.diagramLeave, async (payload) => {
    const parsed = leaveMessageSchema.safeParse(payload)
    if (!parsed.success) {
      const error = describeMessageError(parsed.error)
      return refuse(socket, CLIENT_EVENTS.diagramLeave, payload, { code: 'invalid', ...error })
    }
    const { diagramId } = parsed.data
    state.joined.delete(diagramId)
    delete socket.data.presence[diagramId]
    await socket.leave(roomOf(diagramId))
    await broadcastPresence(ctx, diagramId)
  })
}
