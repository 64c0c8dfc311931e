// @vitest-environment node
/**
 * Property: whatever the interleaving (delivery order, acks overtaking broadcasts, dropped
 * connections with lost messages and replays), replicas driven by shared/sync converge on the
 * authoritative order. The "server" here is the same pure decision the real one makes
 * (applyChecked in revision order, idempotent by client op id); the real one is covered by
 * tests/integration/convergence.test.ts. Replay a failure with the seed fast-check prints.
 */
import fc from 'fast-check'
import { expect, it } from 'vitest'
import type { Diagram } from '../../../shared/document/model.ts'
import { OperationError, type Operation } from '../../../shared/document/operations.ts'
import type { OpSubmit } from '../../../shared/protocol/client-messages.ts'
import { applyChecked } from '../../../shared/sync/graph-rules.ts'
import {
  acknowledge,
  catchUp,
  createReplica,
  localApply,
  pendingForReplay,
  receiveRemote,
  reject,
  type Replica,
} from '../../../shared/sync/replica.ts'
import {
  integrityProblems,
  prng,
  randomOperation,
  seedDiagram,
} from '../../integration/helpers/realtime-random.ts'

const D = '6f1d9a4e-3c2b-4f8a-9e7d-1a2b3c4d5e6f'
type Inbound =
  | { kind: 'applied'; revision: number; op: Operation; clientOpId: string }
  | { kind: 'ack'; revision: number; clientOpId: string }
  | { kind: 'reject'; clientOpId: string; reason: string }

interface Peer {
  replica: Replica
  outbox: OpSubmit[]
  inbox: Inbound[]
}

function simulate(seed: number, peers = 3, steps = 200) {
  const rand = prng(seed)
  let doc: Diagram = seedDiagram()
  const log: { revision: number; op: Operation; clientOpId: string }[] = []
  const done = new Map<string, number>()
  const clients: Peer[] = Array.from({ length: peers }, () => ({
    replica: createReplica(D, doc, 0),
    outbox: [],
    inbox: [],
  }))
  const serve = (from: Peer, submit: OpSubmit) => {
    const earlier = done.get(submit.clientOpId)
    if (earlier !== undefined)
      return from.inbox.push({ kind: 'ack', revision: earlier, clientOpId: submit.clientOpId })
    try {
      doc = applyChecked(doc, submit.op)
    } catch (error) {
      if (!(error instanceof OperationError)) throw error
      return from.inbox.push({
        kind: 'reject',
        clientOpId: submit.clientOpId,
        reason: error.message,
      })
    }
    const entry = { revision: log.length + 1, op: submit.op, clientOpId: submit.clientOpId }
    log.push(entry)
    done.set(submit.clientOpId, entry.revision)
    from.inbox.push({ kind: 'ack', revision: entry.revision, clientOpId: submit.clientOpId })
    for (const peer of clients) if (peer !== from) peer.inbox.push({ kind: 'applied', ...entry })
  }
  const deliver = (peer: Peer, message: Inbound) => {
    const at = '2026-12-02T00:00:00.000Z'
    const author = { id: 'u', name: 'U' }
    const r = peer.replica
    if (message.kind === 'applied')
      peer.replica = receiveRemote(r, { diagramId: D, ...message, author, at }).replica
    if (message.kind === 'ack') peer.replica = acknowledge(r, { diagramId: D, ...message }).replica
    if (message.kind === 'reject')
      peer.replica = reject(r, { diagramId: D, code: 'conflict', ...message }).replica
  }
  let n = 0
  for (let step = 0; step < steps; step++) {
    const peer = clients[Math.floor(rand() * peers)]!
    const roll = rand()
    if (roll < 0.35) {
      try {
        const { replica, submit } = localApply(
          peer.replica,
          randomOperation(peer.replica.view, rand, `c${clients.indexOf(peer)}`, n++),
        )
        peer.replica = replica
        peer.outbox.push(submit)
      } catch (error) {
        if (!(error instanceof OperationError)) throw error
      }
    } else if (roll < 0.6 && peer.outbox.length) {
      serve(peer, peer.outbox.shift()!)
    } else if (roll < 0.93 && peer.inbox.length) {
      // Acks and broadcasts may overtake each other (several server processes).
      const i = rand() < 0.3 && peer.inbox.length > 1 ? 1 : 0
      deliver(peer, peer.inbox.splice(i, 1)[0]!)
    } else if (roll >= 0.93) {
      // Connection drop: messages in flight are lost either way; then catch up and replay.
      peer.outbox = peer.outbox.filter(() => rand() < 0.5)
      for (const submit of peer.outbox) serve(peer, submit)
      peer.outbox = []
      peer.inbox = []
      const since = peer.replica.revision
      const useOps = rand() < 0.5 && !peer.replica.stale
      peer.replica = useOps
        ? catchUp(peer.replica, {
            kind: 'ops',
            diagramId: D,
            fromRevision: since,
            revision: log.length,
            role: 'editor',
            ops: log
              .slice(since)
              .map((e) => ({ diagramId: D, ...e, author: { id: 'u', name: 'U' }, at: '' })),
          }).replica
        : catchUp(peer.replica, {
            kind: 'snapshot',
            diagramId: D,
            revision: log.length,
            doc,
            role: 'editor',
          }).replica
      peer.outbox.push(...pendingForReplay(peer.replica))
    }
  }
  // Quiesce: everything sent is served, everything received is delivered.
  while (clients.some((p) => p.outbox.length || p.inbox.length)) {
    for (const peer of clients) {
      while (peer.outbox.length) serve(peer, peer.outbox.shift()!)
      while (peer.inbox.length) deliver(peer, peer.inbox.shift()!)
    }
  }
  return { doc, revision: log.length, clients }
}

it('replicas converge on the server order under any interleaving', () => {
  fc.assert(
    fc.property(fc.integer({ min: 1, max: 2 ** 31 - 1 }), (seed) => {
      const { doc, revision, clients } = simulate(seed)
      for (const peer of clients) {
        expect(peer.replica.revision).toBe(revision)
        expect(peer.replica.pending).toEqual([])
        expect(peer.replica.confirmed).toEqual(doc)
        expect(peer.replica.view).toEqual(doc)
      }
      expect(integrityProblems(doc)).toEqual([])
    }),
    { numRuns: 20 },
  )
}, 30_000)
