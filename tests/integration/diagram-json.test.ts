import supertest from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { fernhollowHallDiagram } from '../../shared/demo/fernhollow-hall.ts'
import { emptyDiagram, type Diagram } from '../../shared/document/model.ts'
import { applyOperation } from '../../shared/document/operations.ts'
import { exportDiagramJson, parseDiagramJson } from '../../shared/import/diagram-json.ts'
import { replaceDocumentOperation } from '../../shared/import/replace-diagram.ts'
import { signUp, startTestApp, type TestApp } from './helpers/test-app.ts'

let t: TestApp
let editor: supertest.Agent
let projectId: string
const base = () => `/api/projects/${projectId}/diagrams`

beforeAll(async () => {
  t = startTestApp()
  editor = supertest.agent(t.app)
  await signUp(editor, 'Jo Designer')
  projectId = (await editor.post('/api/projects').send({ name: 'Harbour Baths' })).body.project.id
})
afterAll(() => t.close())

const read = async (id: string): Promise<Diagram> =>
  (await editor.get(`${base()}/${id}`).expect(200)).body.diagram.document

function imported(text: string): Diagram {
  const outcome = parseDiagramJson(text)
  if (!outcome.ok) throw new Error(outcome.errors.join('; '))
  return outcome.doc
}

describe('diagram JSON through the API', () => {
  it('export → import as a new diagram gives a deep-equal document', async () => {
    const demo = { ...fernhollowHallDiagram, name: 'Domestic water' }
    const id = (
      await editor.post(base()).send({ name: 'Domestic water', document: demo }).expect(201)
    ).body.diagram.id
    const stored = await read(id)
    expect(stored).toStrictEqual(JSON.parse(JSON.stringify(demo)))

    const file = exportDiagramJson(stored)
    const doc = imported(file)
    const copy = await editor.post(base()).send({ name: doc.name, document: doc }).expect(201)
    expect(copy.body.diagram.id).not.toBe(id)
    const again = await read(copy.body.diagram.id)
    expect(again).toStrictEqual(stored)
    expect(exportDiagramJson(again)).toBe(file)
  })

  it('import replacing a diagram is saved like any edit and reads back as the file (under its own name)', async () => {
    const created = (await editor.post(base()).send({ name: 'Pool hall' }).expect(201)).body.diagram
    const current = await read(created.id)
    const doc = imported(exportDiagramJson(fernhollowHallDiagram))
    const next = applyOperation(current, replaceDocumentOperation(current, doc))
    await editor
      .put(`${base()}/${created.id}/document`)
      .send({ baseRevision: 0, document: next })
      .expect(200)
    expect(await read(created.id)).toStrictEqual(
      JSON.parse(JSON.stringify({ ...doc, name: 'Pool hall' })),
    )
  })

  it('a broken file never reaches the server; a hand-made bad document is refused with the field named', async () => {
    const bad = JSON.parse(exportDiagramJson(emptyDiagram('Bad')))
    bad.nodes = [{ id: 'S1', kind: 'supply', pressureKPa: 'high' }]
    const outcome = parseDiagramJson(JSON.stringify(bad))
    expect(outcome.ok).toBe(false)
    expect(!outcome.ok && outcome.errors[0]).toMatch(/^nodes\.0\.pressureKPa: .*\(S1\)$/)
    const res = await editor.post(base()).send({ name: 'Bad', document: bad }).expect(400)
    expect(JSON.stringify(res.body.error)).toContain('pressureKPa')
  })
})
