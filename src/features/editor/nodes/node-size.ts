/**
 * The most room a node of each kind takes on the canvas, used before it has been drawn and
 * measured. Vue Flow counts a node of unknown (zero) size as on screen, so without this a large
 * diagram mounted every node once just to measure it. Erring large only draws a node a little
 * early; the real size replaces this as soon as the node is drawn.
 */
import type { NodeKind } from '@shared/document/model.ts'

// NodeCard.vue caps cards at 180 px wide; three text lines and padding stay under 60 px.
const CARD = { width: 180, height: 60 }
// JunctionNode.vue draws a 12 px dot; its label hangs outside and does not count.
const POINT = { width: 12, height: 12 }

export function nodeSizeBound(kind: NodeKind): { width: number; height: number } {
  return kind === 'junction' ? { ...POINT } : { ...CARD }
}
