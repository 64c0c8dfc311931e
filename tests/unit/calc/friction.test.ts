// Friction and static head against the reference's published and computed check values.
import { describe, expect, test } from 'vitest'
import {
  darcyWeisbachKPa,
  hazenWilliamsKPa,
  swameeJain,
  velocityMps,
} from '../../../shared/calc/friction.ts'
import { FOOT_TO_M, GPM_TO_LPS, KPA_PER_METRE, PSI_TO_KPA } from '../../../shared/calc/units.ts'

const per100ft = 100 * FOOT_TO_M
const rel = (a: number, b: number) => Math.abs(a - b) / b

describe('Hazen-Williams', () => {
  // The source prints "about 9 ft" from its own form (d^4.8655, +0.8 % against the SI form per
  // reference §4.1); the SI form gives 8.87 ft, hence 2 %.
  test('200 gpm, ID 3.048 in, C 140 → about 9 ft per 100 ft (Engineering ToolBox [S46], C)', () => {
    const kpa = hazenWilliamsKPa(200 * GPM_TO_LPS, 3.048 * 25.4, per100ft, 140)
    const feet = kpa / KPA_PER_METRE / FOOT_TO_M
    expect(rel(feet, 9.0)).toBeLessThan(0.02)
  })
  test('10 gpm, ID 0.785 in, C 140 → 11.08 psi per 100 ft (formulas [S41], X; ±1 %)', () => {
    const kpa = hazenWilliamsKPa(10 * GPM_TO_LPS, 0.785 * 25.4, per100ft, 140)
    expect(rel(kpa / PSI_TO_KPA, 11.08)).toBeLessThan(0.01)
  })
  test('loss scales with length and Q^1.852', () => {
    const a = hazenWilliamsKPa(1, 20, 10, 140)
    expect(hazenWilliamsKPa(1, 20, 20, 140)).toBeCloseTo(2 * a, 9)
    expect(hazenWilliamsKPa(2, 20, 10, 140) / a).toBeCloseTo(2 ** 1.852, 9)
    expect(hazenWilliamsKPa(0, 20, 10, 140)).toBe(0)
  })
})

describe('velocity', () => {
  test('10 gpm in ID 0.785 in → 6.63 ft/s = 2.02 m/s ([S46] formula, X)', () => {
    expect(velocityMps(10 * GPM_TO_LPS, 0.785 * 25.4)).toBeCloseTo(2.021, 2)
  })
  test('23.3 gpm: Type L 1 in 9.06 ft/s, 1-1/4 in 5.95 ft/s (reference §8 row 24, X)', () => {
    expect(velocityMps(23.3 * GPM_TO_LPS, 1.025 * 25.4) / FOOT_TO_M).toBeCloseTo(9.06, 1)
    expect(velocityMps(23.3 * GPM_TO_LPS, 1.265 * 25.4) / FOOT_TO_M).toBeCloseTo(5.95, 1)
  })
})

describe('Darcy-Weisbach', () => {
  test('Swamee-Jain ε/D 0.0015, Re 1e5 → 0.02394 ([S54], [S55]; X)', () => {
    expect(swameeJain(1e5, 0.0015)).toBeCloseTo(0.02394, 5)
  })
  test('laminar below Re 2300 → 64/Re', () => expect(swameeJain(1000, 0.001)).toBe(0.064))
  test('10 gpm, 3/4 in Type L, 20 °C, ε 1.5 µm → ≈ 69 kPa per 30.48 m (reference §4.2, X; ±2 %)', () => {
    const kpa = darcyWeisbachKPa(10 * GPM_TO_LPS, 0.785 * 25.4, per100ft, 0.0015, 20)
    expect(rel(kpa, 69.1)).toBeLessThan(0.02)
  })
})

describe('static head', () => {
  test('20 ft rise → 8.66 psi = 59.8 kPa (IPC E103.2.2 [S9], C)', () => {
    const kpa = KPA_PER_METRE * 20 * FOOT_TO_M
    expect(kpa).toBeCloseTo(59.8, 1)
    expect(rel(kpa / PSI_TO_KPA, 8.66)).toBeLessThan(0.003)
  })
})
