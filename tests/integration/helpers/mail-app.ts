import pg from 'pg'
import supertest from 'supertest'
import { createApp } from '../../../server/app.ts'
import { readEnv } from '../../../server/config/env.ts'
import { openDb } from '../../../server/db/knex.ts'
import { startFakeSmtp, type FakeSmtp } from '../../../server/mail/fake-smtp.ts'
import { withFakeSmtp } from '../../../server/mail/mailer.ts'
import { addMember } from '../../../server/modules/projects/projects.repo.ts'
import type { ProjectRole } from '../../../shared/auth/roles.ts'
import { signUp, type TestApp } from './test-app.ts'

/** A test app whose mail goes over SMTP to a fake server on a free port, stored in PostgreSQL. */
export interface MailTestApp extends TestApp {
  smtp: FakeSmtp
  /** Messages captured for this address, newest first (waits briefly for the first one). */
  mailTo(address: string): Promise<CapturedMessage[]>
}

export interface CapturedMessage {
  subject: string
  text: string
  html: string
  recipients: string[]
  mail_from: string
  raw: string
}

export async function startMailTestApp(): Promise<MailTestApp> {
  if (!process.env.DATABASE_URL) {
    throw new Error('DATABASE_URL is not set: run integration tests through `npm test`')
  }
  const env = readEnv({
    ...process.env,
    SIGN_IN_LIMIT: '1000',
    APP_ORIGIN: 'http://tributary.test',
  })
  const db = openDb(env.DATABASE_URL)
  const pool = new pg.Pool({ connectionString: env.DATABASE_URL, max: 3 })
  const smtp = await startFakeSmtp(db, 0)
  const { app } = createApp(withFakeSmtp(env, smtp), db, pool)
  return {
    env,
    db,
    pool,
    app,
    smtp,
    mailTo: (address) =>
      db('captured_mail')
        .whereRaw('lower(?) = ANY (SELECT lower(r) FROM unnest(recipients) r)', [address])
        .orderBy('id', 'desc'),
    async close() {
      await smtp.close()
      await Promise.allSettled([db.destroy(), pool.end()])
    },
  }
}

/** The link token in a message's plain text (the part after /invitations/ or /reset-password/). */
export function linkToken(text: string, kind: 'invitations' | 'reset-password'): string {
  const match = new RegExp(`http://tributary\\.test/${kind}/([A-Za-z0-9_-]{43})`).exec(text)
  if (!match) throw new Error(`no ${kind} link in:\n${text}`)
  return match[1]!
}

/** An owner with a fresh project and one member of each other role, each on its own agent. */
export async function projectWithTeam(t: TestApp, name = 'Millbrook Library') {
  const owner = supertest.agent(t.app)
  const ownerUser = await signUp(owner, 'Orla Owner')
  const res = await owner.post('/api/projects').send({ name }).expect(201)
  const projectId = res.body.project.id as string
  const organisationId = res.body.project.organisationId as string
  const team = { owner: { agent: owner, user: ownerUser } } as Record<
    ProjectRole,
    { agent: supertest.Agent; user: { id: string; email: string; name: string } }
  >
  for (const role of ['editor', 'reviewer', 'viewer'] as const) {
    const agent = supertest.agent(t.app)
    const user = await signUp(agent, `${role[0]!.toUpperCase()}${role.slice(1)} Person`)
    await addMember(t.db, projectId, user.id, role)
    team[role] = { agent, user }
  }
  return { projectId, organisationId, team }
}
