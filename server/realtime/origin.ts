import type { IncomingMessage } from 'node:http'

/**
 * Whether a socket handshake may proceed, judged by its Origin header: the configured public
 * origin(s) (`APP_ORIGIN`, comma-separated) or the very host the request was sent to. Browsers
 * always send Origin on a WebSocket handshake, so a page on another site cannot ride the
 * session cookie; a client without Origin (a script, a test) is not a browser page and passes.
 * @example
 * originAllowed(req, 'https://tributary.example.test')
 */
export function originAllowed(req: IncomingMessage, appOrigin: string | undefined): boolean {
  const origin = req.headers.origin
  if (!origin) return true
  const allowed = (appOrigin ?? '')
    .split(',')
    .map((o) => o.trim().replace(/\/$/, ''))
    .filter(Boolean)
  if (allowed.includes(origin)) return true
  try {
    return new URL(origin).host === req.headers.host
  } catch {
    return false
  }
}
