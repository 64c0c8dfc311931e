import type { AuditEvent } from '@shared/api/audit'

const str = (v: unknown) => (typeof v === 'string' ? v : '')
const who = (d: Record<string, unknown>) => str(d.name) || str(d.email) || 'someone'
const diagram = (d: Record<string, unknown>) => `"${str(d.diagramName) || 'a diagram'}"`
const rev = (d: Record<string, unknown>) => (typeof d.revision === 'number' ? d.revision : '?')
const note = (d: Record<string, unknown>) => (str(d.note) ? `: "${str(d.note)}"` : '')

/** One readable sentence per activity entry; actions of other features fall back to their name. */
export function describeActivity(event: AuditEvent): string {
  const actor = event.actor?.name ?? 'Tributary'
  const d = event.details
  switch (event.action) {
    case 'project.created':
      return `${actor} created the project`
    case 'member.invited':
      return `${actor} invited ${str(d.email)} as ${str(d.role)}`
    case 'invitation.revoked':
      return `${actor} withdrew the invitation to ${str(d.email)}`
    case 'invitation.accepted':
      return `${actor} accepted the invitation and joined as ${str(d.role)}`
    case 'member.role_changed':
      return `${actor} changed ${who(d)} from ${str(d.from)} to ${str(d.to)}`
    case 'member.removed':
      return `${actor} removed ${who(d)} (${str(d.role)}) from the project`
    case 'member.left':
      return `${actor} left the project`
    case 'review.submitted':
      return `${actor} submitted ${diagram(d)} for review at revision ${rev(d)}`
    case 'review.approved':
      return `${actor} approved ${diagram(d)} at revision ${rev(d)}`
    case 'review.changes_requested':
      return `${actor} requested changes to ${diagram(d)} at revision ${rev(d)}${note(d)}`
    default:
      return `${actor}: ${event.action}`
  }
}
