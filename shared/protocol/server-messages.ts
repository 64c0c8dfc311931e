/**
 * Types of every server → client message. Each carries the `diagramId` it is about, and those
 * that change the document carry the `revision` the server gave it (revisions of a diagram are
 * consecutive integers; the document at revision r is the document at r - 1 with op r applied).
 */
import type { ProjectRole } from '../auth/roles.ts'
import type { Diagram } from '../document/model.ts'
import type { Operation } from '../document/operations.ts'
import type { Selection } from './client-messages.ts'

/** Who made an operation. `null` id when the author's account was since deleted. */
export interface OpAuthor {
  id: string | null
  name: string
}

/**
 * `op:applied`, and each item of `diagram:ops`: one committed operation in server order.
 * @example
 * { diagramId, revision: 13, op: { type: 'node.move', … }, clientOpId: '…', author: { id, name: 'Ada' }, at: '2026-…Z' }
 */
export interface OpApplied {
  diagramId: string
  revision: number
  op: Operation
  clientOpId: string
  author: OpAuthor
  /** Commit time, ISO 8601. */
  at: string
}

/** `op:ack`, to the sender only: its op is committed as `revision`. */
export interface OpAck {
  diagramId: string
  clientOpId: string
  revision: number
  /** True when the op had already been committed (a resend); it was not applied again. */
  duplicate?: boolean
}

/** Why an op was refused. */
export type OpRejectCode =
  /** The envelope or op failed the schema. */
  | 'invalid'
  /** The op does not apply to the current document (unknown id, duplicate id, level in use). */
  | 'conflict'
  /** The op would break a graph rule (a loop, a second inlet). */
  | 'graph-rule'
  /** The user may not edit this diagram (viewer, reviewer, not a member). */
  | 'forbidden'
  /** No such diagram. */
  | 'not-found'
  /** Over the size cap or the per-socket rate. */
  | 'limit'
  /** Not joined to this diagram, or the server failed; the op was not stored. */
  | 'unavailable'

/** `op:reject`, to the sender only: roll the op back and show `reason`. */
export interface OpReject {
  diagramId: string
  clientOpId: string
  code: OpRejectCode
  reason: string
  /** The offending field path when the op failed the schema, e.g. `op.patch.count`. */
  field?: string
  /** Node, pipe or level ids involved, for highlighting. */
  ids?: string[]
}

/** `diagram:snapshot`: the whole confirmed document at `revision`. */
export interface DiagramSnapshot {
  diagramId: string
  revision: number
  doc: Diagram
  /** The user's role in the project; only `owner` and `editor` may submit ops. */
  role: ProjectRole
}

/** `diagram:ops`: the ops after the client's `sinceRevision`, up to `revision`, in order. */
export interface DiagramOps {
  diagramId: string
  /** The client's revision the ops start after. */
  fromRevision: number
  /** The revision after the last op (= fromRevision when nothing was missed). */
  revision: number
  ops: OpApplied[]
  role: ProjectRole
}

/** Either answer to `diagram:join`. */
export type CatchUp = ({ kind: 'snapshot' } & DiagramSnapshot) | ({ kind: 'ops' } & DiagramOps)

/** One person in a diagram. Several tabs of one user appear once (selections merged). */
export interface PresenceMember {
  userId: string
  name: string
  /** One or two letters for the avatar. */
  initials: string
  /** A stable colour for this user, `#rrggbb`. */
  color: string
  role: ProjectRole
  selection: Selection
}

/** `presence:state`: everyone currently in the diagram, across all server processes. */
export interface PresenceState {
  diagramId: string
  members: PresenceMember[]
}

/** `presence:cursor` from the server: another person's pointer. */
export interface PresenceCursorRelay {
  diagramId: string
  userId: string
  color: string
  x: number
  y: number
}

/** `message:refused`: a non-op message was refused. */
export interface MessageRefused {
  /** The event that was refused, e.g. `diagram:join`. */
  event: string
  diagramId?: string
  code: OpRejectCode
  reason: string
  field?: string
}
