// @vitest-environment node
import { describe, expect, it } from 'vitest'
import type { Operation } from '../../../shared/document/operations.ts'
import type { OpApplied } from '../../../shared/protocol/server-messages.ts'
import {
  acknowledge,
  catchUp,
  createReplica,
  createWaitingReplica,
  isSynced,
  localApply,
  missingRevision,
  pendingForReplay,
  receiveRemote,
  reject,
} from '../../../shared/sync/replica.ts'
import { applyOperation } from '../../../shared/document/operations.ts'
import { seedDiagram } from '../../integration/helpers/realtime-random.ts'

const D = '6f1d9a4e-3c2b-4f8a-9e7d-1a2b3c4d5e6f'
const applied = (
  revision: number,
  op: Operation,
  clientOpId: string = crypto.randomUUID(),
): OpApplied => ({
  diagramId: D,
  revision,
  op,
  clientOpId,
  author: { id: 'u2', name: 'Other' },
  at: '2026-12-02T00:00:00.000Z',
})

describe('replica', () => {
  it('applies a local op at once and keeps it pending until acknowledged', () => {
    const r0 = createReplica(D, seedDiagram(), 7)
    const { replica, submit } = localApply(r0, {
      type: 'node.update',
      id: 'J1',
      patch: { label: 'A' },
    })
    expect(submit).toMatchObject({ diagramId: D, baseRevision: 7 })
    expect(replica.view.nodes.find((n) => n.id === 'J1')!.label).toBe('A')
    expect(replica.confirmed).toBe(r0.confirmed)
    const { replica: done } = acknowledge(replica, {
      diagramId: D,
      clientOpId: submit.clientOpId,
      revision: 8,
    })
    expect(done.revision).toBe(8)
    expect(done.pending).toEqual([])
    expect(done.confirmed).toEqual(done.view)
    expect(isSynced(done)).toBe(true)
  })

  it('refuses locally an op that does not apply or would close a loop', () => {
    const r = createReplica(D, seedDiagram(), 0)
    expect(() => localApply(r, { type: 'node.remove', id: 'nope' })).toThrow(/no node with id nope/)
    expect(() => localApply(r, { type: 'pipe.update', id: 'P1', patch: { from: 'F1' } })).toThrow(
      /close a loop/,
    )
  })

  it('rebases pending ops on a remote op: different properties of one node both survive', () => {
    let r = createReplica(D, seedDiagram(), 0)
    r = localApply(r, { type: 'node.update', id: 'J2', patch: { label: 'mine' } }).replica
    r = receiveRemote(
      r,
      applied(1, { type: 'node.update', id: 'J2', patch: { elevationM: 12 } }),
    ).replica
    expect(r.revision).toBe(1)
    expect(r.view.nodes.find((n) => n.id === 'J2')).toMatchObject({ label: 'mine', elevationM: 12 })
    expect(r.confirmed.nodes.find((n) => n.id === 'J2')).toMatchObject({
      label: '',
      elevationM: 12,
    })
  })

  it('buffers ops that arrive out of order and applies them by revision; ignores repeats', () => {
    const r0 = createReplica(D, seedDiagram(), 0)
    const a = applied(1, { type: 'node.update', id: 'J1', patch: { label: 'one' } })
    const b = applied(2, { type: 'node.update', id: 'J1', patch: { label: 'two' } })
    let r = receiveRemote(r0, b).replica
    expect(r.revision).toBe(0)
    expect(missingRevision(r)).toBe(1)
    r = receiveRemote(r, a).replica
    r = receiveRemote(r, a).replica
    expect(r.revision).toBe(2)
    expect(r.confirmed.nodes.find((n) => n.id === 'J1')!.label).toBe('two')
    expect(missingRevision(r)).toBeNull()
  })

  it('rolls back a refused op with the reason, and hides a pending op that stopped applying', () => {
    let r = createReplica(D, seedDiagram(), 0)
    const first = localApply(r, { type: 'node.update', id: 'F1', patch: { count: 2 } })
    r = first.replica
    r = localApply(r, { type: 'node.move', id: 'J2', position: { x: 5, y: 5 } }).replica
    const rejected = reject(r, {
      diagramId: D,
      clientOpId: first.submit.clientOpId,
      code: 'forbidden',
      reason: 'a viewer may view this diagram but not edit it',
    })
    expect(rejected.notices).toMatchObject([{ kind: 'rejected', reason: /viewer/ }])
    expect(rejected.replica.view.nodes.find((n) => n.id === 'F1')).toMatchObject({ count: 1 })
    const removed = receiveRemote(rejected.replica, applied(1, { type: 'node.remove', id: 'J2' }))
    expect(removed.notices).toMatchObject([{ kind: 'conflict', reason: /J2/ }])
    expect(removed.replica.pending).toHaveLength(1) // the server decides; it stays until answered
    expect(removed.replica.view).toEqual(removed.replica.confirmed)
  })

  it('catches up from a snapshot or from missed ops, and replays what is pending', () => {
    let r = createReplica(D, seedDiagram(), 3)
    const mine = localApply(r, { type: 'node.update', id: 'J1', patch: { label: 'offline' } })
    r = mine.replica
    const ops = [applied(4, { type: 'node.move', id: 'F1', position: { x: 1, y: 2 } })]
    const viaOps = catchUp(r, {
      kind: 'ops',
      diagramId: D,
      fromRevision: 3,
      revision: 4,
      ops,
      role: 'editor',
    })
    expect(viaOps.replica.revision).toBe(4)
    expect(pendingForReplay(viaOps.replica)).toEqual([{ ...mine.submit, baseRevision: 4 }])
    // Own op already committed before the drop: the catch-up confirms it.
    const own = applied(5, mine.submit.op, mine.submit.clientOpId)
    const confirmed = catchUp(viaOps.replica, {
      kind: 'ops',
      diagramId: D,
      fromRevision: 4,
      revision: 5,
      ops: [own],
      role: 'editor',
    })
    expect(confirmed.replica.pending).toEqual([])
    // A gap the server cannot fill with ops needs a snapshot.
    expect(
      catchUp(r, {
        kind: 'ops',
        diagramId: D,
        fromRevision: 9,
        revision: 9,
        ops: [],
        role: 'editor',
      }).replica.stale,
    ).toBe(true)
    const doc = applyOperation(seedDiagram(), { type: 'node.remove', id: 'F1' })
    const snap = catchUp(r, { kind: 'snapshot', diagramId: D, revision: 10, doc, role: 'editor' })
    expect(snap.replica).toMatchObject({ revision: 10, stale: false, confirmed: doc })
    expect(snap.replica.view.nodes.find((n) => n.id === 'J1')!.label).toBe('offline')
    // A resend answered after the snapshot (revision already included) just leaves pending.
    const ack = acknowledge(snap.replica, {
      diagramId: D,
      clientOpId: mine.submit.clientOpId,
      revision: 6,
      duplicate: true,
    })
    expect(ack.replica.pending).toEqual([])
    expect(ack.replica.view).toEqual(doc)
  })

  it('a waiting replica buffers broadcasts that overtake its first snapshot', () => {
    let r = createWaitingReplica(D)
    expect(isSynced(r)).toBe(false)
    r = receiveRemote(
      r,
      applied(6, { type: 'node.update', id: 'J1', patch: { label: 'six' } }),
    ).replica
    r = catchUp(r, {
      kind: 'snapshot',
      diagramId: D,
      revision: 5,
      doc: seedDiagram(),
      role: 'viewer',
    }).replica
    expect(r.revision).toBe(6)
    expect(r.confirmed.nodes.find((n) => n.id === 'J1')!.label).toBe('six')
    expect(isSynced(r)).toBe(true)
  })
})
