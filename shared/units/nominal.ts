/**
 * Nominal pipe sizes. The document stores copper-tube-size nominal strings ("3/4", "1-1/4");
 * US display adds the inch mark, SI display uses the DN designation (ISO 6708) of the same size.
 */
import type { ParseResult } from './parse.ts'
import type { UnitSystem } from './system.ts'

/** A nominal size: its stored string, its value in inches and its DN (null when none exists). */
export interface NominalSize {
  nominal: string
  inches: number
  dn: number | null
}

/** Nominal sizes in ascending order with their DN equivalents (5/8 has none). */
export const NOMINAL_SIZES: readonly NominalSize[] = [
  { nominal: '3/8', inches: 0.375, dn: 10 },
  { nominal: '1/2', inches: 0.5, dn: 15 },
  { nominal: '5/8', inches: 0.625, dn: null },
  { nominal: '3/4', inches: 0.75, dn: 20 },
  { nominal: '1', inches: 1, dn: 25 },
  { nominal: '1-1/4', inches: 1.25, dn: 32 },
  { nominal: '1-1/2', inches: 1.5, dn: 40 },
  { nominal: '2', inches: 2, dn: 50 },
  { nominal: '2-1/2', inches: 2.5, dn: 65 },
  { nominal: '3', inches: 3, dn: 80 },
  { nominal: '3-1/2', inches: 3.5, dn: 90 },
  { nominal: '4', inches: 4, dn: 100 },
  { nominal: '5', inches: 5, dn: 125 },
  { nominal: '6', inches: 6, dn: 150 },
  { nominal: '8', inches: 8, dn: 200 },
]

const BY_NOMINAL = new Map(NOMINAL_SIZES.map((size) => [size.nominal, size]))

// Whole inches, a fraction, or both joined by a hyphen or a space: 2, 3/4, 1-1/4, 1 1/4.
const FRACTIONAL_INCHES = /^(?:(\d+)(?:[-\s]+(\d+)\/(\d+))?|(\d+)\/(\d+))$/

/**
 * Value in inches of a nominal string, or null when it is not whole inches and/or a fraction.
 * @example nominalInches('1-1/4') // 1.25
 */
export function nominalInches(nominal: string): number | null {
  const m = FRACTIONAL_INCHES.exec(nominal.trim())
  if (!m) return null
  const [, whole, num, den, onlyNum, onlyDen] = m
  if (onlyNum !== undefined) return Number(onlyDen) === 0 ? null : Number(onlyNum) / Number(onlyDen)
  if (num !== undefined && Number(den) === 0) return null
  return Number(whole) + (num !== undefined ? Number(num) / Number(den) : 0)
}

/** DN number of a nominal size, or null when the table has none: `nominalToDn('2')` → 50. */
export function nominalToDn(nominal: string): number | null {
  return BY_NOMINAL.get(nominal.trim())?.dn ?? null
}

/**
 * Display text of a nominal size: `formatNominal('1-1/4', 'us')` → `'1-1/4"'`,
 * `formatNominal('1-1/4', 'si')` → `'DN32'`. Sizes without a DN keep the inch form in SI;
 * a missing size shows as an em dash.
 */
export function formatNominal(nominal: string | null | undefined, units: UnitSystem): string {
  if (nominal === null || nominal === undefined || nominal.trim() === '') return '—'
  const trimmed = nominal.trim()
  const dn = nominalToDn(trimmed)
  if (units === 'si' && dn !== null) return `DN${dn}`
  return nominalInches(trimmed) === null ? trimmed : `${trimmed}"`
}

/**
 * Reads a size typed by a user into the stored nominal string. Accepts `1-1/4`, `1 1/4`,
 * `1-1/4"`, `1.25`, `DN32` and `32` (a bare number above 8 is read as DN).
 * @example parseNominal('DN32') // { ok: true, value: '1-1/4' }
 */
export function parseNominal(
  input: string | null | undefined,
  field = 'Size',
): ParseResult<string> {
  const text = (input ?? '')
    .trim()
    .replace(/(?:"|in|inch)$/i, '')
    .trim()
  if (text === '') return { ok: false, error: `${field} is required` }
  const dnMatch = /^(?:dn\s*)(\d+)$/i.exec(text)
  const bare = Number(text)
  let size: NominalSize | undefined
  if (dnMatch) {
    size = NOMINAL_SIZES.find((s) => s.dn === Number(dnMatch[1]))
  } else if (Number.isFinite(bare) && bare > 8) {
    size = NOMINAL_SIZES.find((s) => s.dn === bare)
  } else {
    const inches = Number.isFinite(bare) ? bare : nominalInches(text)
    size = NOMINAL_SIZES.find((s) => s.inches === inches)
  }
  if (!size) {
    return {
      ok: false,
      error: `${field}: unknown nominal size "${(input ?? '').trim()}" (e.g. 3/4, 1-1/4 or DN32)`,
    }
  }
  return { ok: true, value: size.nominal }
}
