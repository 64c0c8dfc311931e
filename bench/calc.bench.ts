/**
 * Calculation benchmark: `npm run bench`. On generated riser trees of 1,000, 10,000 and 100,000
 * nodes it times (medians):
 * - floor: a typed-array post-order sum of one load per pipe over the same pipe tree (floorPass);
 * - full/floor: floor and full recompute are timed in alternation, the ratio is the median of
 *   the pairs' ratios (a busy machine slows both, though not always alike: README);
 * - compile: validation, graph compile (pre-order renumbering) and reading every node and pipe
 *   into the engine's arrays — what a new document costs before any number is computed;
 * - full recompute: sums, sizes, pressures and the budget check on the compiled state (after a
 *   warm-up, as in the editor, which recomputes on every edit);
 * - computeDiagram: validation + compile + recompute + the full result objects;
 * - incremental: one fixture count edit through the live calculation.
 * Targets (issue #3): incremental at 10,000 nodes ≤ 50 µs; full recompute ≤ 10× the floor.
 * Runs under `node --import tsx` (npm run bench). The hot loops are plain for-loops over typed
 * arrays with no closures, so tsx's function-naming wrapper does not touch them. Like the editor
 * after its first calculation, the timed full recomputes find the engine's demand memo
 * (shared/calc/demand-memo.ts) filled: every pipe is still summed, sized and pressured.
 */
import { computeDiagram } from '../shared/calc/compute.ts'
import { Engine } from '../shared/calc/engine.ts'
import { createLiveCalculation } from '../shared/calc/incremental.ts'
import { riserTreeDiagram } from '../shared/demo/riser-tree.ts'
import type { Diagram } from '../shared/document/model.ts'

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b)
  return s[s.length >> 1]!
}

// Runs `fn` until it has had 300 ms or 400 calls to warm up (the editor recomputes on every
// edit, so the steady state is what users meet), then times `reps` calls.
function time(fn: () => void, reps: number): number {
  const until = performance.now() + 300
  for (let i = 0; i < 400 && performance.now() < until; i++) fn()
  const xs: number[] = []
  for (let i = 0; i < reps; i++) {
    const t = performance.now()
    fn()
    xs.push(performance.now() - t)
  }
  return median(xs)
}

/**
 * Times the floor and the engine's full recompute in alternation, so that both meet the same
 * machine (a shared or throttled processor slows both alike): each pair is one recompute and
 * `batch` floor passes. Returns the medians and the median of the pairs' ratios.
 */
function paired(tree: FloorTree, engine: Engine, pairs: number, batch: number) {
  const until = performance.now() + 300
  for (let i = 0; i < 400 && performance.now() < until; i++) {
    floorPass(tree)
    engine.recomputeAll()
  }
  const floors: number[] = []
  const fulls: number[] = []
  const ratios: number[] = []
  for (let i = 0; i < pairs; i++) {
    let t = performance.now()
    for (let b = 0; b < batch; b++) floorPass(tree)
    const f = (performance.now() - t) / batch
    t = performance.now()
    engine.recomputeAll()
    const u = performance.now() - t
    floors.push(f)
    fulls.push(u)
    ratios.push(u / f)
  }
  return { floorMs: median(floors), fullMs: median(fulls), ratio: median(ratios) }
}

/** The floor's tree: pipes in pre-order, each one's parent position and its own load. */
interface FloorTree {
  parPos: Int32Array
  own: Float64Array
  sum: Float64Array
}

/**
 * One floor pass: every pipe's own load, then one reverse pass adding each pipe's sum to its
 * parent's. A function over the arrays it is handed, as the engine's passes read the arrays of
 * the document they serve. (Written as a closure over its own arrays, the floor of the first
 * tree was compiled with them folded into the machine code as constants — V8 does so for the only
 * closure of a function — which code serving more than one document never is: at 1,000 nodes
 * that loop ran in 1.5 µs against 2.5 µs here, while the 10,000 and 100,000 node floors, later
 * closures, were never folded and ran slower than here.)
 */
function floorPass(t: FloorTree): number {
  const { parPos, sum } = t
  sum.set(t.own)
  for (let k = sum.length - 1; k > 0; k--) sum[parPos[k]!]! += sum[k]!
  return sum[0]!
}

/**
 * The floor's tree: the same pipe tree the engine sizes, one load per pipe (each fixture's inlet
 * pipes carry 1.4 WSFU), parent links in pre-order. A pipe's parent is the inlet of the node it
 * leaves; a water heater's hot outlets hang from its cold inlet. (The nodes are no tree: a
 * fixture with cold and hot inlets has two parents.)
 */
function floorTree(doc: Diagram): FloorTree {
  const fixtures = new Set(doc.nodes.filter((n) => n.kind === 'fixture').map((n) => n.id))
  const inlet = new Map(doc.pipes.map((p, i) => [`${p.to} ${p.system}`, i]))
  const parent = doc.pipes.map(
    (p) => inlet.get(`${p.from} ${p.system}`) ?? inlet.get(`${p.from} cold`) ?? -1,
  )
  const kids: number[][] = doc.pipes.map(() => [])
  parent.forEach((p, i) => p >= 0 && kids[p]!.push(i))
  const order: number[] = []
  const stack = parent.flatMap((p, i) => (p < 0 ? [i] : []))
  if (stack.length !== 1) throw new Error('floor: the pipes should leave one supply')
  while (stack.length > 0) {
    const q = stack.pop()!
    order.push(q)
    // Children in document order (pushed last to first): visited in reverse, the same sum
    // ran about 20 % slower, and a floor should be the fastest plain walk.
    for (let j = kids[q]!.length - 1; j >= 0; j--) stack.push(kids[q]![j]!)
  }
  if (order.length !== doc.pipes.length) throw new Error('floor: the pipes are not one tree')
  const pos = new Int32Array(order.length)
  order.forEach((q, k) => (pos[q] = k))
  const tree = {
    parPos: Int32Array.from(order, (q) => (parent[q]! < 0 ? -1 : pos[parent[q]!]!)),
    own: Float64Array.from(order, (q) => (fixtures.has(doc.pipes[q]!.to) ? 1.4 : 0)),
    sum: new Float64Array(order.length),
  }
  // The supply pipe carries every fixture inlet's load: 1.4 × the number of fixture inlets.
  const inlets = tree.own.reduce((n, x) => n + (x > 0 ? 1 : 0), 0)
  if (Math.abs(floorPass(tree) - 1.4 * inlets) > 1e-6 * inlets) {
    throw new Error('floor: wrong sum')
  }
  return tree
}

const fmt = (ms: number) => (ms < 1 ? `${(ms * 1000).toFixed(1)} µs` : `${ms.toFixed(2)} ms`)

console.log(`node ${process.version}, via tsx (no bundling)`)
console.log(
  'size      nodes   pipes   floor      compile    full       full/floor  computeDiagram  ' +
    'incremental  modes',
)
for (const target of [1_000, 10_000, 100_000]) {
  const doc = riserTreeDiagram(target)
  const tree = floorTree(doc)
  const copy = () => ({ ...doc, nodes: doc.nodes.slice(), pipes: doc.pipes.slice() })
  const compileMs = time(() => new Engine(copy(), false), target >= 100_000 ? 3 : 7)
  const engine = new Engine(copy())
  const pairs = target >= 100_000 ? 40 : 300
  const { floorMs, fullMs, ratio } = paired(tree, engine, pairs, 8)
  // Warm the JIT first: the editor calls computeDiagram on every edit.
  if (target < 100_000) for (let i = 0; i < 20; i++) computeDiagram(doc)
  const computeMs = time(() => computeDiagram(doc), target >= 100_000 ? 3 : 15)

  const live = createLiveCalculation(doc)
  const fixtures = doc.nodes.filter((n) => n.kind === 'fixture').map((n) => n.id)
  let seed = 12345
  const rand = () => (seed = (seed * 1103515245 + 12345) & 0x7fffffff) / 0x7fffffff
  const modes: Record<string, number> = {}
  const xs: number[] = []
  const counts = new Map<string, number>()
  for (let i = 0; i < 2000; i++) {
    const id = fixtures[Math.floor(rand() * fixtures.length)]!
    const count = (counts.get(id) ?? 1) === 1 ? 2 : 1
    counts.set(id, count)
    const t = performance.now()
    const u = live.apply({ type: 'node.update', id, patch: { count } })
    xs.push(performance.now() - t)
    modes[u.mode] = (modes[u.mode] ?? 0) + 1
  }
  const incMs = median(xs.slice(200))
  console.log(
    [
      String(target).padEnd(8),
      String(doc.nodes.length).padStart(7),
      String(doc.pipes.length).padStart(7),
      fmt(floorMs).padStart(10),
      fmt(compileMs).padStart(10),
      fmt(fullMs).padStart(10),
      `${ratio.toFixed(1)}×`.padStart(10),
      fmt(computeMs).padStart(15),
      fmt(incMs).padStart(12),
      ' ' +
        Object.entries(modes)
          .map(([k, v]) => `${k} ${v}`)
          .join(', '),
    ].join(' '),
  )
}
