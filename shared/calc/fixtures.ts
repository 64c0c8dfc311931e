/**
 * Fixture catalogue. Two load columns per fixture:
 * - `ipc`: cold/hot/total WSFU of IPC Table E103.3(2) (2018 IPC page image, C [S15]; rows marked M
 *   are from memory, reference §2.1) — the catalogue of the per-fixture basis.
 * - `upc`: UPC Table A 103.1 totals (UPC 2018 Appendix A, C [S13], reference §2.2) used beside the
 *   flush valve series, as the plan-check worksheet that carries the series does (C* [S18]). The UPC
 *   prints a total only; cold and hot are each 3/4 of it for fixtures with both supplies (UPC
 *   note, M). For flush valve fixtures `upc` holds only what is added on top of the series.
 * Minimum flow pressures come from IPC Table 604.3 (C [S3]). Minimum supply sizes come from the
 * "Min. branch pipe" column of UPC 2018 Table A 103.1 (C [S13], reference §2.2); they are applied
 * under both load bases (docs/calculation.md §3 says why).
 */
import type { Occupancy } from '../document/model.ts'
import { psiToKPa } from './units.ts'

/** Cold, hot and total load of one fixture, WSFU. */
export interface LoadValues {
  cold: number
  hot: number
  total: number
}

/** Loads by occupancy with the source of the values. */
export interface LoadColumn {
  public: LoadValues
  private: LoadValues
  source: string
}

/** Which diminishing series a flush valve fixture joins. */
export type FlushValveKind = 'closet' | 'urinal'

/** One catalogue entry. */
export interface FixtureSpec {
  key: string
  label: string
  flushValve: FlushValveKind | null
  /** Which supplies the fixture takes. */
  supplies: { cold: boolean; hot: boolean }
  ipc: LoadColumn
  upc: LoadColumn
  /** Minimum flow pressure, kPa; null = the project default applies. */
  minPressureKPa: number | null
  minPressureSource: string
  /** Smallest nominal size of the pipe that supplies the fixture ("1/2"), cold side. */
  minNominal: string
  /** The same for the hot supply (smaller only for a flush valve group: its hot side is 1/2 in). */
  minNominalHot: string
  minNominalSource: string
}

const cold = (total: number): LoadValues => ({ cold: total, hot: 0, total })
const hot = (total: number): LoadValues => ({ cold: 0, hot: total, total })
const both = (c: number, h: number, total: number): LoadValues => ({ cold: c, hot: h, total })
// UPC split: 3/4 of the total on each supply (UPC Table A 103.1 note, M).
const upcBoth = (total: number): LoadValues => both(0.75 * total, 0.75 * total, total)
const same = (v: LoadValues, source: string): LoadColumn => ({ public: v, private: v, source })
const col = (pub: LoadValues, priv: LoadValues, source: string): LoadColumn => ({
  public: pub,
  private: priv,
  source,
})

const IPC_C = 'IPC 2018 Table E103.3(2), C [S15]'
const IPC_M = 'IPC Table E103.3(2), from memory (M)'
const UPC_C = 'UPC 2018 Table A 103.1, C [S13]; cold/hot = 3/4 of total (M)'
const P604 = (psi: number, row: string) => ({
  minPressureKPa: psiToKPa(psi),
  minPressureSource: `IPC Table 604.3 "${row}": ${psi} psi, C [S3]`,
})
const LOW = (row: string) => ({
  minPressureKPa: psiToKPa(8),
  minPressureSource: `IPC Table 604.3 "${row}": 8 psi, C [S3]`,
})
// "Min. branch pipe" of UPC 2018 Table A 103.1 (C [S13]).
const A103 = (nominal: string, row: string) => ({
  minNominal: nominal,
  minNominalHot: nominal,
  minNominalSource: `UPC 2018 Table A 103.1 "${row}", min. branch pipe ${nominal} in, C [S13]`,
})
const NONE = { minPressureKPa: null, minPressureSource: 'not in IPC Table 604.3' }

const BOTH = { cold: true, hot: true }
const COLD = { cold: true, hot: false }
const HOT = { cold: false, hot: true }

const list: FixtureSpec[] = [
  {
    key: 'lavatory',
    label: 'Lavatory',
    flushValve: null,
    supplies: BOTH,
    ipc: col(both(1.5, 1.5, 2.0), both(0.5, 0.5, 0.7), IPC_C),
    upc: same(upcBoth(1.0), UPC_C),
    ...LOW('Lavatory, public'),
    ...A103('1/2', 'Lavatory'),
  },
  {
    key: 'water-closet-tank',
    label: 'Water closet, flush tank',
    flushValve: null,
    supplies: COLD,
    ipc: col(cold(5.0), cold(2.2), IPC_M),
    upc: same(cold(2.5), 'UPC 2018 Table A 103.1 (1.6 gpf gravity tank), C [S13]'),
    ...P604(20, 'Water closet, tank, close coupled'),
    ...A103('1/2', 'Water closet, 1.6 gpf gravity tank'),
  },
  {
    key: 'water-closet-flush-valve',
    label: 'Water closet, flush valve',
    flushValve: 'closet',
    supplies: COLD,
    ipc: col(cold(10.0), cold(6.0), IPC_M),
    upc: same(cold(0), 'carried by the flush valve series, C* [S18]'),
    ...P604(35, 'Water closet, siphonic, flushometer valve'),
    ...A103('1', 'Water closet, 1.6 gpf flushometer valve'),
  },
  {
    key: 'urinal-tank',
    label: 'Urinal, flush tank',
    flushValve: null,
    supplies: COLD,
    // The IPC lists a public row only; private use takes the same value (our choice).
    ipc: same(cold(3.0), IPC_M),
    upc: same(cold(2.0), 'UPC 2018 Table A 103.1 (flush tank), C [S13]'),
    ...NONE,
    ...A103('1/2', 'Urinal, flush tank'),
  },
  {
    key: 'urinal-flush-valve',
    label: 'Urinal, flush valve',
    flushValve: 'urinal',
    supplies: COLD,
    // 3/4 in flush valve row (5.0); the 1 in valve row is 10.0 (both M).
    ipc: same(cold(5.0), `${IPC_M}, 3/4 in valve`),
    upc: same(cold(0), 'carried by the flush valve series, C* [S18]'),
    ...P604(25, 'Urinal, valve'),
    ...A103('3/4', 'Urinal, 1.0 gpf flushometer valve'),
  },
  {
    key: 'bathtub',
    label: 'Bathtub',
    flushValve: null,
    supplies: BOTH,
    ipc: col(both(3.0, 3.0, 4.0), both(1.0, 1.0, 1.4), IPC_C),
    upc: same(upcBoth(4.0), UPC_C),
    ...P604(20, 'Bathtub, balanced-pressure, thermostatic or combination mixing valve'),
    ...A103('1/2', 'Bathtub or combination bath/shower (fill)'),
  },
  {
    key: 'shower',
    label: 'Shower',
    flushValve: null,
    supplies: BOTH,
    ipc: col(both(3.0, 3.0, 4.0), both(1.0, 1.0, 1.4), IPC_M),
    upc: same(upcBoth(2.0), UPC_C),
    ...P604(20, 'Shower, balanced-pressure, thermostatic or combination mixing valve'),
    ...A103('1/2', 'Shower, per head'),
  },
  {
    key: 'kitchen-sink',
    label: 'Kitchen sink',
    flushValve: null,
    supplies: BOTH,
    // Public = the "hotel, restaurant" row.
    ipc: col(both(3.0, 3.0, 4.0), both(1.0, 1.0, 1.4), IPC_C),
    upc: same(upcBoth(1.5), UPC_C),
    ...LOW('Sink, residential'),
    ...A103('1/2', 'Sink, kitchen, domestic'),
  },
  {
    key: 'bar-sink',
    label: 'Bar sink',
    flushValve: null,
    supplies: BOTH,
    // Not in the IPC table: rated like a lavatory (IPC footnote a, similar flow and use; M).
    ipc: col(both(1.5, 1.5, 2.0), both(0.5, 0.5, 0.7), 'as lavatory, IPC E103.3(2) footnote a (M)'),
    upc: col(upcBoth(2.0), upcBoth(1.0), UPC_C),
    ...LOW('Sink, residential'),
    ...A103('1/2', 'Sink, bar'),
  },
  {
    key: 'service-sink',
    label: 'Service sink',
    flushValve: null,
    supplies: BOTH,
    ipc: same(both(2.25, 2.25, 3.0), `${IPC_C} (offices; no private row)`),
    upc: col(upcBoth(3.0), upcBoth(1.5), UPC_C),
    ...LOW('Sink, service'),
    ...A103('1/2', 'Sink, service or mop basin'),
  },
  {
    key: 'laundry-tray',
    label: 'Laundry tray',
    flushValve: null,
    supplies: BOTH,
    ipc: same(both(1.0, 1.0, 1.4), `${IPC_C} (private; no public row)`),
    upc: same(upcBoth(1.5), UPC_C),
    ...LOW('Laundry tray'),
    ...A103('1/2', 'Sink, laundry'),
  },
  {
    key: 'drinking-fountain',
    label: 'Drinking fountain',
    flushValve: null,
    supplies: COLD,
    ipc: same(cold(0.25), IPC_C),
    upc: col(cold(0.5), cold(0.5), 'UPC 2018 Table A 103.1, C [S13]'),
    ...LOW('Drinking fountain'),
    ...A103('1/2', 'Drinking fountain or water cooler'),
  },
  {
    key: 'dishwasher',
    label: 'Dishwasher',
    flushValve: null,
    supplies: HOT,
    ipc: same(hot(1.4), `${IPC_C} (private; no public row)`),
    upc: same(hot(1.5), 'UPC 2018 Table A 103.1 (domestic), C [S13]'),
    ...LOW('Dishwasher, residential'),
    ...A103('1/2', 'Dishwasher, domestic'),
  },
  {
    key: 'clothes-washer',
    label: 'Clothes washer',
    flushValve: null,
    supplies: BOTH,
    ipc: col(both(2.25, 2.25, 3.0), both(1.0, 1.0, 1.4), `${IPC_M} (8 lb machine)`),
    upc: same(upcBoth(4.0), UPC_C),
    ...NONE,
    ...A103('1/2', 'Clothes washer'),
  },
  {
    key: 'hose-bibb',
    label: 'Hose bibb',
    flushValve: null,
    supplies: COLD,
    // The IPC has no hose bibb row (it sends constant-use outlets to gpm, C [S10]); the UPC
    // value is used for both bases. UPC's reduced "each additional" value is not applied.
    ipc: same(cold(2.5), 'UPC 2018 Table A 103.1, C [S13] (no IPC row)'),
    upc: same(cold(2.5), 'UPC 2018 Table A 103.1, C [S13]'),
    ...LOW('Sillcock, hose bibb'),
    ...A103('1/2', 'Hose bibb'),
  },
  {
    key: 'bidet',
    label: 'Bidet',
    flushValve: null,
    supplies: BOTH,
    ipc: same(both(1.5, 1.5, 2.0), `${IPC_C} (private; no public row)`),
    upc: same(upcBoth(1.0), UPC_C),
    ...P604(20, 'Bidet, thermostatic mixing valve'),
    ...A103('1/2', 'Bidet'),
  },
  {
    key: 'bathroom-group-tank',
    label: 'Bathroom group, flush tank',
    flushValve: null,
    supplies: BOTH,
    ipc: same(both(2.7, 1.5, 3.6), `${IPC_C} (private; a dwelling group)`),
    // No UPC group row was read: sum of its fixtures, WC 2.5 + lavatory 1.0 + bathtub 4.0 (X).
    upc: same(both(6.25, 3.75, 7.5), 'sum of UPC Table A 103.1 rows [S13] (X)'),
    ...P604(20, 'Water closet, tank, close coupled'),
    // The group's largest fixture minimum (water closet tank, lavatory, bathtub: all 1/2 in, C
    // [S13]); taking the largest is our rule (X).
    minNominal: '1/2',
    minNominalHot: '1/2',
    minNominalSource: 'largest of its fixtures in UPC 2018 Table A 103.1, 1/2 in, C [S13] (X)',
  },
  {
    key: 'bathroom-group-flush-valve',
    label: 'Bathroom group, flush valve',
    flushValve: 'closet',
    supplies: BOTH,
    ipc: same(both(6.0, 3.0, 8.0), `${IPC_C} (private; a dwelling group)`),
    // Its water closet joins the series; lavatory 1.0 + bathtub 4.0 are added on top (X).
    upc: same(both(3.75, 3.75, 5.0), 'lavatory + bathtub of UPC Table A 103.1 [S13] (X)'),
    ...P604(35, 'Water closet, siphonic, flushometer valve'),
    // Cold side: the flushometer valve water closet, 1 in; hot side: lavatory and bathtub, 1/2 in
    // (C [S13]); the per-side split is our rule (X).
    minNominal: '1',
    minNominalHot: '1/2',
    minNominalSource:
      'UPC 2018 Table A 103.1 "Water closet, 1.6 gpf flushometer valve" 1 in (cold), ' +
      'lavatory and bathtub 1/2 in (hot), C [S13] (X)',
  },
]

/** The fixture catalogue by key. */
export const FIXTURES: Record<string, FixtureSpec> = Object.fromEntries(list.map((f) => [f.key, f]))

/** Catalogue loads of a fixture for a load column and occupancy. */
export function catalogueLoad(
  spec: FixtureSpec,
  column: 'ipc' | 'upc',
  occupancy: Occupancy,
): LoadValues {
  return spec[column][occupancy]
}
