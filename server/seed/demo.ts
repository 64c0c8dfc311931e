/**
 * The demo scenario (our own invention): a design firm working on Fernhollow Community Hall, a
 * fictional two-storey hall. Three people with the three working roles; Avery is the firm's admin.
 */
import { fernhollowHallDiagram } from '../../shared/demo/fernhollow-hall.ts'
import type { Db } from '../db/knex.ts'
import { recordAudit } from '../modules/audit/audit.service.ts'
import { insertDiagramRow } from '../modules/diagrams/diagrams.repo.ts'
import {
  addOrganisationMember,
  insertOrganisation,
} from '../modules/organisations/organisations.repo.ts'
import { addMember, insertProject } from '../modules/projects/projects.repo.ts'
import { insertUser } from '../modules/users/users.repo.ts'
import { hashPassword, pickColor } from '../modules/users/users.service.ts'

export const DEMO_PASSWORD = 'tributary-demo'

export const DEMO_ACCOUNTS = [
  { email: 'avery@example.test', name: 'Avery Lindqvist', role: 'owner' },
  { email: 'blake@example.test', name: 'Blake Okonkwo', role: 'editor' },
  { email: 'casey@example.test', name: 'Casey Marchetti', role: 'reviewer' },
] as const

export const DEMO_PROJECT = {
  name: 'Fernhollow Community Hall',
  description:
    'Domestic cold and hot water for a two-storey community hall: washrooms with flush valve ' +
    'batteries on both floors, a kitchenette, a janitor closet and exterior hose bibbs.',
}

/** The fictional design firm the three demo accounts work for. */
export const DEMO_ORGANISATION = 'Brackwater Building Services'

export const DEMO_DIAGRAM_NAME = 'Domestic water'

/** True when no user exists yet (the demo is only seeded into an empty database). */
export async function isEmpty(db: Db): Promise<boolean> {
  const row = await db('users').count<{ count: string }[]>('* as count').first()
  return Number(row?.count ?? 0) === 0
}

/** Inserts the demo accounts, project and riser diagram in one transaction; returns the project id. */
export async function seedDemo(db: Db): Promise<string> {
  const passwordHash = await hashPassword(DEMO_PASSWORD)
  return db.transaction(async (trx) => {
    const users = []
    for (const account of DEMO_ACCOUNTS) {
      const user = await insertUser(trx, {
        email: account.email,
        name: account.name,
        password_hash: passwordHash,
        color: pickColor(account.email),
      })
      users.push({ ...account, id: user.id })
    }
    const owner = users[0]!
    const firm = await insertOrganisation(trx, { name: DEMO_ORGANISATION, created_by: owner.id })
    for (const user of users) {
      await addOrganisationMember(trx, firm.id, user.id, user.id === owner.id ? 'admin' : 'member')
    }
    const project = await insertProject(trx, {
      ...DEMO_PROJECT,
      units: 'us',
      organisation_id: firm.id,
      created_by: owner.id,
    })
    for (const user of users) await addMember(trx, project.id, user.id, user.role)
    // As the project service records it, so the demo's activity page starts with its creation.
    await recordAudit(trx, {
      actorId: owner.id,
      projectId: project.id,
      organisationId: firm.id,
      action: 'project.created',
      details: { name: project.name },
    })
    await insertDiagramRow(trx, {
      project_id: project.id,
      name: DEMO_DIAGRAM_NAME,
      document: { ...fernhollowHallDiagram, name: DEMO_DIAGRAM_NAME },
      created_by: owner.id,
    })
    return project.id
  })
}
