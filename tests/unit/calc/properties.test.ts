// Property tests on random valid riser trees (fast-check).
import fc from 'fast-check'
import { describe, expect, test } from 'vitest'
import { computeDiagram } from '../../../shared/calc/compute.ts'
import { FIXTURES } from '../../../shared/calc/fixtures.ts'
import { createLiveCalculation, type LiveEdit } from '../../../shared/calc/incremental.ts'
import { build, KEYS, treeArb } from './random-trees.ts'

function shuffle<T>(xs: T[], seed: number): T[] {
  const a = xs.slice()
  let s = seed || 1
  for (let i = a.length - 1; i > 0; i--) {
    s = (s * 16807) % 2147483647
    const j = s % (i + 1)
    ;[a[i], a[j]] = [a[j]!, a[i]!]
  }
  return a
}

describe('properties', () => {
  test('per-fixture loads are additive: each pipe carries the table values of what it serves', () => {
    fc.assert(
      fc.property(treeArb, (t) => {
        const doc = build({ ...t, basis: 'per-fixture' })
        const r = computeDiagram(doc)
        // Brute force: for each pipe, which supplies of each fixture pass through it.
        for (const pipe of doc.pipes) {
          const reach = new Map<string, Set<string>>()
          const stack: [string, string][] = [[pipe.to, pipe.system]]
          while (stack.length) {
            const [node, system] = stack.pop()!
            const n = doc.nodes.find((x) => x.id === node)!
            if (n.kind === 'fixture') reach.set(n.id, (reach.get(n.id) ?? new Set()).add(system))
            const next = n.kind === 'water-heater' ? 'hot' : system
            for (const p of doc.pipes)
              if (p.from === node && p.system === next) stack.push([p.to, next])
          }
          let expected = 0
          for (const [id, via] of reach) {
            const n = doc.nodes.find((x) => x.id === id)!
            if (n.kind !== 'fixture') continue
            const v = FIXTURES[n.fixture]!.ipc[n.occupancy ?? doc.settings.occupancy]
            expected += n.count * (via.size === 2 ? v.total : via.has('cold') ? v.cold : v.hot)
          }
          expect(r.pipes[pipe.id]!.load).toBeCloseTo(expected, 9)
        }
      }),
      { numRuns: 150 },
    )
  })

  test('cold-only per-fixture trees: a junction inlet carries the sum of its outlets', () => {
    fc.assert(
      fc.property(treeArb, (t) => {
        const doc = build({ ...t, basis: 'per-fixture' }, false)
        const r = computeDiagram(doc)
        for (const n of doc.nodes) {
          if (n.kind !== 'junction') continue
          const inlet = doc.pipes.find((p) => p.to === n.id)!
          const outs = doc.pipes.filter((p) => p.from === n.id)
          const sum = outs.reduce((s, p) => s + r.pipes[p.id]!.load, 0)
          expect(r.pipes[inlet.id]!.load).toBeCloseTo(sum, 9)
        }
      }),
      { numRuns: 150 },
    )
  })

  test('the order of nodes and pipes does not change the result', () => {
    fc.assert(
      fc.property(treeArb, fc.integer({ min: 1, max: 1e9 }), (t, seed) => {
        const doc = build(t)
        const shuffled = {
          ...doc,
          nodes: shuffle(doc.nodes, seed),
          pipes: shuffle(doc.pipes, seed + 7),
        }
        expect(computeDiagram(shuffled)).toEqual(computeDiagram(doc))
      }),
      { numRuns: 150 },
    )
  })

  let incrementalSeen = 0
  let budgetSeen = 0
  const editArb = fc.oneof(
    fc.record({
      kind: fc.constant('count' as const),
      i: fc.nat(),
      count: fc.integer({ min: 1, max: 9 }),
    }),
    fc.record({ kind: fc.constant('key' as const), i: fc.nat(), key: fc.constantFrom(...KEYS) }),
    fc.record({
      kind: fc.constant('min' as const),
      i: fc.nat(),
      kpa: fc.integer({ min: 0, max: 400 }),
    }),
    fc.record({
      kind: fc.constant('length' as const),
      i: fc.nat(),
      len: fc.integer({ min: 1, max: 60 }),
    }),
    fc.record({
      kind: fc.constant('lock' as const),
      i: fc.nat(),
      nominal: fc.constantFrom('1/2', '1', '2', undefined),
    }),
    fc.record({ kind: fc.constant('meter' as const), loss: fc.integer({ min: 0, max: 120 }) }),
    fc.record({ kind: fc.constant('flow' as const), flow: fc.integer({ min: 0, max: 300 }) }),
    fc.record({
      kind: fc.constant('elevation' as const),
      i: fc.nat(),
      z: fc.integer({ min: 0, max: 12 }),
    }),
  )

  test('incremental updates equal a full recompute', () => {
    fc.assert(
      fc.property(treeArb, fc.array(editArb, { minLength: 1, maxLength: 12 }), (t, edits) => {
        const doc = build(t)
        const live = createLiveCalculation(doc)
        const fixtures = doc.nodes.filter((n) => n.kind === 'fixture').map((n) => n.id)
        for (const e of edits) {
          let edit: LiveEdit | null = null
          const f = fixtures[('i' in e ? e.i : 0) % fixtures.length]!
          const pipe = doc.pipes[('i' in e ? e.i : 0) % doc.pipes.length]!.id
          if (e.kind === 'count') edit = { type: 'node.update', id: f, patch: { count: e.count } }
          if (e.kind === 'key') edit = { type: 'node.update', id: f, patch: { fixture: e.key } }
          if (e.kind === 'min')
            edit = { type: 'node.update', id: f, patch: { minPressureKPa: e.kpa } }
          if (e.kind === 'length')
            edit = { type: 'pipe.update', id: pipe, patch: { lengthM: e.len } }
          if (e.kind === 'lock')
            edit = { type: 'pipe.update', id: pipe, patch: { nominal: e.nominal } }
          if (e.kind === 'meter')
            edit = { type: 'node.update', id: 'meter', patch: { lossKPa: e.loss } }
          if (e.kind === 'elevation')
            edit = { type: 'node.update', id: f, patch: { elevationM: e.z } }
          if (e.kind === 'flow' && t.equipment) {
            edit = { type: 'node.update', id: 'eq', patch: { flowLps: e.flow / 100 } }
          }
          if (!edit) continue
          const u = live.apply(edit)
          if (u.mode === 'incremental') incrementalSeen++
          if (u.mode === 'budget') budgetSeen++
          expect(live.result()).toEqual(computeDiagram(live.doc))
        }
      }),
      { numRuns: 200 },
    )
    // Both paths were exercised, so the equality above is not vacuous.
    expect(incrementalSeen).toBeGreaterThan(50)
    expect(budgetSeen).toBeGreaterThan(5)
  })
})
