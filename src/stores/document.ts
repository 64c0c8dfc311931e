/**
 * The open diagram: document, live calculation, undo/redo, selection, clipboard and autosave.
 * Components call these actions and read `error` strings from their results; nothing here throws
 * into a component. Every edit goes through one shared operation so it can later go over the socket.
 */
import { acceptHMRUpdate, defineStore } from 'pinia'
import { computed, ref, shallowRef } from 'vue'
import { computeDiagram } from '@shared/calc/compute'
import type { DiagramResult } from '@shared/calc/types'
import { batteryOperation, type BatteryOptions } from '@shared/document/battery'
import {
  copySelection,
  pasteFragment,
  PASTE_OFFSET,
  type Fragment,
} from '@shared/document/clipboard'
import { removalOperation } from '@shared/document/graph-edits'
import * as stack from '@shared/document/history'
import { diagramSchema, emptyDiagram, type Diagram } from '@shared/document/model'
import { OPS, type Operation } from '@shared/document/operations'

export type SaveState = 'saved' | 'dirty' | 'saving' | 'failed'
export type Saver = (
  diagramId: string,
  doc: Diagram,
  revision: number,
) => Promise<{ revision: number }>
export type ActionResult = { ok: true } | { ok: false; error: string }

/** Quiet time after the last edit before the document is sent. */
export const SAVE_DEBOUNCE_MS = 800
/** Waits before each retry after a failed save; the last one repeats until a save succeeds. */
export const SAVE_RETRY_MS = [2_000, 5_000, 15_000, 30_000, 60_000] as const

const messageOf = (error: unknown) => (error instanceof Error ? error.message : String(error))

/** What the canvas shows if the engine itself throws: the editor keeps working on the document. */
function failedResult(error: unknown): DiagramResult {
  const message = `calculation failed: ${messageOf(error)}`
  return {
    ok: false,
    pipes: {},
    nodes: {},
    issues: [{ severity: 'error', code: 'calc-failed', message, ids: [] }],
  }
}

export const useDocumentStore = defineStore('document', () => {
  const diagramId = ref<string | null>(null)
  const doc = shallowRef<Diagram>(emptyDiagram())
  const revision = ref(0)
  const history = shallowRef(stack.createHistory())
  const selectedNodeIds = ref<string[]>([])
  const selectedPipeIds = ref<string[]>([])
  const clipboard = shallowRef<Fragment | null>(null)
  const saveState = ref<SaveState>('saved')
  const saveError = ref<string | null>(null)

  const result = computed<DiagramResult>(() => {
    try {
      return computeDiagram(doc.value)
    } catch (error) {
      return failedResult(error)
    }
  })
  const canUndo = computed(() => stack.canUndo(history.value))
  const canRedo = computed(() => stack.canRedo(history.value))

  let saver: Saver | null = null
  let timer: ReturnType<typeof setTimeout> | null = null
  let inFlight: Promise<void> | null = null
  let failures = 0
  let edits = 0 // bumped per change; a save knows whether it captured the latest edit
  let session = 0 // bumped per load; answers for an earlier diagram are ignored
  let pasteCount = 0

  function clearTimer() {
    if (timer !== null) clearTimeout(timer)
    timer = null
  }

  function schedule(ms: number) {
    clearTimer()
    timer = setTimeout(() => void save(), ms)
  }

  function save(): Promise<void> {
    clearTimer()
    if (inFlight) return inFlight
    const id = diagramId.value
    if (!saver || id === null || saveState.value === 'saved') return Promise.resolve()
    const ticket = { session, edits }
    saveState.value = 'saving'
    const run = (async () => {
      try {
        const answer = await saver(id, doc.value, revision.value)
        if (typeof answer?.revision !== 'number') throw new Error('the server sent no revision')
        if (ticket.session !== session) return
        revision.value = answer.revision
        failures = 0
        saveError.value = null
        saveState.value = edits === ticket.edits ? 'saved' : 'dirty'
        if (saveState.value === 'dirty') schedule(SAVE_DEBOUNCE_MS)
      } catch (error) {
        if (ticket.session !== session) return
        failures += 1
        saveState.value = 'failed'
        saveError.value = messageOf(error)
        schedule(SAVE_RETRY_MS[Math.min(failures, SAVE_RETRY_MS.length) - 1]!)
      }
    })()
    inFlight = run
    void run.finally(() => {
      if (inFlight === run) inFlight = null
    })
    return run
  }

  function markDirty() {
    edits += 1
    // While saving or failed, the running save or the retry timer picks up the latest document.
    if (saveState.value === 'saving' || saveState.value === 'failed') return
    saveState.value = 'dirty'
    schedule(SAVE_DEBOUNCE_MS)
  }

  function commit(next: Diagram) {
    doc.value = next
    const nodes = new Set(next.nodes.map((node) => node.id))
    const pipes = new Set(next.pipes.map((pipe) => pipe.id))
    selectedNodeIds.value = selectedNodeIds.value.filter((id) => nodes.has(id))
    selectedPipeIds.value = selectedPipeIds.value.filter((id) => pipes.has(id))
    markDirty()
  }

  /** Injects the HTTP save; until then edits stay 'dirty' in memory. */
  function configureSaver(fn: Saver) {
    saver = fn
    if (saveState.value === 'dirty' && timer === null && !inFlight) schedule(SAVE_DEBOUNCE_MS)
  }

  /** Opens a diagram. An unsaved previous diagram gets one last save attempt first. */
  function load(id: string, input: Diagram, rev: number): ActionResult {
    const parsed = diagramSchema.safeParse(input)
    if (!parsed.success) {
      const issue = parsed.error.issues[0]!
      return {
        ok: false,
        error: `diagram ${id}: ${issue.path.join('.') || 'document'}: ${issue.message}`,
      }
    }
    if (
      saver &&
      diagramId.value !== null &&
      saveState.value !== 'saved' &&
      diagramId.value !== id
    ) {
      void saver(diagramId.value, doc.value, revision.value).catch(() => undefined)
    }
    unload()
    diagramId.value = id
    doc.value = parsed.data
    revision.value = rev
    return { ok: true }
  }

  /** Forgets the open diagram and stops timers (leaving the editor, tests). */
  function unload() {
    clearTimer()
    session += 1
    inFlight = null
    failures = 0
    pasteCount = 0
    diagramId.value = null
    doc.value = emptyDiagram()
    revision.value = 0
    history.value = stack.createHistory()
    selectedNodeIds.value = []
    selectedPipeIds.value = []
    saveState.value = 'saved'
    saveError.value = null
  }

  function apply(op: Operation): ActionResult {
    if (op?.type === OPS.batch && op.ops.length === 0) return { ok: true }
    try {
      const { doc: next, inverse } = stack.applyWithInverse(doc.value, op)
      commit(next)
      history.value = stack.record(history.value, op, inverse)
      return { ok: true }
    } catch (error) {
      return { ok: false, error: messageOf(error) }
    }
  }

  function step(move: typeof stack.undo): ActionResult {
    const outcome = move(history.value, doc.value)
    if (!outcome) return { ok: false, error: 'nothing to do' }
    history.value = outcome.history
    if (!outcome.ok) return { ok: false, error: outcome.error.message }
    commit(outcome.doc)
    return { ok: true }
  }
  const undo = () => step(stack.undo)
  const redo = () => step(stack.redo)

  function select(nodeIds: readonly string[], pipeIds: readonly string[] = []) {
    selectedNodeIds.value = [...nodeIds]
    selectedPipeIds.value = [...pipeIds]
  }
  const clearSelection = () => select([], [])

  /** Copies the selected nodes (and pipes between them); returns the fragment for the system clipboard. */
  function copy(): Fragment | null {
    if (selectedNodeIds.value.length === 0) return null
    clipboard.value = copySelection(doc.value, selectedNodeIds.value)
    pasteCount = 0
    return clipboard.value
  }

  /** Pastes `fragment` (or the last copy); repeated pastes step further out so copies don't stack. */
  function paste(fragment: Fragment | null = clipboard.value): ActionResult {
    if (!fragment) return { ok: false, error: 'nothing to paste' }
    try {
      const n = pasteCount + 1
      const offset = { x: PASTE_OFFSET.x * n, y: PASTE_OFFSET.y * n }
      const pasted = pasteFragment(doc.value, fragment, offset)
      const applied = apply(pasted.op)
      if (applied.ok) {
        pasteCount = n
        select(pasted.nodeIds, pasted.pipeIds)
      }
      return applied
    } catch (error) {
      return { ok: false, error: messageOf(error) }
    }
  }

  function removeSelection(): ActionResult {
    const applied = apply(removalOperation(doc.value, selectedNodeIds.value, selectedPipeIds.value))
    if (applied.ok) clearSelection()
    return applied
  }

  function addBattery(options: BatteryOptions): ActionResult {
    try {
      const battery = batteryOperation(doc.value, options)
      const applied = apply(battery.op)
      if (applied.ok) select(battery.fixtureIds)
      return applied
    } catch (error) {
      return { ok: false, error: messageOf(error) }
    }
  }

  /** Saves now instead of waiting for the next retry. */
  const retryNow = () => save()
  /** Saves any pending edit now; await before leaving the editor. Resolves true when saved. */
  async function flush(): Promise<boolean> {
    await save()
    // An edit made while that save was running needs one more round.
    if (saveState.value === 'dirty') await save()
    return saveState.value === 'saved'
  }

  return {
    diagramId,
    doc,
    revision,
    result,
    history,
    selectedNodeIds,
    selectedPipeIds,
    clipboard,
    saveState,
    saveError,
    canUndo,
    canRedo,
    configureSaver,
    load,
    unload,
    apply,
    undo,
    redo,
    select,
    clearSelection,
    copy,
    paste,
    removeSelection,
    addBattery,
    retryNow,
    flush,
  }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useDocumentStore, import.meta.hot))
