/**
 * "Tidy layout": ELK's layered algorithm places the tree growing upward from the service (as a
 * riser diagram is drawn), then each level's nodes are fitted into their band. The result is one
 * batch of moves, so a tidy-up is a single undo step.
 */
import type { Diagram } from '@shared/document/model'
import { OPS, type Operation } from '@shared/document/operations'
import { fitIntoBands } from './band-fit'

// Approximate node boxes; ELK only needs them for spacing.
const SIZE = { width: 120, height: 60 }

/** Builds the move batch for a tidy layout of `doc` (elkjs is loaded on first use). */
export async function layoutOperation(doc: Diagram): Promise<Operation> {
  const { default: ELK } = await import('elkjs/lib/elk.bundled.js')
  const elk = new ELK()
  const graph = await elk.layout({
    id: 'root',
    layoutOptions: {
      'elk.algorithm': 'layered',
      'elk.direction': 'UP',
      'elk.layered.spacing.nodeNodeBetweenLayers': '60',
      'elk.spacing.nodeNode': '40',
      'elk.layered.nodePlacement.strategy': 'BRANDES_KOEPF',
    },
    children: doc.nodes.map((n) => ({ id: n.id, ...SIZE })),
    edges: doc.pipes
      .filter((p) => doc.nodes.some((n) => n.id === p.from) && doc.nodes.some((n) => n.id === p.to))
      .map((p) => ({ id: p.id, sources: [p.from], targets: [p.to] })),
  })
  const free = new Map((graph.children ?? []).map((c) => [c.id, { x: c.x ?? 0, y: c.y ?? 0 }]))
  const placed = fitIntoBands(doc, free)
  return {
    type: OPS.batch,
    ops: [...placed].map(([id, position]) => ({ type: OPS.nodeMove, id, position })),
  }
}
