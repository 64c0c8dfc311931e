/** The text sections of the report: headings, label/value blocks, boxed notes, lists. */
import type { LabelledValue } from '../../../../shared/report/report-settings.ts'
import { COLOURS, contentWidth, ensureRoom, FONT, MARGIN, type Pdf } from './pdf-kit.ts'

export function heading(doc: Pdf, text: string, size = 13) {
  ensureRoom(doc, size * 4)
  doc.x = MARGIN.left
  doc.moveDown(0.4).font(FONT.bold).fontSize(size).fillColor(COLOURS.ink).text(text)
  doc.moveDown(0.3)
}

export function paragraph(doc: Pdf, text: string, size = 9, colour: string = COLOURS.ink) {
  ensureRoom(doc, size * 3)
  doc
    .font(FONT.regular)
    .fontSize(size)
    .fillColor(colour)
    .text(text, MARGIN.left, doc.y, { width: contentWidth(doc) })
  doc.moveDown(0.4)
}

/** Label/value rows in two columns of the given width. */
export function labelled(
  doc: Pdf,
  rows: LabelledValue[],
  x = MARGIN.left,
  width = contentWidth(doc),
) {
  const labelWidth = Math.min(150, width * 0.4)
  for (const row of rows) {
    ensureRoom(doc, 14)
    const top = doc.y
    doc
      .font(FONT.regular)
      .fontSize(9)
      .fillColor(COLOURS.muted)
      .text(row.label, x, top, { width: labelWidth })
    doc.fillColor(COLOURS.ink).text(row.value, x + labelWidth, top, { width: width - labelWidth })
    doc.y = Math.max(doc.y, top + 12)
  }
  doc.x = MARGIN.left
}

/** A shaded box with a rule on the left: the caution and the review status. */
export function note(doc: Pdf, title: string, body: string, fill: string = COLOURS.caution) {
  const width = contentWidth(doc)
  doc.font(FONT.regular).fontSize(9)
  const height = 20 + doc.heightOfString(body, { width: width - 20 })
  ensureRoom(doc, height + 8)
  const top = doc.y
  doc.rect(MARGIN.left, top, width, height).fill(fill)
  doc.rect(MARGIN.left, top, 3, height).fill(COLOURS.cautionRule)
  doc
    .font(FONT.bold)
    .fontSize(9)
    .fillColor(COLOURS.ink)
    .text(title, MARGIN.left + 10, top + 5, { width: width - 20 })
  doc.font(FONT.regular).text(body, { width: width - 20 })
  doc.x = MARGIN.left
  doc.y = top + height + 8
}

/** A bulleted list, wrapping long entries. */
export function list(doc: Pdf, items: string[], size = 8.5) {
  doc.font(FONT.regular).fontSize(size).fillColor(COLOURS.ink)
  for (const item of items) {
    ensureRoom(doc, size * 2.5)
    const top = doc.y
    doc.text('•', MARGIN.left + 4, top, { lineBreak: false })
    doc.text(item, MARGIN.left + 14, top, { width: contentWidth(doc) - 14 })
    doc.moveDown(0.15)
  }
  doc.x = MARGIN.left
}

/**
 * The footer of every page: the caution, what the report is about and the page number. Drawn in
 * a last pass over the buffered pages, with the bottom margin lifted so pdfkit adds no page.
 */
export function footers(doc: Pdf, caution: string, about: string) {
  const range = doc.bufferedPageRange()
  for (let i = range.start; i < range.start + range.count; i += 1) {
    doc.switchToPage(i)
    const bottom = doc.page.margins.bottom
    doc.page.margins.bottom = 0
    const y = doc.page.height - bottom + 14
    const width = contentWidth(doc)
    doc
      .moveTo(MARGIN.left, y - 5)
      .lineTo(MARGIN.left + width, y - 5)
      .lineWidth(0.5)
      .strokeColor(COLOURS.rule)
      .stroke()
    doc
      .font(FONT.bold)
      .fontSize(7.5)
      .fillColor(COLOURS.ink)
      .text(caution, MARGIN.left, y, { width: width - 90, lineBreak: false })
    doc.font(FONT.regular).fillColor(COLOURS.muted)
    doc.text(`Page ${i + 1} of ${range.count}`, MARGIN.left + width - 90, y, {
      width: 90,
      align: 'right',
      lineBreak: false,
    })
    doc.text(about, MARGIN.left, y + 11, { width, lineBreak: false })
    doc.page.margins.bottom = bottom
  }
}
