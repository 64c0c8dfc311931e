/**
 * Co-editing benchmark (`npm run bench:sync`). In one run, on this machine:
 * 1. edit → peer latency with 5 clients on one diagram through Tributary (validate, decide,
 *    append to the op log and commit, then broadcast), beside 5 clients on a bare socket.io
 *    relay that forwards a message of the same size without doing anything; edits alternate
 *    between the two, so both meet the same moments of a shared machine;
 * 2. acknowledged edits per second with 5 clients pipelining edits to one diagram.
 * This process runs the two servers; the clients run in a process of their own
 * (sync-clients.ts), as browsers do, so the servers' time is not shared with the clients'.
 * Uses the private PostgreSQL (started here, fsync on: every ack waits for a WAL flush) and its
 * own database, tributary_bench, made afresh each run.
 * Targets: p99 ≤ 3 × the bare relay's p99; ≥ 2,000 acknowledged edits/s.
 */
import { execSync, fork } from 'node:child_process'
import { createServer } from 'node:http'
import type { AddressInfo } from 'node:net'
import { Server } from 'socket.io'
import { createDiagramAt, signUpAt } from '../tests/integration/helpers/realtime-http.ts'
import { seedDiagram } from '../tests/integration/helpers/realtime-random.ts'
import { startRealtimeServer } from '../tests/integration/helpers/realtime-server.ts'
import type { SyncBenchResult, SyncBenchSetup } from './sync-clients.ts'

const CLIENTS = 5
const WINDOW = 64 // edits in flight per client in the throughput run
// Per-socket limit for this run. The default (REALTIME_RATE 200/s, burst 400) caps 5 clients at
// 1,000 edits/s, below the target; 2,500/s per socket lets the server, not the limiter, set the
// pace and is still a limit a runaway client hits.
const RATE = process.env.BENCH_RATE ?? '2500'
const PGPORT = process.env.PGPORT ?? '54329'
process.env.DATABASE_URL ??= `postgres://postgres@127.0.0.1:${PGPORT}/tributary_bench`
const sh = (cmd: string) => execSync(cmd, { stdio: 'inherit' })

const quantile = (values: number[], p: number) => {
  const s = [...values].sort((a, b) => a - b)
  return s[Math.min(s.length - 1, Math.floor(p * s.length))] ?? 0
}

/** A socket.io server that forwards each message to every other client and does nothing else. */
async function bareRelay() {
  const http = createServer()
  const io = new Server(http)
  io.on('connection', (s) => s.on('relay', (m: unknown) => s.broadcast.emit('relay', m)))
  await new Promise<void>((resolve) => http.listen(0, '127.0.0.1', resolve))
  return {
    url: `http://127.0.0.1:${(http.address() as AddressInfo).port}`,
    close: () => io.close(),
  }
}

/** Runs the client process and waits for its answer. */
function runClients(setup: SyncBenchSetup): Promise<SyncBenchResult> {
  const child = fork(new URL('./sync-clients.ts', import.meta.url), [JSON.stringify(setup)], {
    execArgv: ['--import', 'tsx'],
  })
  return new Promise((resolve, reject) => {
    child.on('message', (result) => resolve(result as SyncBenchResult))
    child.on('exit', (code) =>
      reject(new Error(`the client process ended (exit ${code}) without an answer`)),
    )
  })
}

sh('bash scripts/pg.sh start')
sh('bash scripts/pg.sh fresh-db tributary_bench') // nothing left from earlier runs
sh('node --import tsx scripts/migrate.ts')
const relayServer = await bareRelay()
const srv = await startRealtimeServer({ REALTIME_RATE: RATE, REALTIME_BURST: RATE })
const owner = await signUpAt(srv.url, 'Bench Owner')
const { diagramId } = await createDiagramAt(srv.url, owner, seedDiagram())
const result = await runClients({
  relayUrl: relayServer.url,
  url: srv.url,
  cookie: owner.cookie,
  diagramId,
  clients: CLIENTS,
  edits: Number(process.env.BENCH_EDITS ?? 1000),
  throughputMs: Number(process.env.BENCH_MS ?? 4000),
  window: WINDOW,
})
await srv.close()
await relayServer.close()

const { relayLatency, latency } = result
const row = (name: string, s: number[]) =>
  `${name.padEnd(22)} ${quantile(s, 0.5).toFixed(2).padStart(8)} ${quantile(s, 0.99).toFixed(2).padStart(8)} ${String(s.length).padStart(8)}`
console.log(
  `\nEdit → peer latency, ${CLIENTS} clients, ${latency.length / (CLIENTS - 1)} edits (ms)`,
)
console.log(`${''.padEnd(22)} ${'p50'.padStart(8)} ${'p99'.padStart(8)} ${'samples'.padStart(8)}`)
console.log(row('bare socket.io relay', relayLatency))
console.log(row('Tributary (committed)', latency))
const ratio = quantile(latency, 0.99) / quantile(relayLatency, 0.99)
console.log(
  `\np99 ratio ${ratio.toFixed(2)} × the bare relay (target ≤ 3×): ${ratio <= 3 ? 'met' : 'NOT met'}`,
)
const perSecond = result.acked / result.seconds
console.log(
  `Acknowledged edits/s, ${CLIENTS} clients pipelining ${WINDOW} each on one diagram: ` +
    `${Math.round(perSecond)} (${result.acked} in ${result.seconds.toFixed(1)} s, ${result.rejected} refused; ` +
    `target ≥ 2,000): ${perSecond >= 2000 ? 'met' : 'NOT met'}`,
)
if (result.firstRefusal) console.error('first refusal:', result.firstRefusal)
console.log(
  `(per-socket rate limit for this run: ${RATE} messages/s, burst ${RATE}; default 200/s, burst 400)`,
)
process.exit(0)
