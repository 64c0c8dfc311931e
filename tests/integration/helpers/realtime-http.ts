import { randomUUID } from 'node:crypto'
import type { DiagramInput } from '../../../shared/document/model.ts'

export const PASSWORD = 'correct horse battery'

/** A signed-in user of a running server: its id and session cookie. */
export interface Session {
  user: { id: string; name: string; email: string }
  cookie: string
}

/** Calls the HTTP API with a session cookie; throws with the body on an unexpected status. */
export async function api<T = Record<string, unknown>>(
  url: string,
  session: Session | null,
  method: string,
  path: string,
  body?: unknown,
  expectStatus?: number,
): Promise<{ status: number; body: T }> {
  const res = await fetch(`${url}${path}`, {
    method,
    headers: {
      ...(session ? { cookie: session.cookie } : {}),
      ...(body !== undefined ? { 'content-type': 'application/json' } : {}),
    },
    body: body === undefined ? undefined : JSON.stringify(body),
  })
  const text = await res.text()
  const parsed = text ? (JSON.parse(text) as T) : ({} as T)
  if (expectStatus !== undefined && res.status !== expectStatus) {
    throw new Error(`${method} ${path}: expected ${expectStatus}, got ${res.status} ${text}`)
  }
  return { status: res.status, body: parsed }
}

/** Signs up a fresh user on a running server. */
export async function signUpAt(url: string, name: string): Promise<Session> {
  const email = `${name.split(' ')[0]!.toLowerCase()}-${randomUUID().slice(0, 8)}@example.test`
  const res = await fetch(`${url}/api/auth/sign-up`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email, name, password: PASSWORD }),
  })
  if (res.status !== 201) throw new Error(`sign-up failed: ${res.status} ${await res.text()}`)
  const cookie = res.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ')
  const { user } = (await res.json()) as { user: Session['user'] }
  return { user, cookie }
}

/** Creates a project and a diagram in it; returns their ids. */
export async function createDiagramAt(
  url: string,
  owner: Session,
  document?: DiagramInput,
): Promise<{ projectId: string; diagramId: string }> {
  const project = await api<{ project: { id: string } }>(
    url,
    owner,
    'POST',
    '/api/projects',
    {
      name: 'Riverside Clinic',
    },
    201,
  )
  const projectId = project.body.project.id
  const diagram = await api<{ diagram: { id: string } }>(
    url,
    owner,
    'POST',
    `/api/projects/${projectId}/diagrams`,
    { name: 'Domestic water', document },
    201,
  )
  return { projectId, diagramId: diagram.body.diagram.id }
}

/** Resolves when `check()` is true; rejects after `ms` with `what` in the message. */
export async function waitUntil(check: () => boolean, what: string, ms = 10_000): Promise<void> {
  const start = Date.now()
  while (!check()) {
    if (Date.now() - start > ms) throw new Error(`timed out after ${ms} ms waiting for ${what}`)
    await new Promise((resolve) => setTimeout(resolve, 5).unref())
  }
}
