import type { Db } from '../../db/knex.ts'
import type { Mailer } from '../../mail/mailer.ts'
import { notFound } from '../../errors.ts'
import { findDiagramRow } from '../diagrams/diagrams.repo.ts'
import type { ReviewFeed } from './review-feed.ts'

/** What the comment and review services share. */
export interface ReviewDeps {
  db: Db
  mailer: Mailer
  /** Base address for links in e-mail. */
  origin: string
  feed: ReviewFeed
}

export interface DiagramRef {
  projectId: string
  diagramId: string
}

/** The diagram row of the project, or 404 (the route's project guard has already run). */
export async function diagramOf(db: Db, ref: DiagramRef) {
  const row = await findDiagramRow(db, ref.projectId, ref.diagramId)
  if (!row) throw notFound('No such diagram in this project')
  return row
}

export const diagramLink = (origin: string, ref: DiagramRef) =>
  `${origin}/projects/${ref.projectId}/diagrams/${ref.diagramId}`

/** Notification e-mail must never undo a committed change: failures are logged, not thrown. */
export async function sendQuietly(send: () => Promise<void>): Promise<void> {
  try {
    await send()
  } catch (err) {
    console.error('[mail] notification not sent:', (err as Error).message)
  }
}
