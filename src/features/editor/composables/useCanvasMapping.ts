/**
 * Document + live results → Vue Flow nodes and edges. The document store is the only truth;
 * Vue Flow gets a fresh derived array whenever the document, the result, the selection or the
 * units change. Positions being dragged are overlaid until the drag ends and becomes a move.
 */
import type { CalcIssue } from '@shared/calc/types'
import type { Diagram, DiagramNode } from '@shared/document/model'
import type { UnitSystem } from '@shared/units/system'
import { computed, type Ref } from 'vue'
import {
  PIPE_EDGE_TYPE,
  sourceHandleFor,
  targetHandleFor,
  type DiagramFlowNode,
  type PipeFlowEdge,
  type RemoteSelection,
} from '../canvas-data'
import type { DiagramResult } from '@shared/calc/types'

export interface CanvasSources {
  doc: Ref<Diagram>
  result: Ref<DiagramResult>
  units: Ref<UnitSystem>
  selectedNodeIds: Ref<readonly string[]>
  selectedPipeIds: Ref<readonly string[]>
  dragPositions: Ref<ReadonlyMap<string, { x: number; y: number }>>
  remoteSelections?: Ref<ReadonlyMap<string, RemoteSelection[]>>
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
const fallbackPosition = (index: number) => ({ x: 80 + (index % 8) * 140, y: 80 + Math.floor(index / 8) * 140 })

export function useCanvasMapping(sources: CanvasSources) {
  const problems = computed(() => issuesById(sources.result.value.issues))

  const nodes = computed<DiagramFlowNode[]>(() => {
    const selected = new Set(sources.selectedNodeIds.value)
    const dragging = sources.dragPositions.value
    const results = sources.result.value.nodes
    return sources.doc.value.nodes.map((node, index) => ({
      id: node.id,
      type: node.kind,
      position: dragging.get(node.id) ?? node.position ?? fallbackPosition(index),
      selected: selected.has(node.id),
      data: {
        node,
        result: results[node.id],
        problems: problems.value.get(node.id) ?? NO_PROBLEMS,
        units: sources.units.value,
        selectedBy: sources.remoteSelections?.value.get(node.id),
      },
    }))
  })

  const edges = computed<PipeFlowEdge[]>(() => {
    const byId = new Map<string, DiagramNode>(sources.doc.value.nodes.map((n) => [n.id, n]))
    const selected = new Set(sources.selectedPipeIds.value)
    const results = sources.result.value.pipes
    const edges: PipeFlowEdge[] = []
    for (const pipe of sources.doc.value.pipes) {
      const from = byId.get(pipe.from)
      const to = byId.get(pipe.to)
      // A pipe to a missing node is listed in the problems panel; there is nothing to draw.
      if (!from || !to) continue
      edges.push({
        id: pipe.id,
        type: PIPE_EDGE_TYPE,
        source: pipe.from,
        target: pipe.to,
        sourceHandle: sourceHandleFor(from) ?? undefined,
        targetHandle: targetHandleFor(to, pipe.system) ?? undefined,
        selected: selected.has(pipe.id),
        data: {
          pipe,
          result: results[pipe.id],
          problems: problems.value.get(pipe.id) ?? NO_PROBLEMS,
          units: sources.units.value,
        },
      })
    }
    return edges
  })

  return { nodes, edges, problems }
}
