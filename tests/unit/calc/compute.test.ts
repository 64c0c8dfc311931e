// The whole pipeline on small diagrams with hand-checkable answers.
import { describe, expect, test } from 'vitest'
import { computeDiagram } from '../../../shared/calc/compute.ts'
import { explainPipe } from '../../../shared/calc/explain.ts'
import { GPM_TO_LPS, KPA_PER_METRE, psiToKPa } from '../../../shared/calc/units.ts'
import { cold, diagram, hot } from './helpers.ts'

// Reference §7.2 (composed example, X): 6 apartments, each a private flush-tank bathroom group
// and a private kitchen sink (IPC E103.3(2), C [S15]); Type L copper; limits 8 / 5 ft/s.
function sixApartments() {
  const nodes: Parameters<typeof diagram>[0] = [
    { id: 'supply', kind: 'supply', pressureKPa: psiToKPa(60) },
    { id: 'j', kind: 'junction' },
    { id: 'heater', kind: 'water-heater' },
    { id: 'jc', kind: 'junction' },
    { id: 'jh', kind: 'junction' },
  ]
  const pipes: Parameters<typeof diagram>[1] = [
    cold('building', 'supply', 'j', 10),
    cold('to-heater', 'j', 'heater', 2),
    cold('cold-main', 'j', 'jc', 10),
    hot('hot-main', 'heater', 'jh', 10),
  ]
  for (let i = 1; i <= 6; i++) {
    nodes.push({ id: `bg${i}`, kind: 'fixture', fixture: 'bathroom-group-tank', elevationM: 7.62 })
    nodes.push({ id: `ks${i}`, kind: 'fixture', fixture: 'kitchen-sink', elevationM: 7.62 })
    pipes.push(cold(`c-bg${i}`, 'jc', `bg${i}`), hot(`h-bg${i}`, 'jh', `bg${i}`))
    pipes.push(cold(`c-ks${i}`, 'jc', `ks${i}`), hot(`h-ks${i}`, 'jh', `ks${i}`))
  }
  return diagram(nodes, pipes, {
    loadBasis: 'per-fixture',
    occupancy: 'private',
    velocityLimits: { cold: 8 * 0.3048, hot: 5 * 0.3048 },
  })
}

describe('composed example, reference §7.2', () => {
  const r = computeDiagram(sixApartments())
  test('loads: total 30.0, cold 22.2, hot 15.0 WSFU (hot + cold ≠ total)', () => {
    expect(r.pipes.building!.load).toBeCloseTo(30.0, 9)
    expect(r.pipes['cold-main']!.load).toBeCloseTo(22.2, 9)
    expect(r.pipes['hot-main']!.load).toBeCloseTo(15.0, 9)
    expect(r.pipes['to-heater']!.load).toBeCloseTo(15.0, 9)
  })
  test('demand: 23.3 gpm at 30 WSFU, 17.5 gpm at 15, flush-tank curve', () => {
    expect(r.pipes.building!.flowLps).toBeCloseTo(23.3 * GPM_TO_LPS, 9)
    expect(r.pipes['hot-main']!.flowLps).toBeCloseTo(17.5 * GPM_TO_LPS, 9)
    expect(r.pipes['cold-main']!.flowLps).toBeCloseTo(20.436 * GPM_TO_LPS, 4)
    expect(r.pipes.building!.curve).toBe('flush-tank')
    expect(r.pipes.building!.demandTable).toBe('ipc-e103.3(3)')
  })
  test('sizes: building 1-1/4 (1 in runs 9.06 ft/s), hot 1-1/4 (1 in 6.81 ft/s), cold 1 in', () => {
    expect(r.pipes.building!.nominal).toBe('1-1/4')
    expect(r.pipes['hot-main']!.nominal).toBe('1-1/4')
    expect(r.pipes['cold-main']!.nominal).toBe('1')
    expect(r.pipes.building!.velocityMps! / 0.3048).toBeCloseTo(5.95, 1)
  })
  test('static head: 25 ft rise costs 74.8 kPa at 9.81 kPa/m', () => {
    expect(r.nodes.bg1!.staticPressureKPa).toBeCloseTo(psiToKPa(60) - KPA_PER_METRE * 7.62, 9)
  })
  test('no issues', () => expect(r.issues).toEqual([]))
})

describe('flush valve series basis', () => {
  const doc = diagram(
    [
      { id: 's', kind: 'supply', pressureKPa: 500 },
      { id: 'j', kind: 'junction' },
      { id: 'wc', kind: 'fixture', fixture: 'water-closet-flush-valve', count: 4 },
      { id: 'ur', kind: 'fixture', fixture: 'urinal-flush-valve', count: 3 },
      { id: 'lav', kind: 'fixture', fixture: 'lavatory', count: 2 },
    ],
    [
      cold('main', 's', 'j', 5),
      cold('p-wc', 'j', 'wc'),
      cold('p-ur', 'j', 'ur'),
      cold('p-lav', 'j', 'lav'),
    ],
    { loadBasis: 'flush-valve-series', occupancy: 'public', velocityLimits: { cold: 3, hot: 1.5 } },
  )
  const r = computeDiagram(doc)
  test('4 WC + 3 urinals = 150, plus 2 lavatories at 0.75 cold (UPC 1.0 × 3/4) = 151.5', () => {
    expect(r.pipes['p-wc']!.load).toBe(105)
    expect(r.pipes['p-ur']!.load).toBe(45)
    expect(r.pipes.main!.load).toBeCloseTo(151.5, 9)
    expect(r.pipes.main!).toMatchObject({
      flushValveClosets: 4,
      flushValveUrinals: 3,
      curve: 'flush-valve',
    })
    expect(r.pipes['p-lav']!.curve).toBe('flush-tank')
  })
  test('the load on a pipe is not the sum of its branches', () => {
    const sum = r.pipes['p-wc']!.load + r.pipes['p-ur']!.load + r.pipes['p-lav']!.load
    expect(r.pipes.main!.load).toBe(sum)
    const twoBranches = diagram(
      [...doc.nodes, { id: 'wc2', kind: 'fixture', fixture: 'water-closet-flush-valve', count: 1 }],
      [...doc.pipes, cold('p-wc2', 'j', 'wc2')],
      doc.settings,
    )
    const r2 = computeDiagram(twoBranches)
    expect(r2.pipes.main!.load).toBeCloseTo(150 + 10 + 1.5, 9) // fifth closet adds 10, not 40
  })
  test('explain names the series steps and the curve', () => {
    const x = explainPipe(doc, r, 'main')!
    expect(x.series).toEqual([
      { kind: 'closet', count: 4, steps: [40, 30, 20, 15], total: 105 },
      { kind: 'urinal', count: 3, steps: [20, 15, 10], total: 45 },
    ])
    expect(x.lines.join('\n')).toContain('40 + 30 + 20 + 15 = 105')
    expect(x.lines.join('\n')).toContain('flush valve curve')
    expect(x.fixtures.map((f) => f.id)).toEqual(['lav', 'ur', 'wc'])
  })
})

describe('pressures', () => {
  const base = (extra: object = {}) =>
    diagram(
      [
        { id: 's', kind: 'supply', pressureKPa: 700, elevationM: 0 },
        { id: 'm', kind: 'meter', lossKPa: 20 },
        { id: 'prv', kind: 'pressure-reducing-valve', setKPa: 450 },
        { id: 'top', kind: 'junction', elevationM: 10 },
        { id: 'lav', kind: 'fixture', fixture: 'lavatory', elevationM: 10, ...extra },
      ],
      [
        cold('a', 's', 'm', 2),
        cold('b', 'm', 'prv', 2),
        cold('c', 'prv', 'top', 10),
        cold('d', 'top', 'lav', 2),
      ],
    )
  test('device loss, valve cap, 9.81 kPa per metre of rise, friction', () => {
    const r = computeDiagram(base())
    const a = r.pipes.a!
    expect(r.nodes.m!.pressureKPa).toBeCloseTo(700 - a.lossKPa! - 20, 9)
    expect(r.nodes.prv!.pressureKPa).toBe(450)
    const c = r.pipes.c!
    expect(r.nodes.top!.pressureKPa).toBeCloseTo(450 - c.lossKPa! - 98.1, 9)
    expect(r.nodes.top!.staticPressureKPa).toBeCloseTo(450 - 98.1, 9)
    expect(r.issues.map((i) => [i.code, i.ids])).toEqual([
      ['above-max-static', ['m']],
      ['above-max-static', ['s']],
    ])
  })
  test('a fixture below its minimum is reported, not rejected', () => {
    const r = computeDiagram(base({ minPressureKPa: 400 }))
    expect(r.ok).toBe(true)
    expect(r.issues.find((i) => i.code === 'below-min-pressure')!.ids).toEqual(['lav'])
  })
  test('the budget pass enlarges the steepest unlocked pipe until the minimum holds', () => {
    const nodes = [
      { id: 's', kind: 'supply' as const, pressureKPa: 300 },
      { id: 'wc', kind: 'fixture' as const, fixture: 'water-closet-flush-valve', count: 2 },
    ]
    const velocityOnly = computeDiagram(
      diagram(nodes, [cold('long', 's', 'wc', 60)], { loadBasis: 'per-fixture' }),
    )
    expect(velocityOnly.pipes.long!.nominal).toBe('2')
    const nodesTight = [{ ...nodes[0]!, pressureKPa: 250 }, nodes[1]!]
    const r = computeDiagram(
      diagram(nodesTight, [cold('long', 's', 'wc', 60)], { loadBasis: 'per-fixture' }),
    )
    expect(r.nodes.wc!.pressureKPa!).toBeGreaterThanOrEqual(psiToKPa(35))
    expect(r.pipes.long!.nominal).not.toBe('2')
    expect(r.issues).toEqual([])
    const locked = computeDiagram(
      diagram(nodesTight, [cold('long', 's', 'wc', 60, { nominal: '1' })], {
        loadBasis: 'per-fixture',
      }),
    )
    expect(locked.pipes.long).toMatchObject({ nominal: '1', locked: true })
    expect(locked.issues.map((i) => i.code).sort()).toEqual([
      'below-min-pressure',
      'velocity-exceeded',
    ])
  })
})

describe('rejected documents name the ids', () => {
  const s = { id: 's', kind: 'supply' as const, pressureKPa: 400 }
  const lav = { id: 'lav', kind: 'fixture' as const, fixture: 'lavatory' }
  const j = (id: string) => ({ id, kind: 'junction' as const })
  test.each([
    [
      'cycle',
      [s, j('a'), j('b'), lav],
      [cold('p1', 's', 'lav'), cold('p2', 'a', 'b'), cold('p3', 'b', 'a')],
      ['p2', 'p3', 'a', 'b'],
    ],
    [
      'cycle',
      [s, j('a'), j('b'), lav],
      [cold('p1', 's', 'a'), cold('p2', 'a', 'b'), cold('p3', 'b', 'a'), cold('p4', 'a', 'lav')],
      ['p2', 'p3'],
    ],
    ['two-supplies', [s, { ...s, id: 's2' }, lav], [cold('p1', 's', 'lav')], ['s', 's2']],
    ['missing-node', [s, lav], [cold('p1', 's', 'nowhere')], ['p1']],
    [
      'outlet-from-terminal',
      [s, lav, j('a')],
      [cold('p1', 's', 'lav'), cold('p2', 'lav', 'a')],
      ['lav', 'p2'],
    ],
    [
      'hot-not-from-heater',
      [s, j('a'), lav],
      [cold('p1', 's', 'lav'), hot('p2', 'a', 'lav')],
      ['p2'],
    ],
    ['unknown-fixture', [s, { ...lav, fixture: 'lavvy' }], [cold('p1', 's', 'lav')], ['lav']],
    ['unknown-material', [s, lav], [cold('p1', 's', 'lav', 5, { material: 'lead' })], ['p1']],
    ['bad-length', [s, lav], [cold('p1', 's', 'lav', 0)], ['p1']],
    [
      'two-inlets',
      [s, j('a'), lav],
      [cold('p1', 's', 'a'), cold('p2', 's', 'lav'), cold('p3', 'a', 'lav')],
      ['lav'],
    ],
  ] as const)('%s', (code, nodes, pipes, ids) => {
    const r = computeDiagram(diagram([...nodes], [...pipes]))
    expect(r.ok).toBe(false)
    const issue = r.issues.find((i) => i.code === code)!
    expect(issue, JSON.stringify(r.issues)).toBeDefined()
    expect(issue.severity).toBe('error')
    for (const id of ids) {
      expect(issue.ids).toContain(id)
      expect(issue.message).toContain(id)
    }
  })
  test('an unlisted fixture with a given load is accepted', () => {
    const r = computeDiagram(
      diagram(
        [s, { ...lav, fixture: 'foot-wash', load: { cold: 1, hot: 1, total: 1.5 } }],
        [cold('p1', 's', 'lav')],
      ),
    )
    expect(r.ok).toBe(true)
    expect(r.pipes.p1!.load).toBe(1)
  })
  test('nodes no pipe reaches are reported, not rejected', () => {
    const r = computeDiagram(diagram([s, lav, j('lonely')], [cold('p1', 's', 'lav')]))
    expect(r.ok).toBe(true)
    expect(r.issues).toEqual([expect.objectContaining({ code: 'unreached', ids: ['lonely'] })])
  })
})
