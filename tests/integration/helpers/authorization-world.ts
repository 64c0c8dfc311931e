import supertest from 'supertest'
import { insertPasswordReset } from '../../../server/auth/password-reset.repo.ts'
import { insertDiagramRow } from '../../../server/modules/diagrams/diagrams.repo.ts'
import { insertInvitation } from '../../../server/modules/invitations/invitations.repo.ts'
import { newToken } from '../../../server/modules/account/one-time-token.ts'
import { addOrganisationMember } from '../../../server/modules/organisations/organisations.repo.ts'
import { addMember, insertProject } from '../../../server/modules/projects/projects.repo.ts'
import { emptyDiagram } from '../../../shared/document/model.ts'
import { PASSWORD, signUp, type TestApp } from './test-app.ts'

/** The callers of the matrix: nobody, someone from another firm, and each project role. */
export const WHO = ['anonymous', 'outsider', 'viewer', 'reviewer', 'editor', 'owner'] as const
export type Who = (typeof WHO)[number]
type Person = { id: string; email: string; name: string }

export interface People {
  agents: Record<Who, supertest.Agent>
  users: Record<Exclude<Who, 'anonymous'>, Person>
  /** A plain member of the firm and of each fresh project (the target of role changes). */
  spare: Person
  /** Has an account but is not in the firm (the target of "add to organisation"). */
  guest: Person
  organisationId: string
  app: TestApp['app']
}

/** Signs everyone up once: the owner is the firm's admin, the other roles are its members. */
export async function createPeople(t: TestApp): Promise<People> {
  const agents = { anonymous: supertest.agent(t.app) } as Record<Who, supertest.Agent>
  const users = {} as People['users']
  for (const who of WHO.slice(1) as Exclude<Who, 'anonymous'>[]) {
    agents[who] = supertest.agent(t.app)
    users[who] = await signUp(agents[who], `${who} Matrix`)
  }
  const spare = await signUp(supertest.agent(t.app), 'Spare Matrix')
  const guest = await signUp(supertest.agent(t.app), 'Guest Matrix')
  const [firm] = await t
    .db('organisation_members')
    .where({ user_id: users.owner.id, role: 'admin' })
  for (const who of ['viewer', 'reviewer', 'editor'] as const) {
    await addOrganisationMember(t.db, firm.organisation_id, users[who].id, 'member')
  }
  return { agents, users, spare, guest, organisationId: firm.organisation_id, app: t.app }
}

/** Signs the agent in again after a route ended or replaced its session. */
export async function resignIn(people: People, who: Who) {
  if (who === 'anonymous') {
    people.agents.anonymous = supertest.agent(people.app)
    return
  }
  await people.agents[who]
    .post('/api/auth/sign-in')
    .send({ email: people.users[who].email, password: PASSWORD })
    .expect(200)
}

export interface World {
  projectId: string
  organisationId: string
  diagramId: string
  invitationId: string
  /** Link tokens made for this request. */
  inviteToken: string
  resetToken: string
  spareId: string
  guestEmail: string
  actorEmail: string
}

/**
 * A fresh project (with a diagram, a pending invitation and a reset link) whenever the previous
 * request may have changed something, so any route may destroy what it is given.
 */
export async function freshWorld(
  t: TestApp,
  people: People,
): Promise<Omit<World, 'inviteToken' | 'actorEmail'>> {
  const { users, spare, guest, organisationId } = people
  const firm = t.db('organisation_members').where({ organisation_id: organisationId })
  await firm.clone().whereIn('user_id', [users.outsider.id, guest.id]).delete()
  await addOrganisationMember(t.db, organisationId, spare.id, 'member')
  await firm.clone().where({ user_id: spare.id }).update({ role: 'member' })
  const project = await insertProject(t.db, {
    name: 'Matrix Works',
    description: '',
    units: 'si',
    organisation_id: organisationId,
    created_by: users.owner.id,
  })
  for (const role of ['owner', 'editor', 'reviewer', 'viewer'] as const) {
    await addMember(t.db, project.id, users[role].id, role)
  }
  await addMember(t.db, project.id, spare.id, 'viewer')
  const diagramId = await insertDiagramRow(t.db, {
    project_id: project.id,
    name: 'Cold water',
    document: { ...emptyDiagram(), name: 'Cold water' },
    created_by: users.owner.id,
  })
  const invitation = await insertInvitation(t.db, {
    project_id: project.id,
    email: guest.email,
    role: 'viewer',
    token_hash: newToken().hash,
    invited_by: users.owner.id,
    expires_at: new Date(Date.now() + 3_600_000),
  })
  const reset = newToken()
  await insertPasswordReset(t.db, {
    user_id: spare.id,
    token_hash: reset.hash,
    expires_at: new Date(Date.now() + 3_600_000),
  })
  return {
    projectId: project.id,
    organisationId,
    diagramId,
    invitationId: invitation.id,
    resetToken: reset.token,
    spareId: spare.id,
    guestEmail: guest.email,
  }
}

/** An invitation to the world's project addressed to the caller (a new address for anonymous). */
export async function callerInvitation(t: TestApp, people: People, projectId: string, who: Who) {
  const actorEmail =
    who === 'anonymous'
      ? `anon-${newToken().hash.slice(0, 10)}@example.test`
      : people.users[who].email
  const invite = newToken()
  await insertInvitation(t.db, {
    project_id: projectId,
    email: actorEmail,
    role: 'viewer',
    token_hash: invite.hash,
    invited_by: people.users.owner.id,
    expires_at: new Date(Date.now() + 3_600_000),
  })
  return { inviteToken: invite.token, actorEmail }
}
