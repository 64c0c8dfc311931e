import type { RequestHandler } from 'express'
import { unauthorized } from '../errors.ts'

/** Answers 401 unless a signed-in user is on the request. */
export const requireUser: RequestHandler = (req, _res, next) => {
  next(req.user ? undefined : unauthorized())
}

/** The signed-in user's id; only call behind `requireUser`. */
export function userId(req: Express.Request): string {
  if (!req.user) throw unauthorized()
  return req.user.id
}
