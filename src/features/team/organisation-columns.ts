import type { OrganisationMember, OrganisationRole } from '@shared/api/organisations'
import { NAvatar, NButton, NSelect, NTag, type DataTableColumns } from 'naive-ui'
import { h } from 'vue'
import { formatWhen } from '@/utils/format-when'
import { initialsOf } from './member-columns'

const ORG_ROLES = [
  { label: 'Admin', value: 'admin' },
  { label: 'Member', value: 'member' },
]

/** Columns of an organisation's member table; admins get a role picker and Remove. */
export function organisationColumns(o: {
  meId: string | undefined
  isAdmin: boolean
  onRole: (m: OrganisationMember, role: OrganisationRole) => void
  onRemove: (m: OrganisationMember) => void
}): DataTableColumns<OrganisationMember> {
  return [
    {
      title: 'Member',
      key: 'name',
      render: (m) =>
        h('div', { class: 'member-cell' }, [
          h(NAvatar, { round: true, size: 28, style: { backgroundColor: m.color } }, () =>
            initialsOf(m.name),
          ),
          h('div', null, [
            h('div', { class: 'member-name' }, m.name),
            h('div', { class: 'member-email' }, m.email),
          ]),
        ]),
    },
    {
      title: 'Role',
      key: 'role',
      width: 160,
      render: (m) =>
        o.isAdmin
          ? h(NSelect, {
              size: 'small',
              value: m.role,
              options: ORG_ROLES,
              onUpdateValue: (r: OrganisationRole) => o.onRole(m, r),
            })
          : h(
              NTag,
              { size: 'small', bordered: false, type: m.role === 'admin' ? 'success' : 'default' },
              () => m.role,
            ),
    },
    { title: 'Joined', key: 'joinedAt', width: 160, render: (m) => formatWhen(m.joinedAt) },
    {
      title: '',
      key: 'actions',
      width: 110,
      render: (m) =>
        o.isAdmin || m.userId === o.meId
          ? h(
              NButton,
              { size: 'small', tertiary: true, type: 'error', onClick: () => o.onRemove(m) },
              () => (m.userId === o.meId ? 'Leave' : 'Remove'),
            )
          : null,
    },
  ]
}
