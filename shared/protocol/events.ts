/**
 * The co-editing socket protocol: its version, event names and limits. Event names are
 * `noun:verb`; the same strings are used by the server (server/realtime) and the client.
 * Payload shapes live in client-messages.ts (zod, validated by the server) and
 * server-messages.ts (types of what the server sends). See DEVELOPERS.md, "Co-editing".
 */

/**
 * Bumped on any incompatible change of an event or payload. A client sends it in
 * `diagram:join`; the server refuses a join from another version with a clear reason.
 * @example
 * socket.emit(EVENTS.diagramJoin, { diagramId, protocolVersion: PROTOCOL_VERSION })
 */
export const PROTOCOL_VERSION = 1

/** Client → server event names. */
export const CLIENT_EVENTS = {
  /** Enter a diagram's room and catch up: `{ diagramId, sinceRevision? }`. */
  diagramJoin: 'diagram:join',
  /** Leave a diagram's room: `{ diagramId }`. */
  diagramLeave: 'diagram:leave',
  /** Submit one operation: `{ diagramId, clientOpId, baseRevision, op }`. */
  opSubmit: 'op:submit',
  /** Share what this person has selected: `{ diagramId, selection }`. */
  presenceUpdate: 'presence:update',
  /** Pointer position in diagram coordinates, volatile: `{ diagramId, x, y }`. */
  presenceCursor: 'presence:cursor',
} as const

/** Server → client event names. */
export const SERVER_EVENTS = {
  /** The whole document at a revision (join, or a gap too large for `diagram:ops`). */
  diagramSnapshot: 'diagram:snapshot',
  /** The operations missed since the client's revision (join with `sinceRevision`). */
  diagramOps: 'diagram:ops',
  /** To the sender only: the op was committed as `revision`. */
  opAck: 'op:ack',
  /** To the sender only: the op was refused with a reason; roll it back. */
  opReject: 'op:reject',
  /** To everyone else in the room (every server process): a committed op. */
  opApplied: 'op:applied',
  /** Who is in the diagram and what each has selected. */
  presenceState: 'presence:state',
  /** Another person's pointer (volatile: may be dropped, never stored). */
  presenceCursor: 'presence:cursor',
  /** A message that was not an op was refused (bad payload, no access, too large, too fast). */
  messageRefused: 'message:refused',
} as const

export const EVENTS = { ...CLIENT_EVENTS, ...SERVER_EVENTS } as const
export type ClientEventName = (typeof CLIENT_EVENTS)[keyof typeof CLIENT_EVENTS]
export type ServerEventName = (typeof SERVER_EVENTS)[keyof typeof SERVER_EVENTS]

/**
 * Protocol limits shared by both sides. The server's actual limits come from its environment
 * (server/config/env.ts) and default to these; a client may use them to avoid sending what would
 * be refused.
 */
export const PROTOCOL_LIMITS = {
  /** Largest serialized message the server accepts, bytes. */
  maxMessageBytes: 256 * 1024,
  /** Largest revision gap answered with `diagram:ops`; a larger one gets a snapshot. */
  maxCatchUpOps: 200,
  /** Ops and presence messages per second a socket may sustain (token bucket refill). */
  messagesPerSecond: 200,
  /** Bucket size: a burst this large is accepted at once. */
  messageBurst: 400,
  /** Cursor messages per second relayed per socket; more are dropped silently. */
  cursorsPerSecond: 30,
  /** Longest list of selected ids in one presence message. */
  maxSelection: 2_000,
} as const
