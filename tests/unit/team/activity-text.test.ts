import type { AuditEvent } from '@shared/api/audit'
import { describe, expect, it } from 'vitest'
import { describeActivity } from '@/features/team/activity-text'

const event = (action: string, details: Record<string, unknown> = {}): AuditEvent => ({
  id: '1',
  action,
  actor: { id: 'u1', name: 'Avery Lindqvist' },
  details,
  createdAt: '2026-12-02T10:00:00Z',
})

describe('activity sentences', () => {
  it.each([
    [event('project.created'), 'Avery Lindqvist created the project'],
    [
      event('member.invited', { email: 'r@example.test', role: 'reviewer' }),
      'Avery Lindqvist invited r@example.test as reviewer',
    ],
    [
      event('invitation.revoked', { email: 'r@example.test' }),
      'Avery Lindqvist withdrew the invitation to r@example.test',
    ],
    [
      event('invitation.accepted', { role: 'viewer' }),
      'Avery Lindqvist accepted the invitation and joined as viewer',
    ],
    [
      event('member.role_changed', { name: 'Blake Okonkwo', from: 'editor', to: 'owner' }),
      'Avery Lindqvist changed Blake Okonkwo from editor to owner',
    ],
    [
      event('member.removed', { email: 'c@example.test', role: 'viewer' }),
      'Avery Lindqvist removed c@example.test (viewer) from the project',
    ],
    [event('member.left'), 'Avery Lindqvist left the project'],
    [event('review.decided'), 'Avery Lindqvist: review.decided'],
  ])('%#: %s', (e, sentence) => {
    expect(describeActivity(e)).toBe(sentence)
  })

  it('names the system when nobody is recorded as actor', () => {
    expect(describeActivity({ ...event('member.left'), actor: null })).toBe(
      'Tributary left the project',
    )
  })
})
