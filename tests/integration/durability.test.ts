/**
 * Durability: clients edit while the server process is killed with SIGKILL, then restarted.
 * Every op a client saw acknowledged is in the database at that revision, no op is applied twice
 * (the log replays to the stored document, and each client op id appears once), and after the
 * clients reconnect and replay their pending work, everyone holds the stored document.
 * Replay a failure with DURABILITY_SEED=<seed in the failure message>.
 */
import { afterAll, expect, it } from 'vitest'
import { openDb } from '../../server/db/knex.ts'
import { documentAt } from '../../server/modules/diagrams/history.service.ts'
import { addMember } from '../../server/modules/projects/projects.repo.ts'
import type { Diagram } from '../../shared/document/model.ts'
import { OperationError } from '../../shared/document/operations.ts'
import { createDiagramAt, signUpAt, waitUntil } from './helpers/realtime-http.ts'
import {
  freePort,
  killHard,
  startServerProcess,
  type ServerProcess,
} from './helpers/realtime-process.ts'
import { integrityProblems, prng, randomOperation, seedDiagram } from './helpers/realtime-random.ts'
import { SyncClient } from './helpers/realtime-sync-client.ts'

const db = openDb(process.env.DATABASE_URL!)
const MAX_PENDING = 60
let server: ServerProcess | undefined
afterAll(async () => {
  if (server) await killHard(server)
  await db.destroy()
})

it('keeps every acknowledged op and applies none twice across a kill -9', async () => {
  const seed = Number(process.env.DURABILITY_SEED ?? Math.floor(Math.random() * 2 ** 31))
  const rand = prng(seed)
  const port = await freePort()
  server = await startServerProcess(port)
  const owner = await signUpAt(server.url, 'Kai Owner')
  const other = await signUpAt(server.url, 'Lee Editor')
  const { projectId, diagramId } = await createDiagramAt(server.url, owner, seedDiagram())
  await addMember(db, projectId, other.user.id, 'editor')
  const clients = [owner, other, owner].map((s) => new SyncClient(server!.url, s.cookie, diagramId))
  const sent = new Set<string>()
  let n = 0
  const editSome = () => {
    for (const [i, c] of clients.entries()) {
      // Offline edits pile up while the server restarts (slowly on a loaded machine); past a
      // few dozen, each replica step replays them all and the test measures its own client.
      if (c.replica.pending.length >= MAX_PENDING) continue
      try {
        sent.add(c.edit(randomOperation(c.replica.view, rand, String(i), n++)))
      } catch (error) {
        if (!(error instanceof OperationError)) throw error
      }
    }
  }
  try {
    await waitUntil(() => clients.every((c) => c.live), 'clients to join')
    const ticker = setInterval(editSome, 4)
    await waitUntil(() => clients.every((c) => c.acked.size >= 5), 'some acknowledged edits')
    await killHard(server)
    const ackedBeforeKill = clients.map((c) => new Map(c.acked))
    await new Promise((resolve) => setTimeout(resolve, 100)) // edits continue offline
    server = await startServerProcess(port)
    await waitUntil(() => clients.every((c) => c.live), 'clients to reconnect')
    await new Promise((resolve) => setTimeout(resolve, 100))
    clearInterval(ticker)
    await waitUntil(() => clients.every((c) => c.synced), 'clients to settle', 15_000)

    const row = (await db('diagrams')
      .where({ id: diagramId })
      .first<{ document: Diagram; revision: number }>())!
    await waitUntil(
      () => clients.every((c) => c.replica.revision === row.revision),
      'same revision',
    )
    const log = await db('diagram_ops')
      .where({ diagram_id: diagramId })
      .orderBy('revision')
      .select<{ client_op_id: string; revision: number }[]>('client_op_id', 'revision')
    const context = `seed ${seed}, ${log.length} ops`
    const byOpId = new Map(log.map((r) => [r.client_op_id, r.revision]))
    for (const acked of ackedBeforeKill) {
      for (const [id, revision] of acked) expect(byOpId.get(id), context).toBe(revision)
    }
    expect(
      log.map((r) => r.revision),
      context,
    ).toEqual(log.map((_, i) => i + 1))
    expect(byOpId.size, context).toBe(log.length)
    expect(
      log.every((r) => sent.has(r.client_op_id)),
      context,
    ).toBe(true)
    // Replaying the log from the first snapshot gives exactly the stored document.
    expect(await documentAt(db, projectId, diagramId, row.revision), context).toEqual(row.document)
    for (const c of clients) expect(c.replica.confirmed, context).toEqual(row.document)
    expect(integrityProblems(row.document), context).toEqual([])
  } finally {
    for (const c of clients) c.close()
  }
}, 60_000)
