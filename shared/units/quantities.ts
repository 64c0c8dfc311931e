/**
 * The physical quantities the editor shows, their unit symbols in each system and the
 * numeric converters between the stored SI value and the displayed value.
 */
import {
  KPA_PER_PSI,
  LPS_PER_GPM,
  METRES_PER_FOOT,
  MILLIMETRES_PER_INCH,
  MPS_PER_FPS,
} from './factors.ts'
import type { UnitSystem } from './system.ts'

/** A displayable quantity. SI storage units: L/s, kPa, m, m/s, mm, m. */
export type Quantity = 'flow' | 'pressure' | 'length' | 'velocity' | 'diameter' | 'elevation'

/** How one quantity is shown: unit symbols, the size of one US unit in SI, display precision. */
export interface QuantitySpec {
  /** Lower-case noun used in messages, e.g. "pressure". */
  name: string
  symbol: Record<UnitSystem, string>
  /** Value of one US unit in the SI storage unit (e.g. 1 psi = 6.894757… kPa). */
  siPerUs: number
  /** Input may be below zero (only elevations). */
  signed: boolean
  /** Significant digits shown, capped by `maxDecimals` per system. */
  significant: number
  maxDecimals: Record<UnitSystem, number>
}

/** The specification of every quantity. */
export const QUANTITIES: Record<Quantity, QuantitySpec> = {
  flow: {
    name: 'flow',
    symbol: { si: 'L/s', us: 'gpm' },
    siPerUs: LPS_PER_GPM,
    signed: false,
    significant: 3,
    maxDecimals: { si: 2, us: 1 },
  },
  pressure: {
    name: 'pressure',
    symbol: { si: 'kPa', us: 'psi' },
    siPerUs: KPA_PER_PSI,
    signed: false,
    significant: 3,
    maxDecimals: { si: 1, us: 1 },
  },
  length: {
    name: 'length',
    symbol: { si: 'm', us: 'ft' },
    siPerUs: METRES_PER_FOOT,
    signed: false,
    significant: 3,
    maxDecimals: { si: 2, us: 1 },
  },
  velocity: {
    name: 'velocity',
    symbol: { si: 'm/s', us: 'ft/s' },
    siPerUs: MPS_PER_FPS,
    signed: false,
    significant: 3,
    maxDecimals: { si: 2, us: 1 },
  },
  diameter: {
    name: 'inside diameter',
    symbol: { si: 'mm', us: 'in' },
    siPerUs: MILLIMETRES_PER_INCH,
    signed: false,
    significant: 4,
    maxDecimals: { si: 1, us: 3 },
  },
  elevation: {
    name: 'elevation',
    symbol: { si: 'm', us: 'ft' },
    siPerUs: METRES_PER_FOOT,
    signed: true,
    // Elevations read as fixed-point: always the cap of decimals.
    significant: 15,
    maxDecimals: { si: 2, us: 1 },
  },
}

/** Unit symbol of a quantity in a unit system, e.g. `unitSymbol('flow', 'us')` → `'gpm'`. */
export function unitSymbol(quantity: Quantity, units: UnitSystem): string {
  return QUANTITIES[quantity].symbol[units]
}

/** Converts a stored SI value to the display unit, e.g. `toDisplay('pressure', 6.894757, 'us')` ≈ 1. */
export function toDisplay(quantity: Quantity, si: number, units: UnitSystem): number {
  return units === 'si' ? si : si / QUANTITIES[quantity].siPerUs
}

/** Converts a value in the display unit back to SI, e.g. `fromDisplay('flow', 20, 'us')` ≈ 1.2618. */
export function fromDisplay(quantity: Quantity, display: number, units: UnitSystem): number {
  return units === 'si' ? display : display * QUANTITIES[quantity].siPerUs
}
