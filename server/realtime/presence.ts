/**
 * Presence: who is in a diagram and what each has selected (kept in socket data, in memory
 * only), and live cursors relayed as volatile messages, never stored.
 */
import { can } from '../../shared/auth/roles.ts'
import {
  describeMessageError,
  presenceCursorSchema,
  presenceUpdateSchema,
} from '../../shared/protocol/client-messages.ts'
import { CLIENT_EVENTS, SERVER_EVENTS } from '../../shared/protocol/events.ts'
import type {
  PresenceCursorRelay,
  PresenceMember,
  PresenceState,
} from '../../shared/protocol/server-messages.ts'
import { mergeSelections } from '../../shared/sync/presence.ts'
import { joinedAccess } from './access.ts'
import {
  handle,
  refuse,
  roomOf,
  type RealtimeContext,
  type RealtimeServer,
  type SocketData,
  type SocketState,
} from './context.ts'

/** Members of a diagram from the sockets in its room (all processes), one per user. */
export function membersOf(diagramId: string, sockets: readonly { data: SocketData }[]) {
  const byUser = new Map<string, PresenceMember>()
  for (const { data } of sockets) {
    const here = data.presence?.[diagramId]
    if (!here) continue
    const seen = byUser.get(data.userId)
    const selection = seen ? mergeSelections([seen.selection, here.selection]) : here.selection
    // Several tabs: the strongest role shows (an editor tab beside a read-only one).
    const role = seen && can(seen.role, 'diagram.edit') ? seen.role : here.role
    const { userId, name, initials, color } = data
    byUser.set(userId, { userId, name, initials, color, role, selection })
  }
  return [...byUser.values()].sort((a, b) => a.name.localeCompare(b.name))
}

/** How long to wait for other server processes' sockets before drawing presence without them. */
const PRESENCE_WAIT_MS = 1000

/**
 * Per context and diagram: whether a member list is being gathered, and whether something
 * changed meanwhile (then it is gathered again when the first is out).
 */
const running = new WeakMap<RealtimeContext, Map<string, { again: boolean }>>()

/**
 * Sends everyone in the room the current member list. One list at a time per diagram: gathering
 * takes a variable time (other processes answer, or the wait runs out), and two overlapping ones
 * could arrive in the wrong order and leave everyone with the older list.
 */
export async function broadcastPresence(ctx: RealtimeContext, diagramId: string): Promise<void> {
  if (ctx.closing) return
  let byDiagram = running.get(ctx)
  if (!byDiagram) running.set(ctx, (byDiagram = new Map()))
  const current = byDiagram.get(diagramId)
  if (current) {
    current.again = true
    return
  }
  const run = { again: false }
  byDiagram.set(diagramId, run)
  try {
    do {
      run.again = false
      await sendPresence(ctx, diagramId)
    } while (run.again && !ctx.closing)
  } finally {
    byDiagram.delete(diagramId)
  }
}

async function sendPresence(ctx: RealtimeContext, diagramId: string): Promise<void> {
  const room = roomOf(diagramId)
  let sockets
  try {
    // A process that ended without saying so stays counted for ~10 s (adapter heartbeat); waiting
    // the adapter's default 5 s for its answer held every presence change back, so wait 1 s.
    sockets = await ctx.io.in(room).timeout(PRESENCE_WAIT_MS).fetchSockets()
  } catch {
    // Another process did not answer in time: show who this process knows about.
    sockets = await ctx.io.local.in(room).fetchSockets()
  }
  const message: PresenceState = {
    diagramId,
    members: membersOf(diagramId, sockets as unknown as { data: SocketData }[]),
  }
  // This process's sockets at once and in order; a room-wide emit would first wait for the
  // adapter's NOTIFY, and two of those can finish in either order.
  ctx.io.local.to(room).emit(SERVER_EVENTS.presenceState, message)
  if ((await ctx.io.of('/').adapter.serverCount()) > 1) ctx.io.serverSideEmit(RELAYED, message)
}

const RELAYED = 'presence:relayed' as const

/** Delivers member lists made by other server processes to this process's sockets. */
export function receiveRelayedPresence(io: RealtimeServer): void {
  io.on(RELAYED, (message: unknown) => {
    const m = message as PresenceState | null
    if (typeof m?.diagramId !== 'string' || !Array.isArray(m.members)) return
    io.local.to(roomOf(m.diagramId)).emit(SERVER_EVENTS.presenceState, m)
  })
}

export function presenceHandlers(ctx: RealtimeContext, state: SocketState): void {
  const { socket } = state

  handle(ctx, socket, CLIENT_EVENTS.presenceUpdate, async (payload) => {
    const parsed = presenceUpdateSchema.safeParse(payload)
    if (!parsed.success) {
      const error = describeMessageError(parsed.error)
      return refuse(socket, CLIENT_EVENTS.presenceUpdate, payload, { code: 'invalid', ...error })
    }
    const { diagramId, selection } = parsed.data
    if (!(await joinedAccess(ctx.db, state, diagramId, 0))) {
      return refuse(socket, CLIENT_EVENTS.presenceUpdate, payload, {
        code: 'unavailable',
        reason: 'diagramId: join the diagram first (diagram:join)',
        field: 'diagramId',
      })
    }
    const here = socket.data.presence[diagramId]
    if (here) here.selection = selection
    await broadcastPresence(ctx, diagramId)
  })

  handle(ctx, socket, CLIENT_EVENTS.presenceCursor, async (payload) => {
    const parsed = presenceCursorSchema.safeParse(payload)
    if (!parsed.success) return // volatile: a bad cursor is simply not relayed
    const { diagramId, x, y } = parsed.data
    if (!(await joinedAccess(ctx.db, state, diagramId))) return
    const relay: PresenceCursorRelay = {
      diagramId,
      userId: socket.data.userId,
      color: socket.data.color,
      x,
      y,
    }
    socket.volatile.to(roomOf(diagramId)).emit(SERVER_EVENTS.presenceCursor, relay)
  })
}
