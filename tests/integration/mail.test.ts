import nodemailer from 'nodemailer'
import supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startFakeSmtp, type FakeSmtp } from '../../server/mail/fake-smtp.ts'
import { createMailer, withFakeSmtp } from '../../server/mail/mailer.ts'
import { invitationMail } from '../../server/mail/templates/invitation.ts'
import { startMailTestApp, type MailTestApp } from './helpers/mail-app.ts'
import { signUp, startTestApp, uniqueEmail } from './helpers/test-app.ts'

let t: MailTestApp
let smtp: FakeSmtp
beforeAll(async () => {
  t = await startMailTestApp()
  smtp = t.smtp
})
afterAll(() => t.close())

describe('the local fake SMTP server', () => {
  it('receives a real SMTP conversation and stores subject, text and HTML (UTF-8, long lines)', async () => {
    const to = uniqueEmail('Mixed.Case')
    const transport = nodemailer.createTransport({
      host: smtp.host,
      port: smtp.port,
      secure: false,
    })
    const long = 'Flush valve battery on level 2 — Zoë’s washroom. '.repeat(6)
    const info = await transport.sendMail({
      from: 'Tributary <no-reply@tributary.example.test>',
      to,
      subject: 'Prüfung: 100 % — Hunter’s curve',
      text: long,
      html: `<p>${long}</p>`,
    })
    expect(info.accepted).toEqual([to])
    const [row] = await t.mailTo(to)
    expect(row).toMatchObject({
      subject: 'Prüfung: 100 % — Hunter’s curve',
      text: long.trimEnd(),
      html: `<p>${long}</p>`,
    })
    expect(row!.mail_from).toBe('Tributary <no-reply@tributary.example.test>')
  })

  it('escapes user text in the HTML part and keeps it plain in the text part', async () => {
    const mailer = createMailer(withFakeSmtp(t.env, smtp))
    const to = uniqueEmail('escape')
    await mailer.send(
      invitationMail({
        to,
        inviterName: 'Mallory <script>alert(1)</script>',
        projectName: 'Pump "A" & Sons',
        organisationName: "O'Neill & Co",
        role: 'editor',
        link: 'http://tributary.test/invitations/abc',
        expiresAt: new Date('2027-01-08T10:00:00Z'),
      }),
    )
    const [row] = await t.mailTo(to)
    expect(row!.html).not.toContain('<script>')
    expect(row!.html).toContain('Mallory &lt;script&gt;alert(1)&lt;/script&gt;')
    expect(row!.html).toContain('Pump &quot;A&quot; &amp; Sons')
    expect(row!.text).toContain(
      'invited you to the project "Pump "A" & Sons" on Tributary as an editor',
    )
    expect(row!.text).toContain('8 January 2027 at 10:00 UTC')
  })

  it('turns a failed delivery into a clear 502 and keeps no invitation or reset link behind', async () => {
    const dead = await startFakeSmtp(t.db, 0)
    await dead.close()
    const broken = startTestApp({ SMTP_HOST: '127.0.0.1', SMTP_PORT: String(dead.port) })
    try {
      const owner = supertest.agent(broken.app)
      await signUp(owner)
      const project = await owner.post('/api/projects').send({ name: 'Unsent' }).expect(201)
      const email = uniqueEmail('unsent')
      const res = await owner
        .post(`/api/projects/${project.body.project.id}/invitations`)
        .send({ email, role: 'viewer' })
        .expect(502)
      expect(res.body.error).toMatchObject({ code: 'mail_failed' })
      expect(await broken.db('invitations').where({ email })).toEqual([])

      // A reset link whose mail fails is taken back (the request itself was answered at once).
      const me = await signUp(supertest.agent(broken.app), 'Unsent Reset')
      await supertest(broken.app)
        .post('/api/auth/password-reset/request')
        .send({ email: me.email })
        .expect(202)
      const resets = () => broken.db('password_resets').where({ user_id: me.id })
      // The mail fails within milliseconds; give the background work ample time either way.
      const end = Date.now() + 1_500
      let seen = false
      while (Date.now() < end) {
        const rows = await resets()
        if (rows.length) seen = true
        if (seen && !rows.length) break
        await new Promise((resolve) => setTimeout(resolve, 10))
      }
      expect(await resets()).toEqual([])
    } finally {
      await broken.close()
    }
  })

  it('shows captured mail to organisation admins only', async () => {
    const admin = supertest.agent(t.app)
    const adminUser = await signUp(admin, 'Mailbox Admin')
    await supertest(t.app)
      .post('/api/auth/password-reset/request')
      .send({ email: adminUser.email })
      .expect(202)
    // The request answers before the mail goes out: wait for it.
    let res = await admin.get('/api/dev/mail').query({ to: adminUser.email }).expect(200)
    for (let i = 0; i < 100 && res.body.messages.length === 0; i++) {
      await new Promise((resolve) => setTimeout(resolve, 50))
      res = await admin.get('/api/dev/mail').query({ to: adminUser.email }).expect(200)
    }
    expect(res.body.messages[0]).toMatchObject({
      to: [adminUser.email],
      subject: 'Choose a new Tributary password',
    })
    expect((await admin.get('/api/dev/mail/access').expect(200)).body).toEqual({ available: true })

    // Another self-registered user administers only a personal organisation: their own mail only.
    const stranger = supertest.agent(t.app)
    const strangerUser = await signUp(stranger, 'Curious Stranger')
    const seen = (await stranger.get('/api/dev/mail').expect(200)).body.messages as {
      to: string[]
    }[]
    expect(seen.flatMap((m) => m.to)).not.toContain(adminUser.email)
    expect(seen.every((m) => m.to.includes(strangerUser.email))).toBe(true)

    // An invited newcomer belongs to no organisation as admin.
    const plain = supertest.agent(t.app)
    const user = await signUp(plain)
    await t.db('organisation_members').where({ user_id: user.id }).update({ role: 'member' })
    await plain.get('/api/dev/mail').expect(403)
    expect((await plain.get('/api/dev/mail/access').expect(200)).body).toEqual({ available: false })
    await supertest(t.app).get('/api/dev/mail').expect(401)
  })

  it('hides the mailbox in production', async () => {
    const prod = startTestApp({
      NODE_ENV: 'production',
      SESSION_SECRET: 'a-production-secret-for-tests',
    })
    try {
      const admin = supertest.agent(prod.app)
      await signUp(admin)
      await admin.get('/api/dev/mail').expect(404)
      expect((await admin.get('/api/dev/mail/access').expect(200)).body).toEqual({
        available: false,
      })
    } finally {
      await prod.close()
    }
  })
})
