/**
 * Typed event maps for socket.io on both sides (types only; shared/ imports no socket library).
 * @example
 * // client
 * const socket: Socket<ServerToClientEvents, ClientToServerEvents> = io({ withCredentials: true })
 * // server
 * const io = new Server<ClientToServerEvents, ServerToClientEvents>(httpServer)
 */
import type {
  JoinMessage,
  LeaveMessage,
  OpSubmit,
  PresenceCursor,
  PresenceUpdate,
} from './client-messages.ts'
import type {
  DiagramOps,
  DiagramSnapshot,
  MessageRefused,
  OpAck,
  OpApplied,
  OpReject,
  PresenceCursorRelay,
  PresenceState,
} from './server-messages.ts'

export interface ServerToClientEvents {
  'diagram:snapshot': (message: DiagramSnapshot) => void
  'diagram:ops': (message: DiagramOps) => void
  'op:ack': (message: OpAck) => void
  'op:reject': (message: OpReject) => void
  'op:applied': (message: OpApplied) => void
  'presence:state': (message: PresenceState) => void
  'presence:cursor': (message: PresenceCursorRelay) => void
  'message:refused': (message: MessageRefused) => void
}

/** What a client may send; the server validates each payload with the zod schema anyway. */
export interface ClientToServerEvents {
  'diagram:join': (message: JoinMessage) => void
  'diagram:leave': (message: LeaveMessage) => void
  'op:submit': (message: OpSubmit) => void
  'presence:update': (message: PresenceUpdate) => void
  'presence:cursor': (message: PresenceCursor) => void
}
