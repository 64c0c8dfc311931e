import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Diagram } from '../../shared/document/model.ts'
import { EVENTS } from '../../shared/protocol/events.ts'
import { api, waitUntil, type Session } from './helpers/realtime-http.ts'
import type { RealtimeTestServer } from './helpers/realtime-server.ts'
import { startRiserWorld, type RiserWorld } from './helpers/riser-world.ts'

let srv: RealtimeTestServer
let owner: Session
let editor: Session
let reviewer: Session
let projectId: string
let diagramId: string
let world: RiserWorld
const client = (session: Session) => world.client(session)
const stored = async () =>
  (await srv
    .db('diagrams')
    .where({ id: diagramId })
    .first<{ document: Diagram; revision: number }>())!

beforeAll(async () => {
  world = await startRiserWorld()
  ;({ srv, owner, editor, reviewer, projectId, diagramId } = world)
})
afterAll(() => world.close())

describe('two designers edit one diagram', () => {
  it('converge, keep both edits to different properties, and store what they show', async () => {
    const a = client(owner)
    const b = client(editor)
    await waitUntil(() => a.live && b.live, 'both clients to join')
    // Different properties of the same node, at the same moment: both survive.
    a.edit({ type: 'node.update', id: 'F1', patch: { label: 'Basin, level 2' } })
    b.edit({ type: 'node.update', id: 'F1', patch: { count: 3 } })
    // The same property: the later revision wins, and both agree on which that is.
    a.edit({ type: 'node.move', id: 'J2', position: { x: 10, y: 10 } })
    b.edit({ type: 'node.move', id: 'J2', position: { x: 99, y: 99 } })
    await waitUntil(
      () => a.synced && b.synced && a.replica.revision === 4 && b.replica.revision === 4,
      'convergence',
    )

    expect(a.replica.confirmed).toEqual(b.replica.confirmed)
    const f1 = a.replica.confirmed.nodes.find((n) => n.id === 'F1')!
    expect(f1).toMatchObject({ label: 'Basin, level 2', count: 3 })
    const row = await stored()
    expect(row.revision).toBe(4)
    expect(row.document).toEqual(a.replica.confirmed)
    const ops = await srv.db('diagram_ops').where({ diagram_id: diagramId }).orderBy('revision')
    expect(ops.map((o) => o.revision)).toEqual([1, 2, 3, 4])
  })

  it('refuses a pipe that would close a loop or add a second inlet, with the reason, and rolls it back', async () => {
    const a = client(owner)
    await waitUntil(() => a.live, 'join')
    const before = a.replica.revision
    // Sent raw so the local check cannot stop it first: the server must refuse it.
    const loop = { id: 'P9', from: 'F1', to: 'J1', system: 'cold' as const, lengthM: 3 }
    a.socket.emit(EVENTS.opSubmit, {
      diagramId,
      clientOpId: crypto.randomUUID(),
      baseRevision: before,
      op: { type: 'pipe.add', pipe: loop },
    })
    const inlet = { id: 'P8', from: 'J1', to: 'F1', system: 'cold' as const, lengthM: 3 }
    a.socket.emit(EVENTS.opSubmit, {
      diagramId,
      clientOpId: crypto.randomUUID(),
      baseRevision: before,
      op: { type: 'pipe.add', pipe: inlet },
    })
    await waitUntil(() => a.rejects.length === 2, 'two rejects')
    expect(a.rejects[0]).toMatchObject({
      code: 'graph-rule',
      reason: expect.stringMatching(/close a loop/),
    })
    expect(a.rejects[1]).toMatchObject({
      code: 'graph-rule',
      reason: expect.stringMatching(/inlet/),
    })
    expect((await stored()).revision).toBe(before)
  })

  it('lets a reviewer watch edits but refuses its own edits', async () => {
    const watcher = client(reviewer)
    const a = client(owner)
    await waitUntil(() => watcher.live && a.live, 'join')
    a.edit({ type: 'node.update', id: 'J1', patch: { label: 'Riser base' } })
    await waitUntil(
      () => watcher.replica.revision === a.replica.revision && a.synced,
      'reviewer receives',
    )
    expect(watcher.replica.confirmed.nodes.find((n) => n.id === 'J1')!.label).toBe('Riser base')

    const revision = (await stored()).revision
    watcher.edit({ type: 'node.update', id: 'J1', patch: { label: 'Mine now' } })
    await waitUntil(() => watcher.rejects.length === 1, 'reject')
    expect(watcher.rejects[0]).toMatchObject({
      code: 'forbidden',
      reason: expect.stringMatching(/reviewer/),
    })
    expect(watcher.notices.at(-1)).toMatchObject({ kind: 'rejected' })
    expect(watcher.replica.view.nodes.find((n) => n.id === 'J1')!.label).toBe('Riser base')
    expect((await stored()).revision).toBe(revision)
  })

  it('refuses the next edit of an editor demoted between two edits', async () => {
    // The first edit leaves the editor's role in the op cache; the second must still be checked
    // against the database, not against that cache.
    const e = client(editor)
    await waitUntil(() => e.live, 'join')
    e.edit({ type: 'node.update', id: 'J2', patch: { label: 'Level 3 branch' } })
    await waitUntil(() => e.synced, 'first edit acknowledged')
    const revision = (await stored()).revision
    const member = { project_id: projectId, user_id: editor.user.id }
    await srv.db('project_members').where(member).update({ role: 'viewer' })
    try {
      e.edit({ type: 'node.update', id: 'J2', patch: { label: 'Not any more' } })
      await waitUntil(() => e.rejects.length === 1, 'reject')
      expect(e.rejects[0]).toMatchObject({
        code: 'forbidden',
        reason: expect.stringMatching(/viewer/),
      })
      expect((await stored()).revision).toBe(revision)
    } finally {
      await srv.db('project_members').where(member).update({ role: 'editor' })
    }
  })

  it('never applies a resent op twice', async () => {
    const a = client(owner)
    await waitUntil(() => a.live, 'join')
    const submit = {
      diagramId,
      clientOpId: crypto.randomUUID(),
      baseRevision: a.replica.revision,
      op: {
        type: 'node.add' as const,
        node: { id: 'J7', kind: 'junction' as const, label: '', elevationM: 0 },
      },
    }
    a.socket.emit(EVENTS.opSubmit, submit)
    a.socket.emit(EVENTS.opSubmit, submit)
    await waitUntil(() => a.acked.has(submit.clientOpId), 'ack')
    await waitUntil(
      () => (a.socket as unknown as { sendBuffer: unknown[] }).sendBuffer.length === 0,
      'sent',
    )
    const rows = await srv
      .db('diagram_ops')
      .where({ diagram_id: diagramId, client_op_id: submit.clientOpId })
    expect(rows).toHaveLength(1)
    expect((await stored()).document.nodes.filter((n) => n.id === 'J7')).toHaveLength(1)
  })

  it('broadcasts a whole-document save made over HTTP to everyone in the room', async () => {
    const a = client(editor)
    await waitUntil(() => a.live, 'join')
    const row = await stored()
    const doc = {
      ...row.document,
      nodes: row.document.nodes.map((n) => (n.id === 'J2' ? { ...n, label: 'Saved' } : n)),
    }
    await api(
      srv.url,
      owner,
      'PUT',
      `/api/projects/${projectId}/diagrams/${diagramId}/document`,
      {
        baseRevision: row.revision,
        document: doc,
      },
      200,
    )
    await waitUntil(() => a.replica.revision === row.revision + 1, 'save broadcast')
    expect(a.replica.confirmed.nodes.find((n) => n.id === 'J2')!.label).toBe('Saved')
    expect((await stored()).document).toEqual(a.replica.confirmed)
  })
})
