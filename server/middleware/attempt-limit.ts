import { rateLimit } from 'express-rate-limit'

/**
 * At most `limit` requests per client address in 15 minutes; beyond it a 429 with the
 * `too_many_attempts` code and `message`. For the public forms an attacker would hammer
 * (sign-in, password reset).
 */
export function attemptLimit(limit: number, message: string) {
  return rateLimit({
    windowMs: 15 * 60 * 1000,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, res) => {
      res.status(429).json({ error: { code: 'too_many_attempts', message } })
    },
  })
}
