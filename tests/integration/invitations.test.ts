import supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { hashToken } from '../../server/modules/account/one-time-token.ts'
import {
  linkToken,
  projectWithTeam,
  startMailTestApp,
  type MailTestApp,
} from './helpers/mail-app.ts'
import { PASSWORD, signUp, uniqueEmail } from './helpers/test-app.ts'

let t: MailTestApp
let world: Awaited<ReturnType<typeof projectWithTeam>>
beforeAll(async () => {
  t = await startMailTestApp()
  world = await projectWithTeam(t, 'Saltmarsh Ferry Terminal')
})
afterAll(() => t.close())

const owner = () => world.team.owner.agent
const invite = (email: string, role = 'reviewer') =>
  owner().post(`/api/projects/${world.projectId}/invitations`).send({ email, role })

describe('invitations by e-mail over SMTP', () => {
  it('mails a single-use link; a new person creates an account and joins with the role', async () => {
    const email = uniqueEmail('rowan')
    const res = await invite(email).expect(201)
    expect(res.body.invitation).toMatchObject({ email, role: 'reviewer', invitedBy: 'Orla Owner' })

    const [message] = await t.mailTo(email)
    expect(message!.subject).toBe('Orla Owner invited you to Saltmarsh Ferry Terminal on Tributary')
    expect(message!.text).toContain('as a reviewer')
    expect(message!.html).toContain('<strong>Saltmarsh Ferry Terminal</strong>')
    const token = linkToken(message!.text, 'invitations')
    expect(message!.html).toContain(`http://tributary.test/invitations/${token}`)

    // Only the hash is stored.
    const row = await t.db('invitations').where({ email }).first()
    expect(row.token_hash).toBe(hashToken(token))
    expect(JSON.stringify(row)).not.toContain(token)

    const preview = await supertest(t.app).get(`/api/invitations/${token}`).expect(200)
    expect(preview.body.invitation).toMatchObject({
      email,
      role: 'reviewer',
      projectName: 'Saltmarsh Ferry Terminal',
      accountExists: false,
    })

    const newcomer = supertest.agent(t.app)
    const joined = await newcomer
      .post('/api/invitations/sign-up')
      .send({ token, name: 'Rowan Achterberg', password: PASSWORD })
      .expect(201)
    expect(joined.body).toMatchObject({
      projectId: world.projectId,
      role: 'reviewer',
      user: { email },
    })
    const project = await newcomer.get(`/api/projects/${world.projectId}`).expect(200)
    expect(project.body.project.role).toBe('reviewer')
    const orgs = await newcomer.get('/api/organisations').expect(200)
    expect(orgs.body.organisations).toEqual([
      expect.objectContaining({ id: world.organisationId, role: 'member' }),
    ])

    // The same link a second time is refused clearly.
    const again = await supertest(t.app).get(`/api/invitations/${token}`).expect(410)
    expect(again.body.error).toMatchObject({
      code: 'link_used',
      message: 'This invitation has already been used',
    })
    await supertest(t.app)
      .post('/api/invitations/sign-up')
      .send({ token, name: 'Copy Cat', password: PASSWORD })
      .expect(410)
  })

  it('lets an existing user sign in and accept, only with the invited address', async () => {
    const invitee = supertest.agent(t.app)
    const user = await signUp(invitee, 'Sasha Ilunga')
    await invite(user.email, 'editor').expect(201)
    const token = linkToken((await t.mailTo(user.email))[0]!.text, 'invitations')
    const preview = await supertest(t.app).get(`/api/invitations/${token}`).expect(200)
    expect(preview.body.invitation.accountExists).toBe(true)

    await supertest(t.app).post('/api/invitations/accept').send({ token }).expect(401)
    const wrongPerson = supertest.agent(t.app)
    await signUp(wrongPerson, 'Not Sasha')
    const refused = await wrongPerson.post('/api/invitations/accept').send({ token }).expect(403)
    expect(refused.body.error.message).toContain(user.email)

    const accepted = await invitee.post('/api/invitations/accept').send({ token }).expect(200)
    expect(accepted.body).toEqual({ projectId: world.projectId, role: 'editor' })
    await invitee.post('/api/invitations/accept').send({ token }).expect(410)
  })

  it('refuses an expired link with a clear error, and an unknown or malformed one', async () => {
    const email = uniqueEmail('late')
    await invite(email).expect(201)
    const token = linkToken((await t.mailTo(email))[0]!.text, 'invitations')
    await t
      .db('invitations')
      .where({ token_hash: hashToken(token) })
      .update({
        expires_at: new Date(Date.now() - 1000),
      })
    const res = await supertest(t.app).get(`/api/invitations/${token}`).expect(410)
    expect(res.body.error).toMatchObject({
      code: 'link_expired',
      message: 'This invitation has expired',
    })
    await supertest(t.app)
      .post('/api/invitations/sign-up')
      .send({ token, name: 'Too Late', password: PASSWORD })
      .expect(410)

    const unknown = await supertest(t.app)
      .get(`/api/invitations/${'x'.repeat(43)}`)
      .expect(404)
    expect(unknown.body.error.code).toBe('link_unknown')
    const malformed = await supertest(t.app).get('/api/invitations/short').expect(400)
    expect(malformed.body.error.fields[0].path).toBe('token')
  })

  it('expires invitations after 7 days', async () => {
    const email = uniqueEmail('week')
    const res = await invite(email).expect(201)
    const days = (Date.parse(res.body.invitation.expiresAt) - Date.now()) / 86_400_000
    expect(days).toBeGreaterThan(6.99)
    expect(days).toBeLessThanOrEqual(7)
  })

  it('withdraws the earlier link when the same address is invited again, and on revoke', async () => {
    const email = uniqueEmail('twice')
    await invite(email, 'viewer').expect(201)
    const first = linkToken((await t.mailTo(email))[0]!.text, 'invitations')
    const second = await invite(email, 'editor').expect(201)
    const res = await supertest(t.app).get(`/api/invitations/${first}`).expect(410)
    expect(res.body.error.code).toBe('link_revoked')

    const pending = await owner().get(`/api/projects/${world.projectId}/invitations`).expect(200)
    expect(
      pending.body.invitations.filter((i: { email: string }) => i.email === email),
    ).toHaveLength(1)

    await owner()
      .delete(`/api/projects/${world.projectId}/invitations/${second.body.invitation.id}`)
      .expect(204)
    const latest = linkToken((await t.mailTo(email))[0]!.text, 'invitations')
    await supertest(t.app).get(`/api/invitations/${latest}`).expect(410)
  })

  it('refuses to invite a member again, a bad address or role, naming the field', async () => {
    const dup = await invite(world.team.viewer.user.email).expect(409)
    expect(dup.body.error.message).toMatch(/^email: /)
    const bad = await owner()
      .post(`/api/projects/${world.projectId}/invitations`)
      .send({ email: 'not an address', role: 'boss' })
      .expect(400)
    expect(bad.body.error.fields.map((f: { path: string }) => f.path).sort()).toEqual([
      'email',
      'role',
    ])
  })

  it('only lets owners invite: a viewer, reviewer or editor gets 403 and no e-mail is sent', async () => {
    for (const role of ['viewer', 'reviewer', 'editor'] as const) {
      const email = uniqueEmail(`by-${role}`)
      const res = await world.team[role].agent
        .post(`/api/projects/${world.projectId}/invitations`)
        .send({ email, role: 'viewer' })
        .expect(403)
      expect(res.body.error.message).toContain(role)
      expect(await t.mailTo(email)).toEqual([])
    }
  })

  it('writes invitations and acceptances to the activity log', async () => {
    const res = await world.team.viewer.agent
      .get(`/api/projects/${world.projectId}/activity`)
      .expect(200)
    const actions = res.body.events.map((e: { action: string }) => e.action)
    expect(actions).toEqual(
      expect.arrayContaining(['member.invited', 'invitation.accepted', 'invitation.revoked']),
    )
    const invited = res.body.events.find((e: { action: string }) => e.action === 'member.invited')
    expect(invited.actor.name).toBe('Orla Owner')
    expect(invited.details).toHaveProperty('email')
  })
})
