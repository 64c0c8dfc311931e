import type { Diagram } from '../../../shared/document/model.ts'
import type { Operation } from '../../../shared/document/operations.ts'
import type { OpApplied, OpRejectCode } from '../../../shared/protocol/server-messages.ts'
import type { OpSource } from './operations.repo.ts'

/** One op offered to the op service. */
export interface OpSubmission {
  clientOpId: string
  author: { id: string; name: string }
  /** The op, or a function of the locked current document (restore, whole-document save). */
  op: Operation | ((current: Diagram) => Operation)
  source: OpSource
  restoredFrom?: number
  /** Check the author's role inside the transaction (socket ops); REST routes check before. */
  checkRole: boolean
  /** Refuse ops that break the graph rules (socket edits); restores reproduce a past state. */
  checkGraphRules: boolean
  /** Refuse unless the diagram is still at this revision (whole-document save). */
  expectRevision?: number
}

/** What became of a submission. */
export type OpOutcome =
  | { kind: 'ack'; revision: number; duplicate: boolean; applied?: OpApplied }
  | { kind: 'reject'; code: OpRejectCode; reason: string; ids?: string[]; revision?: number }
