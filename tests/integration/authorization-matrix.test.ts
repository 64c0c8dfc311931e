/**
 * Every API route × every kind of caller → the expected status, against the real app and
 * PostgreSQL. Each request gets a fresh project, so destructive routes can be tried by everyone.
 * New routes add a row here. Columns: anonymous, outsider (other organisation), viewer,
 * reviewer, editor, owner (the owner is also the organisation's admin; the others are members).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { emptyDiagram } from '../../shared/document/model.ts'
import {
  callerInvitation,
  createPeople,
  freshWorld,
  resignIn,
  WHO,
  type People,
  type Who,
} from './helpers/authorization-world.ts'
import { startMailTestApp, type MailTestApp } from './helpers/mail-app.ts'
import { PASSWORD, uniqueEmail } from './helpers/test-app.ts'

type Method = 'get' | 'post' | 'patch' | 'put' | 'delete'
type World = Awaited<ReturnType<typeof freshWorld>> & Awaited<ReturnType<typeof callerInvitation>>
interface Row {
  route: string
  path: (w: World) => string
  body?: (w: World) => object
  /** anonymous, outsider, viewer, reviewer, editor, owner */
  expect: [number, number, number, number, number, number]
  /** The route ends or replaces the caller's session; sign in again afterwards. */
  resetsSession?: true
}

const all = (s: number): Row['expect'] => [s, s, s, s, s, s]
const signedIn = (s: number): Row['expect'] => [401, s, s, s, s, s]
const readers = (s: number): Row['expect'] => [401, 404, s, s, s, s]
const editors = (s: number): Row['expect'] => [401, 404, 403, 403, s, s]
const owners = (s: number): Row['expect'] => [401, 404, 403, 403, 403, s]
const p = (w: World) => `/api/projects/${w.projectId}`
const o = (w: World) => `/api/organisations/${w.organisationId}`
const d = (w: World) => `${p(w)}/diagrams/${w.diagramId}`
const NO_ID = '00000000-0000-4000-8000-000000000000'

const ROWS: Row[] = [
  { route: 'GET /api/health', path: () => '/api/health', expect: all(200) },
  { route: 'GET /api/nothing-here', path: () => '/api/nothing-here', expect: all(404) },
  // auth
  {
    route: 'POST /api/auth/sign-up',
    path: () => '/api/auth/sign-up',
    body: () => ({ email: uniqueEmail('m'), name: 'New', password: PASSWORD }),
    expect: all(201),
    resetsSession: true,
  },
  {
    route: 'POST /api/auth/sign-in',
    path: () => '/api/auth/sign-in',
    body: (w) => ({ email: w.actorEmail, password: PASSWORD }),
    expect: [401, 200, 200, 200, 200, 200],
    resetsSession: true,
  },
  {
    route: 'POST /api/auth/sign-out',
    path: () => '/api/auth/sign-out',
    expect: all(204),
    resetsSession: true,
  },
  { route: 'GET /api/auth/me', path: () => '/api/auth/me', expect: signedIn(200) },
  {
    route: 'POST /api/auth/password-reset/request',
    path: () => '/api/auth/password-reset/request',
    body: () => ({ email: uniqueEmail('nobody') }),
    expect: all(202),
  },
  {
    route: 'GET /api/auth/password-reset/:token',
    path: (w) => `/api/auth/password-reset/${w.resetToken}`,
    expect: all(200),
  },
  {
    route: 'POST /api/auth/password-reset/complete',
    path: () => '/api/auth/password-reset/complete',
    body: (w) => ({ token: w.resetToken, password: PASSWORD }),
    expect: all(204),
  },
  // account
  { route: 'GET /api/account', path: () => '/api/account', expect: signedIn(200) },
  {
    route: 'PATCH /api/account',
    path: () => '/api/account',
    body: () => ({ units: 'si' }),
    expect: signedIn(200),
  },
  {
    route: 'POST /api/account/password',
    path: () => '/api/account/password',
    body: () => ({ currentPassword: PASSWORD, newPassword: PASSWORD }),
    expect: signedIn(204),
  },
  // organisations
  { route: 'GET /api/organisations', path: () => '/api/organisations', expect: signedIn(200) },
  {
    route: 'POST /api/organisations',
    path: () => '/api/organisations',
    body: () => ({ name: 'Matrix Firm' }),
    expect: signedIn(201),
  },
  { route: 'GET /api/organisations/:id', path: o, expect: readers(200) },
  {
    route: 'GET /api/organisations/:id/members',
    path: (w) => `${o(w)}/members`,
    expect: readers(200),
  },
  {
    route: 'POST /api/organisations/:id/members',
    path: (w) => `${o(w)}/members`,
    body: (w) => ({ email: w.guestEmail }),
    expect: owners(201),
  },
  {
    route: 'PATCH /api/organisations/:id/members/:userId',
    path: (w) => `${o(w)}/members/${w.spareId}`,
    body: () => ({ role: 'admin' }),
    expect: owners(200),
  },
  {
    route: 'DELETE /api/organisations/:id/members/:userId',
    path: (w) => `${o(w)}/members/${w.spareId}`,
    expect: owners(204),
  },
  // invitation links (the invitation is addressed to the caller)
  {
    route: 'GET /api/invitations/:token',
    path: (w) => `/api/invitations/${w.inviteToken}`,
    expect: all(200),
  },
  {
    route: 'POST /api/invitations/accept',
    path: () => '/api/invitations/accept',
    body: (w) => ({ token: w.inviteToken }),
    expect: signedIn(200),
  },
  {
    route: 'POST /api/invitations/sign-up',
    path: () => '/api/invitations/sign-up',
    body: (w) => ({ token: w.inviteToken, name: 'Joiner', password: PASSWORD }),
    expect: [201, 409, 409, 409, 409, 409],
    resetsSession: true,
  },
  // projects
  { route: 'GET /api/projects', path: () => '/api/projects', expect: signedIn(200) },
  {
    route: 'POST /api/projects',
    path: () => '/api/projects',
    body: () => ({ name: 'Matrix Annex' }),
    expect: signedIn(201),
  },
  { route: 'GET /api/projects/:id', path: p, expect: readers(200) },
  {
    route: 'PATCH /api/projects/:id',
    path: p,
    body: () => ({ description: 'changed' }),
    expect: editors(200),
  },
  { route: 'DELETE /api/projects/:id', path: p, expect: owners(204) },
  // diagrams
  {
    route: 'GET /api/projects/:id/diagrams',
    path: (w) => `${p(w)}/diagrams`,
    expect: readers(200),
  },
  {
    route: 'POST /api/projects/:id/diagrams',
    path: (w) => `${p(w)}/diagrams`,
    body: () => ({ name: 'Hot water' }),
    expect: editors(201),
  },
  { route: 'GET /api/projects/:id/diagrams/:diagramId', path: d, expect: readers(200) },
  {
    route: 'PUT /api/projects/:id/diagrams/:diagramId/document',
    path: (w) => `${d(w)}/document`,
    body: () => ({ baseRevision: 0, document: { ...emptyDiagram(), name: 'Cold water' } }),
    expect: editors(200),
  },
  {
    route: 'PATCH /api/projects/:id/diagrams/:diagramId',
    path: d,
    body: () => ({ name: 'Renamed' }),
    expect: editors(200),
  },
  {
    route: 'POST /api/projects/:id/diagrams/:diagramId/duplicate',
    path: (w) => `${d(w)}/duplicate`,
    expect: editors(201),
  },
  { route: 'DELETE /api/projects/:id/diagrams/:diagramId', path: d, expect: editors(204) },
  // members
  { route: 'GET /api/projects/:id/members', path: (w) => `${p(w)}/members`, expect: readers(200) },
  {
    route: 'PATCH /api/projects/:id/members/:userId',
    path: (w) => `${p(w)}/members/${w.spareId}`,
    body: () => ({ role: 'editor' }),
    expect: owners(200),
  },
  {
    route: 'DELETE /api/projects/:id/members/:userId',
    path: (w) => `${p(w)}/members/${w.spareId}`,
    expect: owners(204),
  },
  // the last owner may not leave
  {
    route: 'DELETE /api/projects/:id/members/me',
    path: (w) => `${p(w)}/members/me`,
    expect: [401, 404, 204, 204, 204, 409],
  },
  // invitations of a project
  {
    route: 'GET /api/projects/:id/invitations',
    path: (w) => `${p(w)}/invitations`,
    expect: owners(200),
  },
  {
    route: 'POST /api/projects/:id/invitations',
    path: (w) => `${p(w)}/invitations`,
    body: () => ({ email: uniqueEmail('inv'), role: 'viewer' }),
    expect: owners(201),
  },
  {
    route: 'DELETE /api/projects/:id/invitations/:invitationId',
    path: (w) => `${p(w)}/invitations/${w.invitationId}`,
    expect: owners(204),
  },
  // activity log
  {
    route: 'GET /api/projects/:id/activity',
    path: (w) => `${p(w)}/activity`,
    expect: readers(200),
  },
  // comments and review (the matrix diagram is empty: a new thread has no node to pin to, so
  // callers who may comment get 400; an unknown thread is 404 once the role check has passed)
  {
    route: 'GET /api/projects/:id/diagrams/:diagramId/comments',
    path: (w) => `${d(w)}/comments`,
    expect: readers(200),
  },
  {
    route: 'POST /api/projects/:id/diagrams/:diagramId/comments',
    path: (w) => `${d(w)}/comments`,
    body: () => ({ target: { kind: 'node', id: 'n-missing' }, body: 'Check this' }),
    expect: [401, 404, 403, 400, 400, 400],
  },
  {
    route: 'POST /api/projects/:id/diagrams/:diagramId/comments/:threadId/replies',
    path: (w) => `${d(w)}/comments/${NO_ID}/replies`,
    body: () => ({ body: 'Agreed' }),
    expect: [401, 404, 403, 404, 404, 404],
  },
  {
    route: 'PATCH /api/projects/:id/diagrams/:diagramId/comments/:threadId',
    path: (w) => `${d(w)}/comments/${NO_ID}`,
    body: () => ({ resolved: true }),
    expect: [401, 404, 403, 404, 404, 404],
  },
  {
    route: 'POST /api/projects/:id/diagrams/:diagramId/comments/:threadId/attachments',
    path: (w) => `${d(w)}/comments/${NO_ID}/attachments`,
    expect: [401, 404, 403, 404, 404, 404],
  },
  {
    route: 'GET /api/projects/:id/attachments/:attachmentId',
    path: (w) => `${p(w)}/attachments/${NO_ID}`,
    expect: [401, 404, 404, 404, 404, 404],
  },
  {
    route: 'GET /api/projects/:id/diagrams/:diagramId/review',
    path: (w) => `${d(w)}/review`,
    expect: readers(200),
  },
  {
    route: 'POST /api/projects/:id/diagrams/:diagramId/review/submissions',
    path: (w) => `${d(w)}/review/submissions`,
    body: () => ({ note: 'Ready for review' }),
    expect: editors(201),
  },
  // Nothing has been submitted in a fresh world: whoever may decide hears 409.
  {
    route: 'POST /api/projects/:id/diagrams/:diagramId/review/decisions',
    path: (w) => `${d(w)}/review/decisions`,
    body: () => ({ decision: 'approved', revision: 0 }),
    expect: [401, 404, 403, 409, 403, 409],
  },
  // development mailbox (every self-made account administers its own practice)
  { route: 'GET /api/dev/mail/access', path: () => '/api/dev/mail/access', expect: signedIn(200) },
  { route: 'GET /api/dev/mail', path: () => '/api/dev/mail', expect: signedIn(200) },
]

let t: MailTestApp
let people: People
beforeAll(async () => {
  t = await startMailTestApp()
  people = await createPeople(t)
})
afterAll(() => t.close())

describe('authorization matrix', () => {
  it.each(ROWS)('$route', async (row) => {
    const method = row.route.split(' ')[0]!.toLowerCase() as Method
    const seen: Record<string, number> = {}
    const wanted: Record<string, number> = {}
    let base: Awaited<ReturnType<typeof freshWorld>> | null = null
    for (const [i, who] of WHO.entries()) {
      base ??= await freshWorld(t, people)
      const world = { ...base, ...(await callerInvitation(t, people, base.projectId, who)) }
      const req = people.agents[who][method](row.path(world))
      const res = row.body ? await req.send(row.body(world)) : await req
      seen[who] = res.status
      wanted[who] = row.expect[i]!
      // A successful change may have used up or destroyed the world: make a new one.
      if (method !== 'get' && res.status < 400) base = null
      if (row.resetsSession) await resignIn(people, who as Who)
    }
    expect(seen).toEqual(wanted)
  })
})
