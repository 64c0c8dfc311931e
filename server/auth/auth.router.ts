import { Router, type Request } from 'express'
import { signInBodySchema, signUpBodySchema } from '../../shared/api/schemas.ts'
import type { Db } from '../db/knex.ts'
import { HttpError, unauthorized } from '../errors.ts'
import type { createPassport } from './passport.ts'
import { requireUser } from '../middleware/require-user.ts'
import { attemptLimit } from '../middleware/attempt-limit.ts'
import { validateBody } from '../middleware/validate.ts'
import { createUser, toUser } from '../modules/users/users.service.ts'

const logIn = (req: Request, user: Express.User) =>
  new Promise<void>((resolve, reject) => req.logIn(user, (err) => (err ? reject(err) : resolve())))

export function authRouter(
  db: Db,
  passport: ReturnType<typeof createPassport>,
  signInLimit: number,
): Router {
  const router = Router()
  const signInLimiter = attemptLimit(signInLimit, 'Too many sign-in attempts; wait a few minutes')

  router.post('/sign-up', validateBody(signUpBodySchema), async (req, res) => {
    const user = toUser(await createUser(db, req.body))
    await logIn(req, user)
    res.status(201).json({ user })
  })

  router.post('/sign-in', signInLimiter, validateBody(signInBodySchema), (req, res, next) => {
    passport.authenticate('local', (err: unknown, user: Express.User | false) => {
      if (err) return next(err)
      if (!user) return next(new HttpError(401, 'bad_credentials', 'Wrong e-mail or password'))
      logIn(req, user)
        .then(() => res.json({ user }))
        .catch(next)
    })(req, res, next)
  })

  router.post('/sign-out', (req, res, next) => {
    req.logOut((err) => {
      if (err) return next(err)
      req.session.destroy(() => res.status(204).end())
    })
  })

  router.get('/me', requireUser, (req, res) => {
    if (!req.user) throw unauthorized()
    res.json({ user: req.user })
  })

  return router
}
