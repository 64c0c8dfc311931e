/**
 * The typed socket.io client for co-editing. Event names and payloads come from shared/protocol,
 * so a misspelt event or a wrong payload fails to compile. Same origin: the session cookie goes
 * with the handshake and the server checks it and the Origin.
 */
import type { ClientToServerEvents, ServerToClientEvents } from '@shared/protocol/event-maps'
import { io, type Socket } from 'socket.io-client'

export type DiagramSocket = Socket<ServerToClientEvents, ClientToServerEvents>

/** Reconnection backoff: quick first tries (a server restart), then at most every 10 s. */
export const RECONNECT_DELAY_MS = 500
export const RECONNECT_DELAY_MAX_MS = 10_000

/**
 * A socket that is not connected yet; the channel connects it once its handlers are in place.
 * @example
 * const socket = createDiagramSocket()
 * socket.on('connect', join)
 * socket.connect()
 */
export function createDiagramSocket(url?: string): DiagramSocket {
  const options = {
    autoConnect: false,
    withCredentials: true,
    // Skip the long-polling start: one upgrade less, and the server runs sessions on the handshake.
    transports: ['websocket'],
    reconnectionDelay: RECONNECT_DELAY_MS,
    reconnectionDelayMax: RECONNECT_DELAY_MAX_MS,
  }
  return url ? io(url, options) : io(options)
}
