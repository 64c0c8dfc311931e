import { describe, expect, it } from 'vitest'
import {
  can,
  PROJECT_ACTIONS,
  type ProjectAction,
  type ProjectRole,
} from '../../../shared/auth/roles'

// The permission matrix the server enforces; a change here is a change of product policy.
const EXPECTED: Record<ProjectRole, ProjectAction[]> = {
  owner: [...PROJECT_ACTIONS],
  editor: ['project.read', 'project.update', 'diagram.edit', 'comment.write'],
  reviewer: ['project.read', 'diagram.review', 'comment.write'],
  viewer: ['project.read'],
}

describe('project roles', () => {
  it.each(Object.entries(EXPECTED))('%s may do exactly its listed actions', (role, allowed) => {
    for (const action of PROJECT_ACTIONS) {
      expect(can(role as ProjectRole, action), action).toBe(allowed.includes(action))
    }
  })

  it('grants nothing without a role', () => {
    expect(PROJECT_ACTIONS.some((a) => can(null, a))).toBe(false)
  })
})
