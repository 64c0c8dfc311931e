import { describe, expect, test } from 'vitest'
import {
  formatNominal,
  NOMINAL_SIZES,
  nominalInches,
  nominalToDn,
  parseNominal,
} from '@shared/units/nominal.ts'

describe('nominal sizes', () => {
  test.each([
    ['3/8', '3/8"', 'DN10'],
    ['1/2', '1/2"', 'DN15'],
    ['3/4', '3/4"', 'DN20'],
    ['1', '1"', 'DN25'],
    ['1-1/4', '1-1/4"', 'DN32'],
    ['1-1/2', '1-1/2"', 'DN40'],
    ['2', '2"', 'DN50'],
    ['2-1/2', '2-1/2"', 'DN65'],
    ['3', '3"', 'DN80'],
    ['4', '4"', 'DN100'],
    ['5/8', '5/8"', '5/8"'],
  ])('%s shows as %s in US and %s in SI', (nominal, us, si) => {
    expect(formatNominal(nominal, 'us')).toBe(us)
    expect(formatNominal(nominal, 'si')).toBe(si)
  })

  test('a missing size shows a dash; an unreadable one as stored', () => {
    expect(formatNominal(null, 'si')).toBe('—')
    expect(formatNominal('', 'us')).toBe('—')
    expect(formatNominal('large', 'us')).toBe('large')
  })

  test.each([
    ['1-1/4', 1.25],
    ['1 1/4', 1.25],
    ['3/4', 0.75],
    ['2', 2],
    ['1/0', null],
    ['1-1/0', null],
    ['DN32', null],
  ])('inches of %s', (nominal, inches) => {
    expect(nominalInches(nominal)).toBe(inches)
  })

  test('the table ascends and its inches match its strings', () => {
    for (const [i, size] of NOMINAL_SIZES.entries()) {
      expect(nominalInches(size.nominal)).toBe(size.inches)
      if (i > 0) expect(size.inches).toBeGreaterThan(NOMINAL_SIZES[i - 1]!.inches)
    }
    expect(nominalToDn('2-1/2')).toBe(65)
    expect(nominalToDn('7')).toBeNull()
  })

  test.each([
    ['1-1/4', '1-1/4'],
    ['1 1/4"', '1-1/4'],
    ['1.25 in', '1-1/4'],
    ['DN32', '1-1/4'],
    ['dn 15', '1/2'],
    ['32', '1-1/4'],
    ['0.5', '1/2'],
    ['4', '4'],
  ])('reads %s as %s', (input, nominal) => {
    expect(parseNominal(input)).toEqual({ ok: true, value: nominal })
  })

  test.each([
    ['', 'Size is required'],
    ['1-1/3', 'Size: unknown nominal size "1-1/3" (e.g. 3/4, 1-1/4 or DN32)'],
    ['DN33', 'Size: unknown nominal size "DN33" (e.g. 3/4, 1-1/4 or DN32)'],
  ])('rejects %j', (input, error) => {
    expect(parseNominal(input)).toEqual({ ok: false, error })
  })
})
