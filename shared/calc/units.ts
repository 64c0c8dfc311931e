/**
 * Unit constants. Exact definitions, not code values (reference §0): the engine is SI throughout
 * and converts only where a published table is written in US units.
 */

/** Litres in one US gallon (exact). */
export const LITRES_PER_US_GALLON = 3.785411784
/** One US gallon per minute in L/s. */
export const GPM_TO_LPS = LITRES_PER_US_GALLON / 60
/** One psi in kPa. */
export const PSI_TO_KPA = 6.894757293168
/** One inch in mm (exact). */
export const INCH_TO_MM = 25.4
/** One foot in m (exact). */
export const FOOT_TO_M = 0.3048

/**
 * Static head per metre of rise, kPa/m. The issue fixes 9.81; the IPC (E103.2.2, C [S9]) uses
 * 0.433 psi/ft = 9.80 kPa/m and ρg at 20 °C is 9.789 kPa/m (X) — all within 0.25 %.
 */
export const KPA_PER_METRE = 9.81

/** Fixed-point scale for loads: sums are kept in integer milli-WSFU so they are exact. */
export const LOAD_SCALE = 1000
/** Fixed-point scale for equipment flows: integer µL/s. */
export const FLOW_SCALE = 1_000_000

/** Converts gpm to L/s. */
export function gpmToLps(gpm: number): number {
  return gpm * GPM_TO_LPS
}

/** Converts psi to kPa. */
export function psiToKPa(psi: number): number {
  return psi * PSI_TO_KPA
}

/** Converts inches to millimetres. */
export function inchToMm(inch: number): number {
  return inch * INCH_TO_MM
}
