import supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { addMember } from '../../server/modules/projects/projects.repo.ts'
import type { ProjectRole } from '../../shared/auth/roles.ts'
import { signUp, startTestApp, type TestApp } from './helpers/test-app.ts'

let t: TestApp
let owner: supertest.Agent
let projectId: string
const members = {} as Record<Exclude<ProjectRole, 'owner'>, supertest.Agent>

beforeAll(async () => {
  t = startTestApp()
  owner = supertest.agent(t.app)
  await signUp(owner, 'Olive Owner')
  const res = await owner.post('/api/projects').send({ name: 'Lakeside Clinic' }).expect(201)
  projectId = res.body.project.id
  for (const role of ['editor', 'reviewer', 'viewer'] as const) {
    const agent = supertest.agent(t.app)
    const user = await signUp(agent, `${role} person`)
    await addMember(t.db, projectId, user.id, role)
    members[role] = agent
  }
})
afterAll(() => t.close())

describe('project roles are enforced on the server', () => {
  it('makes the creator the owner and lists the project with the role', async () => {
    const res = await owner.get('/api/projects').expect(200)
    expect(res.body.projects).toEqual([
      expect.objectContaining({
        id: projectId,
        name: 'Lakeside Clinic',
        role: 'owner',
        units: 'si',
      }),
    ])
  })

  it.each([
    ['viewer', 403],
    ['reviewer', 403],
    ['editor', 200],
  ] as const)('lets a %s change the project: %i', async (role, status) => {
    const res = await members[role].patch(`/api/projects/${projectId}`).send({ description: role })
    expect(res.status).toBe(status)
    if (status === 403) expect(res.body.error.message).toContain(role)
  })

  it('lets every member read the project', async () => {
    for (const role of ['viewer', 'reviewer', 'editor'] as const) {
      const res = await members[role].get(`/api/projects/${projectId}`).expect(200)
      expect(res.body.project.role).toBe(role)
    }
  })

  it('hides the project from people who are not members (404) and from anonymous users (401)', async () => {
    const stranger = supertest.agent(t.app)
    await signUp(stranger, 'Stranger')
    await stranger.get(`/api/projects/${projectId}`).expect(404)
    await supertest(t.app).get(`/api/projects/${projectId}`).expect(401)
    await stranger.get('/api/projects/not-a-uuid').expect(404)
  })

  it('only lets the owner delete the project', async () => {
    await members.editor.delete(`/api/projects/${projectId}`).expect(403)
    const res = await owner.post('/api/projects').send({ name: 'Scratch' }).expect(201)
    await owner.delete(`/api/projects/${res.body.project.id}`).expect(204)
    await owner.get(`/api/projects/${res.body.project.id}`).expect(404)
  })

  it('answers a malformed project body with 400 naming the field', async () => {
    const res = await owner
      .patch(`/api/projects/${projectId}`)
      .send({ units: 'imperial' })
      .expect(400)
    expect(res.body.error.fields[0].path).toBe('units')
    await owner.post('/api/projects').send({ name: '   ' }).expect(400)
  })
})
