import { spawn, type ChildProcess } from 'node:child_process'
import { createServer } from 'node:net'

/** A free TCP port on 127.0.0.1. */
export async function freePort(): Promise<number> {
  const server = createServer()
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve))
  const { port } = server.address() as { port: number }
  await new Promise((resolve) => server.close(resolve))
  return port
}

/** A real server process (`node --import tsx server/index.ts`) and how to reach it. */
export interface ServerProcess {
  url: string
  child: ChildProcess
  output: () => string
}

/** Starts the server as its own process and waits until /api/health answers. */
export async function startServerProcess(port: number, env: Record<string, string> = {}) {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    env: { ...process.env, NODE_ENV: 'test', HOST: '127.0.0.1', PORT: String(port), ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  })
  let output = ''
  child.stdout!.on('data', (chunk) => (output += chunk))
  child.stderr!.on('data', (chunk) => (output += chunk))
  const url = `http://127.0.0.1:${port}`
  const start = Date.now()
  for (;;) {
    if (child.exitCode !== null) throw new Error(`server exited early:\n${output}`)
    try {
      if ((await fetch(`${url}/api/health`)).ok) break
    } catch {
      // not listening yet
    }
    if (Date.now() - start > 20_000) throw new Error(`server did not start:\n${output}`)
    await new Promise((resolve) => setTimeout(resolve, 50).unref())
  }
  return { url, child, output: () => output } satisfies ServerProcess
}

/** kill -9, and wait for the process to be gone. */
export async function killHard(server: ServerProcess): Promise<void> {
  if (server.child.exitCode !== null || server.child.signalCode !== null) return
  const exited = new Promise((resolve) => server.child.once('exit', resolve))
  server.child.kill('SIGKILL')
  await exited
}
