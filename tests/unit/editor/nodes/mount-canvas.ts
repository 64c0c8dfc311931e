/** Mounts diagram nodes and pipes in a real Vue Flow canvas (happy-dom needs no stubs). */
import { flushPromises, mount } from '@vue/test-utils'
import { VueFlow } from '@vue-flow/core'
import { defineComponent, h } from 'vue'
import type { CalcIssue, NodeResult, PipeResult } from '@shared/calc/types.ts'
import { nodeSchema, pipeSchema, type DiagramNode, type Pipe } from '@shared/document/model.ts'
import type { UnitSystem } from '@shared/units/system.ts'
import {
  edgeTypes,
  nodeTypes,
  PIPE_EDGE_TYPE,
  sourceHandleFor,
  targetHandleFor,
  type DiagramFlowNode,
  type PipeFlowEdge,
  type RemoteSelection,
} from '@/features/editor/canvas-data.ts'

/** Options for one canvas node. */
export interface NodeOptions {
  result?: NodeResult
  problems?: CalcIssue[]
  units?: UnitSystem
  selectedBy?: RemoteSelection[]
  x?: number
  y?: number
}

/** A canvas node from document input (parsed, so defaults apply). */
export function flowNode(
  input: Record<string, unknown>,
  options: NodeOptions = {},
): DiagramFlowNode {
  const node: DiagramNode = nodeSchema.parse(input)
  return {
    id: node.id,
    type: node.kind,
    position: { x: options.x ?? 0, y: options.y ?? 0 },
    data: {
      node,
      result: options.result,
      problems: options.problems ?? [],
      units: options.units ?? 'si',
      selectedBy: options.selectedBy,
    },
  }
}

/** A canvas edge for a pipe between two canvas nodes, with the handle ids the mapping uses. */
export function flowPipe(
  input: Record<string, unknown>,
  from: DiagramFlowNode,
  to: DiagramFlowNode,
  options: {
    result?: PipeResult
    problems?: CalcIssue[]
    units?: UnitSystem
    selectedBy?: RemoteSelection[]
  } = {},
): PipeFlowEdge {
  const pipe: Pipe = pipeSchema.parse({ ...input, from: from.id, to: to.id })
  return {
    id: pipe.id,
    type: PIPE_EDGE_TYPE,
    source: from.id,
    target: to.id,
    sourceHandle: sourceHandleFor(from.data!.node),
    targetHandle: targetHandleFor(to.data!.node, pipe.system),
    data: {
      pipe,
      result: options.result,
      problems: options.problems ?? [],
      units: options.units ?? 'si',
      selectedBy: options.selectedBy,
    },
  }
}

// happy-dom has no layout and no stylesheet, so Vue Flow warns about both on every mount.
const LAYOUT_WARNINGS = ['needs a width and a height', "haven't loaded the necessary styles"]
const warn = console.warn
console.warn = (...args: unknown[]) => {
  const message = String(args[0])
  if (!LAYOUT_WARNINGS.some((w) => message.includes(w))) warn(...args)
}

/** Mounts a sized Vue Flow canvas with the editor's node and edge types. */
export async function mountCanvas(nodes: DiagramFlowNode[], edges: PipeFlowEdge[] = []) {
  const Host = defineComponent(
    () => () =>
      h('div', { style: 'width: 1000px; height: 700px' }, [
        h(VueFlow, { nodes, edges, nodeTypes, edgeTypes }),
      ]),
  )
  const wrapper = mount(Host, { attachTo: document.body })
  await flushPromises()
  return wrapper
}
