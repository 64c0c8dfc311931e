import supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { addMember } from '../../server/modules/projects/projects.repo.ts'
import { emptyDiagram } from '../../shared/document/model.ts'
import { signUp, startTestApp, type TestApp } from './helpers/test-app.ts'

let t: TestApp
let editor: supertest.Agent
let viewer: supertest.Agent
let projectId: string
const base = () => `/api/projects/${projectId}/diagrams`

beforeAll(async () => {
  t = startTestApp()
  editor = supertest.agent(t.app)
  const editorUser = await signUp(editor, 'Edie Editor')
  projectId = (await editor.post('/api/projects').send({ name: 'Harbour Gym' })).body.project.id
  viewer = supertest.agent(t.app)
  const viewerUser = await signUp(viewer, 'Vic Viewer')
  await addMember(t.db, projectId, viewerUser.id, 'viewer')
  expect(editorUser.id).toBeTruthy()
})
afterAll(() => t.close())

const withJunction = (name: string) => ({
  ...emptyDiagram(name),
  nodes: [
    { id: 'S1', kind: 'supply', label: 'Street main', elevationM: 0, pressureKPa: 400 },
    { id: 'J1', kind: 'junction', label: '', elevationM: 0 },
  ],
  pipes: [{ id: 'P1', from: 'S1', to: 'J1', system: 'cold', lengthM: 12 }],
})

describe('diagrams are stored in PostgreSQL with a revision', () => {
  it('creates, lists with who edited, reads, saves and refuses a stale save', async () => {
    const created = await editor.post(base()).send({ name: 'Domestic water' }).expect(201)
    const id = created.body.diagram.id
    expect(created.body.diagram).toMatchObject({ name: 'Domestic water', revision: 0 })
    expect(created.body.diagram.document.nodes).toEqual([])

    const list = await viewer.get(base()).expect(200)
    expect(list.body.diagrams[0]).toMatchObject({ id, updatedBy: { name: 'Edie Editor' } })

    const doc = withJunction('Domestic water')
    const saved = await editor
      .put(`${base()}/${id}/document`)
      .send({ baseRevision: 0, document: doc })
      .expect(200)
    expect(saved.body.revision).toBe(1)
    const read = await viewer.get(`${base()}/${id}`).expect(200)
    expect(read.body.diagram.revision).toBe(1)
    expect(read.body.diagram.document.pipes).toEqual([
      { id: 'P1', from: 'S1', to: 'J1', system: 'cold', lengthM: 12 },
    ])

    const stale = await editor
      .put(`${base()}/${id}/document`)
      .send({ baseRevision: 0, document: doc })
      .expect(409)
    expect(stale.body.error.message).toMatch(/revision 1/)
  })

  it('refuses a malformed document with 400 naming the field, and keeps the stored one', async () => {
    const id = (await editor.post(base()).send({ name: 'Bad input' }).expect(201)).body.diagram.id
    const bad = withJunction('x')
    ;(bad.nodes[0] as { pressureKPa: unknown }).pressureKPa = 'lots'
    const res = await editor
      .put(`${base()}/${id}/document`)
      .send({ baseRevision: 0, document: bad })
      .expect(400)
    expect(res.body.error.fields[0].path).toBe('document.nodes.0.pressureKPa')
    const read = await editor.get(`${base()}/${id}`).expect(200)
    expect(read.body.diagram.revision).toBe(0)
  })

  it('renames, duplicates and deletes', async () => {
    const id = (await editor.post(base()).send({ name: 'Hot water' }).expect(201)).body.diagram.id
    await editor
      .put(`${base()}/${id}/document`)
      .send({ baseRevision: 0, document: withJunction('Hot water') })
      .expect(200)
    const renamed = await editor
      .patch(`${base()}/${id}`)
      .send({ name: 'Hot water, level 2' })
      .expect(200)
    expect(renamed.body.diagram.document.name).toBe('Hot water, level 2')
    // A later whole-document save made on the old name does not undo the rename.
    await editor
      .put(`${base()}/${id}/document`)
      .send({ baseRevision: renamed.body.diagram.revision, document: withJunction('Hot water') })
      .expect(200)
    const reread = await editor.get(`${base()}/${id}`).expect(200)
    expect(reread.body.diagram.name).toBe('Hot water, level 2')
    expect(reread.body.diagram.document.name).toBe('Hot water, level 2')
    const copy = await editor.post(`${base()}/${id}/duplicate`).expect(201)
    expect(copy.body.diagram.name).toBe('Hot water, level 2 (copy)')
    expect(copy.body.diagram.document.nodes).toHaveLength(2)
    await editor.delete(`${base()}/${id}`).expect(204)
    await editor.get(`${base()}/${id}`).expect(404)
    await editor.get(`${base()}/${copy.body.diagram.id}`).expect(200)
  })

  it('lets a viewer read but never write', async () => {
    const id = (await editor.post(base()).send({ name: 'Read only' }).expect(201)).body.diagram.id
    await viewer.get(`${base()}/${id}`).expect(200)
    await viewer.post(base()).send({ name: 'Mine' }).expect(403)
    await viewer
      .put(`${base()}/${id}/document`)
      .send({ baseRevision: 0, document: withJunction('x') })
      .expect(403)
    await viewer.patch(`${base()}/${id}`).send({ name: 'Renamed' }).expect(403)
    await viewer.delete(`${base()}/${id}`).expect(403)
    await editor.get(`${base()}/not-a-uuid`).expect(404)
  })
})
