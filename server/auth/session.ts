import connectPgSimple from 'connect-pg-simple'
import session from 'express-session'
import type pg from 'pg'

const PgStore = connectPgSimple(session)

/** Session cookie stored in PostgreSQL, shared by HTTP and socket.io and by every server process. */
export function sessionMiddleware(pool: pg.Pool, secret: string, secure: boolean) {
  return session({
    store: new PgStore({ pool, tableName: 'sessions', createTableIfMissing: false }),
    name: 'tributary.sid',
    secret,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: { httpOnly: true, sameSite: 'lax', secure, maxAge: 14 * 24 * 3600 * 1000 },
  })
}
