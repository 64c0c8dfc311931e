import { describe, expect, test } from 'vitest'
import { computeDiagram } from '@shared/calc/compute.ts'
import { DEMAND_TABLES, IPC_DEMAND_TABLE } from '@shared/calc/demand-tables.ts'
import { diagramSchema, type DiagramInput } from '@shared/document/model.ts'
import { inspectPipe } from '@/features/editor/panels/inspector/inspect-pipe.ts'
import { readingText } from '@/features/editor/panels/inspector/inspector-demand.ts'
import { frictionRate, sizeBasisOf } from '@/features/editor/panels/inspector/inspector-size.ts'
import type { PipeInspection } from '@/features/editor/panels/inspector/inspector-types.ts'
import { scheduleDiagram } from '../schedule/schedule-doc.ts'

const doc = scheduleDiagram()
const result = computeDiagram(doc)

const texts = (x: PipeInspection, key: string) =>
  x.sections.find((s) => s.key === key)!.lines.map((l) => l.text)

function parse(
  nodes: DiagramInput['nodes'],
  pipes: DiagramInput['pipes'],
  settings: DiagramInput['settings'] = { loadBasis: 'flush-valve-series', occupancy: 'public' },
) {
  return diagramSchema.parse({ format: 'tributary-diagram', version: 1, settings, nodes, pipes })
}

describe('inspectPipe: a pipe serving a flush valve battery', () => {
  const x = inspectPipe(doc, result, 'p3', 'si')

  test('names the pipe, its system and both ends', () => {
    expect(x).toMatchObject({
      pipeId: 'p3',
      system: 'cold',
      route: 'j1 (Riser A, level 1) → wc (WC battery)',
      notice: null,
    })
    expect(x.sections.map((s) => s.key)).toEqual(['load', 'demand', 'size', 'pressure', 'problems'])
  })

  test('the load: the battery, its series step by step and the total', () => {
    const load = texts(x, 'load')
    expect(load).toContain(
      'Water closet, flush valve × 4 (wc): counted in the flush valve closet series',
    )
    expect(
      load.some((t) =>
        t.startsWith('Flush valve closets: 4 on this pipe → 40 + 30 + 20 + 15 = 105 FU'),
      ),
    ).toBe(true)
    expect(load.at(-1)).toBe('Load on this pipe: 105 FU')
  })

  test('the demand: table, curve, the two rows read between, the design flow', () => {
    const demand = texts(x, 'demand')
    expect(demand).toContain('Curve: flush valve (the pipe serves 4 flush valve closets).')
    expect(demand).toContain(
      '105 FU lies between the rows 100 FU → 67.5 gpm and 120 FU → 73.0 gpm; straight-line ' +
        'interpolation gives 68.9 gpm (4.35 L/s).',
    )
    expect(demand.at(-1)).toBe('Design flow: 4.35 L/s.')
  })

  test('the size: why this size, the bore and velocity against the limit', () => {
    const size = texts(x, 'size')
    expect(size[1]).toMatch(/^DN50 is the smallest size that keeps the velocity within 2\.40 m\/s/)
    expect(size).toContain('Velocity: 2.18 m/s against a cold water limit of 2.40 m/s (91 %).')
  })

  test('friction per length and over the equivalent length, pressure at both ends', () => {
    const pressure = texts(x, 'pressure')
    expect(pressure[0]).toBe('Equivalent length: 6.00 m developed + 25 % for fittings = 7.50 m.')
    const p3 = result.pipes.p3!
    const rate = (p3.lossKPa! / p3.equivalentLengthM).toFixed(3)
    expect(pressure[1]).toBe(`Friction (Hazen-Williams): ${rate} kPa/m over 7.50 m = 7.3 kPa.`)
    expect(pressure.at(-1)).toBe('Pressure: 369 kPa at the inlet, 362 kPa at the outlet.')
  })

  test('US units change the words, not the reasoning', () => {
    const us = inspectPipe(doc, result, 'p3', 'us')
    expect(texts(us, 'demand').at(-1)).toBe('Design flow: 68.9 gpm.')
    expect(texts(us, 'size')[1]).toMatch(/^2" is the smallest size .* within 7\.9 ft\/s/)
  })
})

describe('inspectPipe: other cases', () => {
  test('a long battery reads as a compact series', () => {
    const big = parse(
      [
        { id: 's', kind: 'supply', pressureKPa: 600 },
        { id: 'wc', kind: 'fixture', fixture: 'water-closet-flush-valve', count: 30 },
      ],
      [{ id: 'p', from: 's', to: 'wc', system: 'cold', lengthM: 5 }],
    )
    const load = texts(inspectPipe(big, computeDiagram(big), 'p', 'si'), 'load')
    expect(
      load.some((t) => t.includes('30 on this pipe → 40 + 30 + 20 + 15 + 26 × 10 = 365 FU')),
    ).toBe(true)
  })

  test('a locked size and its velocity problem are named', () => {
    const x = inspectPipe(doc, result, 'p4', 'si')
    expect(texts(x, 'size')[1]).toBe(
      'DN10 is locked by the designer; the calculation does not resize it.',
    )
    const velocity = x.sections.find((s) => s.key === 'size')!.lines.at(-1)!
    expect(velocity).toMatchObject({ tone: 'problem' })
    expect(texts(x, 'problems')).toContain(
      'warning velocity-exceeded: Pipe p4 (locked 3/8) runs at 3.62 m/s, above 2.4 m/s.',
    )
  })

  test('equipment flow is added to the fixture flow', () => {
    const withEquipment = parse(
      [
        { id: 's', kind: 'supply', pressureKPa: 500 },
        { id: 'j', kind: 'junction' },
        { id: 'lav', kind: 'fixture', fixture: 'lavatory' },
        { id: 'boiler', kind: 'equipment', flowLps: 0.5 },
      ],
      [
        { id: 'main', from: 's', to: 'j', system: 'cold', lengthM: 10 },
        { id: 'b1', from: 'j', to: 'lav', system: 'cold', lengthM: 2 },
        { id: 'b2', from: 'j', to: 'boiler', system: 'cold', lengthM: 2 },
      ],
    )
    const r = computeDiagram(withEquipment)
    const demand = texts(inspectPipe(withEquipment, r, 'main', 'si'), 'demand')
    expect(demand).toContain('Equipment added: boiler 0.50 L/s = 0.50 L/s.')
    expect(demand.at(-1)).toBe(`Design flow: ${r.pipes.main!.flowLps.toFixed(2)} L/s.`)
  })

  test('an invalid document says plainly that there are no results', () => {
    const broken = diagramSchema.parse({
      ...doc,
      pipes: [...doc.pipes, { id: 'p99', from: 'j1', to: 'ghost', system: 'cold', lengthM: 2 }],
    })
    const r = computeDiagram(broken)
    const x = inspectPipe(broken, r, 'p2', 'si')
    expect(x.notice).toMatch(/^No results for this pipe: the diagram has \d+ errors? that stop/)
    expect(x.sections.map((s) => s.key)).toEqual(['problems'])
    const own = inspectPipe(broken, r, 'p99', 'si')
    expect(texts(own, 'problems').join(' ')).toContain('ghost')
  })

  test('an unknown pipe id is a message, not a crash', () => {
    expect(inspectPipe(doc, result, 'nope', 'si')).toMatchObject({
      notice: 'Pipe nope is not in the diagram.',
      sections: [],
    })
  })
})

describe('readingText', () => {
  const table = DEMAND_TABLES[IPC_DEMAND_TABLE]!
  const tank = table.columns['flush-tank']
  const valve = table.columns['flush-valve']

  test.each([
    [30, 'si', 'flush-tank', '30 FU is a row of the table: 23.3 gpm (1.47 L/s).'],
    [0, 'si', 'flush-tank', 'No fixture load, so no probable flow from fixtures.'],
    [
      0.5,
      'us',
      'flush-tank',
      '0.5 FU is below the first row (1 FU → 3.0 gpm): read on a straight line from zero, 1.5 gpm.',
    ],
    [
      20.5,
      'us',
      'flush-valve',
      '20.5 FU lies between the rows 20 FU → 35.0 gpm and 25 FU → 38.0 gpm; straight-line ' +
        'interpolation gives 35.3 gpm.',
    ],
  ] as const)('%s FU in %s on the %s column', (load, units, curve, expected) => {
    expect(readingText(table.columns[curve], load, units)).toBe(expected)
  })

  test('below a flush valve column and beyond the last row are flagged', () => {
    expect(readingText(valve, 2, 'us')).toMatch(
      /below the first row \(5 FU → 15\.0 gpm\).*at least one valve/,
    )
    expect(readingText(tank, 6000, 'us')).toMatch(
      /beyond the last row \(5000 FU → 593\.0 gpm\).*authority/,
    )
  })
})

describe('frictionRate', () => {
  test('kPa/m in SI, psi per 100 ft in US (1 kPa/m = 4.42 psi/100 ft)', () => {
    expect(frictionRate(10, 10, 'si')).toBe('1.00 kPa/m')
    expect(frictionRate(10, 10, 'us')).toBe(`${((0.3048 / 6.894757) * 100).toFixed(2)} psi/100 ft`)
  })
})

describe('sizingReason through inspectPipe', () => {
  test('a pipe enlarged by the pressure pass says it was upsized and from what', () => {
    // A long main from a weak supply: the velocity size leaves the flush valve short of pressure.
    const weak = parse(
      [
        { id: 's', kind: 'supply', pressureKPa: 215 },
        { id: 'wc', kind: 'fixture', fixture: 'water-closet-flush-valve' },
      ],
      [{ id: 'main', from: 's', to: 'wc', system: 'cold', lengthM: 120 }],
    )
    const r = computeDiagram(weak)
    const reason = texts(inspectPipe(weak, r, 'main', 'si'), 'size')[1]
    expect(reason).toMatch(/^DN\d+ is upsized from DN50 \(the smallest within 2\.40 m\/s\)/)
    expect(reason).not.toMatch(/^DN50 /)
  })
})

describe('sizingReason: minimum supply size and no size', () => {
  test('a branch raised to the fixture minimum names the fixture and the rule', () => {
    const small = parse(
      [
        { id: 's', kind: 'supply', pressureKPa: 400 },
        { id: 'df', kind: 'fixture', fixture: 'drinking-fountain' },
      ],
      [{ id: 'b', from: 's', to: 'df', system: 'cold', lengthM: 3 }],
    )
    const r = computeDiagram(small)
    expect(r.pipes.b!.sizeBasis).toBe('fixture-minimum')
    const reason = texts(inspectPipe(small, r, 'b', 'us'), 'size')[1]
    expect(reason).toMatch(/^1\/2" is the minimum supply size for Drinking fountain df \(/)
  })

  test('a flow no size of the material can carry is a problem line', () => {
    const big = parse(
      [
        { id: 's', kind: 'supply', pressureKPa: 600 },
        { id: 'wc', kind: 'fixture', fixture: 'water-closet-flush-valve', count: 60 },
      ],
      [{ id: 'p', from: 's', to: 'wc', system: 'cold', lengthM: 5, material: 'pex' }],
    )
    const r = computeDiagram(big)
    const size = inspectPipe(big, r, 'p', 'si').sections.find((s) => s.key === 'size')!
    expect(size.lines[1]).toMatchObject({ tone: 'problem' })
    expect(size.lines[1]!.text).toMatch(
      /^No size: even DN50 PEX tubing, CTS SDR 9 carries .* L\/s faster than 2\.40 m\/s\.$/,
    )
  })
})

describe('the per-fixture basis', () => {
  test('flush valve closets count by their own load, and the basis line says so', () => {
    const perFixture = diagramSchema.parse({
      ...doc,
      settings: { ...doc.settings, loadBasis: 'per-fixture' },
    })
    const r = computeDiagram(perFixture)
    const load = texts(inspectPipe(perFixture, r, 'p3', 'si'), 'load')
    expect(load[0]).toBe('Basis: every fixture by its own load (no flush valve series).')
    expect(load.some((t) => t.includes('Flush valve closets:'))).toBe(false)
    expect(load).toContain(`Load on this pipe: ${Number(r.pipes.p3!.load.toFixed(2))} FU`)
    expect(load.join('\n')).toMatch(
      /Water closet, flush valve × 4 \(wc\): 4 × [\d.]+ FU = [\d.]+ FU/,
    )
  })
})

describe('sizeBasisOf', () => {
  test('reads the basis the calculation reports, or the numbers when there is none', () => {
    const p3 = result.pipes.p3!
    expect(sizeBasisOf(p3, doc.settings)).toBe(p3.sizeBasis)
    const { sizeBasis: _, ...bare } = p3
    expect(sizeBasisOf(bare, doc.settings)).toBe('velocity')
    expect(sizeBasisOf({ ...bare, nominal: '4' }, doc.settings)).toBe('pressure-budget')
    expect(sizeBasisOf({ ...bare, locked: true }, doc.settings)).toBe('locked')
    expect(sizeBasisOf({ ...bare, nominal: null }, doc.settings)).toBe('none')
  })
})
