import type { ErrorRequestHandler, RequestHandler } from 'express'
import { HttpError } from '../errors.ts'

/** Unknown routes under /api answer JSON, never the SPA page. */
export const apiNotFound: RequestHandler = (req, res) => {
  res
    .status(404)
    .json({ error: { code: 'not_found', message: `No such API route: ${req.method} ${req.path}` } })
}

/** Maps typed errors to their status; anything else is logged and answered 500 without details. */
export const errorHandler: ErrorRequestHandler = (err, req, res, next) => {
  if (res.headersSent) {
    next(err)
    return
  }
  if (err instanceof HttpError) {
    res
      .status(err.status)
      .json({ error: { code: err.code, message: err.message, fields: err.fields } })
    return
  }
  // body-parser errors carry a status (400 malformed JSON, 413 too large)
  const status =
    typeof err?.status === 'number' && err.status >= 400 && err.status < 500 ? err.status : 500
  if (status < 500) {
    const message =
      err.type === 'entity.parse.failed' ? 'body: is not valid JSON' : String(err.message)
    res.status(status).json({ error: { code: err.type ?? 'invalid_request', message } })
    return
  }
  console.error(`[error] ${req.method} ${req.originalUrl}`, err)
  res
    .status(500)
    .json({ error: { code: 'internal', message: 'Something went wrong on the server' } })
}
