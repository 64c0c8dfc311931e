import type { IncomingMessage, ServerResponse } from 'node:http'
import type { RequestHandler } from 'express'
import type { Server } from 'socket.io'

type EngineMiddleware = (
  req: IncomingMessage,
  res: ServerResponse,
  next: (err?: unknown) => void,
) => void

/** Runs an Express middleware on the engine.io handshake request only (not on every poll). */
const onHandshake =
  (handler: RequestHandler): EngineMiddleware =>
  (req, res, next) => {
    const query = (req as IncomingMessage & { _query?: Record<string, string> })._query
    if (query?.sid !== undefined) return next()
    ;(handler as unknown as EngineMiddleware)(req, res, next)
  }

/**
 * Shares the HTTP session with sockets: express-session and passport run on the handshake, so
 * `socket.request.user` is the signed-in user; a socket without one is refused.
 */
export function useHttpSession(io: Server, sessionHandlers: RequestHandler[]): void {
  for (const handler of sessionHandlers) io.engine.use(onHandshake(handler))
  io.use((socket, next) => {
    const user = (socket.request as IncomingMessage & { user?: Express.User }).user
    next(user ? undefined : new Error('unauthorized: sign in before opening a diagram'))
  })
}

/** The signed-in user of a socket (checked at connection). */
export const socketUser = (request: IncomingMessage): Express.User =>
  (request as IncomingMessage & { user: Express.User }).user
