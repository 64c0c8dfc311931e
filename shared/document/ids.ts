/**
 * Short, readable ids a designer can say out loud ("F7 is short on pressure"): a prefix by kind
 * and the next free number in the document. Deterministic: the same document gives the same ids.
 */
import type { Diagram, NodeKind } from './model.ts'

export type IdKind = NodeKind | 'pipe' | 'level'

/** Our own prefixes; numbers never repeat within a prefix while an id with that number exists. */
export const ID_PREFIXES = {
  supply: 'S',
  meter: 'M',
  'backflow-preventer': 'BP',
  'pressure-reducing-valve': 'RV',
  'water-heater': 'WH',
  junction: 'J',
  fixture: 'F',
  equipment: 'EQ',
  pipe: 'P',
  level: 'L',
} as const satisfies Record<IdKind, string>

const ID_PATTERN = /^([A-Z]+)(\d+)$/

/**
 * Returns a function that hands out fresh ids for a document, one after another, so a batch that
 * adds many items gets distinct ids. Every id in the document counts, whatever its collection.
 * @example
 * const next = createIdAllocator(doc)
 * next('fixture') // 'F4' when F1..F3 exist
 * next('fixture') // 'F5'
 */
export function createIdAllocator(doc: Diagram): (kind: IdKind) => string {
  const highest = new Map<string, number>()
  for (const { id } of [...doc.nodes, ...doc.pipes, ...doc.levels]) {
    const match = ID_PATTERN.exec(id)
    if (!match) continue
    const [, prefix, digits] = match
    highest.set(prefix!, Math.max(highest.get(prefix!) ?? 0, Number(digits)))
  }
  return (kind) => {
    const prefix = ID_PREFIXES[kind]
    const number = (highest.get(prefix) ?? 0) + 1
    highest.set(prefix, number)
    return `${prefix}${number}`
  }
}

/**
 * The next free id of one kind.
 * @example
 * nextId(emptyDiagram(), 'junction') // 'J1'
 */
export function nextId(doc: Diagram, kind: IdKind): string {
  return createIdAllocator(doc)(kind)
}
