/**
 * Tributary's own simple report symbols, one small shape per node kind, drawn centred on a point;
 * the picture's legend draws the same shapes.
 */
import type { NodeKind } from '../../../../shared/document/model.ts'
import { COLOURS, type Pdf } from './pdf-kit.ts'

/** Legend text of each kind, in legend order. */
export const SYMBOL_NAMES: [NodeKind, string][] = [
  ['supply', 'Supply'],
  ['meter', 'Meter'],
  ['backflow-preventer', 'Backflow preventer'],
  ['pressure-reducing-valve', 'Pressure reducing valve'],
  ['water-heater', 'Water heater'],
  ['junction', 'Junction'],
  ['fixture', 'Fixture (× count)'],
  ['equipment', 'Equipment'],
]

/** Draws the symbol of `kind` with half-size `r` at (x, y). */
export function drawSymbol(doc: Pdf, kind: NodeKind, x: number, y: number, r: number) {
  doc
    .save()
    .lineWidth(Math.max(0.4, r / 5))
    .strokeColor(COLOURS.ink)
    .fillColor(COLOURS.ink)
  switch (kind) {
    case 'supply':
      doc.rect(x - r, y - r, 2 * r, 2 * r).fill()
      break
    case 'meter':
      doc.circle(x, y, r).fillAndStroke('#ffffff', COLOURS.ink)
      doc
        .moveTo(x - r, y)
        .lineTo(x + r, y)
        .stroke()
      break
    case 'backflow-preventer':
      doc
        .polygon([x, y - r], [x + r, y], [x, y + r], [x - r, y])
        .fillAndStroke('#ffffff', COLOURS.ink)
      doc
        .moveTo(x, y - r)
        .lineTo(x, y + r)
        .stroke()
      break
    case 'pressure-reducing-valve':
      doc.polygon([x - r, y + r], [x + r, y + r], [x, y - r]).fillAndStroke('#ffffff', COLOURS.ink)
      break
    case 'water-heater':
      doc.rect(x - r * 0.8, y - r * 1.3, r * 1.6, r * 2.6).fillAndStroke('#ffffff', COLOURS.ink)
      doc
        .moveTo(x - r * 0.8, y)
        .lineTo(x + r * 0.8, y)
        .stroke()
      break
    case 'junction':
      doc.circle(x, y, r * 0.45).fill()
      break
    case 'fixture':
      doc.circle(x, y, r).fillAndStroke('#ffffff', COLOURS.ink)
      break
    case 'equipment':
      doc.rect(x - r, y - r, 2 * r, 2 * r).fillAndStroke('#ffffff', COLOURS.ink)
      doc
        .moveTo(x - r, y - r)
        .lineTo(x + r, y + r)
        .stroke()
      break
  }
  doc.restore()
}

/** Cold pipes solid, hot pipes dashed. */
export function pipeStyle(doc: Pdf, system: 'cold' | 'hot', width: number) {
  doc.lineWidth(width).strokeColor(system === 'cold' ? COLOURS.cold : COLOURS.hot)
  if (system === 'hot') doc.dash(width * 4, { space: width * 2.5 })
  else doc.undash()
}
