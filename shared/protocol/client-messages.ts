/**
 * Zod schemas of every client → server message. The server parses each incoming payload with
 * these before touching state; {@link describeMessageError} turns a failure into a reason that
 * names the field.
 */
import { z } from 'zod'
import { operationSchema } from '../document/operations.ts'
import { PROTOCOL_LIMITS, PROTOCOL_VERSION } from './events.ts'

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i

/** A diagram id (uuid, as in the REST API). */
export const diagramIdSchema = z.string().regex(UUID, 'must be a diagram id (uuid)')
/** A client-chosen operation id (uuid); a resent op with the same id is never applied twice. */
export const clientOpIdSchema = z.string().regex(UUID, 'must be a uuid')
export const revisionSchema = z.number().int().nonnegative()

/**
 * `diagram:join`: enter the room and catch up. Without `sinceRevision` the server answers with a
 * snapshot; with it, with the missed ops (or a snapshot when the gap is large).
 * @example
 * joinMessageSchema.parse({ diagramId, sinceRevision: 41, protocolVersion: 1 })
 */
export const joinMessageSchema = z.strictObject({
  diagramId: diagramIdSchema,
  sinceRevision: revisionSchema.optional(),
  protocolVersion: z.literal(PROTOCOL_VERSION).optional(),
})
export type JoinMessage = z.infer<typeof joinMessageSchema>

/** `diagram:leave`. */
export const leaveMessageSchema = z.strictObject({ diagramId: diagramIdSchema })
export type LeaveMessage = z.infer<typeof leaveMessageSchema>

/**
 * `op:submit`: one operation in its envelope. `baseRevision` is the confirmed revision the
 * client had when it made the op; the server applies the op to its latest state regardless
 * (ops address nodes and pipes by id) and uses the base only for diagnostics.
 * @example
 * opSubmitSchema.parse({
 *   diagramId, clientOpId: crypto.randomUUID(), baseRevision: 12,
 *   op: { type: 'node.update', id: 'F3', patch: { count: 2 } },
 * })
 */
export const opSubmitSchema = z.strictObject({
  diagramId: diagramIdSchema,
  clientOpId: clientOpIdSchema,
  baseRevision: revisionSchema,
  op: operationSchema,
})
export type OpSubmit = z.infer<typeof opSubmitSchema>

const idList = () => z.array(z.string().min(1).max(64)).max(PROTOCOL_LIMITS.maxSelection)

/** What one person has selected on the canvas. */
export const selectionSchema = z.strictObject({
  nodes: idList().default([]),
  pipes: idList().default([]),
})
export type Selection = z.infer<typeof selectionSchema>

/**
 * `presence:update`: share the selection (kept in memory only, never stored).
 * @example
 * presenceUpdateSchema.parse({ diagramId, selection: { nodes: ['J2'], pipes: [] } })
 */
export const presenceUpdateSchema = z.strictObject({
  diagramId: diagramIdSchema,
  selection: selectionSchema,
})
export type PresenceUpdate = z.infer<typeof presenceUpdateSchema>

/**
 * `presence:cursor`: pointer in diagram coordinates; relayed volatile, never stored.
 * @example
 * presenceCursorSchema.parse({ diagramId, x: 310.5, y: -42 })
 */
export const presenceCursorSchema = z.strictObject({
  diagramId: diagramIdSchema,
  x: z.number().finite(),
  y: z.number().finite(),
})
export type PresenceCursor = z.infer<typeof presenceCursorSchema>

/**
 * The first issue of a failed parse as `field.path: message`, for refusals sent back to a
 * client, plus the field path alone.
 * @example
 * const parsed = opSubmitSchema.safeParse(input)
 * if (!parsed.success) describeMessageError(parsed.error) // { reason: 'baseRevision: …', field: 'baseRevision' }
 */
export function describeMessageError(error: z.ZodError): { reason: string; field?: string } {
  const issue = error.issues[0]
  if (!issue) return { reason: 'invalid message' }
  const field = issue.path.length ? issue.path.map(String).join('.') : undefined
  return { reason: field ? `${field}: ${issue.message}` : issue.message, field }
}
