import { createPinia, setActivePinia } from 'pinia'
import { afterEach, beforeEach, describe, expect, test, vi } from 'vitest'
import type { Diagram } from '@shared/document/model'
import { SAVE_DEBOUNCE_MS, SAVE_RETRY_MS, useDocumentStore, type Saver } from '@/stores/document'
import { sampleDiagram } from '../document/sample'

type SaveCall = { diagramId: string; doc: Diagram; revision: number }

/** A saver whose answers the test decides, one call at a time. */
function fakeSaver() {
  const calls: SaveCall[] = []
  const pending: { resolve: (rev: { revision: number }) => void; reject: (e: Error) => void }[] = []
  const saver: Saver = (diagramId, doc, revision) => {
    calls.push({ diagramId, doc, revision })
    return new Promise((resolve, reject) => pending.push({ resolve, reject }))
  }
  return {
    saver,
    calls,
    succeed: async (revision: number) => {
      pending.shift()!.resolve({ revision })
      await vi.advanceTimersByTimeAsync(0)
    },
    fail: async (message: string) => {
      pending.shift()!.reject(new Error(message))
      await vi.advanceTimersByTimeAsync(0)
    },
  }
}

function openStore() {
  const store = useDocumentStore()
  expect(store.load('d-1', sampleDiagram(), 7)).toEqual({ ok: true })
  return store
}

beforeEach(() => {
  setActivePinia(createPinia())
  vi.useFakeTimers()
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
    expect(store.saveState).toBe('dirty')

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

describe('document store: autosave', () => {
  test('saves once after the quiet period, with the latest document and revision', async () => {
    const store = openStore()
    const fake = fakeSaver()
    store.configureSaver(fake.saver)
    store.apply({ type: 'diagram.rename', name: 'A' })
    await vi.advanceTimersByTimeAsync(SAVE_DEBOUNCE_MS - 100)
    store.apply({ type: 'diagram.rename', name: 'B' })
    await vi.advanceTimersByTimeAsync(SAVE_DEBOUNCE_MS - 100)
    store.apply({ type: 'diagram.rename', name: 'C' })
    expect(fake.calls).toHaveLength(0)
    await vi.advanceTimersByTimeAsync(SAVE_DEBOUNCE_MS)
    expect(fake.calls).toHaveLength(1)
    expect(fake.calls[0]).toMatchObject({ diagramId: 'd-1', revision: 7 })
    expect(fake.calls[0]!.doc.name).toBe('C')
    expect(store.saveState).toBe('saving')
    await fake.succeed(8)
    expect(store.saveState).toBe('saved')
    expect(store.revision).toBe(8)
  })

  test('an edit made during a save is saved afterwards', async () => {
    const store = openStore()
    const fake = fakeSaver()
    store.configureSaver(fake.saver)
    store.apply({ type: 'diagram.rename', name: 'A' })
    await vi.advanceTimersByTimeAsync(SAVE_DEBOUNCE_MS)
    store.apply({ type: 'diagram.rename', name: 'B' })
    await fake.succeed(8)
    expect(store.saveState).toBe('dirty')
    await vi.advanceTimersByTimeAsync(SAVE_DEBOUNCE_MS)
    expect(fake.calls).toHaveLength(2)
    expect(fake.calls[1]).toMatchObject({ revision: 8 })
    expect(fake.calls[1]!.doc.name).toBe('B')
    await fake.succeed(9)
    expect(store.saveState).toBe('saved')
  })

  test('failure keeps the document, shows the error, retries with backoff until saved', async () => {
    const store = openStore()
    const fake = fakeSaver()
    store.configureSaver(fake.saver)
    store.apply({ type: 'diagram.rename', name: 'A' })
    await vi.advanceTimersByTimeAsync(SAVE_DEBOUNCE_MS)
    await fake.fail('network down')
    expect(store.saveState).toBe('failed')
    expect(store.saveError).toBe('network down')
    expect(store.doc.name).toBe('A')

    // Typing on while offline is kept and does not hammer the server.
    store.apply({ type: 'diagram.rename', name: 'AB' })
    await vi.advanceTimersByTimeAsync(SAVE_RETRY_MS[0] - 1)
    expect(fake.calls).toHaveLength(1)
    await vi.advanceTimersByTimeAsync(1)
    expect(fake.calls).toHaveLength(2)
    await fake.fail('still down')
    await vi.advanceTimersByTimeAsync(SAVE_RETRY_MS[1] - 1)
    expect(fake.calls).toHaveLength(2)
    await vi.advanceTimersByTimeAsync(1)
    expect(fake.calls).toHaveLength(3)
    expect(fake.calls[2]!.doc.name).toBe('AB')
    await fake.succeed(8)
    expect(store.saveState).toBe('saved')
    expect(store.saveError).toBeNull()
  })

  test('retryNow saves at once instead of waiting for the backoff', async () => {
    const store = openStore()
    const fake = fakeSaver()
    store.configureSaver(fake.saver)
    store.apply({ type: 'diagram.rename', name: 'A' })
    await vi.advanceTimersByTimeAsync(SAVE_DEBOUNCE_MS)
    await fake.fail('timeout')
    expect(store.saveState).toBe('failed')
    const retry = store.retryNow()
    expect(fake.calls).toHaveLength(2)
    expect(store.saveState).toBe('saving')
    await fake.succeed(8)
    await retry
    expect(store.saveState).toBe('saved')
    // The old backoff timer was cancelled.
    await vi.advanceTimersByTimeAsync(SAVE_RETRY_MS[0] * 2)
    expect(fake.calls).toHaveLength(2)
  })

  test('a saver that answers without a revision counts as a failure', async () => {
    const store = openStore()
    store.configureSaver(() => Promise.resolve({} as { revision: number }))
    store.apply({ type: 'diagram.rename', name: 'A' })
    await vi.advanceTimersByTimeAsync(SAVE_DEBOUNCE_MS)
    expect(store.saveState).toBe('failed')
    expect(store.saveError).toMatch(/no revision/)
  })

  test('edits before a saver is configured are saved once it is', async () => {
    const store = openStore()
    store.apply({ type: 'diagram.rename', name: 'A' })
    await vi.advanceTimersByTimeAsync(SAVE_DEBOUNCE_MS * 2)
    expect(store.saveState).toBe('dirty')
    const fake = fakeSaver()
    store.configureSaver(fake.saver)
    await vi.advanceTimersByTimeAsync(SAVE_DEBOUNCE_MS)
    expect(fake.calls).toHaveLength(1)
  })

  test('flush saves pending edits now', async () => {
    const store = openStore()
    store.configureSaver(async (_id, _doc, revision) => ({ revision: revision + 1 }))
    store.apply({ type: 'diagram.rename', name: 'A' })
    expect(await store.flush()).toBe(true)
    expect(store.revision).toBe(8)
  })

  test('an answer for a diagram no longer open is ignored', async () => {
    const store = openStore()
    const fake = fakeSaver()
    store.configureSaver(fake.saver)
    store.apply({ type: 'diagram.rename', name: 'A' })
    await vi.advanceTimersByTimeAsync(SAVE_DEBOUNCE_MS)
    store.load('d-2', sampleDiagram(), 3)
    await fake.succeed(99)
    expect(store.revision).toBe(3)
    expect(store.saveState).toBe('saved')
  })
})
