/** Comment threads pinned to a node or pipe: shapes of /api/projects/:p/diagrams/:d/comments. */
import { z } from 'zod'

export const COMMENT_LIMITS = {
  bodyChars: 4000,
  mentions: 20,
  /** Attachments: images and PDF up to 5 MB each. */
  attachmentBytes: 5 * 1024 * 1024,
  attachmentTypes: ['image/png', 'image/jpeg', 'image/gif', 'image/webp', 'application/pdf'],
} as const

const id = z.string().trim().min(1).max(64)
export const commentTargetSchema = z.object({ kind: z.enum(['node', 'pipe']), id })
export type CommentTarget = z.infer<typeof commentTargetSchema>

const body = z
  .string()
  .trim()
  .min(1, 'must not be empty')
  .max(COMMENT_LIMITS.bodyChars, `must be at most ${COMMENT_LIMITS.bodyChars} characters`)
const mentions = z.array(z.uuid('must be a user id')).max(COMMENT_LIMITS.mentions).default([])

export const createThreadBodySchema = z.object({ target: commentTargetSchema, body, mentions })
export type CreateThreadBody = z.input<typeof createThreadBodySchema>
export type CreateThreadInput = z.output<typeof createThreadBodySchema>
export const replyBodySchema = z.object({ body, mentions })
export type ReplyBody = z.input<typeof replyBodySchema>
export type ReplyInput = z.output<typeof replyBodySchema>
export const threadStateBodySchema = z.object({ resolved: z.boolean() })

const person = z.object({ id: z.string(), name: z.string() }).nullable()

export const commentAttachmentSchema = z.object({
  id: z.string(),
  fileName: z.string(),
  mimeType: z.string(),
  sizeBytes: z.number(),
})
export type CommentAttachment = z.infer<typeof commentAttachmentSchema>

export const commentSchema = z.object({
  id: z.string(),
  author: person,
  body: z.string(),
  mentions: z.array(z.string()),
  attachments: z.array(commentAttachmentSchema),
  createdAt: z.string(),
})
export type Comment = z.infer<typeof commentSchema>

export const commentThreadSchema = z.object({
  id: z.string(),
  diagramId: z.string(),
  target: commentTargetSchema,
  createdAt: z.string(),
  resolvedAt: z.string().nullable(),
  resolvedBy: person,
  /** The node or pipe is no longer in the diagram; the thread stays readable. */
  orphaned: z.boolean(),
  comments: z.array(commentSchema),
})
export type CommentThread = z.infer<typeof commentThreadSchema>

export const threadListBodySchema = z.object({ threads: z.array(commentThreadSchema) })
export const threadBodySchema = z.object({ thread: commentThreadSchema })
