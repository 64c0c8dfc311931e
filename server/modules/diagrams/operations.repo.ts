import type { ProjectRole } from '../../../shared/auth/roles.ts'
import type { Diagram } from '../../../shared/document/model.ts'
import type { Operation } from '../../../shared/document/operations.ts'
import type { Db } from '../../db/knex.ts'
import { preparedQuery } from '../../db/prepared.ts'

/** The diagram row as the op service needs it, read under `FOR UPDATE`. */
export interface LockedDiagram {
  id: string
  project_id: string
  name: string
  revision: number
}

export type OpSource = 'edit' | 'save' | 'restore'

export interface OpRow {
  diagram_id: string
  revision: number
  client_op_id: string
  author_id: string | null
  source: OpSource
  restored_from: number | null
  op: Operation
  created_at: Date
}

/** An op row with its author's name, as history and catch-up return it. */
export interface OpRowWithAuthor extends OpRow {
  author_name: string | null
}

export const readDiagramState = (db: Db, id: string) =>
  db('diagrams')
    .where({ id })
    .first<{ project_id: string; revision: number; document: Diagram } | undefined>(
      'project_id',
      'revision',
      'document',
    )

export const insertSnapshot = (trx: Db, diagramId: string, revision: number, document: Diagram) =>
  trx('diagram_snapshots')
    .insert({ diagram_id: diagramId, revision, document: JSON.stringify(document) })
    .onConflict(['diagram_id', 'revision'])
    .ignore()

/** The nearest snapshot at or before `revision`. */
export const snapshotAtOrBefore = (db: Db, diagramId: string, revision: number) =>
  db('diagram_snapshots')
    .where({ diagram_id: diagramId })
    .andWhere('revision', '<=', revision)
    .orderBy('revision', 'desc')
    .first<{ revision: number; document: Diagram } | undefined>('revision', 'document')

export const earliestSnapshotRevision = async (db: Db, diagramId: string) =>
  (
    await db('diagram_snapshots')
      .where({ diagram_id: diagramId })
      .min<{ min: number | null }>('revision as min')
      .first()
  )?.min ?? null

const withAuthor = (db: Db) =>
  db('diagram_ops as o')
    .leftJoin('users as u', 'u.id', 'o.author_id')
    .select('o.*', 'u.name as author_name')

/** Ops with revision in (after, upTo], oldest first, at most `limit`. */
export const opsBetween = (db: Db, diagramId: string, after: number, upTo: number, limit: number) =>
  withAuthor(db)
    .where('o.diagram_id', diagramId)
    .andWhere('o.revision', '>', after)
    .andWhere('o.revision', '<=', upTo)
    .orderBy('o.revision', 'asc')
    .limit(limit)
    .select<OpRowWithAuthor[]>()

/** Newest first, revisions below `before`. */
export const opsDescending = (db: Db, diagramId: string, before: number, limit: number) =>
  withAuthor(db)
    .where('o.diagram_id', diagramId)
    .andWhere('o.revision', '<', before)
    .orderBy('o.revision', 'desc')
    .limit(limit)
    .select<OpRowWithAuthor[]>()

/** The locked row plus what the commit needs, read in one round trip. */
export interface LockedState extends LockedDiagram {
  /** Null when the stored revision equals `cachedRevision` (the caller has that document). */
  document: Diagram | null
  roles: { user_id: string; role: ProjectRole }[]
  seen: { client_op_id: string; revision: number }[]
}

/**
 * Locks the diagram row (`FOR UPDATE`: serialises writers across processes) and reads, in the
 * same statement, the authors' roles and the revisions already given to these client op ids.
 * The sub-selects see the statement's snapshot: a resend committed by another process while
 * this one waited for the lock is caught by the unique index instead (the caller retries).
 */
export async function lockDiagramState(
  trx: Db,
  id: string,
  cachedRevision: number,
  userIds: string[],
  clientOpIds: string[],
): Promise<LockedState | undefined> {
  const result = await trx.raw(
    `SELECT d.id, d.project_id, d.name, d.revision,
       CASE WHEN d.revision = ? THEN NULL ELSE d.document END AS document,
       COALESCE((SELECT json_agg(json_build_object('user_id', m.user_id, 'role', m.role))
         FROM project_members m
         WHERE m.project_id = d.project_id AND m.user_id = ANY(?::uuid[])), '[]') AS roles,
       COALESCE((SELECT json_agg(json_build_object('client_op_id', o.client_op_id, 'revision', o.revision))
         FROM diagram_ops o
         WHERE o.diagram_id = d.id AND o.client_op_id = ANY(?::text[])), '[]') AS seen
     FROM diagrams d WHERE d.id = ? FOR UPDATE OF d`,
    [cachedRevision, userIds, clientOpIds, id],
  )
  return (result as { rows: LockedState[] }).rows[0]
}

/**
 * Appends op rows and writes the new document and revision in one statement; returns the
 * commit time (the transaction's timestamp, which is also every row's `created_at`).
 */
export async function appendOpsAndState(
  trx: Db,
  id: string,
  rows: Omit<OpRow, 'created_at'>[],
  state: { document: Diagram; revision: number; userId: string | null; name?: string },
): Promise<Date> {
  const result = await trx.raw(
    `WITH ins AS (
       INSERT INTO diagram_ops (diagram_id, revision, client_op_id, author_id, source, restored_from, op)
       SELECT ?::uuid, r.revision, r.client_op_id, r.author_id, r.source, r.restored_from, r.op
       FROM jsonb_to_recordset(?::jsonb) AS r(revision int, client_op_id text, author_id uuid,
         source text, restored_from int, op jsonb)
       RETURNING 1
     )
     UPDATE diagrams SET document = ?::json, revision = ?, updated_by = ?, updated_at = now(),
       name = COALESCE(?, name)
     WHERE id = ?
     RETURNING now() AS at, (SELECT count(*) FROM ins) AS inserted`,
    [
      id,
      JSON.stringify(rows.map(({ diagram_id: _d, ...row }) => row)),
      JSON.stringify(state.document),
      state.revision,
      state.userId,
      state.name ?? null,
      id,
    ],
  )
  return (result as { rows: { at: Date }[] }).rows[0]!.at
}

/**
 * The optimistic commit, one statement and so one round trip and one transaction: append the
 * rows, write the document and revision, and (when asked) keep a snapshot, but only if the
 * diagram is still at `baseRevision` and every author in `roles` still has that role. Under READ
 * COMMITTED the UPDATE re-checks its WHERE on the newest row version after any concurrent
 * writer, and the INSERTs read the UPDATE's RETURNING, so either all of it happens or none.
 * A resend already in the log fails the unique index (23505). Returns null when nothing was
 * written because the revision or a role moved on.
 */
export async function appendIfCurrent(
  db: Db,
  id: string,
  baseRevision: number,
  roles: { user_id: string; role: ProjectRole }[],
  rows: Omit<OpRow, 'created_at'>[],
  state: { document: Diagram; revision: number; userId: string | null },
  snapshot: boolean,
): Promise<Date | null> {
  const name = state.document.name
  const result = await preparedQuery<{ at: Date; updated: number }>(
    db,
    'append-if-current',
    APPEND,
    [
      JSON.stringify(state.document),
      state.revision,
      state.userId,
      name.trim(),
      name,
      id,
      baseRevision,
      JSON.stringify(roles),
      JSON.stringify(rows.map(({ diagram_id: _d, ...row }) => row)),
      snapshot,
    ],
  )
  const row = result.rows[0]!
  return row.updated === 1 ? row.at : null
}

// appendIfCurrent's statement; $4 is the trimmed name, $5 the name as written, $10 whether to
// keep a snapshot. One statement for both cases, so each connection plans it once: a second
// shape used every hundredth commit was planned afresh each time and made the slowest edits.
const APPEND = `WITH upd AS (
     UPDATE diagrams AS d SET document = $1::json, revision = $2::int, updated_by = $3::uuid,
       updated_at = now(),
       -- as the locked path: the row takes the document's name when that differs
       name = CASE WHEN $4::text <> '' AND d.name IS DISTINCT FROM $5::text THEN $4::text ELSE d.name END
     WHERE d.id = $6::uuid AND d.revision = $7::int AND NOT EXISTS (
       SELECT 1 FROM jsonb_to_recordset($8::jsonb) AS g(user_id uuid, role text)
       WHERE NOT EXISTS (SELECT 1 FROM project_members m
         WHERE m.project_id = d.project_id AND m.user_id = g.user_id AND m.role = g.role))
     RETURNING d.id, d.revision
   ), ins AS (
     INSERT INTO diagram_ops (diagram_id, revision, client_op_id, author_id, source, restored_from, op)
     SELECT upd.id, r.revision, r.client_op_id, r.author_id, r.source, r.restored_from, r.op
     FROM upd, jsonb_to_recordset($9::jsonb) AS r(revision int, client_op_id text, author_id uuid,
       source text, restored_from int, op jsonb)
     RETURNING 1
   ), snap AS (
     INSERT INTO diagram_snapshots (diagram_id, revision, document)
     SELECT id, revision, $1::json FROM upd WHERE $10::boolean -- the parameter: cheaper than the row's copy
     ON CONFLICT (diagram_id, revision) DO NOTHING
   )
   SELECT now() AS at, (SELECT count(*) FROM upd)::int AS updated`
