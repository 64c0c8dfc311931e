// Minimum supply sizes per fixture: UPC 2018 Table A 103.1 "Min. branch pipe" column (C [S13],
// reference §2.2), applied to the pipe that feeds the fixture.
import { describe, expect, test } from 'vitest'
import { computeDiagram } from '../../../shared/calc/compute.ts'
import { explainPipe } from '../../../shared/calc/explain.ts'
import { FIXTURES } from '../../../shared/calc/fixtures.ts'
import { minDiameterMm } from '../../../shared/calc/friction.ts'
import { MATERIALS } from '../../../shared/calc/materials.ts'
import { cold, diagram, hot } from './helpers.ts'

describe('catalogue minimum supply sizes (UPC 2018 Table A 103.1, C [S13])', () => {
  test.each([
    ['kitchen-sink', '1/2', '1/2', 'Sink, kitchen, domestic'],
    ['drinking-fountain', '1/2', '1/2', 'Drinking fountain or water cooler'],
    ['lavatory', '1/2', '1/2', 'Lavatory'],
    ['water-closet-tank', '1/2', '1/2', 'Water closet, 1.6 gpf gravity tank'],
    ['water-closet-flush-valve', '1', '1', 'Water closet, 1.6 gpf flushometer valve'],
    ['urinal-flush-valve', '3/4', '3/4', 'Urinal, 1.0 gpf flushometer valve'],
    ['urinal-tank', '1/2', '1/2', 'Urinal, flush tank'],
    // Our per-side rule (X): the flushometer closet sets the cold side, lavatory and tub the hot.
    ['bathroom-group-flush-valve', '1', '1/2', 'flushometer valve'],
  ])('%s: cold %s in, hot %s in', (key, coldMin, hotMin, row) => {
    const spec = FIXTURES[key]!
    expect(spec.minNominal).toBe(coldMin)
    expect(spec.minNominalHot).toBe(hotMin)
    expect(spec.minNominalSource).toContain('Table A 103.1')
    expect(spec.minNominalSource).toContain(row)
  })
  test('every catalogue fixture has a minimum and a source', () => {
    for (const spec of Object.values(FIXTURES)) {
      expect(MATERIALS['copper-l']!.sizes.map((s) => s.nominal)).toContain(spec.minNominal)
      expect(spec.minNominalSource, spec.key).toMatch(/\[S13\]/)
    }
  })
})

const supply = { id: 's', kind: 'supply' as const, pressureKPa: 500 }
const L = MATERIALS['copper-l']!
// Index of the smallest Type L size that keeps `flowLps` within `limit` m/s.
const velocityIndex = (flowLps: number, limit: number) =>
  L.sizes.findIndex((z) => z.insideDiameterMm >= minDiameterMm(flowLps, limit))

describe('sizing respects the fixture minimum', () => {
  const doc = diagram(
    [
      supply,
      { id: 'j', kind: 'junction' },
      { id: 'heater', kind: 'water-heater' },
      { id: 'df', kind: 'fixture', fixture: 'drinking-fountain' },
      { id: 'ks', kind: 'fixture', fixture: 'kitchen-sink' },
    ],
    [
      cold('main', 's', 'j', 10),
      cold('c-df', 'j', 'df', 4),
      cold('c-ks', 'j', 'ks', 4),
      cold('c-heater', 'j', 'heater', 2),
      hot('h-ks', 'heater', 'ks', 4),
    ],
    // Hot at the cold limit, so that velocity alone would give 3/8 on both supplies.
    { occupancy: 'private', velocityLimits: { cold: 2.4, hot: 2.4 } },
  )
  const r = computeDiagram(doc)
  test('a drinking fountain (0.25 WSFU, 0.75 gpm) sizes to 3/8 by velocity, raised to 1/2', () => {
    const p = r.pipes['c-df']!
    expect(L.sizes[velocityIndex(p.flowLps, 2.4)]!.nominal).toBe('3/8')
    expect(p).toMatchObject({ nominal: '1/2', sizeBasis: 'fixture-minimum' })
    expect(p.fixtureMinimum).toMatchObject({ nodeId: 'df', nominal: '1/2' })
  })
  test('a private kitchen sink: cold and hot supplies both raised to 1/2', () => {
    for (const id of ['c-ks', 'h-ks']) {
      const p = r.pipes[id]!
      const limit = doc.settings.velocityLimits[p.system]
      expect(L.sizes[velocityIndex(p.flowLps, limit)]!.nominal, id).toBe('3/8')
      expect(p, id).toMatchObject({ nominal: '1/2', sizeBasis: 'fixture-minimum' })
    }
  })
  test('the explanation says why, with the source', () => {
    const text = explainPipe(doc, r, 'c-ks')!.lines.join('\n')
    expect(text).toContain('Raised to 1/2 in, the minimum supply for a kitchen sink (ks)')
    expect(text).toContain('UPC 2018 Table A 103.1 "Sink, kitchen, domestic"')
  })
  test('a pipe that does not end at a fixture keeps its velocity size', () => {
    expect(r.pipes['c-heater']!.sizeBasis).toBe('velocity')
    expect(r.pipes['c-heater']!.fixtureMinimum).toBeNull()
  })
  test.each([
    ['water-closet-flush-valve', '1', 10],
    ['urinal-flush-valve', '3/4', 10],
  ])('%s at a %s in minimum: a high velocity limit would allow less', (fixture, min, limit) => {
    const d = diagram([supply, { id: 'f', kind: 'fixture', fixture }], [cold('p', 's', 'f', 3)], {
      velocityLimits: { cold: limit, hot: 1.5 },
    })
    const p = computeDiagram(d).pipes.p!
    const byVelocity = velocityIndex(p.flowLps, limit)
    expect(L.sizes.findIndex((z) => z.nominal === min)).toBeGreaterThan(byVelocity)
    expect(p).toMatchObject({ nominal: min, sizeBasis: 'fixture-minimum' })
  })
})

describe('a locked size below the minimum', () => {
  const doc = diagram(
    [supply, { id: 'df', kind: 'fixture', fixture: 'drinking-fountain' }],
    [cold('p-df', 's', 'df', 3, { nominal: '3/8' })],
  )
  const r = computeDiagram(doc)
  test('is kept and reported as a warning naming the pipe and the fixture', () => {
    expect(r.pipes['p-df']).toMatchObject({ nominal: '3/8', locked: true, sizeBasis: 'locked' })
    const issue = r.issues.find((i) => i.code === 'below-fixture-minimum')!
    expect(issue).toMatchObject({ severity: 'warning', ids: ['p-df', 'df'] })
    expect(issue.message).toContain('p-df')
    expect(issue.message).toContain('drinking fountain df')
    expect(issue.message).toContain('1/2 in')
    expect(r.ok).toBe(true)
  })
  test('a locked size at or above it is not reported', () => {
    const ok = diagram(doc.nodes, [cold('p-df', 's', 'df', 3, { nominal: '1/2' })])
    expect(computeDiagram(ok).issues.map((i) => i.code)).not.toContain('below-fixture-minimum')
  })
})

describe('load basis default', () => {
  test('a document that names no basis uses per-fixture (IPC Table E103.3(2))', () => {
    const d = diagram(
      [supply, { id: 'wc', kind: 'fixture', fixture: 'water-closet-flush-valve', count: 2 }],
      [cold('p', 's', 'wc', 3)],
      { occupancy: 'public' },
    )
    expect(d.settings.loadBasis).toBe('per-fixture')
    // 2 × 10 WSFU public flush valve closets (IPC row, M), not the series' 40 + 30.
    expect(computeDiagram(d).pipes.p!.load).toBe(20)
  })
})
