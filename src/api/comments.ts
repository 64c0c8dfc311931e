import {
  threadBodySchema,
  threadListBodySchema,
  type CreateThreadBody,
  type ReplyBody,
} from '@shared/api/comments'
import { apiErrorBodySchema } from '@shared/api/schemas'
import { ApiError, request } from './http'

const base = (projectId: string, diagramId: string) =>
  `/projects/${projectId}/diagrams/${diagramId}/comments`

export const listThreads = (projectId: string, diagramId: string) =>
  request(base(projectId, diagramId), threadListBodySchema).then((b) => b.threads)
export const createThread = (projectId: string, diagramId: string, body: CreateThreadBody) =>
  request(base(projectId, diagramId), threadBodySchema, { method: 'POST', body }).then(
    (b) => b.thread,
  )
export const reply = (projectId: string, diagramId: string, threadId: string, body: ReplyBody) =>
  request(`${base(projectId, diagramId)}/${threadId}/replies`, threadBodySchema, {
    method: 'POST',
    body,
  }).then((b) => b.thread)
export const setResolved = (
  projectId: string,
  diagramId: string,
  threadId: string,
  resolved: boolean,
) =>
  request(`${base(projectId, diagramId)}/${threadId}`, threadBodySchema, {
    method: 'PATCH',
    body: { resolved },
  }).then((b) => b.thread)

/** Where a member's browser fetches an attachment (the session cookie authorises it). */
export const attachmentUrl = (projectId: string, attachmentId: string) =>
  `/api/projects/${projectId}/attachments/${attachmentId}`

/** Multipart upload of one image or PDF as a new comment of the thread. */
export async function attach(
  projectId: string,
  diagramId: string,
  threadId: string,
  file: File,
  body = '',
) {
  const form = new FormData()
  form.append('body', body)
  form.append('file', file)
  let res: Response
  try {
    res = await fetch(`/api${base(projectId, diagramId)}/${threadId}/attachments`, {
      method: 'POST',
      credentials: 'include',
      body: form,
    })
  } catch {
    throw new ApiError(0, 'network', 'The server cannot be reached; check your connection')
  }
  const json = await res.json().catch(() => null)
  if (!res.ok) {
    const parsed = apiErrorBodySchema.safeParse(json)
    if (!parsed.success) throw new ApiError(res.status, 'http', `The server answered ${res.status}`)
    const { code, message, fields } = parsed.data.error
    throw new ApiError(res.status, code, message, fields)
  }
  return threadBodySchema.parse(json).thread
}
