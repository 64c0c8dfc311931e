/**
 * Friction loss in a full-flowing pipe (reference §4). Inputs: flow L/s, diameters
 * mm, lengths m; results kPa. Static head uses the same 9.81 kPa per metre of water as elevation.
 */
import { KPA_PER_METRE } from './units.ts'

const HW_SI = 10.67 // Hazen-Williams SI constant, C* [S41] (10.7 in [S42])

/**
 * Hazen-Williams loss, kPa: h = 10.67 · L · Q^1.852 / (C^1.852 · D^4.87) with h, L, D in m and
 * Q in m³/s (C* [S41]), converted at 9.81 kPa per metre of head.
 */
export function hazenWilliamsKPa(
  flowLps: number,
  idMm: number,
  lengthM: number,
  c: number,
): number {
  if (!(flowLps > 0)) return 0
  const q = flowLps / 1000
  const d = idMm / 1000
  return (KPA_PER_METRE * HW_SI * lengthM * q ** 1.852) / (c ** 1.852 * d ** 4.87)
}

/**
 * Swamee-Jain explicit friction factor: f = 0.25 / log10(ε/(3.7 D) + 5.74 / Re^0.9)²
 * (Swamee & Jain 1976, C* [S54]); valid about 5000 ≤ Re ≤ 1e8 (C* [S55]). Below Re 2300 the
 * laminar 64/Re is used; the transitional band keeps Swamee-Jain, the conservative side.
 */
export function swameeJain(reynolds: number, relativeRoughness: number): number {
  if (reynolds < 2300) return 64 / reynolds
  const x = Math.log10(relativeRoughness / 3.7 + 5.74 / reynolds ** 0.9)
  return 0.25 / (x * x)
}

// Water at temperature, °C: kinematic viscosity in 1e-6 m²/s and density in kg/m³.
// 10/20/40/60 °C viscosities and the 20/60 °C densities C* [S61], [S62]; the rest from memory (M).
const WATER: [tempC: number, nu: number, rho: number][] = [
  [0, 1.787, 999.8],
  [10, 1.307, 999.7],
  [20, 1.004, 998.23],
  [40, 0.658, 992.2],
  [60, 0.475, 983.4],
  [80, 0.365, 971.8],
  [100, 0.294, 958.4],
]

/** Kinematic viscosity (m²/s) and density (kg/m³) of water, interpolated linearly in °C. */
export function waterProperties(tempC: number): { nu: number; rho: number } {
  const t = Math.min(100, Math.max(0, tempC))
  let i = 0
  while (i < WATER.length - 2 && WATER[i + 1]![0] < t) i++
  const [t0, nu0, rho0] = WATER[i]!
  const [t1, nu1, rho1] = WATER[i + 1]!
  const w = (t - t0) / (t1 - t0)
  return { nu: (nu0 + w * (nu1 - nu0)) * 1e-6, rho: rho0 + w * (rho1 - rho0) }
}

/** Darcy-Weisbach loss, kPa: Δp = f · (L/D) · ρv²/2 (C* [S51]) with f from Swamee-Jain. */
export function darcyWeisbachKPa(
  flowLps: number,
  idMm: number,
  lengthM: number,
  roughnessMm: number,
  tempC: number,
): number {
  const { nu, rho } = waterProperties(tempC)
  return darcyLossKPa(flowLps, idMm, lengthM, roughnessMm, nu, rho)
}

/** darcyWeisbachKPa with the water's viscosity (m²/s) and density (kg/m³) already looked up. */
export function darcyLossKPa(
  flowLps: number,
  idMm: number,
  lengthM: number,
  roughnessMm: number,
  nu: number,
  rho: number,
): number {
  if (!(flowLps > 0)) return 0
  const d = idMm / 1000
  const v = flowLps / 1000 / ((Math.PI * d * d) / 4)
  const f = swameeJain((v * d) / nu, roughnessMm / idMm)
  return (f * (lengthM / d) * rho * v * v) / 2 / 1000
}

/** Mean velocity, m/s, of `flowLps` in a bore of `idMm`. */
export function velocityMps(flowLps: number, idMm: number): number {
  const d = idMm / 1000
  return flowLps / 1000 / ((Math.PI * d * d) / 4)
}

/** Smallest inside diameter, mm, that keeps `flowLps` at or below `limitMps`. */
export function minDiameterMm(flowLps: number, limitMps: number): number {
  return 1000 * Math.sqrt((4 * flowLps) / 1000 / (Math.PI * limitMps))
}
