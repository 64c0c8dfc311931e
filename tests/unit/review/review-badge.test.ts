import { describe, expect, it } from 'vitest'
import { reviewBadge, reviewDecisionBodySchema } from '@shared/api/reviews'
import { describeActivity } from '@/features/team/activity-text'

const latest = (revision: number) => ({
  id: '1',
  kind: 'approved' as const,
  revision,
  note: '',
  actor: null,
  createdAt: '2026-12-02T00:00:00.000Z',
})

describe('review status wording', () => {
  it('says "approved at revision N" until the diagram changes, then "changed since approval"', () => {
    expect(reviewBadge({ status: 'approved', latest: latest(7) }, 7)).toBe('Approved at revision 7')
    expect(reviewBadge({ status: 'approved', latest: latest(7) }, 8)).toBe(
      'Changed since approval (revision 7)',
    )
    expect(reviewBadge({ status: 'not_submitted', latest: null }, 3)).toBe(
      'Not yet submitted for review',
    )
  })

  it('requires a note when changes are requested', () => {
    const parsed = reviewDecisionBodySchema.safeParse({
      decision: 'changes_requested',
      revision: 1,
      note: ' ',
    })
    expect(parsed.success).toBe(false)
    expect(parsed.error!.issues[0]!.path).toEqual(['note'])
    expect(reviewDecisionBodySchema.safeParse({ decision: 'approved', revision: 1 }).success).toBe(
      true,
    )
  })

  it('has activity sentences for submissions and decisions', () => {
    const event = (action: string, details: Record<string, unknown>) => ({
      id: '1',
      action,
      actor: { id: 'u', name: 'Casey Reviewer' },
      details,
      createdAt: '2026-12-02T00:00:00.000Z',
    })
    expect(
      describeActivity(event('review.approved', { diagramName: 'Domestic water', revision: 4 })),
    ).toBe('Casey Reviewer approved "Domestic water" at revision 4')
    expect(
      describeActivity(
        event('review.changes_requested', {
          diagramName: 'Domestic water',
          revision: 4,
          note: 'Upsize',
        }),
      ),
    ).toBe('Casey Reviewer requested changes to "Domestic water" at revision 4: "Upsize"')
    expect(
      describeActivity(event('review.submitted', { diagramName: 'Domestic water', revision: 3 })),
    ).toBe('Casey Reviewer submitted "Domestic water" for review at revision 3')
  })
})
