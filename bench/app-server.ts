/**
 * What the Chromium benchmarks share: a Tributary server process on its own port, and the API
 * calls that set up a signed-in owner with a project of their own.
 */
import { spawn, type ChildProcess } from 'node:child_process'

export interface AppServer {
  base: string
  process: ChildProcess
  /** Calls the API with the session cookie; throws with the status and body on failure. */
  api(path: string, cookie: string, body?: unknown, method?: string): Promise<Response>
  /** Signs up a new account with a project; returns its session cookie and the project id. */
  ownerWithProject(name: string): Promise<{ cookie: string; projectId: string }>
}

/** Starts `server/index.ts` on `port` against `databaseUrl` and waits until it answers. */
export async function startAppServer(port: number, databaseUrl: string): Promise<AppServer> {
  const base = `http://127.0.0.1:${port}`
  const child = spawn('node', ['--import', 'tsx', 'server/index.ts'], {
    env: {
      ...process.env,
      PORT: String(port),
      DATABASE_URL: databaseUrl,
      NODE_ENV: 'test',
      SIGN_IN_LIMIT: '1000',
    },
    stdio: 'ignore',
  })
  const api = async (path: string, cookie: string, body?: unknown, method = 'POST') => {
    const res = await fetch(`${base}/api${path}`, {
      method,
      headers: { 'Content-Type': 'application/json', cookie },
      body: body === undefined ? undefined : JSON.stringify(body),
    })
    if (!res.ok) throw new Error(`${method} ${path}: ${res.status} ${await res.text()}`)
    return res
  }
  const healthy = () =>
    fetch(`${base}/api/health`).then(
      (r) => r.ok,
      () => false,
    )
  for (let i = 0; !(await healthy()); i++) {
    if (i === 100) {
      child.kill()
      throw new Error(`the server did not start on port ${port}`)
    }
    await new Promise((r) => setTimeout(r, 200))
  }
  return {
    base,
    process: child,
    api,
    async ownerWithProject(name) {
      const signUp = await api('/auth/sign-up', '', {
        email: `bench-${Date.now()}@example.test`,
        name: 'Bench Runner',
        password: 'bench-password-1',
      })
      const cookie = signUp.headers.get('set-cookie')!.split(';')[0]!
      const projectId = (await (await api('/projects', cookie, { name })).json()).project.id
      return { cookie, projectId }
    },
  }
}
