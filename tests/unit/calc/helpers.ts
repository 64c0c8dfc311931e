// Small builders for test diagrams.
import { diagramSchema, type Diagram, type DiagramInput } from '../../../shared/document/model.ts'

type Nodes = DiagramInput['nodes']
type Pipes = DiagramInput['pipes']

/** A parsed diagram from nodes, pipes and settings overrides. */
export function diagram(
  nodes: Nodes,
  pipes: Pipes,
  settings: DiagramInput['settings'] = {},
): Diagram {
  return diagramSchema.parse({ format: 'tributary-diagram', version: 1, settings, nodes, pipes })
}

/** A cold pipe. */
export const cold = (id: string, from: string, to: string, lengthM = 5, extra = {}) => ({
  id,
  from,
  to,
  system: 'cold' as const,
  lengthM,
  ...extra,
})

/** A hot pipe. */
export const hot = (id: string, from: string, to: string, lengthM = 5, extra = {}) => ({
  id,
  from,
  to,
  system: 'hot' as const,
  lengthM,
  ...extra,
})
