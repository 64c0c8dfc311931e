import type { ProjectRole } from '@shared/auth/roles'

/** What each project role means, in the words shown beside the role pickers. */
export const ROLE_MEANING: Record<ProjectRole, string> = {
  owner: 'manages the project and its members',
  editor: 'draws and changes the riser diagrams',
  reviewer: 'checks diagrams and records review comments',
  viewer: 'looks at diagrams and results',
}

export const ROLE_OPTIONS = (['owner', 'editor', 'reviewer', 'viewer'] as const).map((role) => ({
  label: role[0]!.toUpperCase() + role.slice(1),
  value: role,
}))
