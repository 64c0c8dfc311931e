import { describe, expect, test } from 'vitest'
import { fromDisplay, toDisplay, unitSymbol, type Quantity } from '@shared/units/quantities.ts'
import { unitSystemSchema, UNIT_SYSTEMS } from '@shared/units/system.ts'

describe('unit system', () => {
  test('lists si and us', () => {
    expect(UNIT_SYSTEMS).toEqual(['si', 'us'])
  })

  test('rejects an unknown system', () => {
    expect(unitSystemSchema.safeParse('imperial').success).toBe(false)
    expect(unitSystemSchema.parse('us')).toBe('us')
  })
})

describe('toDisplay / fromDisplay', () => {
  // [quantity, SI value, US value]: one US unit and a typical design value each.
  const cases: [Quantity, number, number][] = [
    ['flow', 0.0630901964, 1],
    ['flow', 1.261803928, 20],
    ['pressure', 6.894757293168361, 1],
    ['pressure', 344.73786465841806, 50],
    ['length', 0.3048, 1],
    ['length', 30.48, 100],
    ['velocity', 0.3048, 1],
    ['velocity', 2.4384, 8],
    ['diameter', 25.4, 1],
    ['diameter', 26.035, 1.025],
    ['elevation', -3.048, -10],
  ]

  test.each(cases)('%s: %d SI is %d US', (quantity, si, us) => {
    expect(toDisplay(quantity, si, 'us')).toBeCloseTo(us, 9)
    expect(fromDisplay(quantity, us, 'us')).toBeCloseTo(si, 9)
  })

  test.each(cases)('%s: SI display is the stored value', (quantity, si) => {
    expect(toDisplay(quantity, si, 'si')).toBe(si)
    expect(fromDisplay(quantity, si, 'si')).toBe(si)
  })

  test.each([
    ['flow', 'L/s', 'gpm'],
    ['pressure', 'kPa', 'psi'],
    ['length', 'm', 'ft'],
    ['velocity', 'm/s', 'ft/s'],
    ['diameter', 'mm', 'in'],
    ['elevation', 'm', 'ft'],
  ] as const)('%s symbols', (quantity, si, us) => {
    expect(unitSymbol(quantity, 'si')).toBe(si)
    expect(unitSymbol(quantity, 'us')).toBe(us)
  })
})
