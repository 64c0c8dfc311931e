import { COMMENT_LIMITS, type CommentThread } from '../../../shared/api/comments.ts'
import type { Db } from '../../db/knex.ts'
import { badRequest, notFound } from '../../errors.ts'
import { findAttachment, insertAttachment } from './attachments.repo.ts'
import { getThread } from './comments.service.ts'
import { insertComment } from './comments.repo.ts'
import type { DiagramRef, ReviewDeps } from './review-deps.ts'

const field = (path: string, message: string) =>
  badRequest(`${path}: ${message}`, [{ path, message }])

/** The real type from the first bytes: the client's declared type is not trusted. */
export function sniffType(data: Buffer): string | null {
  const starts = (...bytes: number[]) => bytes.every((b, i) => data[i] === b)
  if (starts(0x89, 0x50, 0x4e, 0x47)) return 'image/png'
  if (starts(0xff, 0xd8, 0xff)) return 'image/jpeg'
  if (starts(0x47, 0x49, 0x46, 0x38)) return 'image/gif'
  if (starts(0x52, 0x49, 0x46, 0x46) && data.subarray(8, 12).toString('latin1') === 'WEBP')
    return 'image/webp'
  if (data.subarray(0, 5).toString('latin1') === '%PDF-') return 'application/pdf'
  return null
}

/** The name as uploaded, without path separators or control characters (it goes in headers). */
function safeFileName(name: string): string {
  const clean = [...(name || 'attachment')].map((ch) =>
    ch < ' ' || ch === '/' || ch === '\\' ? '_' : ch,
  )
  return clean.join('').slice(0, 200)
}

export async function attach(
  deps: ReviewDeps,
  ref: DiagramRef,
  threadId: string,
  authorId: string,
  input: { file: Express.Multer.File | undefined; body: unknown },
): Promise<CommentThread> {
  await getThread(deps.db, ref, threadId)
  const file = input.file
  if (!file) throw field('file', 'attach one image or PDF as the multipart field "file"')
  const type = sniffType(file.buffer)
  if (!type || !(COMMENT_LIMITS.attachmentTypes as readonly string[]).includes(type)) {
    throw field('file', 'must be a PNG, JPEG, GIF or WebP image or a PDF')
  }
  if (input.body !== undefined && typeof input.body !== 'string')
    throw field('body', 'must be text')
  const body = (input.body ?? '').trim()
  if (body.length > COMMENT_LIMITS.bodyChars)
    throw field('body', `must be at most ${COMMENT_LIMITS.bodyChars} characters`)
  const fileName = safeFileName(file.originalname)
  await deps.db.transaction(async (trx) => {
    const commentId = await insertComment(trx, {
      thread_id: threadId,
      author_id: authorId,
      body,
      mentions: [],
    })
    await insertAttachment(trx, {
      comment_id: commentId,
      project_id: ref.projectId,
      file_name: fileName,
      mime_type: type,
      size_bytes: file.size,
      data: file.buffer,
    })
  })
  const thread = await getThread(deps.db, ref, threadId)
  deps.feed.publish({ kind: 'thread', diagramId: ref.diagramId, thread })
  return thread
}

/** The file of an attachment in the project, or 404 (also for other projects' attachments). */
export async function readAttachment(db: Db, projectId: string, id: string) {
  const row = await findAttachment(db, projectId, id)
  if (!row) throw notFound('No such attachment in this project')
  return row
}
