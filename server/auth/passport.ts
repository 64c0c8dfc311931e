import { Passport } from 'passport'
import { Strategy as LocalStrategy } from 'passport-local'
import type { User as SharedUser } from '../../shared/api/schemas.ts'
import type { Db } from '../db/knex.ts'
import { findUserById } from '../modules/users/users.repo.ts'
import { checkCredentials, toUser } from '../modules/users/users.service.ts'

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // The session holds the public user shape, never the password hash.
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends SharedUser {}
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
  passport.serializeUser((user, done) => done(null, (user as SharedUser).id))
  passport.deserializeUser((id: string, done) => {
    findUserById(db, id)
      .then((row) => done(null, row ? toUser(row) : false))
      .catch(done)
  })
  return passport
}
