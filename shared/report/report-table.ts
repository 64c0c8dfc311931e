/** A plain table of text cells, the shape every tabular part of the report is drawn from. */

export interface ReportColumn {
  title: string
  /** Right-aligned numbers. */
  numeric?: boolean
  /** Share of the table width. */
  weight: number
}

export interface ReportTable {
  columns: ReportColumn[]
  rows: string[][]
  /** Per row: 'error' or 'warning' rows are marked; same length as rows. */
  marks: ('error' | 'warning' | null)[]
}
