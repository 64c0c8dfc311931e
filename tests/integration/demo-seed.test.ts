/**
 * The demo seed (`npm start` on an empty database): its people, roles, project, diagram and the
 * first line of the project's activity. Seeded inside a transaction that is rolled back, so the
 * fixed demo addresses never meet the other tests' data.
 */
import { afterAll, expect, test } from 'vitest'
import { projectActivity } from '../../server/modules/audit/audit.service.ts'
import { listMembers } from '../../server/modules/members/members.service.ts'
import { DEMO_ORGANISATION, seedDemo } from '../../server/seed/demo.ts'
import { computeDiagram } from '../../shared/calc/compute.ts'
import type { Diagram } from '../../shared/document/model.ts'
import { startTestApp } from './helpers/test-app.ts'

const t = startTestApp()
afterAll(() => t.close())

class RolledBack extends Error {}

test('seeds three people in their roles, the hall project with its diagram, and its creation in the activity', async () => {
  await t.db
    .transaction(async (trx) => {
      const projectId = await seedDemo(trx)

      const members = await listMembers(trx, projectId)
      expect(members.map((m) => [m.email, m.role]).sort()).toEqual([
        ['avery@example.test', 'owner'],
        ['blake@example.test', 'editor'],
        ['casey@example.test', 'reviewer'],
      ])
      const project = await trx('projects as p')
        .join('organisations as o', 'o.id', 'p.organisation_id')
        .where('p.id', projectId)
        .first('p.name', 'o.name as organisation')
      expect(project).toEqual({
        name: 'Fernhollow Community Hall',
        organisation: DEMO_ORGANISATION,
      })

      const diagram = await trx('diagrams').where({ project_id: projectId }).first('document')
      const result = computeDiagram(diagram.document as Diagram)
      expect(result.issues.filter((i) => i.severity === 'error')).toEqual([])

      const activity = await projectActivity(trx, projectId)
      expect(activity).toEqual([
        expect.objectContaining({
          action: 'project.created',
          actor: expect.objectContaining({ name: 'Avery Lindqvist' }),
          details: { name: 'Fernhollow Community Hall' },
        }),
      ])
      throw new RolledBack()
    })
    .catch((error: unknown) => {
      if (!(error instanceof RolledBack)) throw error
    })
})
