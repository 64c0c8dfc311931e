/**
 * The co-editing protocol in one import.
 * @example
 * import { EVENTS, PROTOCOL_VERSION, opSubmitSchema, type OpApplied } from '../protocol/index.ts'
 */
export * from './events.ts'
export * from './client-messages.ts'
export * from './server-messages.ts'
export * from './history.ts'
export * from './event-maps.ts'
