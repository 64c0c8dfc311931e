import { describe, expect, test } from 'vitest'
import { ref } from 'vue'
import { computeDiagram } from '@shared/calc/compute.ts'
import { fernhollowHallDiagram } from '@shared/demo/fernhollow-hall.ts'
import type { Diagram } from '@shared/document/model.ts'
import type { RemoteSelection } from '@/features/editor/canvas-data.ts'
import { useCanvasMapping } from '@/features/editor/composables/useCanvasMapping.ts'

// Vue Flow is told what changed by object identity, so the mapping must keep the canvas objects
// of nodes and pipes whose labels stay the same and replace only the others.
function mapping(doc: Diagram) {
  const source = ref(doc)
  const result = ref(computeDiagram(doc))
  const remotePipeSelections = ref<ReadonlyMap<string, RemoteSelection[]>>(new Map())
  const mapped = useCanvasMapping({
    doc: source,
    result,
    units: ref('si'),
    selectedNodeIds: ref([]),
    selectedPipeIds: ref([]),
    dragPositions: ref(new Map()),
    remotePipeSelections,
  })
  const change = (next: Diagram) => {
    source.value = next
    result.value = computeDiagram(next)
  }
  return { ...mapped, change, remotePipeSelections }
}

const byId = <T extends { id: string }>(list: T[]) => new Map(list.map((item) => [item.id, item]))

describe('canvas mapping', () => {
  test('a recalculation with the same results keeps every node and pipe object', () => {
    const { nodes, edges, change } = mapping(fernhollowHallDiagram)
    const [beforeNodes, beforeEdges] = [nodes.value, edges.value]
    change({ ...fernhollowHallDiagram })
    expect(nodes.value).not.toBe(beforeNodes)
    nodes.value.forEach((node, i) => expect(node).toBe(beforeNodes[i]))
    edges.value.forEach((edge, i) => expect(edge).toBe(beforeEdges[i]))
  })

  test("a co-editor's pipe selection replaces only that pipe, carrying who selected it", () => {
    const { edges, remotePipeSelections } = mapping(fernhollowHallDiagram)
    const before = byId(edges.value)
    const pipeId = fernhollowHallDiagram.pipes[3]!.id
    const robin = { name: 'Robin Vale', color: '#2a9d8f' }
    remotePipeSelections.value = new Map([[pipeId, [robin]]])
    const replaced = edges.value.filter((edge) => before.get(edge.id) !== edge)
    expect(replaced.map((edge) => edge.id)).toEqual([pipeId])
    expect(replaced[0]!.data!.selectedBy).toEqual([robin])
  })

  test('moving one node replaces only that node', () => {
    const { nodes, change } = mapping(fernhollowHallDiagram)
    const before = byId(nodes.value)
    const moved = fernhollowHallDiagram.nodes[0]!
    change({
      ...fernhollowHallDiagram,
      nodes: fernhollowHallDiagram.nodes.map((n) =>
        n === moved ? { ...n, position: { x: 5, y: 5 } } : n,
      ),
    })
    const replaced = nodes.value.filter((node) => before.get(node.id) !== node)
    expect(replaced.map((node) => node.id)).toEqual([moved.id])
    expect(replaced[0]!.position).toEqual({ x: 5, y: 5 })
  })

  test('a new default material replaces the pipes whose results change, with new data', () => {
    const { edges, change } = mapping(fernhollowHallDiagram)
    const before = byId(edges.value)
    const material =
      fernhollowHallDiagram.settings.material === 'steel-40' ? 'copper-l' : 'steel-40'
    change({ ...fernhollowHallDiagram, settings: { ...fernhollowHallDiagram.settings, material } })
    const replaced = edges.value.filter((edge) => before.get(edge.id) !== edge)
    expect(replaced.length).toBeGreaterThan(0)
    for (const edge of replaced) expect(edge.data).not.toBe(before.get(edge.id)!.data)
  })
})
