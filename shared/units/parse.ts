/**
 * Reads what a user typed (in display units, optionally with a unit symbol) back into the SI value
 * the document stores. Errors name the field so a form can show them as they are.
 */
import { QUANTITIES, fromDisplay, type Quantity } from './quantities.ts'
import type { UnitSystem } from './system.ts'

/** Outcome of reading user input: the SI value, or a message naming the field. */
export type ParseResult<T = number> = { ok: true; value: T } | { ok: false; error: string }

/** What a form hands over: text from a text input, a number (or null) from a numeric input. */
export type UserInput = string | number | null | undefined

/** Unit spellings accepted after a number, lower case, for each quantity and system. */
const UNIT_ALIASES: Record<Quantity, Record<UnitSystem, string[]>> = {
  flow: { si: ['l/s', 'lps'], us: ['gpm', 'gal/min'] },
  pressure: { si: ['kpa'], us: ['psi'] },
  length: { si: ['m'], us: ['ft', "'"] },
  velocity: { si: ['m/s'], us: ['ft/s', 'fps'] },
  diameter: { si: ['mm'], us: ['in', '"'] },
  elevation: { si: ['m'], us: ['ft', "'"] },
}

const NUMBER_THEN_UNIT = /^([+-]?(?:\d+\.?\d*|\.\d+)(?:e[+-]?\d+)?)\s*(.*)$/i

function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1)
}

function unitOf(quantity: Quantity, symbol: string): UnitSystem | null {
  const lower = symbol.toLowerCase()
  const aliases = UNIT_ALIASES[quantity]
  if (aliases.si.includes(lower)) return 'si'
  if (aliases.us.includes(lower)) return 'us'
  return null
}

/**
 * Reads a value typed in `units` (or in the unit it names) and returns it in SI.
 * A number from a numeric input is taken as display units.
 *
 * @param field - name used in error messages; defaults to the quantity's name
 * @example parseQuantity('pressure', '50', 'us') // { ok: true, value: 344.737… } (kPa)
 * @example parseQuantity('pressure', '350 kPa', 'us') // { ok: true, value: 350 }
 * @example parseQuantity('flow', 'lots', 'si', 'Equipment flow')
 * // { ok: false, error: 'Equipment flow must be a number, got "lots"' }
 */
export function parseQuantity(
  quantity: Quantity,
  input: UserInput,
  units: UnitSystem,
  field: string = QUANTITIES[quantity].name,
): ParseResult {
  const label = capitalise(field)
  const spec = QUANTITIES[quantity]
  let display: number
  let system = units
  if (typeof input === 'number') {
    display = input
  } else {
    const text = (input ?? '').trim()
    if (text === '') return { ok: false, error: `${label} is required` }
    if (/\d,\d/.test(text)) {
      return { ok: false, error: `${label}: use a point for decimals and no thousands separator` }
    }
    const match = NUMBER_THEN_UNIT.exec(text)
    if (!match) return { ok: false, error: `${label} must be a number, got "${text}"` }
    display = Number(match[1])
    const symbol = match[2]!.trim()
    if (symbol !== '') {
      const named = unitOf(quantity, symbol)
      if (!named) {
        const expected = `${spec.symbol.si} or ${spec.symbol.us}`
        return { ok: false, error: `${label}: unknown unit "${symbol}" (use ${expected})` }
      }
      system = named
    }
  }
  if (!Number.isFinite(display)) return { ok: false, error: `${label} must be a finite number` }
  if (!spec.signed && display < 0) return { ok: false, error: `${label} cannot be negative` }
  return { ok: true, value: fromDisplay(quantity, display, system) }
}

/** Flow typed in display units → L/s. */
export function parseFlow(input: UserInput, units: UnitSystem, field?: string): ParseResult {
  return parseQuantity('flow', input, units, field)
}

/** Pressure typed in display units → kPa. */
export function parsePressure(input: UserInput, units: UnitSystem, field?: string): ParseResult {
  return parseQuantity('pressure', input, units, field)
}

/** Pipe length typed in display units → m. */
export function parseLength(input: UserInput, units: UnitSystem, field?: string): ParseResult {
  return parseQuantity('length', input, units, field)
}

/** Velocity typed in display units → m/s. */
export function parseVelocity(input: UserInput, units: UnitSystem, field?: string): ParseResult {
  return parseQuantity('velocity', input, units, field)
}

/** Inside diameter typed in display units → mm. */
export function parseDiameter(input: UserInput, units: UnitSystem, field?: string): ParseResult {
  return parseQuantity('diameter', input, units, field)
}

/** Elevation typed in display units → m (may be negative). */
export function parseElevation(input: UserInput, units: UnitSystem, field?: string): ParseResult {
  return parseQuantity('elevation', input, units, field)
}
