/**
 * Every material's sizes in flat number arrays, built once per process, so the sizing loop reads
 * numbers by index instead of walking objects: inside diameter, bore area, and the Hazen-Williams
 * factor of each size. A pipe then carries only the flat index of its material's first size.
 */
import { MATERIALS, type Material } from './materials.ts'
import { KPA_PER_METRE } from './units.ts'

/** Flat size tables; sizes of material m are [start[m], start[m] + count[m]). */
export interface SizeTables {
  materials: Material[]
  materialIndex: Map<string, number>
  start: Int32Array
  count: Int32Array
  /** Per flat size: inside diameter, mm. */
  idMm: Float64Array
  /** Per flat size: bore area, m². */
  area: Float64Array
  /**
   * Per flat size: kPa per metre of equivalent length per (m³/s)^1.852, so that the loss is
   * hw · L · Q^1.852 — the SI Hazen-Williams form h = 10.67 · L · Q^1.852 / (C^1.852 · D^4.87)
   * (h, L, D in m, Q in m³/s; C* [S41], reference §4.1) times 9.81 kPa per metre of head.
   */
  hw: Float64Array
  /** Per flat size: the material's absolute roughness, mm. */
  roughnessMm: Float64Array
}

/** Builds the flat tables of `materials` (the catalogue by default). */
export function buildSizeTables(materials: Record<string, Material> = MATERIALS): SizeTables {
  const list = Object.values(materials)
  const total = list.reduce((n, m) => n + m.sizes.length, 0)
  const t: SizeTables = {
    materials: list,
    materialIndex: new Map(list.map((m, i) => [m.key, i])),
    start: new Int32Array(list.length),
    count: new Int32Array(list.length),
    idMm: new Float64Array(total),
    area: new Float64Array(total),
    hw: new Float64Array(total),
    roughnessMm: new Float64Array(total),
  }
  let k = 0
  list.forEach((m, i) => {
    t.start[i] = k
    t.count[i] = m.sizes.length
    const c = m.hazenWilliamsC ** 1.852
    for (const s of m.sizes) {
      const d = s.insideDiameterMm / 1000
      t.idMm[k] = s.insideDiameterMm
      t.area[k] = (Math.PI * d * d) / 4
      t.hw[k] = (KPA_PER_METRE * 10.67) / (c * d ** 4.87)
      t.roughnessMm[k] = m.roughnessMm
      k++
    }
  })
  return t
}

/** The catalogue's tables. */
export const SIZE_TABLES = buildSizeTables()

/**
 * Largest flow, L/s, each flat size carries at `limitMps`: a flow fits a size when it is at most
 * this capacity, the same test as "inside diameter ≥ minDiameterMm(flow, limit)" without a square
 * root per pipe.
 */
export function capacities(t: SizeTables, limitMps: number): Float64Array {
  return Float64Array.from(t.area, (a) => a * limitMps * 1000)
}
