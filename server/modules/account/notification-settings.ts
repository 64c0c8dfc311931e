import type { NotificationKind } from '../../../shared/api/account.ts'
import type { Db } from '../../db/knex.ts'

const COLUMN: Record<NotificationKind, 'notify_mentions' | 'notify_reviews'> = {
  mentions: 'notify_mentions',
  reviews: 'notify_reviews',
}

/**
 * Whether the user wants e-mail of this kind. Features that send notification e-mail (mentions,
 * review decisions) call this first and stay silent for users who opted out.
 */
export async function wantsEmail(db: Db, userId: string, kind: NotificationKind): Promise<boolean> {
  const row = await db('users')
    .where({ id: userId })
    .first<Record<string, boolean> | undefined>(COLUMN[kind])
  return row?.[COLUMN[kind]] ?? false
}
