/**
 * Fits a free layout (x, y per node) into the level bands: x is kept, and each level's nodes are
 * scaled vertically into their own band, so the tidied drawing still reads floor by floor.
 */
import { LEVEL_BAND_HEIGHT, levelBands } from '@shared/document/levels'
import type { Diagram } from '@shared/document/model'

/** Room left free at the top and bottom of a band (labels, node height). */
const BAND_MARGIN = { top: 40, bottom: 110 }

export type Positions = ReadonlyMap<string, { x: number; y: number }>

export function fitIntoBands(doc: Diagram, free: Positions): Map<string, { x: number; y: number }> {
  const bands = levelBands(doc.levels)
  const placed = new Map<string, { x: number; y: number }>()
  const groups = new Map<string | null, string[]>()
  for (const node of doc.nodes) {
    if (!free.has(node.id)) continue
    const key = bands.some((b) => b.level.id === node.levelId) ? node.levelId! : null
    groups.set(key, [...(groups.get(key) ?? []), node.id])
  }
  // Nodes without a level go below the lowest band.
  const belowAll = bands.length ? bands[bands.length - 1]!.bottom : 0
  for (const [levelId, ids] of groups) {
    const band = bands.find((b) => b.level.id === levelId)
    const top = band ? band.top + BAND_MARGIN.top : belowAll + BAND_MARGIN.top
    const height = LEVEL_BAND_HEIGHT - BAND_MARGIN.top - BAND_MARGIN.bottom
    const ys = ids.map((id) => free.get(id)!.y)
    const min = Math.min(...ys)
    const span = Math.max(...ys) - min
    for (const id of ids) {
      const p = free.get(id)!
      const y =
        band || span > 0 ? top + (span > 0 ? ((p.y - min) / span) * height : height / 2) : p.y
      placed.set(id, { x: Math.round(p.x / 10) * 10, y: Math.round(y / 10) * 10 })
    }
  }
  return placed
}
