/** The editor's import and export actions, as the toolbar's menu offers them. */
export type TransferAction = 'import-fixtures' | 'export-json' | 'import-json' | 'report'

export interface TransferItem {
  key: TransferAction
  label: string
  /** Changes the diagram: hidden from members who may only read. */
  edits: boolean
}

export const TRANSFER_ITEMS: TransferItem[] = [
  { key: 'import-fixtures', label: 'Import fixture schedule (CSV)…', edits: true },
  { key: 'import-json', label: 'Import diagram (JSON)…', edits: true },
  { key: 'export-json', label: 'Export diagram (JSON)', edits: false },
  { key: 'report', label: 'Download calculation report (PDF)', edits: false },
]
