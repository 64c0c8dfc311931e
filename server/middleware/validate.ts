import type { RequestHandler } from 'express'
import type { z } from 'zod'
import { badRequest } from '../errors.ts'

/** Issues of a failed parse as `{ path, message }`, the path written `a.b.0.c` ("body" if empty). */
export function describeIssues(error: z.ZodError): { path: string; message: string }[] {
  return error.issues.map((i) => ({
    path: i.path.length ? i.path.map(String).join('.') : 'body',
    message: i.message,
  }))
}

/** Replaces `req.body` with the parsed value, or answers 400 naming every bad field. */
export function validateBody<S extends z.ZodType>(schema: S): RequestHandler {
  return (req, _res, next) => {
    const parsed = schema.safeParse(req.body ?? {})
    if (!parsed.success) {
      const fields = describeIssues(parsed.error)
      const message = fields.map((f) => `${f.path}: ${f.message}`).join('; ')
      next(badRequest(message, fields))
      return
    }
    req.body = parsed.data
    next()
  }
}
