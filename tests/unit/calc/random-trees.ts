// Random valid riser trees for property tests (fast-check): a supply, a meter, an optional
// pressure-reducing valve, cold junctions, an optional water heater with hot junctions, fixtures,
// and optional equipment.
import fc from 'fast-check'
import { FIXTURES } from '../../../shared/calc/fixtures.ts'
import type { Diagram } from '../../../shared/document/model.ts'
import { cold, diagram, hot } from './helpers.ts'

export const KEYS = Object.keys(FIXTURES)

export const treeArb = fc.record({
  junctions: fc.array(
    fc.record({
      parent: fc.nat(),
      z: fc.integer({ min: 0, max: 8 }),
      len: fc.integer({ min: 1, max: 40 }),
    }),
    { minLength: 1, maxLength: 10 },
  ),
  hotJunctions: fc.array(fc.record({ parent: fc.nat(), len: fc.integer({ min: 1, max: 40 }) }), {
    maxLength: 5,
  }),
  fixtures: fc.array(
    fc.record({
      key: fc.constantFrom(...KEYS),
      count: fc.integer({ min: 1, max: 6 }),
      at: fc.nat(),
      hotAt: fc.option(fc.nat(), { nil: undefined }),
      occupancy: fc.constantFrom('public', 'private') as fc.Arbitrary<'public' | 'private'>,
      len: fc.integer({ min: 1, max: 15 }),
    }),
    { minLength: 1, maxLength: 14 },
  ),
  equipment: fc.option(fc.record({ at: fc.nat(), flow: fc.integer({ min: 1, max: 200 }) }), {
    nil: undefined,
  }),
  heater: fc.boolean(),
  prv: fc.boolean(),
  basis: fc.constantFrom('per-fixture', 'flush-valve-series') as fc.Arbitrary<
    'per-fixture' | 'flush-valve-series'
  >,
  pressure: fc.integer({ min: 150, max: 700 }),
  darcy: fc.boolean(),
})

export type Tree = typeof treeArb extends fc.Arbitrary<infer T> ? T : never

export function build(t: Tree, withHot = true): Diagram {
  const nodes: Parameters<typeof diagram>[0] = [
    { id: 'supply', kind: 'supply', pressureKPa: t.pressure },
    { id: 'meter', kind: 'meter', lossKPa: 15 },
  ]
  const pipes: Parameters<typeof diagram>[1] = [cold('svc', 'supply', 'meter', 8)]
  let head = 'meter'
  if (t.prv) {
    nodes.push({ id: 'prv', kind: 'pressure-reducing-valve', setKPa: 420 })
    pipes.push(cold('p-prv', head, 'prv', 1))
    head = 'prv'
  }
  t.junctions.forEach((j, i) => {
    nodes.push({ id: `j${i}`, kind: 'junction', elevationM: j.z })
    pipes.push(cold(`c${i}`, i === 0 ? head : `j${j.parent % i}`, `j${i}`, j.len))
  })
  const nj = t.junctions.length
  const hotOn = withHot && t.heater
  if (hotOn) {
    nodes.push({ id: 'heater', kind: 'water-heater', lossKPa: 5 })
    pipes.push(cold('c-heater', 'j0', 'heater', 2))
    nodes.push({ id: 'h0', kind: 'junction' })
    pipes.push(hot('h0', 'heater', 'h0', 3))
    t.hotJunctions.forEach((j, i) => {
      nodes.push({ id: `h${i + 1}`, kind: 'junction' })
      pipes.push(hot(`h${i + 1}`, `h${j.parent % (i + 1)}`, `h${i + 1}`, j.len))
    })
  }
  t.fixtures.forEach((f, i) => {
    const spec = FIXTURES[f.key]!
    nodes.push({
      id: `f${i}`,
      kind: 'fixture',
      fixture: f.key,
      count: f.count,
      occupancy: f.occupancy,
      elevationM: 1,
    })
    pipes.push(cold(`fc${i}`, `j${f.at % nj}`, `f${i}`, f.len))
    if (hotOn && spec.supplies.hot && f.hotAt !== undefined) {
      pipes.push(hot(`fh${i}`, `h${f.hotAt % (t.hotJunctions.length + 1)}`, `f${i}`, f.len))
    }
  })
  if (t.equipment) {
    nodes.push({ id: 'eq', kind: 'equipment', flowLps: t.equipment.flow / 100 })
    pipes.push(cold('p-eq', `j${t.equipment.at % nj}`, 'eq', 3))
  }
  return diagram(nodes, pipes, {
    loadBasis: t.basis,
    frictionMethod: t.darcy ? 'darcy-weisbach' : 'hazen-williams',
  })
}
