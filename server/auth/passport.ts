import { Passport } from 'passport'
import { Strategy as LocalStrategy } from 'passport-local'
import type { User } from '../../shared/api/schemas.ts'
import type { Db } from '../db/knex.ts'
import { findUserById } from '../modules/users/users.repo.ts'
import { checkCredentials, toUser } from '../modules/users/users.service.ts'

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends Omit<import('../../shared/api/schemas.ts').User, never> {}
  }
}

/** One passport instance per app, so tests can run several apps in one process. */
export function createPassport(db: Db) {
  const passport = new Passport()
  passport.use(
    new LocalStrategy({ usernameField: 'email' }, (email, password, done) => {
      checkCredentials(db, email, password)
        .then((row) => done(null, row ? toUser(row) : false))
        .catch(done)
    }),
  )
  passport.serializeUser((user, done) => done(null, (user as User).id))
  passport.deserializeUser((id: string, done) => {
    findUserById(db, id)
      .then((row) => done(null, row ? toUser(row) : false))
      .catch(done)
  })
  return passport
}
