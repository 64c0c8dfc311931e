/**
 * The open diagram: document, live calculation, undo/redo, selection and clipboard, kept as a
 * co-editing replica (shared/sync). Every edit — undo and redo included — is applied at once and
 * queued as a pending op; the realtime channel (src/realtime) sends it and feeds back acks,
 * refusals and others' ops, which rebase what is still pending. Components call these actions
 * and read `error` strings from their results; nothing here throws into a component.
 */
import { can, type ProjectRole } from '@shared/auth/roles'
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
import type { OpSubmit } from '@shared/protocol/client-messages'
import { PROTOCOL_LIMITS } from '@shared/protocol/events'
import type { CatchUp, OpAck, OpApplied, OpReject } from '@shared/protocol/server-messages'
import * as sync from '@shared/sync/replica'
import { summarizeOperation } from '@shared/sync/summary'
import { acceptHMRUpdate, defineStore } from 'pinia'
import { computed, ref, shallowRef, watch } from 'vue'
import { useConnectionStore } from './connection'

/** saved: the server has every edit. saving: edits are on their way. offline: edits are kept here
 * until the connection returns. failed: the server will not take edits (see `saveError`). */
export type SaveState = 'saved' | 'saving' | 'offline' | 'failed'
export type ActionResult = { ok: true } | { ok: false; error: string }
export type SyncNoticeKind = sync.SyncNotice['kind']
/** Something to tell the user after a sync step; `seq` grows so a watcher sees repeats. */
export interface DocumentNotice {
  seq: number
  kind: SyncNoticeKind
  text: string
  ids: string[]
}

/** How long `flush` waits for the server to confirm pending edits. */
export const FLUSH_TIMEOUT_MS = 8_000
/** Refusals that say "not now" rather than "never": the op stays pending and is sent again. */
const TRANSIENT = new Set<OpReject['code']>(['limit', 'unavailable'])
/** After this many transient refusals of one op it is rolled back like any other refusal. */
export const MAX_TRANSIENT_RETRIES = 5

const messageOf = (error: unknown) => (error instanceof Error ? error.message : String(error))
const bytesOf = (value: unknown) => new TextEncoder().encode(JSON.stringify(value)).length

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

function noticeText(notice: sync.SyncNotice): string {
  const what = summarizeOperation(notice.op)
  if (notice.kind === 'rejected')
    return `Your edit (${what}) was refused and undone: ${notice.reason}`
  if (notice.kind === 'conflict') {
    return `Your edit (${what}) no longer fits after someone else's change; it is on hold until the server decides: ${notice.reason}`
  }
  return `A change from the server did not apply here (${notice.reason}); reloading the diagram`
}

export const useDocumentStore = defineStore('document', () => {
  const connection = useConnectionStore()
  const replica = shallowRef<sync.Replica>(sync.createReplica('', emptyDiagram(), 0))
  const diagramId = ref<string | null>(null)
  /** A past revision shown read-only (history), or null for the live diagram. */
  const preview = shallowRef<{ revision: number; doc: Diagram } | null>(null)
  const role = ref<ProjectRole | null>(null)
  const history = shallowRef(stack.createHistory())
  const selectedNodeIds = ref<string[]>([])
  const selectedPipeIds = ref<string[]>([])
  const clipboard = shallowRef<Fragment | null>(null)
  const notice = shallowRef<DocumentNotice | null>(null)

  const doc = computed(() => preview.value?.doc ?? replica.value.view)
  /** The last revision the server confirmed. */
  const revision = computed(() => replica.value.revision)
  const pendingCount = computed(() => replica.value.pending.length)
  const canEdit = computed(() => role.value === null || can(role.value, 'diagram.edit'))
  const result = computed<DiagramResult>(() => {
    try {
      return computeDiagram(doc.value)
    } catch (error) {
      return failedResult(error)
    }
  })
  const canUndo = computed(() => stack.canUndo(history.value))
  const canRedo = computed(() => stack.canRedo(history.value))

  const saveState = computed<SaveState>(() => {
    if (!pendingCount.value) return 'saved'
    if (connection.status === 'refused') return 'failed'
    return connection.live ? 'saving' : 'offline'
  })
  const saveError = computed(() => {
    if (saveState.value === 'failed') return connection.reason
    if (saveState.value !== 'offline') return null
    const n = pendingCount.value
    return `${n} ${n === 1 ? 'change is' : 'changes are'} kept here and sent when the connection returns`
  })

  let outbox: ((submit: OpSubmit) => void) | null = null
  let noticeSeq = 0
  let pasteCount = 0
  const transientRefusals = new Map<string, number>()

  // Others' edits can remove what is selected here, not just our own.
  watch(
    doc,
    (next) => {
      const nodes = new Set(next.nodes.map((node) => node.id))
      const pipes = new Set(next.pipes.map((pipe) => pipe.id))
      const keptNodes = selectedNodeIds.value.filter((id) => nodes.has(id))
      const keptPipes = selectedPipeIds.value.filter((id) => pipes.has(id))
      if (keptNodes.length !== selectedNodeIds.value.length) selectedNodeIds.value = keptNodes
      if (keptPipes.length !== selectedPipeIds.value.length) selectedPipeIds.value = keptPipes
    },
    { flush: 'sync' },
  )

  function tell(notices: readonly sync.SyncNotice[]) {
    for (const n of notices) {
      notice.value = { seq: ++noticeSeq, kind: n.kind, text: noticeText(n), ids: n.ids }
    }
  }

  function take(outcome: sync.SyncResult) {
    replica.value = outcome.replica
    tell(outcome.notices)
  }

  /** Why an edit cannot be made now, or null. */
  function editBlock(): string | null {
    if (preview.value) {
      return `You are looking at revision ${preview.value.revision}; go back to the live diagram to edit`
    }
    if (!canEdit.value)
      return 'You can follow this diagram but not edit it (your role is read-only)'
    return null
  }

  /** Applies a local op to the view, queues it and sends it when live. Throws when it does not apply. */
  function submitLocal(op: Operation) {
    const { replica: next, submit } = sync.localApply(replica.value, op)
    const bytes = bytesOf(submit)
    if (bytes > PROTOCOL_LIMITS.maxMessageBytes) {
      throw new Error(
        `this change is too large to send (${Math.ceil(bytes / 1024)} kB, the limit is ${PROTOCOL_LIMITS.maxMessageBytes / 1024} kB); make it in smaller steps`,
      )
    }
    replica.value = next
    if (connection.live) outbox?.(submit)
  }

  /** Opens a diagram at the revision the API returned; the channel catches up from there. */
  function load(id: string, input: Diagram, rev: number): ActionResult {
    const parsed = diagramSchema.safeParse(input)
    if (!parsed.success) {
      const issue = parsed.error.issues[0]!
      return {
        ok: false,
        error: `diagram ${id}: ${issue.path.join('.') || 'document'}: ${issue.message}`,
      }
    }
    unload()
    diagramId.value = id
    replica.value = sync.createReplica(id, parsed.data, rev)
    return { ok: true }
  }

  /** Forgets the open diagram (leaving the editor, tests). */
  function unload() {
    pasteCount = 0
    transientRefusals.clear()
    diagramId.value = null
    replica.value = sync.createReplica('', emptyDiagram(), 0)
    preview.value = null
    role.value = null
    history.value = stack.createHistory()
    selectedNodeIds.value = []
    selectedPipeIds.value = []
    notice.value = null
  }

  function apply(op: Operation): ActionResult {
    if (op?.type === OPS.batch && op.ops.length === 0) return { ok: true }
    const blocked = editBlock()
    if (blocked) return { ok: false, error: blocked }
    try {
      const { inverse } = stack.applyWithInverse(replica.value.view, op)
      submitLocal(op)
      history.value = stack.record(history.value, op, inverse)
      return { ok: true }
    } catch (error) {
      return { ok: false, error: messageOf(error) }
    }
  }

  function step(move: typeof stack.undo): ActionResult {
    const blocked = editBlock()
    if (blocked) return { ok: false, error: blocked }
    const outcome = move(history.value, replica.value.view)
    if (!outcome) return { ok: false, error: 'nothing to do' }
    history.value = outcome.history
    if (!outcome.ok) return { ok: false, error: outcome.error.message }
    try {
      submitLocal(outcome.op)
      return { ok: true }
    } catch (error) {
      return { ok: false, error: messageOf(error) }
    }
  }
  const undo = () => step(stack.undo)
  const redo = () => step(stack.redo)

  // ── sync inputs, called by the realtime channel ──────────────────────────────────────────

  /** The channel's sender; it is called only while the link is live. */
  function attachOutbox(fn: ((submit: OpSubmit) => void) | null) {
    outbox = fn
  }

  /** A join was answered (snapshot or missed ops); the role comes with it. */
  function caughtUp(update: CatchUp) {
    if (update.diagramId !== diagramId.value) return
    role.value = update.role
    take(sync.catchUp(replica.value, update))
  }

  function remoteApplied(applied: OpApplied) {
    if (applied.diagramId === diagramId.value) take(sync.receiveRemote(replica.value, applied))
  }

  function acknowledged(ack: OpAck) {
    if (ack.diagramId !== diagramId.value) return
    transientRefusals.delete(ack.clientOpId)
    take(sync.acknowledge(replica.value, ack))
  }

  /** A refusal: 'retry' when it only means "not now" (the op stays pending), else rolled back. */
  function rejected(rejection: OpReject): 'retry' | 'rolled-back' | 'unknown' {
    const pending = replica.value.pending.find((p) => p.clientOpId === rejection.clientOpId)
    if (!pending) return 'unknown'
    const tries = (transientRefusals.get(rejection.clientOpId) ?? 0) + 1
    if (TRANSIENT.has(rejection.code) && tries <= MAX_TRANSIENT_RETRIES) {
      transientRefusals.set(rejection.clientOpId, tries)
      return 'retry'
    }
    transientRefusals.delete(rejection.clientOpId)
    take(sync.reject(replica.value, rejection))
    // Undo must not bring back (or take away) an edit that never happened.
    const kept = (e: stack.HistoryEntry) => e.forward !== pending.op && e.inverse !== pending.op
    const h = history.value
    history.value = { ...h, past: h.past.filter(kept), future: h.future.filter(kept) }
    return 'rolled-back'
  }

  /** Pending ops to send again after a (re)join, rebased on the confirmed revision. */
  const replayable = () => sync.pendingForReplay(replica.value)
  const needsSnapshot = computed(() => replica.value.stale)
  const missingRevision = computed(() => sync.missingRevision(replica.value))

  // ── history preview ──────────────────────────────────────────────────────────────────────

  /** Shows the diagram as it was at `rev`, read-only; live edits keep arriving underneath. */
  function showRevision(rev: number, input: Diagram) {
    preview.value = { revision: rev, doc: input }
  }
  const closeRevision = () => (preview.value = null)

  // ── selection and clipboard ──────────────────────────────────────────────────────────────

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

  /** Reconnects now instead of waiting for the next automatic attempt. */
  const retryNow = () => connection.retryNow()

  /** Waits until the server has every edit (true), or gives up offline or after a timeout (false). */
  function flush(timeoutMs = FLUSH_TIMEOUT_MS): Promise<boolean> {
    if (!pendingCount.value) return Promise.resolve(true)
    if (!connection.live) return Promise.resolve(false)
    return new Promise((resolve) => {
      const finish = (ok: boolean) => {
        stop()
        clearTimeout(timer)
        resolve(ok)
      }
      const timer = setTimeout(() => finish(false), timeoutMs)
      const stop = watch([pendingCount, () => connection.live], ([n, live]) => {
        if (!n) finish(true)
        else if (!live) finish(false)
      })
    })
  }

  return {
    diagramId,
    doc,
    revision,
    replica,
    preview,
    role,
    canEdit,
    pendingCount,
    result,
    history,
    selectedNodeIds,
    selectedPipeIds,
    clipboard,
    saveState,
    saveError,
    notice,
    canUndo,
    canRedo,
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
    attachOutbox,
    caughtUp,
    remoteApplied,
    acknowledged,
    rejected,
    replayable,
    needsSnapshot,
    missingRevision,
    showRevision,
    closeRevision,
  }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useDocumentStore, import.meta.hot))
