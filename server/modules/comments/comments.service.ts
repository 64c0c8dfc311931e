import type { CommentThread, CreateThreadInput, ReplyInput } from '../../../shared/api/comments.ts'
import type { Diagram } from '../../../shared/document/model.ts'
import type { Db } from '../../db/knex.ts'
import { badRequest, notFound } from '../../errors.ts'
import { mentionMail } from './mention-mail.ts'
import { wantsEmail } from '../account/notification-settings.ts'
import { findProjectName } from './project-name.ts'
import * as repo from './comments.repo.ts'
import {
  diagramLink,
  diagramOf,
  sendQuietly,
  type DiagramRef,
  type ReviewDeps,
} from './review-deps.ts'

function targetExists(doc: Diagram, kind: 'node' | 'pipe', id: string) {
  return kind === 'node' ? doc.nodes.some((n) => n.id === id) : doc.pipes.some((p) => p.id === id)
}

/** Threads with their comments and attachments; `orphaned` against the given document. */
async function assemble(db: Db, rows: repo.ThreadRow[], doc: Diagram): Promise<CommentThread[]> {
  if (!rows.length) return []
  const comments = await repo.listCommentRows(
    db,
    rows.map((r) => r.id),
  )
  const files = comments.length
    ? await repo.listAttachmentRows(
        db,
        comments.map((c) => c.id),
      )
    : []
  return rows.map((t) => ({
    id: t.id,
    diagramId: t.diagram_id,
    target: { kind: t.target_kind, id: t.target_id },
    createdAt: t.created_at.toISOString(),
    resolvedAt: t.resolved_at?.toISOString() ?? null,
    resolvedBy: t.resolved_by
      ? { id: t.resolved_by, name: t.resolved_by_name ?? 'Former user' }
      : null,
    orphaned: !targetExists(doc, t.target_kind, t.target_id),
    comments: comments
      .filter((c) => c.thread_id === t.id)
      .map((c) => ({
        id: c.id,
        author: c.author_id ? { id: c.author_id, name: c.author_name ?? 'Former user' } : null,
        body: c.body,
        mentions: c.mentions,
        createdAt: c.created_at.toISOString(),
        attachments: files
          .filter((f) => f.comment_id === c.id)
          .map((f) => ({
            id: f.id,
            fileName: f.file_name,
            mimeType: f.mime_type,
            sizeBytes: f.size_bytes,
          })),
      })),
  }))
}

export async function listThreads(db: Db, ref: DiagramRef): Promise<CommentThread[]> {
  const diagram = await diagramOf(db, ref)
  return assemble(db, await repo.listThreadRows(db, ref.diagramId), diagram.document)
}

export async function getThread(db: Db, ref: DiagramRef, threadId: string): Promise<CommentThread> {
  const diagram = await diagramOf(db, ref)
  const row = await repo.findThreadRow(db, ref.diagramId, threadId)
  if (!row) throw notFound('No such comment thread on this diagram')
  return (await assemble(db, [row], diagram.document))[0]!
}

/** Mentioned ids must be project members; a stranger's id is a 400 on that field. */
async function checkMentions(db: Db, projectId: string, mentions: string[]) {
  const unique = [...new Set(mentions)]
  const members = unique.length ? await repo.membersAmong(db, projectId, unique) : []
  const missing = unique.findIndex((id) => !members.some((m) => m.id === id))
  if (missing >= 0) {
    throw badRequest(`mentions.${missing}: is not a member of this project`, [
      { path: `mentions.${missing}`, message: 'is not a member of this project' },
    ])
  }
  return members
}

async function mailMentions(
  deps: ReviewDeps,
  ref: DiagramRef,
  authorId: string,
  body: string,
  mentioned: { id: string; name: string; email: string }[],
) {
  const others = mentioned.filter((m) => m.id !== authorId)
  if (!others.length) return
  const [diagram, projectName, author] = await Promise.all([
    diagramOf(deps.db, ref),
    findProjectName(deps.db, ref.projectId),
    deps.db('users').where({ id: authorId }).first<{ name: string }>('name'),
  ])
  for (const person of others) {
    if (!(await wantsEmail(deps.db, person.id, 'mentions'))) continue
    const mail = mentionMail({
      to: person.email,
      authorName: author?.name ?? 'Someone',
      projectName,
      diagramName: diagram.name,
      body,
      link: diagramLink(deps.origin, ref),
    })
    await sendQuietly(() => deps.mailer.send(mail))
  }
}

async function publish(deps: ReviewDeps, ref: DiagramRef, threadId: string) {
  const thread = await getThread(deps.db, ref, threadId)
  deps.feed.publish({ kind: 'thread', diagramId: ref.diagramId, thread })
  return thread
}

export async function createThread(
  deps: ReviewDeps,
  ref: DiagramRef,
  authorId: string,
  input: CreateThreadInput,
): Promise<CommentThread> {
  const diagram = await diagramOf(deps.db, ref)
  if (!targetExists(diagram.document, input.target.kind, input.target.id)) {
    throw badRequest(`target.id: no ${input.target.kind} with this id in the diagram`, [
      { path: 'target.id', message: `no ${input.target.kind} with this id in the diagram` },
    ])
  }
  const mentioned = await checkMentions(deps.db, ref.projectId, input.mentions)
  const threadId = await deps.db.transaction(async (trx) => {
    const id = await repo.insertThread(trx, {
      project_id: ref.projectId,
      diagram_id: ref.diagramId,
      target_kind: input.target.kind,
      target_id: input.target.id,
      created_by: authorId,
    })
    await repo.insertComment(trx, {
      thread_id: id,
      author_id: authorId,
      body: input.body,
      mentions: mentioned.map((m) => m.id),
    })
    return id
  })
  await mailMentions(deps, ref, authorId, input.body, mentioned)
  return publish(deps, ref, threadId)
}

export async function reply(
  deps: ReviewDeps,
  ref: DiagramRef,
  threadId: string,
  authorId: string,
  input: ReplyInput,
): Promise<{ thread: CommentThread; commentId: string }> {
  await getThread(deps.db, ref, threadId)
  const mentioned = await checkMentions(deps.db, ref.projectId, input.mentions)
  const commentId = await repo.insertComment(deps.db, {
    thread_id: threadId,
    author_id: authorId,
    body: input.body,
    mentions: mentioned.map((m) => m.id),
  })
  await mailMentions(deps, ref, authorId, input.body, mentioned)
  return { thread: await publish(deps, ref, threadId), commentId }
}

export async function setThreadResolved(
  deps: ReviewDeps,
  ref: DiagramRef,
  threadId: string,
  userId: string,
  resolved: boolean,
): Promise<CommentThread> {
  await getThread(deps.db, ref, threadId)
  await repo.setResolved(deps.db, threadId, resolved ? userId : null)
  return publish(deps, ref, threadId)
}
