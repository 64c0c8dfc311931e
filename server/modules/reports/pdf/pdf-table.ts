/**
 * Draws a report table across as many pages as it needs, repeating the header on each page.
 * Cells are one line; text that does not fit is cut with an ellipsis (the CSV and the editor keep
 * the full text).
 */
import type { ReportTable } from '../../../../shared/report/report-table.ts'
import { COLOURS, contentBottom, contentWidth, fitText, FONT, MARGIN, type Pdf } from './pdf-kit.ts'

export interface TableStyle {
  fontSize: number
  rowHeight: number
}

const PAD = 2.5

function header(doc: Pdf, table: ReportTable, widths: number[], style: TableStyle) {
  const top = doc.y
  const height = style.rowHeight * 2
  doc.rect(MARGIN.left, top, contentWidth(doc), height).fill(COLOURS.shade)
  doc.font(FONT.bold).fontSize(style.fontSize).fillColor(COLOURS.ink)
  let x = MARGIN.left
  table.columns.forEach((column, i) => {
    doc.text(column.title, x + PAD, top + 2, {
      width: widths[i]! - 2 * PAD,
      height: height - 2,
      align: column.numeric ? 'right' : 'left',
      ellipsis: true,
    })
    x += widths[i]!
  })
  doc.moveTo(MARGIN.left, top + height).lineTo(MARGIN.left + contentWidth(doc), top + height)
  doc.lineWidth(0.6).strokeColor(COLOURS.rule).stroke()
  doc.y = top + height
}

/** Draws `table` from the current y; `continued` titles the header on follow-on pages. */
export function drawTable(doc: Pdf, table: ReportTable, style: TableStyle, continued: string) {
  const total = table.columns.reduce((sum, c) => sum + c.weight, 0)
  const widths = table.columns.map((c) => (c.weight / total) * contentWidth(doc))
  header(doc, table, widths, style)
  table.rows.forEach((row, r) => {
    if (doc.y + style.rowHeight > contentBottom(doc)) {
      doc.addPage()
      doc
        .font(FONT.bold)
        .fontSize(9)
        .fillColor(COLOURS.muted)
        .text(continued, MARGIN.left, MARGIN.top)
      doc.y += 4
      header(doc, table, widths, style)
    }
    const top = doc.y
    const mark = table.marks[r]
    const fill =
      mark === 'error'
        ? COLOURS.error
        : mark === 'warning'
          ? COLOURS.warning
          : r % 2
            ? COLOURS.shade
            : null
    if (fill) doc.rect(MARGIN.left, top, contentWidth(doc), style.rowHeight).fill(fill)
    doc.font(FONT.regular).fontSize(style.fontSize).fillColor(COLOURS.ink)
    let x = MARGIN.left
    row.forEach((cell, i) => {
      const width = widths[i]! - 2 * PAD
      doc.text(
        fitText(doc, cell, width),
        x + PAD,
        top + (style.rowHeight - style.fontSize) / 2 - 0.5,
        {
          width,
          align: table.columns[i]!.numeric ? 'right' : 'left',
          lineBreak: false,
        },
      )
      x += widths[i]!
    })
    doc.y = top + style.rowHeight
  })
  doc.x = MARGIN.left
  doc.y += 8
}
