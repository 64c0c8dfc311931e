/**
 * The client side of `npm run bench:sync`, run as a process of its own (as browsers are never
 * inside the server): 5 clients on the bare relay and 5 on Tributary measure edit → peer latency
 * with edits alternating between the two, then the Tributary clients pipeline edits for the
 * throughput figure. Started by sync.bench.ts with a JSON argument; answers over IPC.
 */
import { io as connect, type Socket } from 'socket.io-client'
import { EVENTS } from '../shared/protocol/events.ts'
import { waitUntil } from '../tests/integration/helpers/realtime-http.ts'
import { openSocket, type ClientSocket } from '../tests/integration/helpers/realtime-sync-client.ts'

export interface SyncBenchSetup {
  relayUrl: string
  url: string
  cookie: string
  diagramId: string
  clients: number
  edits: number
  throughputMs: number
  /** Edits in flight per client in the throughput run. */
  window: number
}

export interface SyncBenchResult {
  relayLatency: number[]
  latency: number[]
  acked: number
  rejected: number
  seconds: number
  firstRefusal: string | null
}

interface Peers {
  emit: (i: number, id: string) => void
  onReceive: (cb: (id: string) => void) => void
}

/** `promise`, or a clear error after 10 s. */
function withTimeout<T>(promise: Promise<T>, what: string): Promise<T> {
  let timer: NodeJS.Timeout | undefined
  const timeout = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error(`timed out after 10 s waiting for ${what}`)), 10_000)
  })
  return Promise.race([promise, timeout]).finally(() => clearTimeout(timer))
}

/**
 * Sends `edits` messages one at a time from rotating senders, alternating between the two sets
 * of clients so that both meet the same machine at the same moments (a busy neighbour, a slow
 * disk flush); returns every peer's receipt delay for each set.
 */
async function measure(setup: SyncBenchSetup, relay: Peers[], tributary: Peers[]) {
  const { clients: n, edits } = setup
  const sentAt = new Map<string, number>()
  const received = new Map<string, number>()
  const samples: [number[], number[]] = [[], []]
  let reachedAll: (() => void) | null = null
  ;[relay, tributary].forEach((clients, k) => {
    for (const c of clients) {
      c.onReceive((id) => {
        const t = sentAt.get(id)
        if (t === undefined) return
        samples[k]!.push(performance.now() - t)
        const count = (received.get(id) ?? 0) + 1
        received.set(id, count)
        if (count === n - 1) reachedAll?.()
      })
    }
  })
  for (let i = 0; i < 2 * edits; i++) {
    const clients = i % 2 === 0 ? relay : tributary
    const id = crypto.randomUUID()
    const reached = new Promise<void>((resolve) => (reachedAll = resolve))
    sentAt.set(id, performance.now())
    clients[(i >> 1) % n]!.emit(i >> 1, id)
    await withTimeout(reached, `edit ${i} to reach every peer`)
  }
  return samples
}

async function relayPeers(setup: SyncBenchSetup): Promise<{ peers: Peers[]; sockets: Socket[] }> {
  const sockets: Socket[] = []
  for (let i = 0; i < setup.clients; i++) {
    sockets.push(connect(setup.relayUrl, { transports: ['websocket'] }))
  }
  await waitUntil(() => sockets.every((s) => s.connected), 'relay clients')
  // The same message as a Tributary edit, so both carry the same bytes.
  const payload = (i: number, id: string) => ({
    diagramId: setup.diagramId,
    clientOpId: id,
    baseRevision: i,
    op: { type: 'node.move', id: 'J2', position: { x: i, y: i } },
  })
  const peers: Peers[] = sockets.map((s) => ({
    emit: (i, id) => s.emit('relay', payload(i, id)),
    onReceive: (cb) => s.on('relay', (m: { clientOpId: string }) => cb(m.clientOpId)),
  }))
  return { peers, sockets }
}

async function tributarySockets(setup: SyncBenchSetup): Promise<ClientSocket[]> {
  const sockets: ClientSocket[] = []
  let joined = 0
  for (let i = 0; i < setup.clients; i++) {
    const s = openSocket(setup.url, setup.cookie)
    s.on(EVENTS.diagramSnapshot, () => joined++)
    s.on('connect', () => s.emit(EVENTS.diagramJoin, { diagramId: setup.diagramId }))
    sockets.push(s)
  }
  await waitUntil(() => joined === setup.clients, 'clients to join')
  return sockets
}

async function run(setup: SyncBenchSetup): Promise<SyncBenchResult> {
  const relay = await relayPeers(setup)
  const sockets = await tributarySockets(setup)
  const submit = (s: ClientSocket, i: number, id: string) =>
    s.emit(EVENTS.opSubmit, {
      diagramId: setup.diagramId,
      clientOpId: id,
      baseRevision: 0,
      op: { type: 'node.move', id: 'J2', position: { x: i, y: i } },
    })
  const [relayLatency, latency] = await measure(
    setup,
    relay.peers,
    sockets.map((s) => ({
      emit: (i, id) => submit(s, i, id),
      onReceive: (cb) => s.on(EVENTS.opApplied, (m) => cb(m.clientOpId)),
    })),
  )
  for (const s of relay.sockets) s.close()

  // Throughput: every client keeps `window` edits in flight for `throughputMs`.
  let acked = 0
  let rejected = 0
  let firstRefusal: string | null = null
  let running = true
  let n = 0
  for (const s of sockets) {
    s.on(EVENTS.opAck, () => {
      acked++
      if (running) submit(s, n++, crypto.randomUUID())
    })
    s.on(EVENTS.opReject, (m) => {
      rejected++
      firstRefusal ??= m.reason
      // A refused edit leaves the window too; keep `window` in flight.
      if (running) submit(s, n++, crypto.randomUUID())
    })
  }
  const start = performance.now()
  for (const s of sockets)
    for (let i = 0; i < setup.window; i++) submit(s, n++, crypto.randomUUID())
  await new Promise((resolve) => setTimeout(resolve, setup.throughputMs))
  running = false
  const seconds = (performance.now() - start) / 1000
  for (const s of sockets) s.close()
  return { relayLatency, latency, acked, rejected, seconds, firstRefusal }
}

const setup = JSON.parse(process.argv[2] ?? '{}') as SyncBenchSetup
run(setup).then(
  (result) => process.send!(result, () => process.exit(0)),
  (error: unknown) => {
    console.error(error)
    process.exit(1)
  },
)
