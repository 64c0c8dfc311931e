/**
 * Document + live results → Vue Flow nodes and edges. The document store is the only truth.
 *
 * Each node and pipe keeps the same canvas object (and the same `data` object) for as long as
 * nothing it shows has changed, so whoever hands them to Vue Flow can tell by identity what to
 * push. On a 2,000-node diagram a property edit then touches only the nodes and pipes whose
 * labels change, instead of re-assigning `data` on every node (each assignment re-renders every
 * drawn node and edge). `data` is marked raw: Vue Flow's state is deeply reactive and would
 * otherwise wrap every document node and result in a proxy, which nothing here needs because a
 * change always arrives as a new `data` object.
 */
import type { CalcIssue, DiagramResult } from '@shared/calc/types'
import type { Diagram, DiagramNode } from '@shared/document/model'
import type { UnitSystem } from '@shared/units/system'
import type { VueFlowStore } from '@vue-flow/core'
import { computed, markRaw, type Ref } from 'vue'
import {
  PIPE_EDGE_TYPE,
  sourceHandleFor,
  targetHandleFor,
  type DiagramFlowNode,
  type DiagramNodeData,
  type PipeEdgeData,
  type PipeFlowEdge,
  type RemoteSelection,
} from '../canvas-data'
import { samePlain } from '../canvas-data'
import { nodeSizeBound } from '../nodes/node-size'

export interface CanvasSources {
  doc: Ref<Diagram>
  result: Ref<DiagramResult>
  units: Ref<UnitSystem>
  selectedNodeIds: Ref<readonly string[]>
  selectedPipeIds: Ref<readonly string[]>
  dragPositions: Ref<ReadonlyMap<string, { x: number; y: number }>>
  remoteSelections?: Ref<ReadonlyMap<string, RemoteSelection[]>>
  remotePipeSelections?: Ref<ReadonlyMap<string, RemoteSelection[]>>
}

const NO_PROBLEMS: CalcIssue[] = []

/** Issues by the id they name, so each node and pipe finds its own in O(1). */
function issuesById(issues: readonly CalcIssue[]): Map<string, CalcIssue[]> {
  const byId = new Map<string, CalcIssue[]>()
  for (const issue of issues) {
    for (const id of issue.ids) {
      const list = byId.get(id)
      if (list) list.push(issue)
      else byId.set(id, [issue])
    }
  }
  return byId
}

// Nodes without a stored position (imported documents) are fanned out so none hides another.
const fallbackPosition = (index: number) => ({
  x: 80 + (index % 8) * 140,
  y: 80 + Math.floor(index / 8) * 140,
})

/** The previous data object when it shows the same, else the next one (marked raw). */
function keepData<T extends object>(previous: T | undefined, next: T): T {
  return previous && samePlain(previous, next) ? previous : markRaw(next)
}

const samePosition = (a: { x: number; y: number }, b: { x: number; y: number }) =>
  a.x === b.x && a.y === b.y

export function useCanvasMapping(sources: CanvasSources) {
  const problems = computed(() => issuesById(sources.result.value.issues))
  // The canvas objects of the last run, by id; reused while they still show the same.
  let lastNodes = new Map<string, DiagramFlowNode>()
  let lastEdges = new Map<string, PipeFlowEdge>()

  const nodes = computed<DiagramFlowNode[]>(() => {
    const selected = new Set(sources.selectedNodeIds.value)
    const dragging = sources.dragPositions.value
    const results = sources.result.value.nodes
    const units = sources.units.value
    const remote = sources.remoteSelections?.value
    const next = new Map<string, DiagramFlowNode>()
    const list = sources.doc.value.nodes.map((node, index) => {
      const last = lastNodes.get(node.id)
      const data = keepData<DiagramNodeData>(last?.data, {
        node,
        result: results[node.id],
        problems: problems.value.get(node.id) ?? NO_PROBLEMS,
        units,
        selectedBy: remote?.get(node.id),
      })
      const wanted = dragging.get(node.id) ?? node.position ?? fallbackPosition(index)
      const position = last && samePosition(last.position, wanted) ? last.position : wanted
      const isSelected = selected.has(node.id)
      const same =
        last &&
        last.type === node.kind &&
        last.data === data &&
        last.position === position &&
        last.selected === isSelected
      const flowNode: DiagramFlowNode = same
        ? last
        : { id: node.id, type: node.kind, position, selected: isSelected, data }
      next.set(node.id, flowNode)
      return flowNode
    })
    lastNodes = next
    return list
  })

  const edges = computed<PipeFlowEdge[]>(() => {
    const byId = new Map<string, DiagramNode>(sources.doc.value.nodes.map((n) => [n.id, n]))
    const selected = new Set(sources.selectedPipeIds.value)
    const results = sources.result.value.pipes
    const units = sources.units.value
    const remote = sources.remotePipeSelections?.value
    const next = new Map<string, PipeFlowEdge>()
    const list: PipeFlowEdge[] = []
    for (const pipe of sources.doc.value.pipes) {
      const from = byId.get(pipe.from)
      const to = byId.get(pipe.to)
      // A pipe to a missing node is listed in the problems panel; there is nothing to draw.
      if (!from || !to) continue
      const last = lastEdges.get(pipe.id)
      const data = keepData<PipeEdgeData>(last?.data, {
        pipe,
        result: results[pipe.id],
        problems: problems.value.get(pipe.id) ?? NO_PROBLEMS,
        units,
        selectedBy: remote?.get(pipe.id),
      })
      const edge: PipeFlowEdge = {
        id: pipe.id,
        type: PIPE_EDGE_TYPE,
        source: pipe.from,
        target: pipe.to,
        sourceHandle: sourceHandleFor(from) ?? undefined,
        targetHandle: targetHandleFor(to, pipe.system) ?? undefined,
        selected: selected.has(pipe.id),
        data,
      }
      const kept = last && sameEdge(last, edge) ? last : edge
      next.set(pipe.id, kept)
      list.push(kept)
    }
    lastEdges = next
    return list
  })

  return { nodes, edges, problems }
}

function sameEdge(a: PipeFlowEdge, b: PipeFlowEdge) {
  return (
    a.data === b.data &&
    a.selected === b.selected &&
    a.source === b.source &&
    a.target === b.target &&
    a.sourceHandle === b.sourceHandle &&
    a.targetHandle === b.targetHandle
  )
}

/**
 * Hands mapped nodes and pipes to Vue Flow, pushing only what changed. Vue Flow's controlled
 * `:nodes`/`:edges` props re-apply every element on each change; here, while the set of ids stays
 * the same, only the objects the mapping replaced are assigned onto Vue Flow's own nodes and
 * edges, so a change re-renders only the drawn nodes and pipes it concerns. Nodes new to Vue Flow
 * get a size bound, so only those on screen are drawn (see nodes/node-size.ts).
 */
export function createFlowPush(flow: VueFlowStore) {
  let shownNodes = new Map<string, DiagramFlowNode>()
  let shownEdges = new Map<string, PipeFlowEdge>()

  function pushNodes(next: readonly DiagramFlowNode[]) {
    if (sameIds(shownNodes, next)) {
      for (const node of next) if (shownNodes.get(node.id) !== node) flow.updateNode(node.id, node)
    } else {
      flow.setNodes(
        next.map((node) =>
          flow.findNode(node.id) ? node : { ...node, dimensions: nodeSizeBound(node.type!) },
        ),
      )
    }
    shownNodes = new Map(next.map((node) => [node.id, node]))
  }

  function pushEdges(next: readonly PipeFlowEdge[]) {
    const sameEnds = (edge: PipeFlowEdge) => {
      const shown = shownEdges.get(edge.id)!
      return (
        shown.source === edge.source &&
        shown.target === edge.target &&
        shown.sourceHandle === edge.sourceHandle &&
        shown.targetHandle === edge.targetHandle
      )
    }
    if (sameIds(shownEdges, next) && next.every(sameEnds)) {
      for (const edge of next) {
        const graphEdge = flow.findEdge(edge.id)
        if (graphEdge && shownEdges.get(edge.id) !== edge) {
          Object.assign(graphEdge, { data: edge.data, selected: edge.selected })
        }
      }
    } else {
      flow.setEdges([...next])
    }
    shownEdges = new Map(next.map((edge) => [edge.id, edge]))
  }

  // Nodes first: Vue Flow drops an edge whose end it does not know yet.
  return (nodes: readonly DiagramFlowNode[], edges: readonly PipeFlowEdge[]) => {
    pushNodes(nodes)
    pushEdges(edges)
  }
}

function sameIds(shown: ReadonlyMap<string, unknown>, next: readonly { id: string }[]) {
  return shown.size === next.length && next.every((item) => shown.has(item.id))
}
