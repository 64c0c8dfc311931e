/**
 * Live calculation: keeps the engine's state between edits so that one property edit (a fixture
 * count, a pipe length, a device loss ...) costs the pipes on the edited element's paths to the
 * supply, O(depth · log n), instead of the whole diagram. Structural edits (adding, removing or
 * reconnecting nodes and pipes) and project settings rebuild the state.
 *
 * Equality with computeDiagram is by construction: loads are integer sums (exact in any order),
 * sizes depend only on a pipe's own flow, and whenever some fixture is within 1e-6 kPa of its
 * minimum, or the last design needed the pressure budget pass, that pass is re-run in full.
 */
import {
  nodeSchema,
  pipeSchema,
  type Diagram,
  type DiagramNode,
  type Pipe,
} from '../document/model.ts'
import { cloneForEngine } from './compute.ts'
import { Engine, type UpdateMode } from './engine.ts'
import { buildResult, nodeResult, pipeResult } from './result.ts'
import type { CalcIssue, DiagramResult, NodeResult, PipeResult } from './types.ts'
import { checkFixtureKey, checkPipe } from './validate.ts'

/** A node's editable properties (not its id or kind). */
export type NodePatch = Partial<Omit<DiagramNode, 'id' | 'kind'>> & Record<string, unknown>

/** One edit to apply to a live calculation. */
export type LiveEdit =
  | { type: 'node.update'; id: string; patch: NodePatch }
  | {
      type: 'pipe.update'
      id: string
      patch: Partial<Pick<Pipe, 'lengthM' | 'material' | 'nominal'>>
    }
  | { type: 'document.replace'; doc: Diagram }

/** What an edit did. */
export interface LiveUpdate {
  /**
   * 'incremental': only `pipes` changed; 'budget': loads were updated incrementally, then the
   * pressure budget pass re-ran; 'recompute': sums and sizes were redone on the same graph;
   * 'rebuild': a new state was built; 'rejected': the edit was invalid and nothing changed.
   */
  mode: UpdateMode | 'rebuild' | 'rejected'
  /** Ids of pipes whose load, flow or size may have changed (all pipes after a rebuild). */
  pipes: string[]
  /** Why an edit was rejected. */
  issues: CalcIssue[]
}

/** A calculation kept live across edits. */
export interface LiveCalculation {
  /** The current document (the live calculation's own copy). */
  readonly doc: Diagram
  /** Applies one edit and updates the calculation. */
  apply(edit: LiveEdit): LiveUpdate
  /** The full result, equal to computeDiagram(doc); O(n), cached until the next edit. */
  result(): DiagramResult
  /** One pipe's result (pressures read along its path, O(depth)). */
  pipe(id: string): PipeResult | undefined
  /** One node's result. */
  node(id: string): NodeResult | undefined
}

// Properties that change the graph itself, not just numbers on it.
const STRUCTURAL_NODE_KEYS = new Set(['id', 'kind'])
const VIEW_ONLY_KEYS = new Set(['label', 'position', 'levelId'])

/**
 * Starts a live calculation of `doc` (copied; the caller's document is never changed).
 * @example
 * const live = createLiveCalculation(doc)
 * live.apply({ type: 'node.update', id: 'wc-g-men', patch: { count: 5 } })
 * live.pipe('riser-1')?.nominal
 */
export function createLiveCalculation(doc: Diagram): LiveCalculation {
  let engine = new Engine(cloneForEngine(doc))
  let cached: DiagramResult | null = null
  const all = () => engine.pipeIds.slice()

  const rebuild = (next: Diagram): LiveUpdate => {
    engine = new Engine(cloneForEngine(next))
    return { mode: 'rebuild', pipes: all(), issues: [] }
  }
  const reject = (issues: CalcIssue[]): LiveUpdate => ({ mode: 'rejected', pipes: [], issues })
  const ids = (qs: number[]) => qs.map((q) => engine.pipeIds[q]!)

  function applyNode(id: string, patch: NodePatch): LiveUpdate {
    const i = engine.nodeAt(id)
    if (i === undefined) return reject([issue('unknown-id', `No node "${id}".`, [id])])
    if (Object.keys(patch).some((k) => STRUCTURAL_NODE_KEYS.has(k))) {
      return reject([
        issue('structural-edit', `Node ${id}: change id or kind with document.replace.`, [id]),
      ])
    }
    const parsed = nodeSchema.safeParse({ ...engine.doc.nodes[i], ...patch })
    if (!parsed.success) {
      const msg = parsed.error.issues.map((x) => `${x.path.join('.')}: ${x.message}`).join('; ')
      return reject([issue('schema', `Node ${id}: ${msg}`, [id])])
    }
    const node = parsed.data
    if (Object.keys(patch).every((k) => VIEW_ONLY_KEYS.has(k))) {
      ;(engine.doc.nodes as DiagramNode[])[i] = node
      return { mode: 'none', pipes: [], issues: [] }
    }
    const local: CalcIssue[] = []
    checkFixtureKey(node, (code, message, ids) => local.push(issue(code, message, ids)))
    if (local.length > 0 || engine.hasErrors) {
      return rebuild(replaceAt(engine.doc, 'nodes', i, node))
    }
    const r = engine.updateNode(i, node)
    return { mode: r.mode, pipes: ids(r.pipes), issues: [] }
  }

  function applyPipe(id: string, patch: LiveEdit & { type: 'pipe.update' }): LiveUpdate {
    const q = engine.g.pipeIndex.get(id)
    if (q === undefined) return reject([issue('unknown-id', `No pipe "${id}".`, [id])])
    const parsed = pipeSchema.safeParse({ ...engine.docPipe(q), ...patch.patch })
    if (!parsed.success) {
      const msg = parsed.error.issues.map((x) => `${x.path.join('.')}: ${x.message}`).join('; ')
      return reject([issue('schema', `Pipe ${id}: ${msg}`, [id])])
    }
    const pipe = parsed.data
    const local: CalcIssue[] = []
    checkPipe(engine.doc, pipe, (code, message, ids) => local.push(issue(code, message, ids)))
    if (local.length > 0 || engine.hasErrors)
      return rebuild(replaceAt(engine.doc, 'pipes', engine.g.pipeDoc[q]!, pipe))
    const r = engine.updatePipe(q, pipe)
    return { mode: r.mode, pipes: ids(r.pipes), issues: [] }
  }

  return {
    get doc() {
      return engine.doc
    },
    apply(edit) {
      cached = null
      if (edit.type === 'document.replace') return rebuild(edit.doc)
      if (!engine.structuralOk) return rebuild(engine.doc)
      if (edit.type === 'node.update') return applyNode(edit.id, edit.patch)
      return applyPipe(edit.id, edit)
    },
    result() {
      cached ??= buildResult(engine)
      return cached
    },
    pipe(id) {
      const q = engine.g.pipeIndex.get(id)
      if (q === undefined || !engine.structuralOk) return undefined
      if (!engine.stale) return pipeResult(engine, q)
      return withFreshPressures(engine, () => pipeResult(engine, q))
    },
    node(id) {
      const v = engine.nodeAt(id)
      if (v === undefined || !engine.structuralOk) return undefined
      if (!engine.stale) return nodeResult(engine, v)
      return withFreshPressures(engine, () => nodeResult(engine, v))
    },
  }
}

// After incremental edits pressures are stale; the first read refreshes them all once (O(n)),
// later reads are free until the next edit.
function withFreshPressures<T>(engine: Engine, read: () => T): T {
  engine.refreshPressures()
  return read()
}

function issue(code: string, message: string, ids: string[]): CalcIssue {
  return { severity: 'error', code, message, ids }
}

function replaceAt<K extends 'nodes' | 'pipes'>(
  doc: Diagram,
  key: K,
  i: number,
  item: Diagram[K][number],
): Diagram {
  const list = doc[key].slice() as Diagram[K][number][]
  list[i] = item
  return { ...doc, [key]: list }
}
