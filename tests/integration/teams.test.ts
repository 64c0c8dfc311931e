import supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { projectWithTeam, startMailTestApp, type MailTestApp } from './helpers/mail-app.ts'
import { signUp } from './helpers/test-app.ts'

let t: MailTestApp
beforeAll(async () => {
  t = await startMailTestApp()
})
afterAll(() => t.close())

const actions = async (agent: supertest.Agent, projectId: string) =>
  (await agent.get(`/api/projects/${projectId}/activity`).expect(200)).body.events.map(
    (e: { action: string }) => e.action,
  )

describe('project members and roles', () => {
  it('lists the members for every member, owners first', async () => {
    const { projectId, team } = await projectWithTeam(t)
    const res = await team.viewer.agent.get(`/api/projects/${projectId}/members`).expect(200)
    expect(res.body.members.map((m: { role: string }) => m.role)).toEqual([
      'owner',
      'editor',
      'reviewer',
      'viewer',
    ])
    expect(res.body.members[0]).toMatchObject({ name: 'Orla Owner', email: team.owner.user.email })
  })

  it('lets only the owner change roles, and logs who changed what', async () => {
    const { projectId, team } = await projectWithTeam(t)
    const path = `/api/projects/${projectId}/members/${team.viewer.user.id}`
    for (const role of ['editor', 'reviewer', 'viewer'] as const) {
      const res = await team[role].agent.patch(path).send({ role: 'editor' }).expect(403)
      expect(res.body.error.message).toContain(role)
    }
    const res = await team.owner.agent.patch(path).send({ role: 'reviewer' }).expect(200)
    expect(res.body.member).toMatchObject({ userId: team.viewer.user.id, role: 'reviewer' })
    await team.viewer.agent.get(`/api/projects/${projectId}`).expect(200)
    expect((await team.viewer.agent.get(`/api/projects/${projectId}`)).body.project.role).toBe(
      'reviewer',
    )

    const log = await team.owner.agent.get(`/api/projects/${projectId}/activity`).expect(200)
    expect(log.body.events[0]).toMatchObject({
      action: 'member.role_changed',
      actor: { id: team.owner.user.id, name: 'Orla Owner' },
      details: { userId: team.viewer.user.id, from: 'viewer', to: 'reviewer' },
    })
    expect(Date.parse(log.body.events[0].createdAt)).toBeGreaterThan(Date.now() - 60_000)
  })

  it('answers a bad role with 400 naming the field, an unknown member with 404', async () => {
    const { projectId, team } = await projectWithTeam(t)
    const bad = await team.owner.agent
      .patch(`/api/projects/${projectId}/members/${team.editor.user.id}`)
      .send({ role: 'chief' })
      .expect(400)
    expect(bad.body.error.fields[0].path).toBe('role')
    const stranger = await signUp(supertest.agent(t.app), 'Stranger')
    await team.owner.agent
      .patch(`/api/projects/${projectId}/members/${stranger.id}`)
      .send({ role: 'viewer' })
      .expect(404)
    await team.owner.agent.delete(`/api/projects/${projectId}/members/not-a-uuid`).expect(404)
  })

  it('never lets the last owner be demoted or leave; a second owner makes it possible', async () => {
    const { projectId, team } = await projectWithTeam(t)
    const self = `/api/projects/${projectId}/members/${team.owner.user.id}`
    const demote = await team.owner.agent.patch(self).send({ role: 'editor' }).expect(409)
    expect(demote.body.error.message).toContain('last owner')
    await team.owner.agent.delete(`/api/projects/${projectId}/members/me`).expect(409)
    await team.owner.agent.delete(self).expect(409)

    await team.owner.agent
      .patch(`/api/projects/${projectId}/members/${team.editor.user.id}`)
      .send({ role: 'owner' })
      .expect(200)
    await team.owner.agent.patch(self).send({ role: 'editor' }).expect(200)
    // Now the former editor is the only owner.
    await team.editor.agent
      .patch(`/api/projects/${projectId}/members/${team.editor.user.id}`)
      .send({ role: 'viewer' })
      .expect(409)
  })

  it('lets any member leave, and owners remove others; both are logged', async () => {
    const { projectId, team } = await projectWithTeam(t)
    await team.reviewer.agent.delete(`/api/projects/${projectId}/members/me`).expect(204)
    await team.reviewer.agent.get(`/api/projects/${projectId}`).expect(404)

    await team.editor.agent
      .delete(`/api/projects/${projectId}/members/${team.viewer.user.id}`)
      .expect(403)
    await team.owner.agent
      .delete(`/api/projects/${projectId}/members/${team.viewer.user.id}`)
      .expect(204)
    await team.viewer.agent.get(`/api/projects/${projectId}`).expect(404)

    expect(await actions(team.owner.agent, projectId)).toEqual(
      expect.arrayContaining(['member.left', 'member.removed', 'project.created']),
    )
  })
})

describe('organisations', () => {
  it('gives a new account a personal organisation that holds its projects', async () => {
    const agent = supertest.agent(t.app)
    await signUp(agent, 'Perry Quist')
    const orgs = await agent.get('/api/organisations').expect(200)
    expect(orgs.body.organisations).toEqual([
      expect.objectContaining({ name: "Perry Quist's practice", role: 'admin', memberCount: 1 }),
    ])
    const project = await agent.post('/api/projects').send({ name: 'Depot' }).expect(201)
    expect(project.body.project.organisationId).toBe(orgs.body.organisations[0].id)
    expect(project.body.project.organisationName).toBe("Perry Quist's practice")
  })

  it('creates projects only in an organisation the user belongs to', async () => {
    const a = supertest.agent(t.app)
    const b = supertest.agent(t.app)
    await signUp(a, 'Ada Firm')
    await signUp(b, 'Bo Other')
    const created = await a.post('/api/organisations').send({ name: 'Ashgrove Design' }).expect(201)
    const orgId = created.body.organisation.id
    await a.post('/api/projects').send({ name: 'School', organisationId: orgId }).expect(201)
    const res = await b
      .post('/api/projects')
      .send({ name: 'Sneaky', organisationId: orgId })
      .expect(404)
    expect(res.body.error.fields[0].path).toBe('organisationId')
  })

  it('lets admins add, promote and remove members; members cannot; the last admin stays', async () => {
    const admin = supertest.agent(t.app)
    const other = supertest.agent(t.app)
    await signUp(admin, 'Ines Admin')
    const otherUser = await signUp(other, 'Milo Member')
    const org = (
      await admin.post('/api/organisations').send({ name: 'Coldwell Partners' }).expect(201)
    ).body.organisation
    const members = `/api/organisations/${org.id}/members`

    await other.get(members).expect(404)
    const added = await admin.post(members).send({ email: otherUser.email }).expect(201)
    expect(added.body.member).toMatchObject({ userId: otherUser.id, role: 'member' })
    await admin.post(members).send({ email: otherUser.email }).expect(409)
    const missing = await admin
      .post(members)
      .send({ email: 'nobody-here@example.test' })
      .expect(404)
    expect(missing.body.error.fields[0].path).toBe('email')

    await other.get(members).expect(200)
    await other.post(members).send({ email: 'x@example.test' }).expect(403)
    await other.patch(`${members}/${otherUser.id}`).send({ role: 'admin' }).expect(403)

    const me = (await admin.get('/api/auth/me')).body.user.id
    await admin.patch(`${members}/${me}`).send({ role: 'member' }).expect(409)
    await admin.delete(`${members}/${me}`).expect(409)
    await admin.patch(`${members}/${otherUser.id}`).send({ role: 'admin' }).expect(200)
    await admin.patch(`${members}/${me}`).send({ role: 'member' }).expect(200)
    await admin.post(members).send({ email: 'x@example.test' }).expect(403)
    await other.delete(`${members}/${me}`).expect(204)
    await admin.get(members).expect(404)
  })

  it('refuses to remove someone from the organisation while they are the last owner of its project', async () => {
    const { organisationId, team } = await projectWithTeam(t, 'Harbour Baths')
    const members = `/api/organisations/${organisationId}/members`
    await team.owner.agent
      .post(members)
      .send({ email: team.editor.user.email, role: 'admin' })
      .expect(201)
    const res = await team.editor.agent.delete(`${members}/${team.owner.user.id}`).expect(409)
    expect(res.body.error.message).toContain('Harbour Baths')
  })
})
