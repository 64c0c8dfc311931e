/**
 * Randomized convergence, seeded and replayable: several clients on two server processes' worth
 * of socket.io servers (relaying through the PostgreSQL adapter) make random edits, including
 * conflicting reparenting, while connections drop at random. At the end every replica and the
 * database hold the same document, with no loop, no second inlet and nothing orphaned.
 * Replay a failure with CONVERGENCE_SEED=<seed printed by fast-check>.
 */
import fc from 'fast-check'
import { afterAll, beforeAll, expect, it } from 'vitest'
import { addMember } from '../../server/modules/projects/projects.repo.ts'
import type { Diagram } from '../../shared/document/model.ts'
import { OperationError } from '../../shared/document/operations.ts'
import { EVENTS } from '../../shared/protocol/events.ts'
import { createDiagramAt, signUpAt, waitUntil, type Session } from './helpers/realtime-http.ts'
import { integrityProblems, prng, randomOperation, seedDiagram } from './helpers/realtime-random.ts'
import { startRealtimeServer, type RealtimeTestServer } from './helpers/realtime-server.ts'
import { SyncClient } from './helpers/realtime-sync-client.ts'

const CLIENTS = 4
const ROUNDS = 12
const EDITS_PER_ROUND = 3

let servers: RealtimeTestServer[]
let users: Session[]

beforeAll(async () => {
  servers = [await startRealtimeServer(), await startRealtimeServer()]
  users = []
  for (let i = 0; i < CLIENTS; i++) users.push(await signUpAt(servers[i % 2]!.url, `Designer ${i}`))
})
afterAll(async () => {
  await Promise.all(servers.map((s) => s.close()))
})

const pause = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms).unref())

async function run(seed: number) {
  const rand = prng(seed)
  const { projectId, diagramId } = await createDiagramAt(servers[0]!.url, users[0]!, seedDiagram())
  for (const user of users.slice(1))
    await addMember(servers[0]!.db, projectId, user.user.id, 'editor')
  const clients = users.map((u, i) => new SyncClient(servers[i % 2]!.url, u.cookie, diagramId))
  try {
    await waitUntil(() => clients.every((c) => c.live), 'every client to join')
    let n = 0
    for (let round = 0; round < ROUNDS; round++) {
      for (const [i, c] of clients.entries()) {
        // Drop and restore connections at random; edits made meanwhile stay pending.
        if (rand() < 0.15 && c.socket.connected) c.socket.disconnect()
        else if (!c.socket.connected && rand() < 0.6) c.socket.connect()
        for (let e = 0; e < EDITS_PER_ROUND; e++) {
          try {
            c.edit(randomOperation(c.replica.view, rand, String(i), n++))
          } catch (error) {
            if (!(error instanceof OperationError)) throw error // refused locally: fine
          }
        }
      }
      await pause(Math.floor(rand() * 15))
    }
    for (const c of clients) if (!c.socket.connected) c.socket.connect()
    const row = async () =>
      (await servers[0]!
        .db('diagrams')
        .where({ id: diagramId })
        .first<{ document: Diagram; revision: number }>())!
    let stored = await row()
    await waitUntil(() => clients.every((c) => c.synced), 'every client to settle', 15_000)
    stored = await row()
    await waitUntil(
      () => clients.every((c) => c.replica.revision === stored.revision),
      'same revision',
      15_000,
    )

    if (process.env.CONVERGENCE_VERBOSE)
      console.log(
        `seed ${seed}: revision ${stored.revision}, rejects ${clients.map((c) => c.rejects.length)}, nodes ${stored.document.nodes.length}`,
      )
    for (const c of clients) expect(c.replica.confirmed).toEqual(stored.document)
    expect(integrityProblems(stored.document)).toEqual([])
    const revisions = await servers[0]!
      .db('diagram_ops')
      .where({ diagram_id: diagramId })
      .pluck('revision')
    expect(revisions.length).toBe(stored.revision)
    // Every op a client saw acknowledged is in the log exactly once, at that revision.
    const log = await servers[0]!
      .db('diagram_ops')
      .where({ diagram_id: diagramId })
      .select<{ client_op_id: string; revision: number }[]>('client_op_id', 'revision')
    const byOpId = new Map(log.map((r) => [r.client_op_id, r.revision]))
    for (const c of clients) for (const [id, rev] of c.acked) expect(byOpId.get(id)).toBe(rev)
  } finally {
    for (const c of clients) c.close()
  }
}

it('several clients with random edits and disconnects converge with the database', async () => {
  const seed = process.env.CONVERGENCE_SEED ? Number(process.env.CONVERGENCE_SEED) : undefined
  await fc.assert(
    fc.asyncProperty(fc.integer({ min: 1, max: 2 ** 31 - 1 }), async (s) => run(s)),
    { numRuns: 2, seed, endOnFailure: true },
  )
}, 60_000)

it('presence crosses processes: each side sees the other and the selection made there', async () => {
  const { projectId, diagramId } = await createDiagramAt(servers[0]!.url, users[0]!, seedDiagram())
  await addMember(servers[0]!.db, projectId, users[1]!.user.id, 'editor')
  const here = new SyncClient(servers[0]!.url, users[0]!.cookie, diagramId)
  const there = new SyncClient(servers[1]!.url, users[1]!.cookie, diagramId)
  try {
    const sees = (c: SyncClient, userId: string, node?: string) =>
      !!c.presence?.members.some(
        (m) => m.userId === userId && (!node || m.selection.nodes.includes(node)),
      )
    await waitUntil(
      () => sees(here, users[1]!.user.id) && sees(there, users[0]!.user.id),
      'both present on both processes',
    )
    there.socket.emit(EVENTS.presenceUpdate, {
      diagramId,
      selection: { nodes: ['J2'], pipes: [] },
    })
    await waitUntil(() => sees(here, users[1]!.user.id, 'J2'), 'the selection across processes')
  } finally {
    here.close()
    there.close()
  }
})
