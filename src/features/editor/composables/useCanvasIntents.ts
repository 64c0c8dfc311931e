/**
 * Canvas gestures → document operations: drag-stop becomes one move batch (snapped to the level
 * under each node), a drawn connection becomes a pipe (refused with a reason when it would close
 * a loop or give a node a second inlet), a palette drop or click becomes a new node.
 */
import { connectionProblem } from '@shared/document/graph-edits'
import { createIdAllocator } from '@shared/document/ids'
import { elevationOnLevel, levelAtY } from '@shared/document/levels'
import type { Diagram, DiagramNode, System } from '@shared/document/model'
import { newNode } from '@shared/document/new-node'
import { OPS, type Operation } from '@shared/document/operations'
import { useDocumentStore } from '@/stores/document'
import { HANDLE } from '../canvas-data'
import type { PaletteItem } from '../palette/palette-item'

export interface IntentOutcome {
  ok: boolean
  message?: string
}

/** Default developed length of a drawn pipe (the designer sets the real one); risers get the storey height. */
const DEFAULT_PIPE_M = 3

/** The system a new pipe belongs to: the hot inlet is hot; otherwise it follows what feeds it. */
export function systemOfConnection(
  doc: Diagram,
  from: DiagramNode,
  targetHandle: string | null | undefined,
): System {
  if (targetHandle === HANDLE.hot) return 'hot'
  if (targetHandle === HANDLE.cold) return 'cold'
  if (from.kind === 'water-heater') return 'hot'
  const inlet = doc.pipes.find((p) => p.to === from.id)
  return inlet?.system ?? 'cold'
}

function pipeLength(from: DiagramNode, to: DiagramNode): number {
  const rise = Math.abs(to.elevationM - from.elevationM)
  return Math.round(Math.max(DEFAULT_PIPE_M, rise + 1) * 10) / 10
}

/** Spacing of nodes added by palette click (px): fixtures stand above their branch, others follow it. */
const STEP = { across: 190, up: 140, along: 200 }
const CLEARANCE = 60

/**
 * Where a clicked palette item goes: next to the selected node it will be piped from (a fixture
 * above the branch, beside the fixtures already there; anything else further along), else at
 * `fallback`; nudged until it does not sit on another node.
 */
export function placeNear(
  doc: Diagram,
  parent: DiagramNode | undefined,
  kind: DiagramNode['kind'],
  fallback: { x: number; y: number },
): { x: number; y: number } {
  let p = fallback
  if (parent?.position) {
    const siblings = doc.pipes.filter((pipe) => pipe.from === parent.id).length
    p =
      kind === 'fixture' || kind === 'equipment'
        ? { x: parent.position.x + siblings * STEP.across, y: parent.position.y - STEP.up }
        : { x: parent.position.x + STEP.along, y: parent.position.y + siblings * 60 }
  }
  const taken = (q: { x: number; y: number }) =>
    doc.nodes.some(
      (n) =>
        n.position &&
        Math.abs(n.position.x - q.x) < CLEARANCE &&
        Math.abs(n.position.y - q.y) < CLEARANCE,
    )
  for (let i = 0; i < 50 && taken(p); i++) p = { x: p.x + 40, y: p.y + 40 }
  return p
}

export function useCanvasIntents() {
  const store = useDocumentStore()
  const find = (id: string) => store.doc.nodes.find((n) => n.id === id)

  function applyOrExplain(op: Operation): IntentOutcome {
    const outcome = store.apply(op)
    return outcome.ok ? { ok: true } : { ok: false, message: outcome.error }
  }

  /** Commits the end of a drag of one or more nodes. */
  function moveNodes(moved: { id: string; position: { x: number; y: number } }[]): IntentOutcome {
    const doc = store.doc
    const ops: Operation[] = []
    for (const { id, position } of moved) {
      const node = find(id)
      if (!node) continue
      const rounded = { x: Math.round(position.x), y: Math.round(position.y) }
      const level = levelAtY(doc.levels, rounded.y)
      const from = doc.levels.find((l) => l.id === node.levelId)
      const changesLevel = level && level.id !== node.levelId
      ops.push({
        type: OPS.nodeMove,
        id,
        position: rounded,
        ...(changesLevel
          ? { levelId: level.id, elevationM: elevationOnLevel(node.elevationM, from, level) }
          : {}),
      })
    }
    if (!ops.length) return { ok: true }
    return applyOrExplain(ops.length === 1 ? ops[0]! : { type: OPS.batch, ops })
  }

  /** Draws a pipe between two handles. */
  function connect(source: string, target: string, targetHandle?: string | null): IntentOutcome {
    const from = find(source)
    const to = find(target)
    if (!from || !to)
      return { ok: false, message: 'Both ends of a pipe must be nodes of this diagram' }
    const system = systemOfConnection(store.doc, from, targetHandle)
    const problem = connectionProblem(store.doc, { from: source, to: target, system })
    if (problem) return { ok: false, message: `Pipe not drawn: ${problem}` }
    const id = createIdAllocator(store.doc)('pipe')
    const outcome = applyOrExplain({
      type: OPS.pipeAdd,
      pipe: { id, from: source, to: target, system, lengthM: pipeLength(from, to) },
    })
    if (outcome.ok) store.select([], [id])
    return outcome
  }

  /**
   * Adds a node from the palette at `position`. With a single feeding node selected, the new node
   * is piped to it at once (the quickest way to grow a branch).
   */
  function addNode(
    item: PaletteItem,
    position: { x: number; y: number },
    placed = false,
  ): IntentOutcome {
    const parent = store.selectedNodeIds.length === 1 ? find(store.selectedNodeIds[0]!) : undefined
    const at = placed ? position : placeNear(store.doc, parent, item.kind, position)
    const node = newNode(store.doc, item, at)
    const ops: Operation[] = [{ type: OPS.nodeAdd, node }]
    let pipeNote = ''
    if (
      parent &&
      parent.kind !== 'fixture' &&
      parent.kind !== 'equipment' &&
      node.kind !== 'supply'
    ) {
      const system = systemOfConnection(
        store.doc,
        parent,
        node.kind === 'fixture' ? HANDLE.cold : null,
      )
      const afterAdd = { ...store.doc, nodes: [...store.doc.nodes, node] }
      if (!connectionProblem(afterAdd, { from: parent.id, to: node.id, system })) {
        const id = createIdAllocator(afterAdd)('pipe')
        ops.push({
          type: OPS.pipeAdd,
          pipe: { id, from: parent.id, to: node.id, system, lengthM: pipeLength(parent, node) },
        })
        pipeNote = ` and piped from ${parent.id}`
      }
    }
    const outcome = applyOrExplain(ops.length === 1 ? ops[0]! : { type: OPS.batch, ops })
    if (outcome.ok) store.select([node.id])
    return outcome.ok ? { ok: true, message: `Added ${node.id}${pipeNote}` } : outcome
  }

  return { moveNodes, connect, addNode }
}
