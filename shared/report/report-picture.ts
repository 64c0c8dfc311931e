/**
 * The diagram picture of the report as plain geometry in canvas pixels: level bands, node marks
 * and pipe runs (across, then down, as a riser diagram reads). The PDF scales it to the page.
 */
import type { DiagramResult } from '../calc/types.ts'
import { levelBands, LEVEL_BAND_HEIGHT } from '../document/levels.ts'
import type { Diagram, NodeKind, System } from '../document/model.ts'
import { formatNominal } from '../units/nominal.ts'
import type { UnitSystem } from '../units/system.ts'

export interface Point {
  x: number
  y: number
}

export interface PictureNode extends Point {
  id: string
  kind: NodeKind
  /** Count of a battery (fixtures), else 1. */
  count: number
}

export interface PicturePipe {
  id: string
  system: System
  points: Point[]
  /** Size text at the pipe, e.g. "DN25"; empty when not sized. */
  size: string
}

export interface PictureBand {
  name: string
  top: number
  bottom: number
}

export interface ReportPicture {
  nodes: PictureNode[]
  pipes: PicturePipe[]
  bands: PictureBand[]
  bounds: { minX: number; minY: number; maxX: number; maxY: number }
  /** Ids of nodes without a canvas position, drawn in a row under the diagram. */
  unplaced: string[]
}

/** Spacing of unplaced nodes and margin around the drawing, canvas px. */
const SPACING = 90
/** Unplaced nodes per row. */
const ROW = 12
const MARGIN = 40
/** Hot pipes end this far right of a fixture's centre so its cold and hot drops both show. */
const HOT_INLET_OFFSET = 8

/** Builds the picture of `doc`; pipes carry the sizes of `result`. */
export function reportPicture(
  doc: Diagram,
  result: DiagramResult,
  units: UnitSystem,
): ReportPicture {
  const placed = doc.nodes.flatMap((n) => (n.position ? [n.position] : []))
  if (placed.length === 0) {
    // Nothing was ever drawn (a generated or imported document): no picture to make.
    const bounds = { minX: 0, minY: 0, maxX: 0, maxY: 0 }
    return { nodes: [], pipes: [], bands: [], bounds, unplaced: doc.nodes.map((n) => n.id) }
  }
  const minX = placed.length ? Math.min(...placed.map((p) => p.x)) : 0
  let maxY = placed.length ? Math.max(...placed.map((p) => p.y)) : 0
  const unplaced: string[] = []
  const nodes: PictureNode[] = doc.nodes.map((n) => {
    let at = n.position
    if (!at) {
      const slot = unplaced.length
      at = { x: minX + (slot % ROW) * SPACING, y: maxY + SPACING * (1 + Math.floor(slot / ROW)) }
      unplaced.push(n.id)
    }
    return { id: n.id, kind: n.kind, count: n.kind === 'fixture' ? n.count : 1, x: at.x, y: at.y }
  })
  if (unplaced.length) maxY += SPACING * Math.ceil(unplaced.length / ROW)
  const byId = new Map(nodes.map((n) => [n.id, n]))
  const pipes = doc.pipes.flatMap((pipe): PicturePipe[] => {
    const from = byId.get(pipe.from)
    const to = byId.get(pipe.to)
    if (!from || !to) return []
    const r = result.pipes[pipe.id]
    const nominal = r ? r.nominal : (pipe.nominal ?? null)
    const end = {
      x: to.x + (pipe.system === 'hot' && to.kind === 'fixture' ? HOT_INLET_OFFSET : 0),
      y: to.y,
    }
    return [
      {
        id: pipe.id,
        system: pipe.system,
        points: [{ x: from.x, y: from.y }, { x: end.x, y: from.y }, end],
        size: nominal ? formatNominal(nominal, units) : '',
      },
    ]
  })
  const xs = nodes.map((n) => n.x)
  const ys = nodes.map((n) => n.y)
  const bounds = {
    minX: (xs.length ? Math.min(...xs) : 0) - MARGIN,
    maxX: (xs.length ? Math.max(...xs) : LEVEL_BAND_HEIGHT) + MARGIN * 2,
    minY: (ys.length ? Math.min(...ys) : 0) - MARGIN,
    maxY: (ys.length ? Math.max(...ys) : LEVEL_BAND_HEIGHT) + MARGIN,
  }
  // Bands are cut to the drawing so empty floor space does not shrink the picture.
  const bands = levelBands(doc.levels)
    .map((b) => ({
      name: b.level.name,
      top: Math.max(b.top, bounds.minY),
      bottom: Math.min(b.bottom, bounds.maxY),
    }))
    .filter((b) => b.bottom - b.top > 0)
  return { nodes, pipes, bands, bounds, unplaced }
}
