/**
 * The pure co-editing core shared by the client and the server.
 * @example
 * import { createReplica, localApply, acknowledge, receiveRemote } from '../sync/index.ts'
 */
export * from './replica.ts'
export * from './graph-rules.ts'
export * from './diff.ts'
export * from './presence.ts'
export * from './summary.ts'
