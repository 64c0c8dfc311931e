/**
 * What every realtime handler shares: the server, the database, the op queue, the limits, and
 * per-socket state. Handlers are thin: parse with the shared zod schema, check access, call a
 * service, emit.
 */
import type { Server, Socket } from 'socket.io'
import type { ProjectRole } from '../../shared/auth/roles.ts'
import type { Selection } from '../../shared/protocol/client-messages.ts'
import type {
  ClientToServerEvents,
  ServerToClientEvents,
} from '../../shared/protocol/event-maps.ts'
import { SERVER_EVENTS } from '../../shared/protocol/events.ts'
import type {
  MessageRefused,
  OpApplied,
  OpRejectCode,
} from '../../shared/protocol/server-messages.ts'
import type { Db } from '../db/knex.ts'
import type { OpQueue } from '../modules/diagrams/operations.queue.ts'

export interface RealtimeLimits {
  maxMessageBytes: number
  messagesPerSecond: number
  messageBurst: number
  cursorsPerSecond: number
  catchUpOps: number
}

export interface RealtimeContext {
  io: RealtimeServer
  db: Db
  queue: OpQueue
  /** Hands a committed op to the other server processes (batched; see ops.ts). */
  relay: (applied: OpApplied) => void
  limits: RealtimeLimits
  /** Handler work still running; `close()` waits for it before the pools end. */
  inflight: Set<Promise<unknown>>
  closing: boolean
}

/** Runs `work` and keeps it in `ctx.inflight` until it settles. */
export function track<T>(ctx: RealtimeContext, work: Promise<T>): Promise<T> {
  ctx.inflight.add(work)
  const done = () => ctx.inflight.delete(work)
  work.then(done, done)
  return work
}

/** Serialisable per-socket data, readable from other processes through `fetchSockets()`. */
export interface SocketData {
  userId: string
  name: string
  initials: string
  color: string
  /** Diagrams this socket has joined: its role there and what it has selected. */
  presence: Record<string, { role: ProjectRole; selection: Selection }>
}

/** A joined diagram as this process remembers it for the socket. */
export interface Joined {
  projectId: string
  role: ProjectRole
  /** When membership was last confirmed in the database (ms). */
  checkedAt: number
}

/**
 * Between server processes, through the adapter: committed ops, a batch per tick, so a group
 * commit costs one NOTIFY rather than one per op; and the member lists of presence (the
 * receiving side checks their shape before passing them on).
 */
export interface RelayEvents {
  'ops:committed': (batch: OpApplied[]) => void
  'presence:relayed': (message: unknown) => void
}

/** Incoming payloads are typed `unknown` on purpose: every handler parses them with zod. */
export type IncomingEvents = { [E in keyof ClientToServerEvents]: (payload: unknown) => void }

export type RealtimeServer = Server<IncomingEvents, ServerToClientEvents, RelayEvents, SocketData>
export type RealtimeSocket = Socket<IncomingEvents, ServerToClientEvents, RelayEvents, SocketData>

/** Everything a handler knows about its socket. */
export interface SocketState {
  socket: RealtimeSocket
  joined: Map<string, Joined>
}

/** The socket.io room of a diagram. */
export const roomOf = (diagramId: string) => `diagram:${diagramId}`

/**
 * Refuses a message: an `op:submit` gets `op:reject` (so the client rolls that op back),
 * anything else `message:refused`. Never throws.
 */
export function refuse(
  socket: RealtimeSocket,
  event: string,
  payload: unknown,
  refusal: { code: OpRejectCode; reason: string; field?: string },
): void {
  const record = typeof payload === 'object' && payload !== null ? payload : {}
  const { diagramId, clientOpId } = record as { diagramId?: unknown; clientOpId?: unknown }
  const id = typeof diagramId === 'string' ? diagramId : undefined
  if (event === 'op:submit' && typeof clientOpId === 'string') {
    socket.emit(SERVER_EVENTS.opReject, { diagramId: id ?? '', clientOpId, ...refusal })
    return
  }
  const message: MessageRefused = { event, diagramId: id, ...refusal }
  socket.emit(SERVER_EVENTS.messageRefused, message)
}

/**
 * Registers a handler that can never crash the process or leave a promise rejection unhandled:
 * an unexpected failure is logged and the sender gets an `unavailable` refusal. The handler is
 * called synchronously, so work it starts before its first `await` keeps the arrival order.
 */
export function handle(
  ctx: RealtimeContext,
  socket: RealtimeSocket,
  event: keyof IncomingEvents,
  handler: (payload: unknown) => Promise<void> | void,
): void {
  const fail = (error: unknown, payload: unknown) => {
    console.error(`realtime ${event} failed:`, error)
    refuse(socket, event, payload, {
      code: 'unavailable',
      reason: 'the server could not handle this message; nothing was changed, try again',
    })
  }
  socket.on(event, (payload: unknown) => {
    try {
      if (ctx.closing) return
      track(ctx, Promise.resolve(handler(payload))).catch((error: unknown) => fail(error, payload))
    } catch (error) {
      fail(error, payload)
    }
  })
}
