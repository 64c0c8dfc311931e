import { describe, expect, test } from 'vitest'
import {
  KPA_PER_PSI,
  LITRES_PER_US_GALLON,
  LPS_PER_GPM,
  METRES_PER_FOOT,
  MILLIMETRES_PER_INCH,
  MPS_PER_FPS,
  NEWTONS_PER_POUND_FORCE,
} from '@shared/units/factors.ts'

// Exact definitions (NIST SP 811 Appendix B) and the rounded figures the plumbing codes print.
describe('conversion factors', () => {
  test.each([
    ['foot, exact', METRES_PER_FOOT, 0.3048, 15],
    ['inch, exact', MILLIMETRES_PER_INCH, 25.4, 15],
    ['US gallon (231 in³), exact', LITRES_PER_US_GALLON, 3.785411784, 15],
    ['pound-force, exact', NEWTONS_PER_POUND_FORCE, 4.4482216152605, 12],
    ['gpm from the gallon, exact', LPS_PER_GPM, 0.0630901964, 12],
    ['psi from the pound-force and inch, exact', KPA_PER_PSI, 6.894757293168361, 12],
    ['gpm as printed (1 gpm = 0.0630902 L/s)', LPS_PER_GPM, 0.0630902, 7],
    ['psi as printed (1 psi = 6.894757 kPa)', KPA_PER_PSI, 6.894757, 6],
    ['ft/s, same ratio as the foot', MPS_PER_FPS, 0.3048, 15],
  ])('%s', (_name, actual, expected, digits) => {
    expect(actual).toBeCloseTo(expected, digits)
  })

  test('the gallon is 231 cubic inches', () => {
    expect((231 * MILLIMETRES_PER_INCH ** 3) / 1e6).toBeCloseTo(LITRES_PER_US_GALLON, 12)
  })
})
