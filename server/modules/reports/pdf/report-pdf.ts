/**
 * Lays out a report model as a PDF: title block with review status and caution, settings and load
 * basis, the diagram picture, the pipe schedule, node pressures, problems and sources.
 */
import type { ReportModel } from '../../../../shared/report/report-model.ts'
import { issueText } from '../../../../shared/units/issue-text.ts'
import { drawPicture } from './pdf-picture.ts'
import { COLOURS, contentWidth, createPdf, MARGIN, pdfBuffer, type Pdf } from './pdf-kit.ts'
import { footers, heading, labelled, list, note, paragraph } from './pdf-sections.ts'
import { drawTable } from './pdf-table.ts'

function titlePage(doc: Pdf, model: ReportModel) {
  doc
    .font('plex-semibold')
    .fontSize(18)
    .fillColor(COLOURS.ink)
    .text(model.title, MARGIN.left, MARGIN.top)
  doc.moveDown(0.6)
  const half = contentWidth(doc) / 2 - 10
  const top = doc.y
  labelled(doc, model.identity, MARGIN.left, half)
  const left = doc.y
  doc.y = top
  labelled(doc, model.summary, MARGIN.left + half + 20, half)
  doc.y = Math.max(left, doc.y) + 8
  note(
    doc,
    `Review status: ${model.review.label}`,
    model.review.detail ?? 'No review decision is recorded for this revision.',
    COLOURS.shade,
  )
  note(doc, 'Caution', model.caution)
  heading(doc, 'Settings')
  labelled(doc, model.settings, MARGIN.left, half + 60)
  heading(doc, `Load basis: ${model.loadBasis.name}`, 11)
  paragraph(doc, model.loadBasis.text)
}

/** Renders `model` to PDF bytes. */
export async function renderReportPdf(model: ReportModel): Promise<Buffer> {
  const doc = createPdf(model.units, model.title)
  titlePage(doc, model)

  doc.addPage()
  heading(doc, 'Diagram')
  drawPicture(doc, model.picture)

  doc.addPage()
  heading(doc, 'Pipe schedule')
  paragraph(
    doc,
    'Sizes are nominal; "(locked)" marks a size set by the designer. Rows with an error are shaded red, rows with a warning amber.',
    8,
    COLOURS.muted,
  )
  drawTable(doc, model.schedule, { fontSize: 6.5, rowHeight: 11 }, 'Pipe schedule (continued)')

  heading(doc, 'Node pressures')
  drawTable(doc, model.nodes, { fontSize: 7, rowHeight: 11.5 }, 'Node pressures (continued)')

  heading(doc, 'Problems')
  if (model.problems.length === 0) paragraph(doc, 'The calculation reports no problems.')
  else
    list(
      doc,
      model.problems.map(
        (p) =>
          `${p.severity === 'error' ? 'Error' : 'Warning'} (${p.code}): ${issueText(p, model.units)}${p.ids.length ? ` [${p.ids.join(', ')}]` : ''}`,
      ),
    )

  heading(doc, 'Sources of the values used')
  for (const group of model.sources) {
    heading(doc, group.topic, 9.5)
    list(doc, group.entries, 8)
  }
  heading(doc, 'Status tags', 9.5)
  list(
    doc,
    model.statusTags.map((t) => `${t.tag}: ${t.meaning}`),
    8,
  )

  heading(doc, 'Review and responsibility')
  note(
    doc,
    `Review status: ${model.review.label}`,
    model.review.detail ?? 'No review decision is recorded for this revision.',
    COLOURS.shade,
  )
  note(doc, 'Caution', model.caution)

  const about = model.identity
    .filter((row) => ['Project', 'Diagram', 'Revision'].includes(row.label))
    .map((row) => `${row.label}: ${row.value}`)
    .join('   ·   ')
  footers(doc, model.caution, about)
  return pdfBuffer(doc)
}
