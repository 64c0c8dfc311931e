/** The level the "Add level" button creates. */
import { createIdAllocator } from '@shared/document/ids'
import type { Diagram, Level } from '@shared/document/model'

/**
 * Storey height for a new level: 3.5 m floor to floor is a common-practice default for
 * residential and light commercial work, not a code value; the user edits it.
 */
export const DEFAULT_STOREY_HEIGHT_M = 3.5

/** A new level one storey above the highest, named "Level N" with the first free N. */
export function newLevel(doc: Diagram): Level {
  const names = new Set(doc.levels.map((l) => l.name.trim().toLowerCase()))
  let n = doc.levels.length + 1
  while (names.has(`level ${n}`)) n += 1
  const highest = doc.levels.length ? Math.max(...doc.levels.map((l) => l.elevationM)) : null
  return {
    id: createIdAllocator(doc)('level'),
    name: `Level ${n}`,
    elevationM: highest === null ? 0 : highest + DEFAULT_STOREY_HEIGHT_M,
  }
}
