import type { Db } from '../../db/knex.ts'

export interface ThreadRow {
  id: string
  project_id: string
  diagram_id: string
  target_kind: 'node' | 'pipe'
  target_id: string
  created_at: Date
  resolved_at: Date | null
  resolved_by: string | null
  resolved_by_name: string | null
}

export interface CommentRow {
  id: string
  thread_id: string
  author_id: string | null
  author_name: string | null
  body: string
  mentions: string[]
  created_at: Date
}

export interface AttachmentMetaRow {
  id: string
  comment_id: string
  file_name: string
  mime_type: string
  size_bytes: number
}

const threads = (db: Db) =>
  db('comment_threads as t')
    .leftJoin('users as r', 'r.id', 't.resolved_by')
    .select('t.*', 'r.name as resolved_by_name')

export const listThreadRows = (db: Db, diagramId: string) =>
  threads(db).where('t.diagram_id', diagramId).orderBy('t.created_at').select<ThreadRow[]>()

export const findThreadRow = (db: Db, diagramId: string, threadId: string) =>
  threads(db).where({ 't.diagram_id': diagramId, 't.id': threadId }).first<ThreadRow | undefined>()

export const listCommentRows = (db: Db, threadIds: string[]) =>
  db('comments as c')
    .leftJoin('users as u', 'u.id', 'c.author_id')
    .whereIn('c.thread_id', threadIds)
    .orderBy('c.created_at')
    .orderBy('c.id')
    .select<CommentRow[]>('c.*', 'u.name as author_name')

export const listAttachmentRows = (db: Db, commentIds: string[]) =>
  db('comment_attachments')
    .whereIn('comment_id', commentIds)
    .orderBy('created_at')
    .select<AttachmentMetaRow[]>('id', 'comment_id', 'file_name', 'mime_type', 'size_bytes')

export async function insertThread(
  db: Db,
  row: {
    project_id: string
    diagram_id: string
    target_kind: string
    target_id: string
    created_by: string
  },
): Promise<string> {
  const [inserted] = await db('comment_threads').insert(row).returning<{ id: string }[]>('id')
  return inserted!.id
}

export async function insertComment(
  db: Db,
  row: { thread_id: string; author_id: string; body: string; mentions: string[] },
): Promise<string> {
  const [inserted] = await db('comments').insert(row).returning<{ id: string }[]>('id')
  return inserted!.id
}

export const setResolved = (db: Db, threadId: string, by: string | null) =>
  db('comment_threads')
    .where({ id: threadId })
    .update({ resolved_at: by ? db.fn.now() : null, resolved_by: by })

/** The members among `userIds` with their e-mail (non-members are dropped). */
export const membersAmong = (db: Db, projectId: string, userIds: string[]) =>
  db('project_members as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where('m.project_id', projectId)
    .whereIn('m.user_id', userIds)
    .select<{ id: string; name: string; email: string }[]>('u.id', 'u.name', 'u.email')
