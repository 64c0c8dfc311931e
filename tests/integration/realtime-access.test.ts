import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { addMember } from '../../server/modules/projects/projects.repo.ts'
import { EVENTS } from '../../shared/protocol/events.ts'
import type {
  MessageRefused,
  OpReject,
  PresenceCursorRelay,
} from '../../shared/protocol/server-messages.ts'
import { signUpAt, waitUntil, type Session } from './helpers/realtime-http.ts'
import type { RealtimeTestServer } from './helpers/realtime-server.ts'
import { startRiserWorld, type RiserWorld } from './helpers/riser-world.ts'
import { openSocket } from './helpers/realtime-sync-client.ts'

let srv: RealtimeTestServer
let owner: Session
let editor: Session
let projectId: string
let diagramId: string
let world: RiserWorld
const client = (session: Session) => world.client(session)
beforeAll(async () => {
  world = await startRiserWorld()
  ;({ srv, owner, editor, projectId, diagramId } = world)
})
afterAll(() => world.close())

describe('presence', () => {
  it('lists who is in the diagram with initials and colour, shares selections, relays cursors', async () => {
    const viewer = await signUpAt(srv.url, 'Vera Viewer')
    await addMember(srv.db, projectId, viewer.user.id, 'viewer')
    const a = client(owner)
    const b = client(viewer)
    await waitUntil(() => a.live && b.live, 'join')
    await waitUntil(
      () => !!a.presence?.members.some((m) => m.userId === viewer.user.id),
      'presence of both',
    )
    const names = a.presence!.members.map((m) => m.name)
    expect(names).toEqual(expect.arrayContaining(['Orla Owner', 'Vera Viewer']))
    const orla = a.presence!.members.find((m) => m.userId === owner.user.id)!
    expect(orla).toMatchObject({
      initials: 'OO',
      color: expect.stringMatching(/^#[0-9a-f]{6}$/),
      role: 'owner',
    })

    b.socket.emit(EVENTS.presenceUpdate, { diagramId, selection: { nodes: ['J2'], pipes: ['P2'] } })
    await waitUntil(
      () =>
        a.presence!.members.some(
          (m) => m.userId === viewer.user.id && m.selection.nodes.includes('J2'),
        ),
      'selection shared',
    )
    const cursors: PresenceCursorRelay[] = []
    a.socket.on(EVENTS.presenceCursor, (m) => cursors.push(m))
    b.socket.emit(EVENTS.presenceCursor, { diagramId, x: 120, y: 48 })
    await waitUntil(() => cursors.length > 0, 'cursor')
    expect(cursors[0]).toMatchObject({ diagramId, userId: viewer.user.id, x: 120, y: 48 })

    b.close()
    await waitUntil(
      () => !a.presence!.members.some((m) => m.userId === viewer.user.id),
      'leave on disconnect',
    )
  })

  it('still changes within a second or two when another server process went away unannounced', async () => {
    // A heartbeat from a process that then says nothing more: the adapter counts it for ~10 s.
    const ghost = { uid: `ghost-${Date.now()}`, nsp: '/', type: 2 }
    await srv.db.raw('SELECT pg_notify(?, ?)', ['socket.io#/', JSON.stringify(ghost)])
    await new Promise((resolve) => setTimeout(resolve, 300))
    expect(await srv.realtime.io.of('/').adapter.serverCount()).toBeGreaterThan(1)
    const a = client(owner)
    const b = client(editor)
    await waitUntil(
      () => !!a.presence?.members.some((m) => m.userId === editor.user.id),
      'both present',
    )
    const left = Date.now()
    b.close()
    await waitUntil(
      () => !a.presence!.members.some((m) => m.userId === editor.user.id),
      'leave shown',
      8000,
    )
    expect(Date.now() - left).toBeLessThan(3000)
  })
})

describe('access and limits', () => {
  it('refuses a socket without a session and one from another origin', async () => {
    const errors: string[] = []
    const anonymous = openSocket(srv.url, null)
    anonymous.on('connect_error', (e) => errors.push(`anon: ${e.message}`))
    const foreign = openSocket(srv.url, owner.cookie, { origin: 'http://elsewhere.example.test' })
    foreign.on('connect_error', (e) => errors.push(`foreign: ${e.message}`))
    await waitUntil(() => errors.length >= 2, 'two refusals')
    anonymous.close()
    foreign.close()
    expect(errors.find((e) => e.startsWith('anon'))).toMatch(/unauthorized/)
    expect(errors.find((e) => e.startsWith('foreign'))).toBeTruthy()
  })

  it('does not let a non-member join, and names the bad field of a malformed message', async () => {
    const stranger = await signUpAt(srv.url, 'Sam Stranger')
    const socket = openSocket(srv.url, stranger.cookie)
    const refusals: MessageRefused[] = []
    const rejects: OpReject[] = []
    socket.on(EVENTS.messageRefused, (m) => refusals.push(m))
    socket.on(EVENTS.opReject, (m) => rejects.push(m))
    socket.emit(EVENTS.diagramJoin, { diagramId })
    socket.emit(EVENTS.diagramJoin, { diagramId: 'not-a-uuid' } as never)
    const clientOpId = crypto.randomUUID()
    socket.emit(EVENTS.opSubmit, {
      diagramId,
      clientOpId,
      baseRevision: -1,
      op: { type: 'node.remove', id: 'J1' },
    })
    await waitUntil(() => refusals.length === 2 && rejects.length === 1, 'refusals')
    socket.close()
    expect(refusals).toContainEqual(
      expect.objectContaining({ event: 'diagram:join', code: 'not-found' }),
    )
    expect(refusals).toContainEqual(
      expect.objectContaining({ code: 'invalid', field: 'diagramId' }),
    )
    expect(rejects[0]).toMatchObject({ clientOpId, code: 'invalid', field: 'baseRevision' })
  })

  it('refuses a message over the size cap and messages over the per-socket rate', async () => {
    const a = client(owner)
    await waitUntil(() => a.live, 'join')
    const big = 'x'.repeat(srv.env.REALTIME_MAX_BYTES)
    const clientOpId = crypto.randomUUID()
    a.socket.emit(EVENTS.opSubmit, {
      diagramId,
      clientOpId,
      baseRevision: a.replica.revision,
      op: { type: 'diagram.rename', name: big },
    })
    await waitUntil(() => a.rejects.length === 1, 'size refusal')
    expect(a.rejects[0]).toMatchObject({
      clientOpId,
      code: 'limit',
      reason: expect.stringMatching(/too large/),
    })

    for (let i = 0; i < 100; i++)
      a.socket.emit(EVENTS.presenceUpdate, { diagramId, selection: { nodes: [], pipes: [] } })
    await waitUntil(() => a.refusals.some((r) => r.code === 'limit'), 'rate refusal')
    expect(a.refusals.find((r) => r.code === 'limit')!.reason).toMatch(/too many messages/)
  })
})
