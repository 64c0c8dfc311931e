/**
 * Project roles and what each may do. Pure: the server enforces it on every request, the client
 * reads it only to hide controls a user could not use anyway.
 */
import { z } from 'zod'

export const projectRoleSchema = z.enum(['owner', 'editor', 'reviewer', 'viewer'])
export type ProjectRole = z.infer<typeof projectRoleSchema>

export const PROJECT_ACTIONS = [
  'project.read',
  'project.update',
  'project.delete',
  'members.manage',
  'diagram.edit',
  'diagram.review',
  'comment.write',
] as const
export type ProjectAction = (typeof PROJECT_ACTIONS)[number]

const GRANTS: Record<ProjectRole, readonly ProjectAction[]> = {
  owner: PROJECT_ACTIONS,
  editor: ['project.read', 'project.update', 'diagram.edit', 'comment.write'],
  reviewer: ['project.read', 'diagram.review', 'comment.write'],
  viewer: ['project.read'],
}

/**
 * Whether a member with `role` may perform `action`.
 * @example can('viewer', 'diagram.edit') // false
 */
export function can(role: ProjectRole | null | undefined, action: ProjectAction): boolean {
  return role ? GRANTS[role].includes(action) : false
}
