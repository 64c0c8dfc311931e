import type { ProjectMember } from '@shared/api/members'
import type { ProjectRole } from '@shared/auth/roles'
import { NAvatar, NButton, NSelect, NTag, type DataTableColumns } from 'naive-ui'
import { h } from 'vue'
import RoleTag from '@/components/RoleTag.vue'
import { formatWhen } from '@/utils/format-when'
import { ROLE_OPTIONS } from './role-options'

export interface MemberColumnOptions {
  meId: string | undefined
  canManage: boolean
  onRole: (member: ProjectMember, role: ProjectRole) => void
  onRemove: (member: ProjectMember) => void
  onLeave: () => void
}

export const initialsOf = (name: string) =>
  name
    .split(/\s+/)
    .map((w) => w[0])
    .join('')
    .slice(0, 2)
    .toUpperCase()

/** Columns of the members table; owners get a role picker and a Remove button per row. */
export function memberColumns(o: MemberColumnOptions): DataTableColumns<ProjectMember> {
  return [
    {
      title: 'Member',
      key: 'name',
      render: (m) =>
        h('div', { class: 'member-cell' }, [
          h(NAvatar, { round: true, size: 30, style: { backgroundColor: m.color } }, () =>
            initialsOf(m.name),
          ),
          h('div', null, [
            h('div', { class: 'member-name' }, [
              m.name,
              m.userId === o.meId
                ? h(NTag, { size: 'tiny', bordered: false, style: 'margin-left:6px' }, () => 'you')
                : null,
            ]),
            h('div', { class: 'member-email' }, m.email),
          ]),
        ]),
    },
    {
      title: 'Role',
      key: 'role',
      width: 180,
      render: (m) =>
        o.canManage
          ? h(NSelect, {
              size: 'small',
              value: m.role,
              options: ROLE_OPTIONS,
              'data-testid': `member-role-${m.email}`,
              onUpdateValue: (role: ProjectRole) => o.onRole(m, role),
            })
          : h(RoleTag, { role: m.role }),
    },
    { title: 'Joined', key: 'joinedAt', width: 170, render: (m) => formatWhen(m.joinedAt) },
    {
      title: '',
      key: 'actions',
      width: 130,
      render: (m) => {
        if (m.userId === o.meId) {
          return h(
            NButton,
            { size: 'small', tertiary: true, 'data-testid': 'leave-project', onClick: o.onLeave },
            () => 'Leave',
          )
        }
        return o.canManage
          ? h(
              NButton,
              {
                size: 'small',
                tertiary: true,
                type: 'error',
                'data-testid': `remove-${m.email}`,
                onClick: () => o.onRemove(m),
              },
              () => 'Remove',
            )
          : null
      },
    },
  ]
}
