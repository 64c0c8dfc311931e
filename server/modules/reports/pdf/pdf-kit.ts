/**
 * The report's PDF document: page size by unit system (A4 for SI, US Letter for US), landscape
 * so the pipe schedule fits, IBM Plex Sans embedded from the installed package (no network).
 */
import { createRequire } from 'node:module'
import PDFDocument from 'pdfkit'

const require = createRequire(import.meta.url)
const font = (weight: number) =>
  require.resolve(`@fontsource/ibm-plex-sans/files/ibm-plex-sans-latin-${weight}-normal.woff`)

export const FONT = { regular: 'plex', bold: 'plex-semibold' } as const

export const COLOURS = {
  ink: '#1d2a33',
  muted: '#5b6770',
  rule: '#c9d0d5',
  shade: '#f2f4f5',
  cold: '#1f5fa8',
  hot: '#b8322a',
  error: '#fbe3e1',
  warning: '#fbf1d6',
  caution: '#fbf4dc',
  cautionRule: '#c9a227',
} as const

/** Page margins, pt; the bottom one leaves room for the footer. */
export const MARGIN: Readonly<Record<'top' | 'left' | 'right' | 'bottom', number>> = {
  top: 36,
  left: 36,
  right: 36,
  bottom: 58,
}

export type Pdf = InstanceType<typeof PDFDocument>

/** A new landscape document with the fonts registered and pages kept for the footer pass. */
export function createPdf(units: 'si' | 'us', title: string): Pdf {
  const doc = new PDFDocument({
    size: units === 'us' ? 'LETTER' : 'A4',
    layout: 'landscape',
    margins: { ...MARGIN },
    bufferPages: true,
    info: { Title: title, Creator: 'Tributary' },
  })
  doc.registerFont(FONT.regular, font(400))
  doc.registerFont(FONT.bold, font(600))
  doc.font(FONT.regular).fillColor(COLOURS.ink)
  return doc
}

/** Usable width between the margins. */
export const contentWidth = (doc: Pdf) => doc.page.width - MARGIN.left - MARGIN.right

/** Lowest y content may reach on the current page. */
export const contentBottom = (doc: Pdf) => doc.page.height - MARGIN.bottom

/** Starts a new page when fewer than `needed` points remain. */
export function ensureRoom(doc: Pdf, needed: number) {
  if (doc.y + needed > contentBottom(doc)) doc.addPage()
}

/** Text cut to `width` with an ellipsis, in the current font and size. */
export function fitText(doc: Pdf, text: string, width: number): string {
  if (doc.widthOfString(text) <= width) return text
  let low = 0
  let high = text.length
  while (low < high) {
    const mid = Math.ceil((low + high) / 2)
    if (doc.widthOfString(`${text.slice(0, mid)}…`) <= width) low = mid
    else high = mid - 1
  }
  return `${text.slice(0, low)}…`
}

/** Collects the document's bytes once it ends. */
export function pdfBuffer(doc: Pdf): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = []
    doc.on('data', (chunk: Buffer) => chunks.push(chunk))
    doc.on('end', () => resolve(Buffer.concat(chunks)))
    doc.on('error', reject)
    doc.end()
  })
}
