// The compiled engine (pre-order typed arrays, demand table reads, capacity compares, a memo of
// load → flow) against a plain reference written from the document and the primitive functions
// (readDemand, minDiameterMm, hazenWilliamsKPa, darcyWeisbachKPa, seriesLoad) on random trees.
import fc from 'fast-check'
import { describe, expect, test } from 'vitest'
import { computeDiagram } from '../../../shared/calc/compute.ts'
import { contributionOf } from '../../../shared/calc/contributions.ts'
import { readDemand } from '../../../shared/calc/demand.ts'
import { DEMAND_TABLES, IPC_DEMAND_TABLE } from '../../../shared/calc/demand-tables.ts'
import { FIXTURES } from '../../../shared/calc/fixtures.ts'
import { darcyWeisbachKPa, hazenWilliamsKPa, minDiameterMm } from '../../../shared/calc/friction.ts'
import { MATERIALS, nominalInches } from '../../../shared/calc/materials.ts'
import { seriesLoad } from '../../../shared/calc/series.ts'
import { KPA_PER_METRE, LOAD_SCALE } from '../../../shared/calc/units.ts'
import type { Diagram, DiagramNode, Pipe } from '../../../shared/document/model.ts'
import { build, treeArb } from './random-trees.ts'

const close = (a: number, b: number, scale = 1) =>
  Math.abs(a - b) <= 1e-9 * Math.max(scale, Math.abs(a), Math.abs(b))

// What a pipe serves, walked from its outlet: fixtures with the supplies that pass, equipment flow.
function served(doc: Diagram, pipe: Pipe) {
  const reach = new Map<string, Set<'cold' | 'hot'>>()
  let equipment = 0
  const stack: [string, 'cold' | 'hot'][] = [[pipe.to, pipe.system]]
  while (stack.length > 0) {
    const [id, system] = stack.pop()!
    const n = doc.nodes.find((x) => x.id === id)!
    if (n.kind === 'fixture') reach.set(id, (reach.get(id) ?? new Set()).add(system))
    if (n.kind === 'equipment') equipment += n.flowLps
    const next = n.kind === 'water-heater' ? 'hot' : system
    for (const p of doc.pipes) if (p.from === id && p.system === next) stack.push([p.to, next])
  }
  return { reach, equipment }
}

function referenceLoad(doc: Diagram, reach: Map<string, Set<'cold' | 'hot'>>) {
  let milli = 0
  let closets = 0
  let urinals = 0
  let valve = false
  for (const [id, via] of reach) {
    const n = doc.nodes.find((x) => x.id === id) as DiagramNode & { kind: 'fixture' }
    const c = contributionOf(n, doc.settings)
    milli += via.size === 2 ? c.total : via.has('cold') ? c.cold : c.hot
    if (via.has('cold')) {
      closets += c.closets
      urinals += c.urinals
      valve ||= FIXTURES[n.fixture]?.flushValve != null
    }
  }
  let load = milli / LOAD_SCALE
  if (doc.settings.loadBasis === 'flush-valve-series')
    load += seriesLoad('closet', closets) + seriesLoad('urinal', urinals)
  return { load, valve }
}

function nodeOut(n: DiagramNode, inP: number): number {
  if (n.kind === 'supply') return n.pressureKPa
  if (n.kind === 'pressure-reducing-valve') return Math.min(inP, n.setKPa)
  if (n.kind === 'meter' || n.kind === 'backflow-preventer' || n.kind === 'water-heater')
    return inP - n.lossKPa
  return inP
}

describe('compiled path equals the reference path', () => {
  test('loads, flows, sizes, friction and pressures on random trees (1e-9 relative)', () => {
    let raised = 0
    fc.assert(
      fc.property(treeArb, (t) => {
        const doc = build(t)
        const r = computeDiagram(doc)
        const s = doc.settings
        const supplyP = (doc.nodes.find((n) => n.kind === 'supply') as { pressureKPa: number })
          .pressureKPa
        const friction = new Map<string, number>()
        for (const pipe of doc.pipes) {
          const res = r.pipes[pipe.id]!
          const { reach, equipment } = served(doc, pipe)
          const { load, valve } = referenceLoad(doc, reach)
          expect(close(res.load, load)).toBe(true)
          const column =
            DEMAND_TABLES[IPC_DEMAND_TABLE]!.columns[valve ? 'flush-valve' : 'flush-tank']
          const flow = readDemand(column, load).lps + equipment
          expect(res.curve).toBe(valve ? 'flush-valve' : 'flush-tank')
          expect(close(res.flowLps, flow), `${pipe.id} flow`).toBe(true)
          const m = MATERIALS[pipe.material ?? s.material]!
          const need = minDiameterMm(flow, s.velocityLimits[pipe.system])
          const vel = m.sizes.findIndex((z) => z.insideDiameterMm >= need)
          const to = doc.nodes.find((n) => n.id === pipe.to)!
          const spec = to.kind === 'fixture' ? FIXTURES[to.fixture] : undefined
          const minNominal = spec && (pipe.system === 'hot' ? spec.minNominalHot : spec.minNominal)
          const min = minNominal
            ? m.sizes.findIndex((z) => nominalInches(z.nominal) >= nominalInches(minNominal))
            : 0
          const expected = vel < 0 ? -1 : Math.max(vel, min)
          const got = m.sizes.findIndex((z) => z.nominal === res.nominal)
          if (res.sizeBasis === 'pressure-budget') expect(got).toBeGreaterThan(expected)
          else expect(got, pipe.id).toBe(expected)
          if (res.sizeBasis === 'fixture-minimum') raised++
          if (got < 0) return
          const id = m.sizes[got]!.insideDiameterMm
          const leq = pipe.lengthM * (1 + s.fittingAllowance)
          const temp = pipe.system === 'hot' ? 60 : s.waterTempC
          const fr =
            s.frictionMethod === 'darcy-weisbach'
              ? darcyWeisbachKPa(flow, id, leq, m.roughnessMm, temp)
              : hazenWilliamsKPa(flow, id, leq, m.hazenWilliamsC)
          expect(close(res.lossKPa!, fr), `${pipe.id} friction`).toBe(true)
          friction.set(pipe.id, fr)
        }
        // Pressures from the supply down, with the reference friction.
        const out = new Map<string, number>()
        const outlet = (pipe: Pipe): number => {
          const cached = out.get(pipe.id)
          if (cached !== undefined) return cached
          const from = doc.nodes.find((n) => n.id === pipe.from)!
          const side = from.kind === 'water-heater' ? 'cold' : pipe.system
          const inlet = doc.pipes.find((p) => p.to === from.id && p.system === side)
          const z = (id: string) => doc.nodes.find((n) => n.id === id)!.elevationM
          const p =
            nodeOut(from, inlet ? outlet(inlet) : 0) -
            friction.get(pipe.id)! -
            KPA_PER_METRE * (z(pipe.to) - z(pipe.from))
          out.set(pipe.id, p)
          return p
        }
        for (const pipe of doc.pipes) {
          const got = r.pipes[pipe.id]!.outletPressureKPa!
          expect(close(got, outlet(pipe), supplyP), `${pipe.id} pressure`).toBe(true)
        }
      }),
      { numRuns: 150 },
    )
    // The fixture minimum was exercised, so its branch of the comparison is not vacuous.
    expect(raised).toBeGreaterThan(20)
  })
})
