/**
 * Generated riser trees for benchmarks and property checks: a supply, a meter and a water heater,
 * cold and hot distribution trees with fan-out 8, and risers of ten floors; each floor has a
 * cold and a hot branch serving two lavatories, a flush-tank water closet and a shower.
 * The top distribution pipes are locked at 12 in steel, as a campus main would be.
 */
import { diagramSchema, type Diagram, type DiagramInput } from '../document/model.ts'

const FLOORS = 10
const FAN_OUT = 8
const NODES_PER_RISER = 2 + FLOORS * 8

/** A riser tree of about `targetNodes` nodes. */
export function riserTreeDiagram(targetNodes: number): Diagram {
  const nodes: DiagramInput['nodes'] = []
  const pipes: DiagramInput['pipes'] = []
  let pipeNo = 0
  const pipe = (from: string, to: string, system: 'cold' | 'hot', lengthM: number, extra = {}) =>
    pipes.push({ id: `p${pipeNo++}`, from, to, system, lengthM, ...extra })
  const junction = (id: string, elevationM = 0) => nodes.push({ id, kind: 'junction', elevationM })

  nodes.push({ id: 'supply', kind: 'supply', pressureKPa: 900 })
  nodes.push({ id: 'meter', kind: 'meter', lossKPa: 20 })
  nodes.push({ id: 'heater', kind: 'water-heater', lossKPa: 10 })
  pipe('supply', 'meter', 'cold', 10, { material: 'steel-40', nominal: '12' })
  junction('c-root')
  pipe('meter', 'c-root', 'cold', 5, { material: 'steel-40', nominal: '12' })
  pipe('c-root', 'heater', 'cold', 3, { material: 'steel-40', nominal: '12' })
  junction('h-root')
  pipe('heater', 'h-root', 'hot', 3, { material: 'steel-40', nominal: '12' })

  const risers = Math.max(1, Math.round((targetNodes - 5) / NODES_PER_RISER))
  // Distribution levels until there is one leaf junction per riser.
  let level = ['root']
  let depth = 0
  while (level.length < risers) {
    const next: string[] = []
    for (const parent of level) {
      for (let k = 0; k < FAN_OUT && next.length < risers; k++) {
        const id = `${parent}.${k}`
        next.push(id)
        const lock = depth < 2 ? { material: 'steel-40', nominal: '12' } : { material: 'steel-40' }
        junction(`c-${id}`)
        junction(`h-${id}`)
        pipe(`c-${parent}`, `c-${id}`, 'cold', 20, lock)
        pipe(`h-${parent}`, `h-${id}`, 'hot', 20, lock)
      }
    }
    level = next
    depth++
  }
  for (const base of level) {
    let cPrev = `c-${base}`
    let hPrev = `h-${base}`
    for (let f = 0; f < FLOORS; f++) {
      const z = 3 * f
      const c = `${cPrev}.f${f}`
      const h = `${hPrev}.f${f}`
      junction(c, z)
      junction(h, z)
      pipe(cPrev, c, 'cold', f === 0 ? 5 : 3)
      pipe(hPrev, h, 'hot', f === 0 ? 5 : 3)
      const cb = `${c}.b`
      const hb = `${h}.b`
      junction(cb, z)
      junction(hb, z)
      pipe(c, cb, 'cold', 4)
      pipe(h, hb, 'hot', 4)
      for (const [k, fixture] of [
        'lavatory',
        'lavatory',
        'water-closet-tank',
        'shower',
      ].entries()) {
        const id = `${c}.x${k}`
        nodes.push({ id, kind: 'fixture', fixture, elevationM: z + 1 })
        pipe(cb, id, 'cold', 2)
        if (fixture !== 'water-closet-tank') pipe(hb, id, 'hot', 2.5)
      }
      cPrev = c
      hPrev = h
    }
  }
  return diagramSchema.parse({
    format: 'tributary-diagram',
    version: 1,
    name: `Riser tree, ${nodes.length} nodes`,
    settings: { loadBasis: 'per-fixture', occupancy: 'private', maxStaticKPa: 1000 },
    nodes,
    pipes,
  })
}
