/**
 * A generated riser tree with canvas positions, for the editor benchmark: nodes are placed by
 * depth (x) and by order within their depth (y), which is enough to draw every node and pipe.
 */
import { riserTreeDiagram } from '../shared/demo/riser-tree.ts'
import type { Diagram } from '../shared/document/model.ts'

export function editorBenchDiagram(targetNodes: number): Diagram {
  const doc = riserTreeDiagram(targetNodes)
  const children = new Map<string, string[]>()
  for (const pipe of doc.pipes) {
    if (pipe.system !== 'cold' && doc.pipes.some((p) => p.to === pipe.to && p.system === 'cold'))
      continue
    children.set(pipe.from, [...(children.get(pipe.from) ?? []), pipe.to])
  }
  const depthOf = new Map<string, number>([['supply', 0]])
  const queue = ['supply']
  while (queue.length) {
    const id = queue.shift()!
    for (const child of children.get(id) ?? []) {
      if (depthOf.has(child)) continue
      depthOf.set(child, depthOf.get(id)! + 1)
      queue.push(child)
    }
  }
  const rowAtDepth = new Map<number, number>()
  const nodes = doc.nodes.map((node) => {
    const depth = depthOf.get(node.id) ?? 0
    const row = rowAtDepth.get(depth) ?? 0
    rowAtDepth.set(depth, row + 1)
    return { ...node, position: { x: depth * 180, y: row * 90 } }
  })
  // No locked sizes, so the benchmark's material change resizes every pipe.
  const pipes = doc.pipes.map(({ nominal: _locked, material: _material, ...pipe }) => pipe)
  return {
    ...doc,
    name: `Benchmark riser tree (${nodes.length} nodes)`,
    settings: { ...doc.settings, material: 'steel-40' },
    nodes,
    pipes,
  }
}
