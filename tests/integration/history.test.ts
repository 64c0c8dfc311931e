import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { addMember } from '../../server/modules/projects/projects.repo.ts'
import type { Diagram } from '../../shared/document/model.ts'
import type { RevisionListBody } from '../../shared/protocol/history.ts'
import { api, createDiagramAt, signUpAt, waitUntil, type Session } from './helpers/realtime-http.ts'
import { seedDiagram } from './helpers/realtime-random.ts'
import { startRealtimeServer, type RealtimeTestServer } from './helpers/realtime-server.ts'
import { SyncClient } from './helpers/realtime-sync-client.ts'

let srv: RealtimeTestServer
let owner: Session
let viewer: Session
let projectId: string
let diagramId: string
let client: SyncClient
const base = () => `/api/projects/${projectId}/diagrams/${diagramId}`
const byId = (doc: Diagram) => ({
  ...doc,
  nodes: [...doc.nodes].sort((a, b) => a.id.localeCompare(b.id)),
  pipes: [...doc.pipes].sort((a, b) => a.id.localeCompare(b.id)),
})

beforeAll(async () => {
  srv = await startRealtimeServer()
  owner = await signUpAt(srv.url, 'Hana Owner')
  viewer = await signUpAt(srv.url, 'Ivo Viewer')
  ;({ projectId, diagramId } = await createDiagramAt(srv.url, owner, seedDiagram()))
  await addMember(srv.db, projectId, viewer.user.id, 'viewer')
  client = new SyncClient(srv.url, owner.cookie, diagramId)
  await waitUntil(() => client.live, 'join')
})
afterAll(async () => {
  client.close()
  await srv.close()
})

describe('revision history', () => {
  it('lists revisions with author, time and a summary, newest first, in pages', async () => {
    client.edit({ type: 'node.update', id: 'J1', patch: { label: 'Riser A' } })
    client.edit({ type: 'pipe.remove', id: 'P3' })
    client.edit({ type: 'node.remove', id: 'F1' })
    await waitUntil(() => client.synced && client.replica.revision === 3, 'three edits')
    const { body } = await api<RevisionListBody>(
      srv.url,
      viewer,
      'GET',
      `${base()}/revisions`,
      undefined,
      200,
    )
    expect(body.current).toBe(3)
    expect(body.earliest).toBe(0)
    // Revision 0 is the diagram as its creator made it.
    expect(body.revisions.map((r) => r.revision)).toEqual([3, 2, 1, 0])
    expect(body.revisions[3]).toMatchObject({
      author: { id: owner.user.id, name: 'Hana Owner' },
      source: 'create',
      restoredFrom: null,
      summary: 'Created the diagram',
    })
    expect(body.revisions[2]).toMatchObject({
      author: { id: owner.user.id, name: 'Hana Owner' },
      source: 'edit',
      summary: 'changed label of J1',
    })
    expect(Date.parse(body.revisions[0]!.at)).toBeGreaterThan(Date.now() - 60_000)
    const page = await api<RevisionListBody>(
      srv.url,
      viewer,
      'GET',
      `${base()}/revisions?before=3&limit=1`,
    )
    expect(page.body.revisions.map((r) => r.revision)).toEqual([2])
    // The page that reaches revision 1 also carries revision 0.
    const last = await api<RevisionListBody>(
      srv.url,
      viewer,
      'GET',
      `${base()}/revisions?before=2&limit=1`,
    )
    expect(last.body.revisions.map((r) => r.revision)).toEqual([1, 0])
    const bad = await api(srv.url, viewer, 'GET', `${base()}/revisions?limit=0`)
    expect(bad.status).toBe(400)
  })

  it('shows the document as of a revision', async () => {
    const at1 = await api<{ document: Diagram }>(
      srv.url,
      viewer,
      'GET',
      `${base()}/revisions/1`,
      undefined,
      200,
    )
    expect(at1.body.document.nodes.map((n) => n.id)).toContain('F1')
    expect(at1.body.document.nodes.find((n) => n.id === 'J1')!.label).toBe('Riser A')
    const at0 = await api<{ document: Diagram }>(
      srv.url,
      viewer,
      'GET',
      `${base()}/revisions/0`,
      undefined,
      200,
    )
    expect(at0.body.document).toEqual({ ...seedDiagram(), name: 'Domestic water' })
    expect((await api(srv.url, viewer, 'GET', `${base()}/revisions/99`)).status).toBe(404)
    expect((await api(srv.url, viewer, 'GET', `${base()}/revisions/-1`)).status).toBe(400)
  })

  it('restores a revision as a new op that connected clients receive; a viewer may not', async () => {
    const refused = await api(srv.url, viewer, 'POST', `${base()}/restore`, { revision: 1 })
    expect(refused.status).toBe(403)
    const restored = await api<{ revision: number }>(
      srv.url,
      owner,
      'POST',
      `${base()}/restore`,
      { revision: 1 },
      200,
    )
    expect(restored.body).toEqual({ revision: 4, restoredFrom: 1 })
    await waitUntil(() => client.replica.revision === 4, 'restore broadcast')
    const at1 = (await api<{ document: Diagram }>(srv.url, owner, 'GET', `${base()}/revisions/1`))
      .body.document
    expect(byId(client.replica.confirmed)).toEqual(byId(at1))
    const row = await srv.db('diagrams').where({ id: diagramId }).first<{ document: Diagram }>()
    expect(row!.document).toEqual(client.replica.confirmed)
    const list = await api<RevisionListBody>(srv.url, owner, 'GET', `${base()}/revisions?limit=1`)
    expect(list.body.revisions[0]).toMatchObject({
      revision: 4,
      source: 'restore',
      restoredFrom: 1,
    })
    const missing = await api(srv.url, owner, 'POST', `${base()}/restore`, { revision: 'one' })
    expect(missing.status).toBe(400)
    expect(JSON.stringify(missing.body)).toMatch(/revision/)
  })

  it('records a whole-document save in the log and rebuilds any revision past a snapshot', async () => {
    const row = (await srv
      .db('diagrams')
      .where({ id: diagramId })
      .first<{ document: Diagram; revision: number }>())!
    const saved = { ...row.document, settings: { ...row.document.settings, fittingAllowance: 0.4 } }
    await api(
      srv.url,
      owner,
      'PUT',
      `/api/projects/${projectId}/diagrams/${diagramId}/document`,
      {
        baseRevision: row.revision,
        document: saved,
      },
      200,
    )
    const list = await api<RevisionListBody>(srv.url, owner, 'GET', `${base()}/revisions?limit=1`)
    expect(list.body.revisions[0]).toMatchObject({
      source: 'save',
      summary: 'changed settings: fitting allowance',
    })
    await waitUntil(() => client.replica.revision === row.revision + 1, 'save broadcast')

    // Past revision 100 a snapshot is kept; views on either side of it still replay correctly.
    for (let i = 0; i < 110; i++)
      client.edit({ type: 'node.move', id: 'J2', position: { x: i, y: i } })
    await waitUntil(() => client.synced, 'many edits', 15_000)
    const snapshots = await srv
      .db('diagram_snapshots')
      .where({ diagram_id: diagramId })
      .pluck('revision')
    expect(snapshots.length).toBeGreaterThanOrEqual(2)
    const at = async (r: number) =>
      (
        await api<{ document: Diagram }>(
          srv.url,
          owner,
          'GET',
          `${base()}/revisions/${r}`,
          undefined,
          200,
        )
      ).body.document
    const current = client.replica.revision
    expect(await at(current)).toEqual(client.replica.confirmed)
    expect((await at(60)).nodes.find((n) => n.id === 'J2')!.position).toEqual({
      x: 60 - 6,
      y: 60 - 6,
    })
  })
})
