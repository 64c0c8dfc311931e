import supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { PASSWORD, signUp, startTestApp, uniqueEmail, type TestApp } from './helpers/test-app.ts'

let t: TestApp
beforeAll(() => {
  t = startTestApp()
})
afterAll(() => t.close())

describe('sign-up, sign-in and sign-out against PostgreSQL', () => {
  it('signs up, stores an argon2id hash, and is signed in at once', async () => {
    const agent = supertest.agent(t.app)
    const user = await signUp(agent, 'Dana Ferreira')
    const me = await agent.get('/api/auth/me').expect(200)
    expect(me.body.user).toMatchObject({ id: user.id, name: 'Dana Ferreira' })
    const row = await t.db('users').where({ id: user.id }).first()
    expect(row.password_hash).toMatch(/^\$argon2id\$/)
    expect(row.password_hash).not.toContain(PASSWORD)
  })

  it('refuses a second account with the same e-mail in another case', async () => {
    const agent = supertest.agent(t.app)
    const user = await signUp(agent)
    const res = await supertest(t.app)
      .post('/api/auth/sign-up')
      .send({ email: user.email.toUpperCase(), name: 'Copy', password: PASSWORD })
      .expect(409)
    expect(res.body.error.message).toMatch(/^email: /)
  })

  it('answers a wrong password with 401 and a clear message, and no session', async () => {
    const { email } = await signUp(supertest.agent(t.app))
    const agent = supertest.agent(t.app)
    const res = await agent.post('/api/auth/sign-in').send({ email, password: 'wrong password!' })
    expect(res.status).toBe(401)
    expect(res.body.error).toEqual({ code: 'bad_credentials', message: 'Wrong e-mail or password' })
    await agent.get('/api/auth/me').expect(401)
  })

  it('signs in with the right password (e-mail case ignored) and signs out', async () => {
    const { email } = await signUp(supertest.agent(t.app))
    const agent = supertest.agent(t.app)
    const res = await agent
      .post('/api/auth/sign-in')
      .send({ email: email.toUpperCase(), password: PASSWORD })
      .expect(200)
    const cookie = String(res.headers['set-cookie'])
    expect(cookie).toMatch(/HttpOnly/i)
    expect(cookie).toMatch(/SameSite=Lax/i)
    await agent.get('/api/auth/me').expect(200)
    await agent.post('/api/auth/sign-out').expect(204)
    await agent.get('/api/auth/me').expect(401)
  })

  it('keeps the session across a server restart (sessions live in PostgreSQL)', async () => {
    const first = startTestApp()
    const agent = supertest.agent(first.app)
    const user = await signUp(agent)
    const cookie = (
      await agent.post('/api/auth/sign-in').send({ email: user.email, password: PASSWORD })
    ).headers['set-cookie']
    await first.close()

    const second = startTestApp()
    try {
      const me = await supertest(second.app).get('/api/auth/me').set('Cookie', cookie!).expect(200)
      expect(me.body.user.id).toBe(user.id)
      const row = await second
        .db('sessions')
        .whereRaw(`sess::jsonb -> 'passport' ->> 'user' = ?`, [user.id])
        .first()
      expect(row).toBeTruthy()
    } finally {
      await second.close()
    }
  })

  it('limits sign-in attempts per address', async () => {
    const limited = startTestApp({ SIGN_IN_LIMIT: '3' })
    try {
      const email = uniqueEmail()
      for (let i = 0; i < 3; i++) {
        await supertest(limited.app)
          .post('/api/auth/sign-in')
          .send({ email, password: 'x' })
          .expect(401)
      }
      const res = await supertest(limited.app)
        .post('/api/auth/sign-in')
        .send({ email, password: 'x' })
      expect(res.status).toBe(429)
      expect(res.body.error.code).toBe('too_many_attempts')
    } finally {
      await limited.close()
    }
  })
})

describe('request validation and API errors', () => {
  it.each([
    [{ email: 'not-an-address', name: 'A', password: PASSWORD }, 'email'],
    [{ email: uniqueEmail(), name: '', password: PASSWORD }, 'name'],
    [{ email: uniqueEmail(), name: 'A', password: 'short' }, 'password'],
    [{ email: uniqueEmail(), name: 'A' }, 'password'],
  ])('answers 400 naming the field for %j', async (body, field) => {
    const res = await supertest(t.app).post('/api/auth/sign-up').send(body).expect(400)
    expect(res.body.error.fields.map((f: { path: string }) => f.path)).toContain(field)
    expect(res.body.error.message).toContain(`${field}: `)
  })

  it('answers malformed JSON with 400, not a stack trace', async () => {
    const res = await supertest(t.app)
      .post('/api/auth/sign-in')
      .set('Content-Type', 'application/json')
      .send('{"email":')
      .expect(400)
    expect(res.body.error.message).toBe('body: is not valid JSON')
    expect(res.text).not.toMatch(/at .*\.ts:\d+/)
  })

  it('answers unknown API routes with 404 JSON', async () => {
    const res = await supertest(t.app).get('/api/no-such-thing').expect(404)
    expect(res.body.error.code).toBe('not_found')
  })

  it('reports health only when the database answers', async () => {
    await supertest(t.app).get('/api/health').expect(200, { ok: true })
    const broken = startTestApp({ DATABASE_URL: 'postgres://postgres@127.0.0.1:1/nowhere' })
    try {
      await supertest(broken.app).get('/api/health').expect(503, { ok: false })
    } finally {
      await broken.close()
    }
  })

  it('sets the usual security headers', async () => {
    const res = await supertest(t.app).get('/api/health')
    expect(res.headers['content-security-policy']).toContain("default-src 'self'")
    expect(res.headers['x-powered-by']).toBeUndefined()
  })
})
