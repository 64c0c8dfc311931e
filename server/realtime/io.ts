/**
 * The realtime layer: a socket.io server on the app's HTTP server, relaying between server
 * processes through PostgreSQL (@socket.io/postgres-adapter), sharing the HTTP session,
 * checking the Origin, limiting size and rate per socket, and turning events into calls on the
 * diagram services. See DEVELOPERS.md, "Co-editing", and README, "Running several server
 * processes".
 */
import type { Server as HttpServer } from 'node:http'
import { createAdapter } from '@socket.io/postgres-adapter'
import type { RequestHandler } from 'express'
import type pg from 'pg'
import { Server } from 'socket.io'
import { PROTOCOL_LIMITS, SERVER_EVENTS } from '../../shared/protocol/events.ts'
import { colorFor, initialsOf } from '../../shared/sync/presence.ts'
import type { Env } from '../config/env.ts'
import type { Db } from '../db/knex.ts'
import type { OpFeed } from '../modules/diagrams/operations.feed.ts'
import { createOpQueue } from '../modules/diagrams/operations.queue.ts'
import {
  roomOf,
  track,
  type RealtimeContext,
  type RealtimeServer,
  type RealtimeLimits,
  type SocketState,
} from './context.ts'
import { guardSocket } from './guard.ts'
import { joinHandlers } from './join.ts'
import { opHandlers, receiveRelayedOps, relayOps } from './ops.ts'
import { originAllowed } from './origin.ts'
import { broadcastPresence, presenceHandlers, receiveRelayedPresence } from './presence.ts'
import { socketUser, useHttpSession } from './session.ts'

export interface RealtimeOptions {
  env: Env
  db: Db
  pool: pg.Pool
  sessionHandlers: RequestHandler[]
  /** Ops committed over HTTP (save, restore) to broadcast; from `createApp`. */
  opFeed?: OpFeed
}

export interface Realtime {
  io: RealtimeServer
  /** Disconnects every socket, stops the adapter and waits for commits in flight. */
  close(): Promise<void>
}

export function limitsFrom(env: Env): RealtimeLimits {
  return {
    maxMessageBytes: env.REALTIME_MAX_BYTES,
    messagesPerSecond: env.REALTIME_RATE,
    messageBurst: env.REALTIME_BURST,
    cursorsPerSecond: PROTOCOL_LIMITS.cursorsPerSecond,
    catchUpOps: env.REALTIME_CATCH_UP_OPS,
  }
}

/**
 * @example
 * const { app, sessionHandlers, opFeed } = createApp(env, db, pool)
 * const server = createServer(app)
 * const realtime = attachRealtime(server, { env, db, pool, sessionHandlers, opFeed })
 */
export function attachRealtime(httpServer: HttpServer, options: RealtimeOptions): Realtime {
  const { env, db, pool, sessionHandlers, opFeed } = options
  const limits = limitsFrom(env)
  const io: RealtimeServer = new Server(httpServer, {
    // Hard ceiling; messages between the cap and this get a clear refusal from guard.ts.
    maxHttpBufferSize: limits.maxMessageBytes * 4,
    allowRequest: (req, callback) => {
      const ok = originAllowed(req, env.APP_ORIGIN)
      callback(ok ? null : 'origin not allowed', ok)
    },
    serveClient: false,
  })
  io.adapter(createAdapter(pool, { errorHandler: (e) => console.error('socket.io adapter:', e) }))
  useHttpSession(io, sessionHandlers)

  const queue = createOpQueue(db)
  const relay = relayOps(io)
  const ctx: RealtimeContext = { io, db, queue, relay, limits, inflight: new Set(), closing: false }
  receiveRelayedOps(io)
  receiveRelayedPresence(io)

  io.on('connection', (socket) => {
    const user = socketUser(socket.request)
    socket.data = {
      userId: user.id,
      name: user.name,
      initials: initialsOf(user.name),
      color: colorFor(user.id),
      presence: {},
    }
    const state: SocketState = { socket, joined: new Map() }
    guardSocket(socket, limits)
    joinHandlers(ctx, state)
    opHandlers(ctx, state)
    presenceHandlers(ctx, state)
    socket.on('disconnect', () => {
      for (const diagramId of state.joined.keys()) {
        track(ctx, broadcastPresence(ctx, diagramId)).catch(() => undefined)
      }
    })
  })

  const unsubscribe = opFeed?.subscribe((applied) => {
    io.local.to(roomOf(applied.diagramId)).emit(SERVER_EVENTS.opApplied, applied)
    relay(applied)
  })

  return {
    io,
    async close() {
      unsubscribe?.()
      ctx.closing = true
      io.disconnectSockets(true)
      while (ctx.inflight.size) await Promise.allSettled([...ctx.inflight])
      await queue.idle()
      // Lets the last batch of committed ops reach the other processes (ops.ts, relayOps).
      await new Promise((resolve) => setImmediate(resolve))
      await io.close()
    },
  }
}
