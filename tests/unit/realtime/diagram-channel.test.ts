// @vitest-environment node
/**
 * The realtime channel against a real socket.io server on a loopback port. The server side is
 * scripted by each test (what it answers and when), so the client's protocol steps — join with
 * the last revision, replay pending ops after catch-up, re-join for a snapshot — are observed on
 * the wire, not assumed.
 */
import { createServer, type Server as HttpServer } from 'node:http'
import type { AddressInfo } from 'node:net'
import { createPinia, setActivePinia } from 'pinia'
import { Server, type Socket as ServerSocket } from 'socket.io'
import { afterEach, beforeEach, describe, expect, test, vi } from 'vitest'
import type { ClientToServerEvents, ServerToClientEvents } from '@shared/protocol/event-maps'
import type { JoinMessage, OpSubmit } from '@shared/protocol/client-messages'
import type { OpApplied, PresenceMember } from '@shared/protocol/server-messages'
import type { CommentThread } from '@shared/api/comments'
import { openCommentsFeed } from '@/realtime/comments'
import { openDiagramChannel, type DiagramChannel } from '@/realtime/diagram-channel'
import { createDiagramSocket } from '@/realtime/socket'
import { useCommentsStore } from '@/stores/comments'
import { useConnectionStore } from '@/stores/connection'
import { useDocumentStore } from '@/stores/document'
import { usePresenceStore } from '@/stores/presence'
import { useReviewsStore } from '@/stores/reviews'
import { sampleDiagram } from '../document/sample'

const DIAGRAM = '6f1c2d3e-4b5a-4c6d-8e7f-0a1b2c3d4e5f'
type TestServer = Server<ClientToServerEvents, ServerToClientEvents>
type Peer = ServerSocket<ClientToServerEvents, ServerToClientEvents>

let http: HttpServer
let io: TestServer
let url: string
let channel: DiagramChannel | null = null
/** What the client sent, in order. */
let joins: JoinMessage[]
let submits: OpSubmit[]
let events: string[]
let peer: Peer | null
/** The scripted server's current revision (scripts that answer joins themselves move it on). */
const server = { revision: 7 }

async function waitFor(check: () => boolean, what: string, ms = 3_000) {
  const end = Date.now() + ms
  while (!check()) {
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}`)
    await new Promise((resolve) => setTimeout(resolve, 10).unref())
  }
}

const member = (userId: string, name: string): PresenceMember => ({
  userId,
  name,
  initials: name.slice(0, 1),
  color: '#2a9d8f',
  role: 'editor',
  selection: { nodes: userId === 'u-2' ? ['F1'] : [], pipes: [] },
})
const applied = (
  revision: number,
  op: OpApplied['op'],
  clientOpId = `c-${revision}`,
): OpApplied => ({
  diagramId: DIAGRAM,
  revision,
  op,
  clientOpId,
  author: { id: 'u-2', name: 'Robin Vale' },
  at: '2026-12-01T10:00:00.000Z',
})

/** Default script: answer a join with the ops since, acknowledge every op with the next revision. */
function serve(onJoin?: (socket: Peer, join: JoinMessage) => void) {
  io.on('connection', (socket) => {
    peer = socket
    socket.onAny((event) => events.push(event))
    socket.on('diagram:join', (join) => {
      joins.push(join)
      if (onJoin) return onJoin(socket, join)
      socket.emit('diagram:ops', {
        diagramId: DIAGRAM,
        fromRevision: join.sinceRevision ?? 0,
        revision: server.revision,
        ops: [],
        role: 'editor',
      })
      socket.emit('presence:state', {
        diagramId: DIAGRAM,
        members: [member('u-1', 'Me'), member('u-2', 'Robin Vale')],
      })
    })
    socket.on('op:submit', (submit) => {
      submits.push(submit)
      server.revision += 1
      socket.emit('op:ack', {
        diagramId: DIAGRAM,
        clientOpId: submit.clientOpId,
        revision: server.revision,
      })
    })
  })
}

function open() {
  const store = useDocumentStore()
  store.load(DIAGRAM, sampleDiagram(), 7)
  channel = openDiagramChannel(DIAGRAM, { selfId: 'u-1', socket: createDiagramSocket(url) })
  return { store, connection: useConnectionStore(), presence: usePresenceStore() }
}

beforeEach(async () => {
  setActivePinia(createPinia())
  joins = []
  submits = []
  events = []
  peer = null
  server.revision = 7
  http = createServer()
  io = new Server(http)
  await new Promise<void>((resolve) => http.listen(0, '127.0.0.1', resolve))
  url = `http://127.0.0.1:${(http.address() as AddressInfo).port}`
})
afterEach(async () => {
  channel?.close()
  channel = null
  await io.close()
})

describe('realtime channel', () => {
  test('joins from the loaded revision, syncs, sends edits and marks them saved on ack', async () => {
    serve()
    const { store, connection, presence } = open()
    expect(connection.status).toBe('connecting')
    await waitFor(() => connection.status === 'synced', 'sync')
    expect(joins[0]).toEqual({ diagramId: DIAGRAM, sinceRevision: 7, protocolVersion: 1 })
    expect(presence.others.map((m) => m.name)).toEqual(['Robin Vale'])
    expect(presence.remoteSelections.get('F1')).toEqual([{ name: 'Robin Vale', color: '#2a9d8f' }])

    store.apply({ type: 'node.update', id: 'F1', patch: { count: 2 } })
    expect(store.saveState).toBe('saving')
    await waitFor(() => store.saveState === 'saved', 'ack')
    expect(submits).toHaveLength(1)
    expect(store.revision).toBe(8)
  })

  test('after a drop: offline edits are kept, the client catches up from its revision, then replays them', async () => {
    let joinsSoFar = 0
    serve((socket, join) => {
      joinsSoFar += 1
      // On the re-join, someone else's edit made while we were away comes back first.
      const missed =
        joinsSoFar > 1
          ? [applied(8, { type: 'node.update', id: 'F1', patch: { label: 'Basin' } })]
          : []
      server.revision = 7 + missed.length
      socket.emit('diagram:ops', {
        diagramId: DIAGRAM,
        fromRevision: join.sinceRevision!,
        revision: 7 + missed.length,
        ops: missed,
        role: 'editor',
      })
    })
    const { store, connection } = open()
    await waitFor(() => connection.status === 'synced', 'first sync')

    peer!.disconnect(true)
    await waitFor(() => connection.status === 'offline', 'offline')
    store.apply({ type: 'node.update', id: 'F1', patch: { count: 4 } })
    expect(store.saveState).toBe('offline')
    expect(submits).toHaveLength(0)

    await waitFor(() => store.saveState === 'saved', 'replayed and acknowledged')
    expect(joins.map((j) => j.sinceRevision)).toEqual([7, 7])
    expect(submits).toHaveLength(1)
    expect(submits[0]!.baseRevision).toBe(8)
    expect(store.doc.nodes.find((n) => n.id === 'F1')).toMatchObject({ count: 4, label: 'Basin' })
    expect(connection.recovered).toBe(true)
  })

  test('a gap the server cannot fill with ops is answered with a snapshot; pending edits stay on top', async () => {
    serve((socket) => {
      const doc = { ...sampleDiagram(), name: 'Far ahead' }
      server.revision = 500
      socket.emit('diagram:snapshot', { diagramId: DIAGRAM, revision: 500, doc, role: 'editor' })
    })
    const store = useDocumentStore()
    store.load(DIAGRAM, sampleDiagram(), 7)
    useConnectionStore().set('offline')
    store.apply({ type: 'node.update', id: 'F1', patch: { count: 6 } })
    channel = openDiagramChannel(DIAGRAM, { selfId: 'u-1', socket: createDiagramSocket(url) })
    await waitFor(() => store.saveState === 'saved', 'replay after snapshot')
    expect(submits[0]!.baseRevision).toBe(500)
    expect(store.revision).toBe(501)
    expect(store.doc.name).toBe('Far ahead')
    expect(store.doc.nodes.find((n) => n.id === 'F1')).toMatchObject({ count: 6 })
  })

  test('a refused op is rolled back with the reason', async () => {
    serve()
    io.on('connection', (socket) => {
      socket.removeAllListeners('op:submit')
      socket.on('op:submit', (submit) =>
        socket.emit('op:reject', {
          diagramId: DIAGRAM,
          clientOpId: submit.clientOpId,
          code: 'graph-rule',
          reason: 'J2 would get a second inlet',
          ids: ['J2'],
        }),
      )
    })
    const { store, connection } = open()
    await waitFor(() => connection.status === 'synced', 'sync')
    store.apply({ type: 'diagram.rename', name: 'Nope' })
    await waitFor(() => store.notice !== null, 'the refusal')
    expect(store.doc.name).toBe('Block A')
    expect(store.notice?.text).toContain('J2 would get a second inlet')
    expect(store.saveState).toBe('saved')
  })

  test('a refused join says why, and edits show as not saved', async () => {
    serve((socket) =>
      socket.emit('message:refused', {
        event: 'diagram:join',
        diagramId: DIAGRAM,
        code: 'not-found',
        reason: 'diagramId: no such diagram, or you are not a member of its project',
      }),
    )
    const { store, connection } = open()
    await waitFor(() => connection.status === 'refused', 'refusal')
    expect(connection.reason).toMatch(/not a member/)
    store.apply({ type: 'diagram.rename', name: 'Kept' })
    expect(store.saveState).toBe('failed')
    expect(store.doc.name).toBe('Kept')
  })

  test('selection is shared (debounced), cursors only while live, and leaving says so', async () => {
    serve()
    const received: unknown[] = []
    io.on('connection', (socket) => {
      socket.on('presence:update', (m) => received.push(m))
      socket.on('presence:cursor', (m) => received.push(m))
    })
    const { store, connection, presence } = open()
    await waitFor(() => connection.status === 'synced', 'sync')
    store.select(['J1'])
    store.select(['J1', 'F1'])
    presence.sendCursor(12.5, -40)
    await waitFor(() => received.length >= 3, 'presence messages')
    expect(received).toContainEqual({
      diagramId: DIAGRAM,
      selection: { nodes: ['J1', 'F1'], pipes: [] },
    })
    expect(received).toContainEqual({ diagramId: DIAGRAM, x: 12.5, y: -40 })
    // The first presence:update is the empty selection sent on sync; the two selects were merged.
    expect(received.filter((m) => (m as { selection?: unknown }).selection)).toHaveLength(2)

    channel!.close()
    channel = null
    await waitFor(() => events.includes('diagram:leave'), 'leave')
    expect(connection.status).toBe('idle')
  })
})

/** Sends an event the typed test server does not list (comment events ride the same socket). */
const sayToClient = (event: string, message: unknown) =>
  (peer as unknown as { emit(event: string, message: unknown): void }).emit(event, message)

describe('comments feed on the channel socket', () => {
  test('thread and review changes arrive on it; after a drop threads and review are read again', async () => {
    serve()
    const { connection } = open()
    const comments = useCommentsStore()
    const reviews = useReviewsStore()
    const reloads: string[] = []
    vi.spyOn(comments, 'load').mockImplementation(async () => void reloads.push('threads'))
    vi.spyOn(reviews, 'load').mockImplementation(async () => void reloads.push('review'))
    const feed = openCommentsFeed('p-1', DIAGRAM, channel!.socket)
    await waitFor(() => connection.status === 'synced', 'sync')

    const thread = { id: 't-1', diagramId: DIAGRAM } as unknown as CommentThread
    sayToClient('comment:thread', { diagramId: DIAGRAM, thread })
    sayToClient('comment:thread', { diagramId: 'another', thread })
    await waitFor(() => comments.threads.length === 1, 'the thread')
    expect(reloads).toEqual([])

    peer!.disconnect(true)
    await waitFor(() => reloads.length === 2, 'reload after the reconnect')
    expect(reloads.sort()).toEqual(['review', 'threads'])
    // One socket: the feed never joined on its own. The reloads start on the client's reconnect,
    // which can be before the server has the channel's join; a join of the feed's own would
    // come as soon.
    await waitFor(() => joins.length >= 2, 'the rejoin')
    await new Promise((resolve) => setTimeout(resolve, 50))
    expect(joins).toHaveLength(2)

    feed.close()
    sayToClient('comment:thread', { diagramId: DIAGRAM, thread: { ...thread, id: 't-2' } })
    await new Promise((resolve) => setTimeout(resolve, 50))
    expect(comments.threads.map((t) => t.id)).toEqual(['t-1'])
  })
})
