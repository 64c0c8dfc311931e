// Table-driven checks against published values; each row names its source (reference ids [Sxx]
// from /work/shared/reference/water-supply-sizing.md and its status tag).
import { describe, expect, test } from 'vitest'
import { readDemand } from '../../../shared/calc/demand.ts'
import { DEMAND_TABLES, IPC_DEMAND_TABLE } from '../../../shared/calc/demand-tables.ts'
import { FIXTURES } from '../../../shared/calc/fixtures.ts'
import { MATERIALS } from '../../../shared/calc/materials.ts'
import { seriesLoad } from '../../../shared/calc/series.ts'
import { GPM_TO_LPS, psiToKPa } from '../../../shared/calc/units.ts'

const ipc = DEMAND_TABLES[IPC_DEMAND_TABLE]!.columns

describe('Hunter demand, IPC Table E103.3(3)', () => {
  // C1: Engineering ToolBox "Converting WSFU to GPM" [S5]; reference §1.2 and §8 rows 1-5.
  test.each([
    [1, 3.0],
    [2, 5.0],
    [4, 8.0],
    [8, 12.8],
    [15, 17.5],
    [30, 23.3],
    [50, 29.1],
  ])('flush tanks: %d WSFU → %d gpm [S5, C1]', (load, gpm) => {
    const r = readDemand(ipc['flush-tank'], load)
    expect(r.gpm).toBe(gpm)
    expect(r.lps).toBeCloseTo(gpm * 0.0630902, 4)
  })
  test.each([
    [5, 15.0],
    [7, 19.8],
    [10, 27.0],
    [15, 31.0],
    [20, 35.0],
    [30, 42.0],
    [50, 50.0],
  ])('flush valves: %d WSFU → %d gpm [S5, C1]', (load, gpm) => {
    expect(readDemand(ipc['flush-valve'], load).gpm).toBe(gpm)
  })
  // Illinois Table N, C [S6]: same values as the IPC flush-tank column at these rows.
  test.each([
    [100, 43.5],
    [1000, 208],
  ])('flush tanks: %d WSFU → %d gpm [S6, C]', (load, gpm) => {
    expect(readDemand(ipc['flush-tank'], load).gpm).toBe(gpm)
  })
  test('30 WSFU flush tanks = 1.470 L/s (reference §7.2)', () => {
    expect(readDemand(ipc['flush-tank'], 30).lps).toBeCloseTo(1.47, 3)
  })
  test('interpolates linearly: 22.2 WSFU → 20.44 gpm (reference §7.2, X)', () => {
    expect(readDemand(ipc['flush-tank'], 22.2).gpm).toBeCloseTo(20.436, 3)
  })
  test('below the first row and beyond the last', () => {
    // 0.25 WSFU on the flush-tank line through the origin = 0.75 gpm (IPC 604.3 fountain, C [S3]).
    expect(readDemand(ipc['flush-tank'], 0.25).gpm).toBeCloseTo(0.75, 9)
    expect(readDemand(ipc['flush-valve'], 3)).toMatchObject({ gpm: 15, range: 'below-first-row' })
    expect(readDemand(ipc['flush-tank'], 0).gpm).toBe(0)
    const beyond = readDemand(ipc['flush-tank'], 6000)
    expect(beyond.range).toBe('beyond-last-row')
    expect(beyond.gpm).toBeCloseTo(593 + (68 * 1000) / 1000, 9)
  })
  test('both columns meet from 1000 WSFU (C [S7])', () => {
    for (const load of [1000, 1500, 2500, 5000]) {
      expect(readDemand(ipc['flush-tank'], load).gpm).toBe(readDemand(ipc['flush-valve'], load).gpm)
    }
  })
  test('columns rise monotonically', () => {
    for (const column of Object.values(ipc)) {
      for (let i = 1; i < column.length; i++) {
        expect(column[i]!.load).toBeGreaterThan(column[i - 1]!.load)
        expect(column[i]!.gpm).toBeGreaterThan(column[i - 1]!.gpm)
      }
    }
  })
})

describe('fixture loads', () => {
  // IPC 2018 Table E103.3(2), C [S15] (reference §2.1 confirmed rows).
  test.each([
    ['lavatory', 'public', 1.5, 1.5, 2.0],
    ['lavatory', 'private', 0.5, 0.5, 0.7],
    ['bathtub', 'public', 3.0, 3.0, 4.0],
    ['bathtub', 'private', 1.0, 1.0, 1.4],
    ['kitchen-sink', 'public', 3.0, 3.0, 4.0],
    ['kitchen-sink', 'private', 1.0, 1.0, 1.4],
    ['bidet', 'private', 1.5, 1.5, 2.0],
    ['dishwasher', 'private', 0, 1.4, 1.4],
    ['drinking-fountain', 'public', 0.25, 0, 0.25],
    ['service-sink', 'public', 2.25, 2.25, 3.0],
    ['laundry-tray', 'private', 1.0, 1.0, 1.4],
    ['bathroom-group-tank', 'private', 2.7, 1.5, 3.6],
    ['bathroom-group-flush-valve', 'private', 6.0, 3.0, 8.0],
  ] as const)('IPC %s (%s): %d / %d / %d [S15, C]', (key, occ, cold, hot, total) => {
    expect(FIXTURES[key]!.ipc[occ]).toEqual({ cold, hot, total })
  })
  // UPC 2018 Table A 103.1, C [S13] (reference §2.2): totals.
  test.each([
    ['lavatory', 'private', 1.0],
    ['water-closet-tank', 'private', 2.5],
    ['bathtub', 'private', 4.0],
    ['shower', 'private', 2.0],
    ['kitchen-sink', 'private', 1.5],
    ['dishwasher', 'private', 1.5],
    ['clothes-washer', 'private', 4.0],
    ['hose-bibb', 'public', 2.5],
    ['bar-sink', 'public', 2.0],
    ['service-sink', 'public', 3.0],
    ['drinking-fountain', 'public', 0.5],
    ['urinal-tank', 'public', 2.0],
  ] as const)('UPC %s (%s): total %d [S13, C]', (key, occ, total) => {
    expect(FIXTURES[key]!.upc[occ].total).toBe(total)
  })
  test('UPC house of reference §8 row 11 totals 18.0 WSFU [S13]', () => {
    const t = (k: string) => FIXTURES[k]!.upc.private.total
    const sum =
      2 * t('water-closet-tank') +
      2 * t('lavatory') +
      2 * t('shower') +
      t('kitchen-sink') +
      t('dishwasher') +
      t('clothes-washer')
    expect(sum).toBe(18.0)
  })
  test('every catalogue key of the issue exists, with sources and both occupancies', () => {
    const keys = [
      'lavatory',
      'water-closet-tank',
      'water-closet-flush-valve',
      'urinal-tank',
      'urinal-flush-valve',
      'bathtub',
      'shower',
      'kitchen-sink',
      'bar-sink',
      'service-sink',
      'laundry-tray',
      'drinking-fountain',
      'dishwasher',
      'clothes-washer',
      'hose-bibb',
      'bidet',
      'bathroom-group-tank',
      'bathroom-group-flush-valve',
    ]
    for (const k of keys) {
      const f = FIXTURES[k]!
      expect(f, k).toBeDefined()
      expect(f.ipc.source.length).toBeGreaterThan(0)
      expect(f.upc.source.length).toBeGreaterThan(0)
      for (const occ of ['public', 'private'] as const) {
        expect(f.ipc[occ].total).toBeGreaterThan(0)
      }
    }
    expect(FIXTURES['water-closet-flush-valve']!.flushValve).toBe('closet')
    expect(FIXTURES['urinal-flush-valve']!.flushValve).toBe('urinal')
  })
  // IPC Table 604.3, C [S3] (reference §5.2 and §8 row 27).
  test.each([
    ['water-closet-flush-valve', 35],
    ['urinal-flush-valve', 25],
    ['water-closet-tank', 20],
    ['lavatory', 8],
  ])('%s needs %d psi [S3, C]', (key, psi) => {
    expect(FIXTURES[key]!.minPressureKPa).toBeCloseTo(psiToKPa(psi), 9)
  })
})

describe('flush valve series (UPC practice, C* [S18]; reference §2.3)', () => {
  test.each([
    [1, 40],
    [2, 70],
    [3, 90],
    [4, 105],
    [5, 115],
    [6, 125],
    [8, 145],
    [10, 165],
  ])('%d water closets → %d FU', (n, fu) => expect(seriesLoad('closet', n)).toBe(fu))
  test.each([
    [1, 20],
    [2, 35],
    [3, 45],
    [4, 53],
    [5, 58],
    [6, 63],
    [7, 68],
    [8, 73],
    [10, 83],
  ])('%d urinals → %d FU', (n, fu) => expect(seriesLoad('urinal', n)).toBe(fu))
  test('4 water closets + 3 urinals = 150 FU (reference §7.1 #5)', () => {
    expect(seriesLoad('closet', 4) + seriesLoad('urinal', 3)).toBe(150)
  })
  test('none → 0', () => expect(seriesLoad('closet', 0)).toBe(0))
})

describe('pipe inside diameters', () => {
  const id = (m: string, n: string) =>
    MATERIALS[m]!.sizes.find((s) => s.nominal === n)!.insideDiameterMm / 25.4
  // Reference §8 rows 17-20.
  test.each([
    ['copper-l', '3/4', 0.785, 'CDA Table 14.2f [S26], C'],
    ['copper-k', '1', 0.995, 'CDA Table 14.2f [S26], C'],
    ['copper-m', '1/2', 0.569, '[S28], C*'],
    ['copper-l', '1-1/4', 1.265, 'CDA Table 14.2f [S26], C'],
    ['steel-40', '1', 1.049, 'Grinnell [S36], [S39], C*'],
    ['cpvc', '3/4', 0.715, 'ASTM D2846 Table I via [S34], C*'],
    ['pex', '3/4', 0.681, 'supplier sheet [S33], C*'],
  ])('%s %s: ID %d in (%s)', (m, n, inches) => {
    expect(id(m, n)).toBeCloseTo(inches, 9)
  })
  test('every material: sizes ascend, C and source given', () => {
    for (const key of ['copper-k', 'copper-l', 'copper-m', 'pex', 'cpvc', 'steel-40']) {
      const m = MATERIALS[key]!
      expect(m.hazenWilliamsC).toBeGreaterThan(0)
      expect(m.source.length).toBeGreaterThan(0)
      for (let i = 1; i < m.sizes.length; i++) {
        expect(m.sizes[i]!.insideDiameterMm).toBeGreaterThan(m.sizes[i - 1]!.insideDiameterMm)
      }
    }
  })
  test('gpm conversion is the exact gallon', () => expect(GPM_TO_LPS).toBeCloseTo(0.0630902, 7))
})
