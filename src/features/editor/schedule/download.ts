import { downloadBlob } from '@/features/editor/export/download-blob'

/** Saves text as a file through a temporary link: no server round trip, works offline. */
export function downloadText(text: string, fileName: string, type = 'text/csv;charset=utf-8') {
  downloadBlob(new Blob([text], { type }), fileName)
}
