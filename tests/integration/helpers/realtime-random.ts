/**
 * Seeded random edits for the replica property tests, the convergence test and the benchmark.
 * Ops are drawn from the document the client sees, so most apply locally; some (reparenting,
 * removals) conflict once others' edits arrive, which is the point.
 */
import type { Diagram, DiagramNode } from '../../../shared/document/model.ts'
import type { Operation } from '../../../shared/document/operations.ts'

/** mulberry32: a tiny seeded PRNG, so a failing run replays from its seed. */
export function prng(seed: number): () => number {
  let a = seed >>> 0
  return () => {
    a = (a + 0x6d2b79f5) >>> 0
    let t = a
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

const pick = <T>(rand: () => number, items: readonly T[]): T | undefined =>
  items.length ? items[Math.floor(rand() * items.length)] : undefined

/** A small riser to start from: a supply feeding two junctions and a fixture. */
export function seedDiagram(): Diagram {
  return {
    format: 'tributary-diagram',
    version: 1,
    name: 'Converge',
    settings: {
      loadBasis: 'per-fixture',
      occupancy: 'public',
      velocityLimits: { cold: 2.4, hot: 1.5 },
      fittingAllowance: 0.25,
      minPressureKPa: 100,
      material: 'copper-l',
      frictionMethod: 'hazen-williams',
      maxStaticKPa: 550,
      waterTempC: 15,
    },
    levels: [],
    nodes: [
      { id: 'S1', kind: 'supply', label: 'Main', elevationM: 0, pressureKPa: 400 },
      { id: 'J1', kind: 'junction', label: '', elevationM: 0 },
      { id: 'J2', kind: 'junction', label: '', elevationM: 0 },
      { id: 'F1', kind: 'fixture', label: '', elevationM: 0, fixture: 'lavatory', count: 1 },
    ],
    pipes: [
      { id: 'P1', from: 'S1', to: 'J1', system: 'cold', lengthM: 5 },
      { id: 'P2', from: 'J1', to: 'J2', system: 'cold', lengthM: 5 },
      { id: 'P3', from: 'J2', to: 'F1', system: 'cold', lengthM: 5 },
    ],
  }
}

/**
 * One random op on `doc`. `tag` makes new ids unique per client (`J-a-7`).
 * @example
 * const op = randomOperation(replica.view, prng(42), 'a', counter++)
 */
export function randomOperation(
  doc: Diagram,
  rand: () => number,
  tag: string,
  n: number,
): Operation {
  const movable = doc.nodes.filter((node) => node.kind !== 'supply')
  const node = pick(rand, movable)
  const anyNode = pick(rand, doc.nodes) as DiagramNode
  const pipe = pick(rand, doc.pipes)
  const roll = rand()
  if (roll < 0.18 || !node) {
    const kind = rand() < 0.5 ? 'junction' : 'fixture'
    const id = `${kind === 'junction' ? 'J' : 'F'}-${tag}-${n}`
    const added: DiagramNode =
      kind === 'junction'
        ? { id, kind, label: '', elevationM: 0 }
        : { id, kind, label: '', elevationM: 0, fixture: 'water-closet-tank', count: 1 }
    const ops: Operation[] = [{ type: 'node.add', node: added }]
    if (rand() < 0.8) {
      ops.push({
        type: 'pipe.add',
        pipe: {
          id: `P-${tag}-${n}`,
          from: anyNode.id,
          to: id,
          system: 'cold',
          lengthM: 1 + Math.floor(rand() * 9),
        },
      })
    }
    return { type: 'batch', ops }
  }
  if (roll < 0.36) return { type: 'node.update', id: node.id, patch: { label: `${tag}${n}` } }
  if (roll < 0.5)
    return {
      type: 'node.move',
      id: node.id,
      position: { x: Math.round(rand() * 800), y: Math.round(rand() * 600) },
    }
  if (roll < 0.58)
    return { type: 'node.update', id: node.id, patch: { elevationM: Math.round(rand() * 30) } }
  if (roll < 0.66) return { type: 'node.remove', id: node.id }
  if (roll < 0.82 && pipe) {
    // Reparenting: the same pipe now comes from another node (may close a loop elsewhere).
    return { type: 'pipe.update', id: pipe.id, patch: { from: anyNode.id } }
  }
  if (roll < 0.88 && pipe)
    return { type: 'pipe.update', id: pipe.id, patch: { lengthM: 1 + Math.floor(rand() * 20) } }
  if (roll < 0.93 && pipe) return { type: 'pipe.remove', id: pipe.id }
  return { type: 'settings.update', patch: { fittingAllowance: Math.round(rand() * 100) / 100 } }
}

/** Problems no replica may ever show: loops, a second inlet, pipes or levels that point nowhere. */
export function integrityProblems(doc: Diagram): string[] {
  const problems: string[] = []
  const ids = new Set(doc.nodes.map((node) => node.id))
  const inlets = new Set<string>()
  const next = new Map<string, string[]>()
  for (const pipe of doc.pipes) {
    if (!ids.has(pipe.from) || !ids.has(pipe.to)) problems.push(`orphan pipe ${pipe.id}`)
    const key = `${pipe.to}|${pipe.system}`
    if (inlets.has(key)) problems.push(`second inlet at ${pipe.to}`)
    inlets.add(key)
    next.set(pipe.from, [...(next.get(pipe.from) ?? []), pipe.to])
  }
  const levels = new Set(doc.levels.map((level) => level.id))
  for (const node of doc.nodes) {
    if (node.levelId && !levels.has(node.levelId)) problems.push(`orphan level on ${node.id}`)
  }
  const state = new Map<string, 'open' | 'done'>()
  const visit = (id: string): boolean => {
    if (state.get(id) === 'done') return false
    if (state.get(id) === 'open') return true
    state.set(id, 'open')
    const loop = (next.get(id) ?? []).some(visit)
    state.set(id, 'done')
    return loop
  }
  if ([...ids].some(visit)) problems.push('a loop')
  return problems
}
