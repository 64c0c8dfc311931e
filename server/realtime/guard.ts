/**
 * Per-socket limits applied to every incoming message before any handler runs: a size cap (the
 * serialised payload) and a token-bucket rate. Cursors have their own bucket and are dropped
 * silently when over it (they are volatile anyway). A refused message gets a clear reason.
 */
import { CLIENT_EVENTS } from '../../shared/protocol/events.ts'
import { refuse, type RealtimeLimits, type RealtimeSocket } from './context.ts'
import { TokenBucket } from './rate-limit.ts'

const KNOWN = new Set<string>(Object.values(CLIENT_EVENTS))

function sizeOf(args: unknown[]): number {
  try {
    return Buffer.byteLength(JSON.stringify(args))
  } catch {
    return Number.POSITIVE_INFINITY
  }
}

export function guardSocket(socket: RealtimeSocket, limits: RealtimeLimits): void {
  const messages = new TokenBucket(limits.messagesPerSecond, limits.messageBurst)
  const cursors = new TokenBucket(limits.cursorsPerSecond, limits.cursorsPerSecond)
  socket.use(([event, ...args], next) => {
    const payload = args[0]
    if (!KNOWN.has(event)) {
      const expected = Object.values(CLIENT_EVENTS).join(', ')
      return refuse(socket, event, payload, {
        code: 'invalid',
        reason: `unknown event "${event}" (expected one of ${expected})`,
      })
    }
    if (event === CLIENT_EVENTS.presenceCursor) return cursors.take() ? next() : undefined
    const bytes = sizeOf(args)
    if (bytes > limits.maxMessageBytes) {
      return refuse(socket, event, payload, {
        code: 'limit',
        reason: `message too large: ${bytes} bytes, the limit is ${limits.maxMessageBytes}; split the change into smaller edits`,
      })
    }
    if (!messages.take()) {
      return refuse(socket, event, payload, {
        code: 'limit',
        reason: `too many messages: the limit is ${limits.messagesPerSecond} per second; slow down and send again`,
      })
    }
    next()
  })
}
