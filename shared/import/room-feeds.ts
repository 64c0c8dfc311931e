/**
 * Which junctions can feed an imported room, per system, and a first guess for each room: a
 * junction on the room's level whose label names the room. No guess means the designer picks.
 */
import type { Diagram, NodeOfKind, System } from '../document/model.ts'
import type { RoomGroup } from './fixture-csv.ts'

/** The junctions chosen for one room; null = none chosen. */
export interface RoomFeed {
  cold: string | null
  hot: string | null
}

/** A junction the designer can pick. */
export interface FeedOption {
  id: string
  label: string
  levelId: string | null
  /** System of its pipes; null while it has none. */
  system: System | null
  /** Display text: "J4 Washroom header (Ground)". */
  text: string
}

/** System of a junction: its inlet's, else its first outlet's, else null. */
export function junctionSystem(doc: Diagram, id: string): System | null {
  const inlet = doc.pipes.find((p) => p.to === id)
  return (inlet ?? doc.pipes.find((p) => p.from === id))?.system ?? null
}

/**
 * Junctions that can feed fixtures on `system`: those already on it and unconnected ones.
 * @example feedOptions(doc, 'hot').map((o) => o.id) // ['J9', 'J11']
 */
export function feedOptions(doc: Diagram, system: System): FeedOption[] {
  const levels = new Map(doc.levels.map((l) => [l.id, l.name]))
  return doc.nodes
    .filter((n): n is NodeOfKind<'junction'> => n.kind === 'junction')
    .map((n) => {
      const own = junctionSystem(doc, n.id)
      const level = n.levelId ? levels.get(n.levelId) : undefined
      const text = [n.id, n.label, level ? `(${level})` : ''].filter(Boolean).join(' ')
      return { id: n.id, label: n.label, levelId: n.levelId ?? null, system: own, text }
    })
    .filter((option) => option.system === system || option.system === null)
}

function guess(options: FeedOption[], room: RoomGroup): string | null {
  const name = room.room.toLowerCase()
  const named = options.filter(
    (o) => o.system !== null && o.label !== '' && o.label.toLowerCase().includes(name),
  )
  const sameLevel = named.filter((o) => o.levelId === room.levelId)
  return (sameLevel[0] ?? (room.levelId === null ? named[0] : undefined))?.id ?? null
}

/** First guess of the feeds of each room, by room key. */
export function suggestFeeds(doc: Diagram, rooms: readonly RoomGroup[]): Record<string, RoomFeed> {
  const cold = feedOptions(doc, 'cold')
  const hot = feedOptions(doc, 'hot')
  return Object.fromEntries(
    rooms.map((room) => [
      room.key,
      { cold: guess(cold, room), hot: room.usesHot ? guess(hot, room) : null },
    ]),
  )
}
