/**
 * Handle ids and sides. The mapping from document pipes to Vue Flow edges relies on the ids:
 * every node that feeds pipes has one source handle `out`; single-inlet nodes have one target
 * `in`; a fixture has `cold` and `hot` targets; the water heater's `in` is its cold inlet and its
 * `out` feeds hot pipes; supply has only `out`; equipment only `in`.
 *
 * Sides follow the way a riser diagram reads: floors are horizontal bands, the service enters at
 * the bottom left and water runs to the right along mains and up risers. So inline devices take
 * water in on the left and pass it on to the right, the water heater sends hot water out of its
 * top, and fixtures and equipment sit above their branch and are fed from below (hot on the left,
 * cold on the right, as at a tap). Junctions are points: both handles sit on the dot and each
 * pipe leaves towards its other end (see edges/pipe-route.ts).
 */
import { Position } from '@vue-flow/core'
import type { DiagramNode, NodeKind, System } from '@shared/document/model.ts'
import { fixtureUsesHot } from './fixture-info.ts'

/** Handle ids used on the canvas. */
export const HANDLE = { in: 'in', out: 'out', cold: 'cold', hot: 'hot' } as const

/** A handle id. */
export type HandleId = (typeof HANDLE)[keyof typeof HANDLE]

/** Side of each node kind's single inlet and outlet (absent when the kind has none). */
export const HANDLE_SIDES = {
  supply: { out: Position.Right },
  meter: { in: Position.Left, out: Position.Right },
  'backflow-preventer': { in: Position.Left, out: Position.Right },
  'pressure-reducing-valve': { in: Position.Left, out: Position.Right },
  'water-heater': { in: Position.Left, out: Position.Top },
  junction: { in: Position.Bottom, out: Position.Top },
  fixture: { in: Position.Bottom },
  equipment: { in: Position.Bottom },
} as const satisfies Record<NodeKind, { in?: Position; out?: Position }>

/** The handle a pipe leaves `node` from, or null when the kind feeds nothing. */
export function sourceHandleFor(node: DiagramNode): HandleId | null {
  return node.kind === 'fixture' || node.kind === 'equipment' ? null : HANDLE.out
}

/**
 * The handle a pipe of `system` enters `node` at, or null when the kind takes no pipe (supply),
 * or a fixture has no inlet for that system.
 */
export function targetHandleFor(node: DiagramNode, system: System): HandleId | null {
  if (node.kind === 'supply') return null
  if (node.kind !== 'fixture') return HANDLE.in
  if (system === 'hot' && !fixtureUsesHot(node.fixture)) return null
  return system === 'hot' ? HANDLE.hot : HANDLE.cold
}
