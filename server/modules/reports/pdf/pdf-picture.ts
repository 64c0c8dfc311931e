/**
 * Draws the diagram picture on its own page: level bands, pipes (cold solid, hot dashed) with
 * their sizes, node symbols with their ids, and a legend. Vector paths from node positions.
 */
import type { ReportPicture } from '../../../../shared/report/report-picture.ts'
import { COLOURS, contentBottom, contentWidth, FONT, MARGIN, type Pdf } from './pdf-kit.ts'
import { drawSymbol, pipeStyle, SYMBOL_NAMES } from './pdf-symbols.ts'

/** Above these counts, ids and sizes would only blot the picture; the tables list them. */
const LABEL_LIMIT = 400
const LEGEND_HEIGHT = 30

function legend(doc: Pdf, top: number) {
  let x = MARGIN.left
  doc.font(FONT.regular).fontSize(7).fillColor(COLOURS.ink)
  for (const system of ['cold', 'hot'] as const) {
    doc.save()
    pipeStyle(doc, system, 1.2)
    doc
      .moveTo(x, top + 4)
      .lineTo(x + 22, top + 4)
      .stroke()
    doc.restore()
    doc.fillColor(COLOURS.ink).text(`${system} water`, x + 26, top, { lineBreak: false })
    x += 80
  }
  for (const [kind, name] of SYMBOL_NAMES) {
    drawSymbol(doc, kind, x + 4, top + 4, 3.5)
    doc.fillColor(COLOURS.ink).text(name, x + 12, top, { lineBreak: false })
    x += 14 + doc.widthOfString(name) + 12
    if (x > MARGIN.left + contentWidth(doc) - 90) {
      x = MARGIN.left + 160
      top += 12
    }
  }
}

/** Draws `picture` in the space left on the current page (the caller starts the page). */
export function drawPicture(doc: Pdf, picture: ReportPicture) {
  if (picture.nodes.length === 0) {
    doc.font(FONT.regular).fontSize(9).fillColor(COLOURS.muted)
    doc.text(
      picture.unplaced.length
        ? 'No node of this diagram has a place on the canvas yet, so there is no picture; ' +
            'Tidy layout in the editor draws one. The tables below list every pipe and node.'
        : 'The diagram is empty.',
      MARGIN.left,
      doc.y,
      { width: contentWidth(doc) },
    )
    return
  }
  const box = {
    x: MARGIN.left,
    y: doc.y,
    w: contentWidth(doc),
    h: contentBottom(doc) - doc.y - LEGEND_HEIGHT,
  }
  const { minX, minY, maxX, maxY } = picture.bounds
  // Canvas pixels to points; never enlarged beyond 1:1 so a small diagram keeps its proportions.
  const scale = Math.min(box.w / (maxX - minX || 1), box.h / (maxY - minY || 1), 1)
  const px = (x: number) => box.x + (x - minX) * scale
  const py = (y: number) => box.y + (y - minY) * scale
  const width = (maxX - minX) * scale

  picture.bands.forEach((band, i) => {
    const top = py(band.top)
    const height = (band.bottom - band.top) * scale
    if (i % 2 === 0) doc.rect(box.x, top, width, height).fill(COLOURS.shade)
    doc
      .font(FONT.bold)
      .fontSize(7)
      .fillColor(COLOURS.muted)
      .text(band.name, box.x + 3, top + 3, { lineBreak: false })
  })

  const line = Math.max(0.5, Math.min(1.4, 1.6 * scale))
  for (const pipe of picture.pipes) {
    doc.save()
    pipeStyle(doc, pipe.system, line)
    const [first, ...rest] = pipe.points
    doc.moveTo(px(first!.x), py(first!.y))
    for (const p of rest) doc.lineTo(px(p.x), py(p.y))
    doc.stroke().restore()
  }
  const labels = picture.nodes.length + picture.pipes.length <= LABEL_LIMIT
  const fontSize = Math.max(4, Math.min(7, 9 * scale))
  doc.font(FONT.regular).fontSize(fontSize)
  if (labels) {
    for (const pipe of picture.pipes) {
      if (!pipe.size) continue
      // Size on the vertical run (the drop) when there is one, else mid-way along the run.
      const [a, corner, b] = pipe.points
      const vertical = Math.abs(b!.y - corner!.y) > Math.abs(corner!.x - a!.x)
      const x = vertical ? px(b!.x) + 2 : px((a!.x + corner!.x) / 2)
      const y = vertical ? py((corner!.y + b!.y) / 2) - fontSize / 2 : py(a!.y) - fontSize - 1
      doc
        .fillColor(pipe.system === 'cold' ? COLOURS.cold : COLOURS.hot)
        .text(pipe.size, x, y, { lineBreak: false })
    }
  }
  const r = Math.max(1.8, Math.min(5, 6 * scale))
  for (const node of picture.nodes) {
    drawSymbol(doc, node.kind, px(node.x), py(node.y), r)
    if (!labels) continue
    const text = node.count > 1 ? `${node.id} × ${node.count}` : node.id
    doc
      .fillColor(COLOURS.ink)
      .text(text, px(node.x) + r + 1, py(node.y) + r - 1, { lineBreak: false })
  }
  const below = box.y + (maxY - minY) * scale + 6
  doc.font(FONT.regular).fontSize(7).fillColor(COLOURS.muted)
  if (picture.unplaced.length) {
    const ids = picture.unplaced
    const listed =
      ids.length > 20
        ? `${ids.slice(0, 20).join(', ')} and ${ids.length - 20} more`
        : ids.join(', ')
    doc.text(`Drawn in the bottom rows, no position on the canvas: ${listed}`, MARGIN.left, below, {
      width: box.w,
    })
  }
  if (!labels)
    doc.text('Ids and sizes are left off this picture for its size; the tables list them.', {
      width: box.w,
    })
  legend(doc, contentBottom(doc) - LEGEND_HEIGHT + 8)
}
