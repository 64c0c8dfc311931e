/**
 * Conversion factors between the stored SI values and US customary units, built from the exact
 * definitions (NIST SP 811, Appendix B; the 1959 international yard and pound agreement).
 * Deriving them keeps every digit; the rounded figures quoted in codes (1 gpm = 0.0630902 L/s,
 * 1 psi = 6.894757 kPa) agree to better than 1 part in 10^6.
 */

/** 1 ft = 0.3048 m, exact by definition. */
export const METRES_PER_FOOT = 0.3048

/** 1 in = 25.4 mm, exact by definition. */
export const MILLIMETRES_PER_INCH = 25.4

/** 1 US gallon = 231 in³ = 3.785411784 L, exact by definition. */
export const LITRES_PER_US_GALLON = 3.785411784

/** 1 gpm in L/s: 3.785411784 / 60 (≈ 0.0630902). */
export const LPS_PER_GPM = LITRES_PER_US_GALLON / 60

/** 1 lbf = 0.45359237 kg × 9.80665 m/s², exact by definition. */
export const NEWTONS_PER_POUND_FORCE = 0.45359237 * 9.80665

/** 1 psi in kPa: 1 lbf / (0.0254 m)² / 1000 (≈ 6.894757). */
export const KPA_PER_PSI = NEWTONS_PER_POUND_FORCE / (0.0254 * 0.0254) / 1000

/** 1 ft/s in m/s, same ratio as the foot. */
export const MPS_PER_FPS = METRES_PER_FOOT
