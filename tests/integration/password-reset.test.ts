import supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { hashToken } from '../../server/modules/account/one-time-token.ts'
import { linkToken, startMailTestApp, type MailTestApp } from './helpers/mail-app.ts'
import { PASSWORD, signUp, uniqueEmail } from './helpers/test-app.ts'

let t: MailTestApp
beforeAll(async () => {
  t = await startMailTestApp()
})
afterAll(() => t.close())

const NEW_PASSWORD = 'a brand new passphrase'

/** The mail sent to `email`, once it has arrived (the request answers before sending it). */
async function mailFor(email: string) {
  const end = Date.now() + 5_000
  for (;;) {
    const [message] = await t.mailTo(email)
    if (message) return message
    if (Date.now() > end) throw new Error(`no mail reached ${email}`)
    await new Promise((resolve) => setTimeout(resolve, 20))
  }
}

async function requestLink(email: string) {
  await supertest(t.app).post('/api/auth/password-reset/request').send({ email }).expect(202)
  const message = await mailFor(email)
  return { message, token: linkToken(message.text, 'reset-password') }
}

describe('password reset by e-mail', () => {
  it('mails a link; the new password works, the old does not, and other sessions end', async () => {
    const laptop = supertest.agent(t.app)
    const user = await signUp(laptop, 'Noor Halvorsen')
    const phone = supertest.agent(t.app)
    await phone
      .post('/api/auth/sign-in')
      .send({ email: user.email, password: PASSWORD })
      .expect(200)

    const { message, token } = await requestLink(user.email.toUpperCase())
    expect(message.subject).toBe('Choose a new Tributary password')
    expect(message.text).toContain('Hello Noor Halvorsen,')
    expect(message.html).toContain(`http://tributary.test/reset-password/${token}`)

    const preview = await supertest(t.app).get(`/api/auth/password-reset/${token}`).expect(200)
    expect(preview.body).toEqual({ email: user.email })

    const resetter = supertest.agent(t.app)
    await resetter
      .post('/api/auth/password-reset/complete')
      .send({ token, password: NEW_PASSWORD })
      .expect(204)

    await laptop.get('/api/auth/me').expect(401)
    await phone.get('/api/auth/me').expect(401)
    await supertest(t.app)
      .post('/api/auth/sign-in')
      .send({ email: user.email, password: PASSWORD })
      .expect(401)
    await supertest(t.app)
      .post('/api/auth/sign-in')
      .send({ email: user.email, password: NEW_PASSWORD })
      .expect(200)

    const reused = await supertest(t.app)
      .post('/api/auth/password-reset/complete')
      .send({ token, password: 'yet another passphrase' })
      .expect(410)
    expect(reused.body.error).toMatchObject({
      code: 'link_used',
      message: 'This reset link has already been used',
    })
  })

  it('answers an unknown address the same way and sends nothing', async () => {
    const known = await signUp(supertest.agent(t.app), 'Known Person')
    const email = uniqueEmail('ghost')
    const request = (address: string) =>
      supertest(t.app).post('/api/auth/password-reset/request').send({ email: address })
    const [ghost, real] = await Promise.all([request(email), request(known.email)])
    expect(ghost.status).toBe(202)
    expect(ghost.body).toEqual(real.body)
    // Both were handled side by side; once the real one's mail is in, the other had its turn.
    await mailFor(known.email)
    expect(await t.mailTo(email)).toEqual([])
  })

  it('refuses an expired link and keeps the password', async () => {
    const user = await signUp(supertest.agent(t.app), 'Late Reader')
    const { token } = await requestLink(user.email)
    const row = await t
      .db('password_resets')
      .where({ token_hash: hashToken(token) })
      .first()
    // Reset links last one hour.
    expect(row.expires_at.getTime() - row.created_at.getTime()).toBeCloseTo(3_600_000, -4)
    await t
      .db('password_resets')
      .where({ id: row.id })
      .update({ expires_at: new Date(Date.now() - 1) })

    const res = await supertest(t.app).get(`/api/auth/password-reset/${token}`).expect(410)
    expect(res.body.error.code).toBe('link_expired')
    await supertest(t.app)
      .post('/api/auth/password-reset/complete')
      .send({ token, password: NEW_PASSWORD })
      .expect(410)
    await supertest(t.app)
      .post('/api/auth/sign-in')
      .send({ email: user.email, password: PASSWORD })
      .expect(200)
  })

  it('retires the other outstanding links once one is used', async () => {
    const user = await signUp(supertest.agent(t.app), 'Twice Asker')
    const first = (await requestLink(user.email)).token
    const second = (await requestLink(user.email)).token
    await supertest(t.app)
      .post('/api/auth/password-reset/complete')
      .send({ token: second, password: NEW_PASSWORD })
      .expect(204)
    await supertest(t.app)
      .post('/api/auth/password-reset/complete')
      .send({ token: first, password: PASSWORD })
      .expect(410)
  })

  it('names the bad field: address, short password, malformed token', async () => {
    const bad = await supertest(t.app)
      .post('/api/auth/password-reset/request')
      .send({ email: 'nope' })
      .expect(400)
    expect(bad.body.error.fields[0].path).toBe('email')
    const res = await supertest(t.app)
      .post('/api/auth/password-reset/complete')
      .send({ token: 'abc', password: 'short' })
      .expect(400)
    expect(res.body.error.fields.map((f: { path: string }) => f.path).sort()).toEqual([
      'password',
      'token',
    ])
  })
})
