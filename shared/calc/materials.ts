/**
 * Pipe materials: inside diameters and friction data. Inside diameters are the reference's
 * (/work/shared/reference/water-supply-sizing.md §3) in inches, converted to mm here; each
 * material names its source ids ([Sxx]) and status tags (C, C*, M, X) as the reference does.
 */
import { inchToMm } from './units.ts'

/** One size of a material. */
export interface PipeSize {
  /** Nominal size as written on drawings: "1/2", "1-1/4" ... */
  nominal: string
  /** Metric designation commonly paired with the nominal size. */
  dn: number
  insideDiameterMm: number
  /** Status tag of the inside diameter (C, C*, M, X). */
  status: string
}

/** A pipe material: sizes ascending by inside diameter. */
export interface Material {
  key: string
  label: string
  standard: string
  /** Hazen-Williams C. */
  hazenWilliamsC: number
  /** Absolute roughness for Darcy-Weisbach, mm. */
  roughnessMm: number
  sizes: PipeSize[]
  source: string
}

// Nominal → DN pairing: C* [S36] for steel; CTS materials share the designation (common practice).
const DN: Record<string, number> = {
  '3/8': 10,
  '1/2': 15,
  '3/4': 20,
  '1': 25,
  '1-1/4': 32,
  '1-1/2': 40,
  '2': 50,
  '2-1/2': 65,
  '3': 80,
  '3-1/2': 90,
  '4': 100,
  '5': 125,
  '6': 150,
  '8': 200,
  '10': 250,
  '12': 300,
}

function sizes(rows: [string, number, string][]): PipeSize[] {
  return rows.map(([nominal, idIn, status]) => ({
    nominal,
    dn: DN[nominal] ?? 0,
    insideDiameterMm: inchToMm(idIn),
    status,
  }))
}

// ASTM B88 drawn tube: CDA Copper Tube Handbook Table 14.2f (K, L: C [S26]); M: C* [S28], [S29].
// 3-1/2 in is left out: the nominal list for copper-tube sizes stops at 3 then 4.
const COPPER_NOMINALS = ['3/8', '1/2', '3/4', '1', '1-1/4', '1-1/2', '2', '2-1/2', '3', '4']
const COPPER_ID: Record<'k' | 'l' | 'm', number[]> = {
  k: [0.402, 0.527, 0.745, 0.995, 1.245, 1.481, 1.959, 2.435, 2.907, 3.857],
  l: [0.43, 0.545, 0.785, 1.025, 1.265, 1.505, 1.985, 2.465, 2.945, 3.905],
  m: [0.45, 0.569, 0.811, 1.055, 1.291, 1.527, 2.009, 2.495, 2.981, 3.935],
}

function copper(type: 'k' | 'l' | 'm'): Material {
  const status = type === 'm' ? 'C*' : 'C'
  return {
    key: `copper-${type}`,
    label: `Copper tube, Type ${type.toUpperCase()}`,
    standard: 'ASTM B88 (drawn)',
    // C 130-140 for copper, C* [S48], [S49]; 140 = new drawn tube, the upper end.
    hazenWilliamsC: 140,
    // Drawn copper 1.5 µm, C* [S57], [S49].
    roughnessMm: 0.0015,
    sizes: sizes(
      COPPER_NOMINALS.map((n, i) => [
        n,
        COPPER_ID[type][i]!,
        n === '3/8' && type === 'm' ? 'C*' : status,
      ]),
    ),
    source: 'Inside diameters: CDA Copper Tube Handbook Table 14.2f [S26] (K, L), [S28]/[S29] (M)',
  }
}

/** Materials by key. */
export const MATERIALS: Record<string, Material> = {
  'copper-k': copper('k'),
  'copper-l': copper('l'),
  'copper-m': copper('m'),
  pex: {
    key: 'pex',
    label: 'PEX tubing, CTS SDR 9',
    standard: 'ASTM F876 / F877',
    // Polyethylene 140, C* [S48]; PEX is not listed separately.
    hazenWilliamsC: 140,
    // Plastics 0.0015-0.007 mm, C* [S59], [S60]; the rougher end is taken.
    roughnessMm: 0.007,
    sizes: sizes([
      ['3/8', 0.36, 'C*'],
      ['1/2', 0.485, 'C*'],
      ['3/4', 0.681, 'C*'],
      ['1', 0.875, 'C*'],
      ['1-1/4', 1.069, 'X/M'],
      ['1-1/2', 1.263, 'X/M'],
      ['2', 1.653, 'X/M'],
    ]),
    source:
      'ID = OD − 2 × min wall: supplier sheet in county records [S33]; 1-1/4 in up from SDR 9 (X/M)',
  },
  cpvc: {
    key: 'cpvc',
    label: 'CPVC, CTS SDR 11',
    standard: 'ASTM D2846',
    // PVC, CPVC 150, C* [S48].
    hazenWilliamsC: 150,
    roughnessMm: 0.007,
    sizes: sizes([
      ['1/2', 0.489, 'C*'],
      ['3/4', 0.715, 'C*'],
      ['1', 0.921, 'C*'],
      ['1-1/4', 1.125, 'C*'],
      ['1-1/2', 1.329, 'C*'],
      ['2', 1.739, 'C*'],
    ]),
    source: 'Average ID from ASTM D2846 Table I as reproduced by a manufacturer [S34]',
  },
  'steel-40': {
    key: 'steel-40',
    label: 'Steel pipe, Schedule 40',
    standard: 'ASME B36.10M',
    // New steel 140-150 and aged 100 both C* [S48]; 120 is the common design pick (M).
    hazenWilliamsC: 120,
    // Commercial steel 45 µm, C* [S57], [S49].
    roughnessMm: 0.045,
    sizes: sizes([
      ['1/2', 0.622, 'C*'],
      ['3/4', 0.824, 'C*'],
      ['1', 1.049, 'C*'],
      ['1-1/4', 1.38, 'C*'],
      ['1-1/2', 1.61, 'C*'],
      ['2', 2.067, 'C*'],
      ['2-1/2', 2.469, 'C*'],
      ['3', 3.068, 'C*'],
      ['3-1/2', 3.548, 'C*'],
      ['4', 4.026, 'C*'],
      // Larger sizes for building mains: from memory, not in the reference (M).
      ['5', 5.047, 'M'],
      ['6', 6.065, 'M'],
      ['8', 7.981, 'M'],
      ['10', 10.02, 'M'],
      ['12', 11.938, 'M'],
    ]),
    source: 'Walls: Grinnell handbook [S36]; IDs [S37], [S38], [S39]; 5-12 in from memory (M)',
  },
}

/** Index of a nominal size within a material, or -1. */
export function sizeIndex(material: Material, nominal: string): number {
  const sizes = material.sizes
  for (let i = 0; i < sizes.length; i++) if (sizes[i]!.nominal === nominal) return i
  return -1
}

/** A nominal designation in inches: "3/8" → 0.375, "1-1/4" → 1.25, "2" → 2. NaN if unreadable. */
export function nominalInches(nominal: string): number {
  const m = /^(?:(\d+)(?:-(\d+)\/(\d+))?|(\d+)\/(\d+))$/.exec(nominal.trim())
  if (!m) return NaN
  if (m[4] !== undefined) return Number(m[4]) / Number(m[5])
  return Number(m[1]) + (m[2] !== undefined ? Number(m[2]) / Number(m[3]) : 0)
}

/** Index of the smallest size of `material` at least `nominal` (by inches); 0 when none given. */
export function sizeAtLeast(material: Material, nominal: string | null): number {
  if (nominal === null) return 0
  const key = `${material.key}|${nominal}`
  let i = atLeastCache.get(key)
  if (i === undefined) {
    const need = nominalInches(nominal)
    const sizes = material.sizes
    i = sizes.findIndex((s) => nominalInches(s.nominal) >= need)
    if (i < 0) i = sizes.length - 1
    atLeastCache.set(key, i)
  }
  return i
}
// Compiling a large diagram asks the same few questions many times.
const atLeastCache = new Map<string, number>()
