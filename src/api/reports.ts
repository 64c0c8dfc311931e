/**
 * The calculation report PDF. A binary download with progress, so it reads the body itself
 * rather than going through `request` (which parses JSON); errors are the same `ApiError`s.
 */
import { apiErrorBodySchema } from '@shared/api/schemas'
import { ApiError } from './http'

/** Where a download is: the server is still making the file, or bytes are arriving. */
export type DownloadProgress =
  { phase: 'preparing' } | { phase: 'downloading'; received: number; total: number | null }

export const reportPath = (projectId: string, diagramId: string) =>
  `/api/projects/${projectId}/diagrams/${diagramId}/report.pdf`

async function failure(res: Response): Promise<ApiError> {
  const parsed = apiErrorBodySchema.safeParse(await res.json().catch(() => null))
  return parsed.success
    ? new ApiError(
        res.status,
        parsed.data.error.code,
        parsed.data.error.message,
        parsed.data.error.fields,
      )
    : new ApiError(res.status, 'http', `The server answered ${res.status}`)
}

/** Fetches the report of a diagram as a PDF blob, reporting progress as it goes. */
export async function fetchReportPdf(
  projectId: string,
  diagramId: string,
  onProgress: (progress: DownloadProgress) => void,
  signal?: AbortSignal,
): Promise<Blob> {
  onProgress({ phase: 'preparing' })
  let res: Response
  try {
    res = await fetch(reportPath(projectId, diagramId), { credentials: 'include', signal })
  } catch (error) {
    if (signal?.aborted) throw error
    throw new ApiError(0, 'network', 'The server cannot be reached; check your connection')
  }
  if (!res.ok) throw await failure(res)
  const total = Number(res.headers.get('Content-Length')) || null
  const chunks: Uint8Array<ArrayBuffer>[] = []
  let received = 0
  const reader = res.body?.getReader()
  if (!reader) return res.blob()
  for (;;) {
    const { done, value } = await reader.read()
    if (done) break
    chunks.push(value as Uint8Array<ArrayBuffer>)
    received += value.length
    onProgress({ phase: 'downloading', received, total })
  }
  return new Blob(chunks, { type: 'application/pdf' })
}
