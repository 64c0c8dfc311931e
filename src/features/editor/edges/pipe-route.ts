/**
 * Which side a pipe leaves and enters by. Nodes with real handles keep their sides; a junction is
 * a point, so a pipe leaves or enters it on the side facing the pipe's other end. That keeps a
 * riser straight (junction above junction) and a main flat (junction beside junction).
 */
import { Position, type XYPosition } from '@vue-flow/core'

/** The side of `from` that faces `to`: vertical wins ties, as risers are the common case. */
export function facingSide(from: XYPosition, to: XYPosition): Position {
  const dx = to.x - from.x
  const dy = to.y - from.y
  if (Math.abs(dy) >= Math.abs(dx)) return dy < 0 ? Position.Top : Position.Bottom
  return dx > 0 ? Position.Right : Position.Left
}

/** End points of a pipe with their declared sides, and whether each end is a point node. */
export interface PipeEnds {
  source: XYPosition
  target: XYPosition
  sourcePosition: Position
  targetPosition: Position
  sourceIsPoint: boolean
  targetIsPoint: boolean
}

/** The sides to route a pipe by. */
export function pipeSides(ends: PipeEnds): { sourcePosition: Position; targetPosition: Position } {
  return {
    sourcePosition: ends.sourceIsPoint ? facingSide(ends.source, ends.target) : ends.sourcePosition,
    targetPosition: ends.targetIsPoint ? facingSide(ends.target, ends.source) : ends.targetPosition,
  }
}

/** Shortest vertical drop that gets its label on the drop rather than at the path's centre. */
const MIN_DROP_PX = 60

/**
 * Where a pipe's label sits. Pipes rising into a fixture or device carry their label on that
 * final vertical run, where neighbouring fixtures are far enough apart for labels not to collide;
 * a fixture's hot and cold labels are staggered so they don't sit side by side. Other pipes are
 * labelled at the centre of their path.
 */
export function labelAnchor(
  ends: Pick<PipeEnds, 'source' | 'target' | 'targetIsPoint'>,
  centre: XYPosition,
  system: 'cold' | 'hot',
): XYPosition {
  const drop = centre.y - ends.target.y
  if (ends.targetIsPoint || Math.abs(ends.target.y - ends.source.y) < MIN_DROP_PX) return centre
  const along = system === 'hot' ? 0.7 : 0.35
  return { x: ends.target.x, y: ends.target.y + drop * along }
}
