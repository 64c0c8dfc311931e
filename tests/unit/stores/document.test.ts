import { createPinia, setActivePinia } from 'pinia'
import { afterEach, beforeEach, describe, expect, test, vi } from 'vitest'
import type { Diagram } from '@shared/document/model'
import type { Operation } from '@shared/document/operations'
import type { OpSubmit } from '@shared/protocol/client-messages'
import type { OpApplied } from '@shared/protocol/server-messages'
import { useConnectionStore } from '@/stores/connection'
import { MAX_TRANSIENT_RETRIES, useDocumentStore } from '@/stores/document'
import { sampleDiagram } from '../document/sample'

const DIAGRAM = 'd-1'

function openStore() {
  const store = useDocumentStore()
  expect(store.load(DIAGRAM, sampleDiagram(), 7)).toEqual({ ok: true })
  return store
}

/** The store with a live link whose sent ops the test reads. */
function liveStore() {
  const store = openStore()
  const sent: OpSubmit[] = []
  store.attachOutbox((submit) => sent.push(submit))
  useConnectionStore().set('synced')
  return { store, sent }
}

const remote = (revision: number, op: Operation, clientOpId = `other-${revision}`): OpApplied => ({
  diagramId: DIAGRAM,
  revision,
  op,
  clientOpId,
  author: { id: 'u-2', name: 'Robin Vale' },
  at: '2026-12-01T10:00:00.000Z',
})
const ack = (submit: OpSubmit, revision: number) => ({
  diagramId: DIAGRAM,
  clientOpId: submit.clientOpId,
  revision,
})
const fixture = (store: ReturnType<typeof useDocumentStore>, id = 'F1') =>
  store.doc.nodes.find((node) => node.id === id) as { count: number; label: string } | undefined

beforeEach(() => {
  setActivePinia(createPinia())
})
afterEach(() => {
  useDocumentStore().unload()
  vi.useRealTimers()
})

describe('document store: edits', () => {
  test('load rejects a broken document with the field named, and keeps the previous one', () => {
    const store = openStore()
    const broken = { ...sampleDiagram(), nodes: [{ id: 'J1', kind: 'pump' }] } as unknown as Diagram
    const outcome = store.load('d-2', broken, 1)
    expect(outcome.ok).toBe(false)
    if (!outcome.ok) expect(outcome.error).toMatch(/^diagram d-2: nodes\.0\.kind: /)
    expect(store.diagramId).toBe('d-1')
  })

  test('apply updates the document and the live result; errors come back as messages', () => {
    const store = openStore()
    expect(store.result.pipes.P5).toBeDefined()
    expect(store.apply({ type: 'node.update', id: 'F1', patch: { count: 3 } })).toEqual({
      ok: true,
    })
    expect(store.doc.nodes.find((node) => node.id === 'F1')).toMatchObject({ count: 3 })
    // Not connected in this test: the edit is kept, waiting to be sent.
    expect(store.saveState).toBe('offline')
    expect(store.pendingCount).toBe(1)

    const refused = store.apply({ type: 'node.remove', id: 'F9' })
    expect(refused).toEqual({ ok: false, error: 'node.remove: no node with id F9' })
    const garbage = store.apply({ type: 'pipe.add' } as never)
    expect(garbage.ok).toBe(false)
  })

  test('the result follows the document (load on the branch grows with the count)', () => {
    const store = openStore()
    const before = store.result.pipes.P5!.load
    store.apply({ type: 'node.update', id: 'F1', patch: { count: 4 } })
    expect(store.result.pipes.P5!.load).toBeGreaterThan(before)
  })

  test('undo and redo', () => {
    const store = openStore()
    const start = store.doc
    expect(store.canUndo).toBe(false)
    store.apply({ type: 'node.remove', id: 'J2' })
    store.apply({ type: 'diagram.rename', name: 'Block B' })
    expect(store.canUndo).toBe(true)
    expect(store.undo()).toEqual({ ok: true })
    expect(store.undo()).toEqual({ ok: true })
    expect(store.doc).toEqual(start)
    expect(store.canUndo).toBe(false)
    expect(store.undo()).toEqual({ ok: false, error: 'nothing to do' })
    expect(store.redo()).toEqual({ ok: true })
    expect(store.doc.nodes.some((node) => node.id === 'J2')).toBe(false)
    expect(store.canRedo).toBe(true)
  })

  test('selection drops ids that an edit removed', () => {
    const store = openStore()
    store.select(['J2', 'F1'], ['P4', 'P1'])
    store.apply({ type: 'node.remove', id: 'J2' })
    expect(store.selectedNodeIds).toEqual(['F1'])
    expect(store.selectedPipeIds).toEqual(['P1'])
  })

  test('copy and paste: fresh ids, selected, each paste further out', () => {
    const store = openStore()
    expect(store.paste()).toEqual({ ok: false, error: 'nothing to paste' })
    store.select(['J2', 'F1'])
    expect(store.copy()?.nodes).toHaveLength(2)
    expect(store.paste()).toEqual({ ok: true })
    expect(store.selectedNodeIds).toEqual(['J3', 'F2'])
    expect(store.paste()).toEqual({ ok: true })
    expect(store.selectedNodeIds).toEqual(['J4', 'F3'])
    const third = store.doc.nodes.find((node) => node.id === 'F3')!
    expect(third.position).toEqual({ x: 180, y: 480 })
    store.undo()
    expect(store.doc.nodes.some((node) => node.id === 'F3')).toBe(false)
  })

  test('removeSelection deletes the selection in one undo step', () => {
    const store = openStore()
    store.select(['J2', 'F1'], ['P3'])
    expect(store.removeSelection()).toEqual({ ok: true })
    expect(store.doc.nodes).toHaveLength(4)
    expect(store.selectedNodeIds).toEqual([])
    store.undo()
    expect(store.doc).toEqual(sampleDiagram())
  })

  test('addBattery adds and selects the fixtures; a bad request is a message', () => {
    const store = openStore()
    const added = store.addBattery({
      parentId: 'J2',
      hotParentId: 'WH1',
      fixture: 'lavatory',
      count: 3,
      usesHot: true,
      layout: 'individual',
    })
    expect(added).toEqual({ ok: true })
    expect(store.selectedNodeIds).toEqual(['F2', 'F3', 'F4'])
    expect(
      store.addBattery({ parentId: 'F1', fixture: 'lavatory', count: 2, usesHot: false }),
    ).toEqual({
      ok: false,
      error: 'battery: parentId: F1 is a fixture and cannot feed other fixtures',
    })
  })
})

describe('document store: sync with the server', () => {
  test('an edit shows at once, goes out with the confirmed revision, and is saved on ack', () => {
    const { store, sent } = liveStore()
    store.apply({ type: 'node.update', id: 'F1', patch: { count: 3 } })
    expect(fixture(store)?.count).toBe(3)
    expect(sent).toHaveLength(1)
    expect(sent[0]).toMatchObject({
      diagramId: DIAGRAM,
      baseRevision: 7,
      op: { type: 'node.update' },
    })
    expect(store.saveState).toBe('saving')
    store.acknowledged(ack(sent[0]!, 8))
    expect(store.saveState).toBe('saved')
    expect(store.revision).toBe(8)
    expect(fixture(store)?.count).toBe(3)
  })

  test('offline, edits are kept (not sent) and offered for replay in order', async () => {
    const store = openStore()
    const sent: OpSubmit[] = []
    store.attachOutbox((submit) => sent.push(submit))
    useConnectionStore().set('offline', 'lost')
    store.apply({ type: 'diagram.rename', name: 'A' })
    store.apply({ type: 'node.update', id: 'F1', patch: { count: 2 } })
    expect(sent).toHaveLength(0)
    expect(store.saveState).toBe('offline')
    expect(store.saveError).toBe('2 changes are kept here and sent when the connection returns')
    expect(await store.flush()).toBe(false)
    const replay = store.replayable()
    expect(replay.map((s) => s.op.type)).toEqual(['diagram.rename', 'node.update'])
    expect(replay.every((s) => s.baseRevision === 7)).toBe(true)
  })

  test("others' edits to other properties of the same node both survive", () => {
    const { store, sent } = liveStore()
    store.apply({ type: 'node.update', id: 'F1', patch: { count: 3 } })
    store.remoteApplied(
      remote(8, { type: 'node.update', id: 'F1', patch: { label: 'Wash basin' } }),
    )
    expect(fixture(store)).toMatchObject({ count: 3, label: 'Wash basin' })
    store.acknowledged(ack(sent[0]!, 9))
    expect(store.replica.confirmed.nodes.find((n) => n.id === 'F1')).toMatchObject({
      count: 3,
      label: 'Wash basin',
    })
    expect(store.saveState).toBe('saved')
  })

  test.each([
    ['mine is committed later', 9, 8, 3],
    ['theirs is committed later', 8, 9, 5],
  ])('the same property: the later revision wins (%s)', (_case, mine, theirs, expected) => {
    const { store, sent } = liveStore()
    store.apply({ type: 'node.update', id: 'F1', patch: { count: 3 } })
    const events = [
      { revision: mine, run: () => store.acknowledged(ack(sent[0]!, mine)) },
      {
        revision: theirs,
        run: () =>
          store.remoteApplied(
            remote(theirs, { type: 'node.update', id: 'F1', patch: { count: 5 } }),
          ),
      },
    ].sort((a, b) => a.revision - b.revision)
    for (const event of events) event.run()
    expect(fixture(store)?.count).toBe(expected)
    expect(store.revision).toBe(9)
    expect(store.pendingCount).toBe(0)
  })

  test('a refused edit is rolled back with the reason, and undo forgets it', () => {
    const { store, sent } = liveStore()
    store.apply({ type: 'node.update', id: 'F1', patch: { count: 3 } })
    const outcome = store.rejected({
      diagramId: DIAGRAM,
      clientOpId: sent[0]!.clientOpId,
      code: 'forbidden',
      reason: 'your role in this project is reviewer',
    })
    expect(outcome).toBe('rolled-back')
    expect(fixture(store)?.count).toBe(1)
    expect(store.saveState).toBe('saved')
    expect(store.notice?.kind).toBe('rejected')
    expect(store.notice?.text).toMatch(/refused and undone: your role in this project is reviewer$/)
    expect(store.canUndo).toBe(false)
  })

  test('"too many messages" keeps the edit pending for a resend, up to a limit', () => {
    const { store, sent } = liveStore()
    store.apply({ type: 'diagram.rename', name: 'A' })
    const refusal = {
      diagramId: DIAGRAM,
      clientOpId: sent[0]!.clientOpId,
      code: 'limit' as const,
      reason: 'too many messages',
    }
    for (let i = 0; i < MAX_TRANSIENT_RETRIES; i++) expect(store.rejected(refusal)).toBe('retry')
    expect(store.doc.name).toBe('A')
    expect(store.rejected(refusal)).toBe('rolled-back')
    expect(store.doc.name).toBe('Block A')
  })

  test('undo and redo are sent as ops too', () => {
    const { store, sent } = liveStore()
    store.apply({ type: 'node.remove', id: 'J2' })
    store.undo()
    store.redo()
    expect(sent.map((s) => s.op.type)).toEqual(['node.remove', 'batch', 'node.remove'])
    expect(new Set(sent.map((s) => s.clientOpId)).size).toBe(3)
  })

  test('a catch-up snapshot keeps pending edits on top; a read-only role refuses edits', () => {
    const store = openStore()
    useConnectionStore().set('offline')
    store.apply({ type: 'node.update', id: 'F1', patch: { count: 4 } })
    const newer = { ...sampleDiagram(), name: 'Block A, rev 20' }
    store.caughtUp({
      kind: 'snapshot',
      diagramId: DIAGRAM,
      revision: 20,
      doc: newer,
      role: 'reviewer',
    })
    expect(store.revision).toBe(20)
    expect(store.doc.name).toBe('Block A, rev 20')
    expect(fixture(store)?.count).toBe(4)
    expect(store.replayable()[0]?.baseRevision).toBe(20)
    expect(store.canEdit).toBe(false)
    const refused = store.apply({ type: 'diagram.rename', name: 'X' })
    expect(refused.ok).toBe(false)
    if (!refused.ok) expect(refused.error).toMatch(/read-only/)
  })

  test('missed ops after a gap are applied in revision order, early ones wait', () => {
    const store = openStore()
    store.remoteApplied(remote(9, { type: 'diagram.rename', name: 'Nine' }))
    expect(store.missingRevision).toBe(8)
    expect(store.doc.name).toBe('Block A')
    store.remoteApplied(remote(8, { type: 'diagram.rename', name: 'Eight' }))
    expect(store.doc.name).toBe('Nine')
    expect(store.missingRevision).toBeNull()
  })

  test('a past revision is shown read-only and live edits keep arriving underneath', () => {
    const store = openStore()
    store.showRevision(3, { ...sampleDiagram(), name: 'Old' })
    expect(store.doc.name).toBe('Old')
    expect(store.apply({ type: 'diagram.rename', name: 'X' }).ok).toBe(false)
    store.remoteApplied(remote(8, { type: 'diagram.rename', name: 'Live' }))
    store.closeRevision()
    expect(store.doc.name).toBe('Live')
  })

  test('flush waits for the acks', async () => {
    const { store, sent } = liveStore()
    store.apply({ type: 'diagram.rename', name: 'A' })
    const flushed = store.flush()
    store.acknowledged(ack(sent[0]!, 8))
    expect(await flushed).toBe(true)
  })

  test('flush gives up after its timeout when the server does not answer', async () => {
    vi.useFakeTimers()
    const { store } = liveStore()
    store.apply({ type: 'diagram.rename', name: 'A' })
    const flushed = store.flush(1_000)
    await vi.advanceTimersByTimeAsync(1_000)
    expect(await flushed).toBe(false)
    expect(store.doc.name).toBe('A')
  })

  test('someone else removing the selected node drops it from the selection', () => {
    const store = openStore()
    store.select(['F1', 'J1'])
    store.remoteApplied(remote(8, { type: 'node.remove', id: 'F1' }))
    expect(store.selectedNodeIds).toEqual(['J1'])
  })

  test('an answer for another diagram is ignored', () => {
    const { store, sent } = liveStore()
    store.apply({ type: 'diagram.rename', name: 'A' })
    store.acknowledged({ ...ack(sent[0]!, 8), diagramId: 'd-2' })
    store.remoteApplied({ ...remote(8, { type: 'diagram.rename', name: 'B' }), diagramId: 'd-2' })
    expect(store.saveState).toBe('saving')
    expect(store.doc.name).toBe('A')
  })
})
