import supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { wantsEmail } from '../../server/modules/account/notification-settings.ts'
import { PASSWORD, signUp, startTestApp, type TestApp } from './helpers/test-app.ts'

let t: TestApp
beforeAll(() => {
  t = startTestApp()
})
afterAll(() => t.close())

describe('the account page API', () => {
  it('reads and updates name, colour, units and e-mail notifications (on by default)', async () => {
    const agent = supertest.agent(t.app)
    const user = await signUp(agent, 'Tove Aranda')
    const before = await agent.get('/api/account').expect(200)
    expect(before.body.account).toMatchObject({
      email: user.email,
      name: 'Tove Aranda',
      units: 'si',
      notifications: { mentions: true, reviews: true },
    })
    expect(await wantsEmail(t.db, user.id, 'mentions')).toBe(true)

    const res = await agent
      .patch('/api/account')
      .send({
        name: 'Tove A. Aranda',
        color: '#2F7D5B',
        units: 'us',
        notifications: { mentions: false },
      })
      .expect(200)
    expect(res.body.account).toMatchObject({
      name: 'Tove A. Aranda',
      color: '#2f7d5b',
      units: 'us',
      notifications: { mentions: false, reviews: true },
    })
    expect(await wantsEmail(t.db, user.id, 'mentions')).toBe(false)
    expect(await wantsEmail(t.db, user.id, 'reviews')).toBe(true)
    const me = await agent.get('/api/auth/me').expect(200)
    expect(me.body.user).toMatchObject({ name: 'Tove A. Aranda', color: '#2f7d5b', units: 'us' })
  })

  it('answers bad settings with 400 naming each field', async () => {
    const agent = supertest.agent(t.app)
    await signUp(agent)
    const res = await agent
      .patch('/api/account')
      .send({ name: '', color: 'green', units: 'metric', notifications: { mentions: 'yes' } })
      .expect(400)
    expect(res.body.error.fields.map((f: { path: string }) => f.path).sort()).toEqual([
      'color',
      'name',
      'notifications.mentions',
      'units',
    ])
    await agent.patch('/api/account').send({}).expect(400)
  })

  it('changes the password only with the current one, and ends the other sessions', async () => {
    const here = supertest.agent(t.app)
    const user = await signUp(here, 'Ezra Lund')
    const elsewhere = supertest.agent(t.app)
    await elsewhere
      .post('/api/auth/sign-in')
      .send({ email: user.email, password: PASSWORD })
      .expect(200)

    const wrong = await here
      .post('/api/account/password')
      .send({ currentPassword: 'not my password', newPassword: 'a fresh passphrase' })
      .expect(400)
    expect(wrong.body.error.fields[0].path).toBe('currentPassword')
    await elsewhere.get('/api/auth/me').expect(200)

    await here
      .post('/api/account/password')
      .send({ currentPassword: PASSWORD, newPassword: 'a fresh passphrase' })
      .expect(204)
    await here.get('/api/auth/me').expect(200)
    await elsewhere.get('/api/auth/me').expect(401)
    const sessions = await t
      .db('sessions')
      .whereRaw(`sess::jsonb -> 'passport' ->> 'user' = ?`, [user.id])
    expect(sessions).toHaveLength(1)
  })

  it('needs a session', async () => {
    await supertest(t.app).get('/api/account').expect(401)
    await supertest(t.app).patch('/api/account').send({ name: 'X' }).expect(401)
  })
})
