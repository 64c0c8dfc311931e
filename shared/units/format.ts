/**
 * Display strings for stored SI values. Missing or non-finite values show as an em dash so a
 * half-computed diagram still renders.
 */
import { QUANTITIES, toDisplay, type Quantity } from './quantities.ts'
import type { UnitSystem } from './system.ts'

/** Shown in place of a value that is missing or not a finite number. */
export const NO_VALUE = '—'

/** Options for {@link formatQuantity}. */
export interface FormatOptions {
  /** Append the unit symbol (default true). */
  unit?: boolean
}

/**
 * Rounds to `significant` digits but never more than `maxDecimals` decimals, and returns the
 * digits as text (no exponent): 1.2618 → "1.26", 12.618 → "12.6", 1262 → "1262".
 */
export function roundForDisplay(value: number, significant: number, maxDecimals: number): string {
  if (value === 0) return '0'
  // Round to the significant digits first so 9.996 becomes 10.0, not 10.00.
  const rounded = Number(value.toPrecision(significant))
  const magnitude = Math.floor(Math.log10(Math.abs(rounded)))
  const decimals = Math.min(Math.max(significant - 1 - magnitude, 0), maxDecimals)
  const text = value.toFixed(decimals)
  // "-0.00" reads as a sign error; show it as zero.
  return Number(text) === 0 ? (0).toFixed(decimals) : text
}

/**
 * Formats a stored SI value in the display unit system, e.g.
 * `formatQuantity('pressure', 344.7, 'us')` → `'50.0 psi'`.
 */
export function formatQuantity(
  quantity: Quantity,
  si: number | null | undefined,
  units: UnitSystem,
  options: FormatOptions = {},
): string {
  if (si === null || si === undefined || !Number.isFinite(si)) return NO_VALUE
  const spec = QUANTITIES[quantity]
  const digits = roundForDisplay(
    toDisplay(quantity, si, units),
    spec.significant,
    spec.maxDecimals[units],
  )
  return options.unit === false ? digits : `${digits} ${spec.symbol[units]}`
}

/** Flow from L/s: `formatFlow(1.2618, 'si')` → `'1.26 L/s'`, `formatFlow(1.2618, 'us')` → `'20.0 gpm'`. */
export function formatFlow(lps: number | null | undefined, units: UnitSystem): string {
  return formatQuantity('flow', lps, units)
}

/** Pressure from kPa: `formatPressure(344.7, 'si')` → `'345 kPa'`, in US `'50.0 psi'`. */
export function formatPressure(kPa: number | null | undefined, units: UnitSystem): string {
  return formatQuantity('pressure', kPa, units)
}

/** Pipe length from m: `formatLength(12.5, 'si')` → `'12.5 m'`, in US `'41.0 ft'`. */
export function formatLength(m: number | null | undefined, units: UnitSystem): string {
  return formatQuantity('length', m, units)
}

/** Velocity from m/s: `formatVelocity(1.92, 'si')` → `'1.92 m/s'`, in US `'6.3 ft/s'`. */
export function formatVelocity(mps: number | null | undefined, units: UnitSystem): string {
  return formatQuantity('velocity', mps, units)
}

/** Inside diameter from mm: `formatDiameter(26.04, 'si')` → `'26.0 mm'`, in US `'1.025 in'`. */
export function formatDiameter(mm: number | null | undefined, units: UnitSystem): string {
  return formatQuantity('diameter', mm, units)
}

/** Elevation from m, fixed decimals: `formatElevation(3.5, 'si')` → `'3.50 m'`, in US `'11.5 ft'`. */
export function formatElevation(m: number | null | undefined, units: UnitSystem): string {
  return formatQuantity('elevation', m, units)
}

/**
 * Water supply fixture units, the same in both systems: whole loads without decimals, others to
 * one decimal: `formatLoad(58)` → `'58 FU'`, `formatLoad(2.5)` → `'2.5 FU'`.
 */
export function formatLoad(fu: number | null | undefined): string {
  if (fu === null || fu === undefined || !Number.isFinite(fu)) return NO_VALUE
  const tenths = Math.round(fu * 10) / 10
  return `${Number.isInteger(tenths) ? tenths.toFixed(0) : tenths.toFixed(1)} FU`
}
