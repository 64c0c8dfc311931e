import type { ReviewEntry, ReviewState } from '../../../shared/api/reviews.ts'
import { NOT_SUBMITTED, type ReviewStatus } from '../../../shared/report/review-status.ts'
import type { Db } from '../../db/knex.ts'
import { conflict, notFound } from '../../errors.ts'
import { reviewDecisionMail } from './decision-mail.ts'
import { wantsEmail } from '../account/notification-settings.ts'
import { recordAudit } from '../audit/audit.service.ts'
import { findProjectName } from '../comments/project-name.ts'
import {
  diagramLink,
  diagramOf,
  sendQuietly,
  type DiagramRef,
  type ReviewDeps,
} from '../comments/review-deps.ts'
import type { ReportRevisionRef } from './report-ref.ts'
import * as repo from './reviews.repo.ts'

const toEntry = (row: repo.ReviewRow): ReviewEntry => ({
  id: String(row.id),
  kind: row.kind,
  revision: row.revision,
  note: row.note,
  actor: row.actor_id ? { id: row.actor_id, name: row.actor_name ?? 'Former user' } : null,
  createdAt: row.created_at.toISOString(),
})

/** The state from the history (newest first) at the diagram's current revision. */
export function reviewStateOf(
  diagramId: string,
  currentRevision: number,
  history: ReviewEntry[],
): ReviewState {
  const latest = history[0] ?? null
  const status = latest ? latest.kind : 'not_submitted'
  return {
    diagramId,
    status,
    latest,
    currentRevision,
    changedSinceApproval: status === 'approved' && latest!.revision !== currentRevision,
    history,
  }
}

export async function getReviewState(db: Db, ref: DiagramRef): Promise<ReviewState> {
  const diagram = await diagramOf(db, ref)
  const rows = await repo.listReviewRows(db, ref.diagramId)
  return reviewStateOf(ref.diagramId, diagram.revision, rows.map(toEntry))
}

const AUDIT_ACTION = {
  submitted: 'review.submitted',
  approved: 'review.approved',
  changes_requested: 'review.changes_requested',
} as const

async function record(
  deps: ReviewDeps,
  ref: DiagramRef,
  actorId: string,
  kind: 'submitted' | 'approved' | 'changes_requested',
  note: string,
  expectRevision?: number,
) {
  return deps.db.transaction(async (trx) => {
    const diagram = await repo.lockDiagramRevision(trx, ref.projectId, ref.diagramId)
    if (!diagram) throw notFound('No such diagram in this project')
    if (expectRevision !== undefined && expectRevision !== diagram.revision) {
      throw conflict(
        `The diagram changed since you opened it (revision ${expectRevision}, now ${diagram.revision}); ` +
          'look at the current revision before deciding',
      )
    }
    if (kind !== 'submitted') {
      const [latest] = await repo.listReviewRows(trx, ref.diagramId, 1)
      if (latest?.kind !== 'submitted')
        throw conflict('This diagram is not awaiting review; an editor submits it first')
    }
    await repo.insertReviewRow(trx, {
      project_id: ref.projectId,
      diagram_id: ref.diagramId,
      kind,
      revision: diagram.revision,
      note,
      actor_id: actorId,
    })
    await recordAudit(trx, {
      actorId,
      projectId: ref.projectId,
      action: AUDIT_ACTION[kind],
      details: {
        diagramId: ref.diagramId,
        diagramName: diagram.name,
        revision: diagram.revision,
        note,
      },
    })
    return diagram
  })
}

async function publish(deps: ReviewDeps, ref: DiagramRef) {
  const review = await getReviewState(deps.db, ref)
  deps.feed.publish({ kind: 'review', diagramId: ref.diagramId, review })
  return review
}

/** An editor (or owner) asks for review of the diagram as it is now. */
export async function submitForReview(
  deps: ReviewDeps,
  ref: DiagramRef,
  actorId: string,
  note: string,
) {
  await record(deps, ref, actorId, 'submitted', note)
  return publish(deps, ref)
}

/** A reviewer's decision on `revision`, which must still be the current one. */
export async function decide(
  deps: ReviewDeps,
  ref: DiagramRef,
  actorId: string,
  input: { decision: 'approved' | 'changes_requested'; revision: number; note: string },
) {
  const diagram = await record(deps, ref, actorId, input.decision, input.note, input.revision)
  const [editors, projectName, actor] = await Promise.all([
    repo.projectEditors(deps.db, ref.projectId),
    findProjectName(deps.db, ref.projectId),
    deps.db('users').where({ id: actorId }).first<{ name: string }>('name'),
  ])
  for (const editor of editors) {
    if (editor.id === actorId || !(await wantsEmail(deps.db, editor.id, 'reviews'))) continue
    const mail = reviewDecisionMail({
      to: editor.email,
      reviewerName: actor?.name ?? 'A reviewer',
      projectName,
      diagramName: diagram.name,
      decision: input.decision,
      revision: diagram.revision,
      note: input.note,
      link: diagramLink(deps.origin, ref),
    })
    await sendQuietly(() => deps.mailer.send(mail))
  }
  return publish(deps, ref)
}

/** For the calculation report: the review status of the reported revision. */
export async function reportReviewStatus(
  db: Db,
  ref: ReportRevisionRef,
): Promise<ReviewStatus | null> {
  const rows = await repo.listReviewRows(db, ref.diagramId)
  const state = reviewStateOf(ref.diagramId, ref.revision, rows.map(toEntry))
  const latest = state.latest
  if (!latest) return NOT_SUBMITTED
  const by = `${latest.actor?.name ?? 'Former user'}, ${latest.createdAt.slice(0, 16).replace('T', ' ')} UTC`
  const note = latest.note ? ` — ${latest.note}` : ''
  switch (state.status) {
    case 'approved':
      return state.changedSinceApproval
        ? {
            label: `Changed since approval at revision ${latest.revision}`,
            detail: `Approved by ${by}${note}`,
          }
        : { label: `Approved at revision ${latest.revision}`, detail: `By ${by}${note}` }
    case 'changes_requested':
      return {
        label: `Changes requested at revision ${latest.revision}`,
        detail: `By ${by}${note}`,
      }
    default:
      return {
        label: `Submitted for review at revision ${latest.revision}`,
        detail: `By ${by}${note}`,
      }
  }
}
