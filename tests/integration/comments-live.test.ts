/**
 * Live arrival: a comment or review change committed over HTTP reaches every socket in the
 * diagram's room (server/realtime/comments-relay.ts), and nobody outside it.
 */
import { createServer } from 'node:http'
import type { AddressInfo } from 'node:net'
import pg from 'pg'
import type { Socket } from 'socket.io-client'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app.ts'
import { readEnv } from '../../server/config/env.ts'
import { openDb } from '../../server/db/knex.ts'
import { addMember } from '../../server/modules/projects/projects.repo.ts'
import { relayComments } from '../../server/realtime/comments-relay.ts'
import { attachRealtime } from '../../server/realtime/io.ts'
import type { DiagramInput } from '../../shared/document/model.ts'
import {
  COMMENT_EVENTS,
  type ReviewChanged,
  type ThreadChanged,
} from '../../shared/protocol/comments.ts'
import { EVENTS, PROTOCOL_VERSION } from '../../shared/protocol/events.ts'
import { api, createDiagramAt, signUpAt, waitUntil, type Session } from './helpers/realtime-http.ts'
import { openSocket } from './helpers/realtime-sync-client.ts'

const riser: DiagramInput = {
  format: 'tributary-diagram',
  version: 1,
  name: 'Domestic water',
  nodes: [
    { id: 'S1', kind: 'supply', label: 'Street main', pressureKPa: 420 },
    { id: 'F1', kind: 'fixture', fixture: 'lavatory', label: 'Basin' },
  ],
  pipes: [{ id: 'P1', from: 'S1', to: 'F1', system: 'cold', lengthM: 6 }],
}

const env = readEnv({ ...process.env, SIGN_IN_LIMIT: '1000' })
const db = openDb(env.DATABASE_URL)
const pool = new pg.Pool({ connectionString: env.DATABASE_URL, max: 5 })
const { app, sessionHandlers, opFeed, reviewFeed } = createApp(env, db, pool)
const server = createServer(app)
const realtime = attachRealtime(server, { env, db, pool, sessionHandlers, opFeed })
relayComments(realtime.io, reviewFeed)
let url: string
let owner: Session
let reviewer: Session
let stranger: Session
let projectId: string
let diagramId: string
const sockets: Socket[] = []

/** A socket that has joined the diagram (or tried to) and records the review events it gets. */
async function listen(session: Session) {
  const socket = openSocket(url, session.cookie) as unknown as Socket
  sockets.push(socket)
  const got = { threads: [] as ThreadChanged[], reviews: [] as ReviewChanged[], joined: false }
  socket.on(COMMENT_EVENTS.threadChanged, (m: ThreadChanged) => got.threads.push(m))
  socket.on(COMMENT_EVENTS.reviewChanged, (m: ReviewChanged) => got.reviews.push(m))
  socket.on(EVENTS.diagramSnapshot, () => (got.joined = true))
  let refused = false
  socket.on(EVENTS.messageRefused, () => (refused = true))
  socket.emit(EVENTS.diagramJoin, { diagramId, protocolVersion: PROTOCOL_VERSION })
  await waitUntil(() => got.joined || refused, 'the join to be answered')
  return got
}

beforeAll(async () => {
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve))
  url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`
  owner = await signUpAt(url, 'Orla Owner')
  reviewer = await signUpAt(url, 'Ravi Reviewer')
  stranger = await signUpAt(url, 'Sam Stranger')
  ;({ projectId, diagramId } = await createDiagramAt(url, owner, riser))
  await addMember(db, projectId, reviewer.user.id, 'reviewer')
})
afterAll(async () => {
  for (const s of sockets) s.disconnect()
  await realtime.close()
  server.closeAllConnections()
  await Promise.allSettled([db.destroy(), pool.end()])
})

describe('comments arrive live', () => {
  it('a new thread, its resolution and a review decision reach the room, not outsiders', async () => {
    const ownerSees = await listen(owner)
    const strangerSees = await listen(stranger)
    expect(ownerSees.joined).toBe(true)
    expect(strangerSees.joined).toBe(false)
    const base = `/api/projects/${projectId}/diagrams/${diagramId}`

    const created = await api<{ thread: { id: string } }>(
      url,
      reviewer,
      'POST',
      `${base}/comments`,
      { target: { kind: 'pipe', id: 'P1' }, body: 'Check the length' },
      201,
    )
    await waitUntil(() => ownerSees.threads.length === 1, 'the new thread')
    expect(ownerSees.threads[0]!.thread).toMatchObject({
      id: created.body.thread.id,
      target: { kind: 'pipe', id: 'P1' },
      comments: [{ body: 'Check the length', author: { name: 'Ravi Reviewer' } }],
    })

    await api(
      url,
      owner,
      'PATCH',
      `${base}/comments/${created.body.thread.id}`,
      { resolved: true },
      200,
    )
    await waitUntil(() => ownerSees.threads.length === 2, 'the resolved thread')
    expect(ownerSees.threads[1]!.thread.resolvedBy?.name).toBe('Orla Owner')

    await api(url, owner, 'POST', `${base}/review/submissions`, {}, 201)
    await waitUntil(() => ownerSees.reviews.length === 1, 'the review state')
    expect(ownerSees.reviews[0]!.review.status).toBe('submitted')

    // Give a stray broadcast time to arrive before asserting that none did.
    await new Promise((resolve) => setTimeout(resolve, 200))
    expect(strangerSees.threads).toHaveLength(0)
    expect(strangerSees.reviews).toHaveLength(0)
  })
})
