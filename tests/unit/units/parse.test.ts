import { describe, expect, test } from 'vitest'
import {
  parseDiameter,
  parseElevation,
  parseFlow,
  parseLength,
  parsePressure,
  parseVelocity,
  type ParseResult,
} from '@shared/units/parse.ts'

function value(result: ParseResult): number {
  if (!result.ok) throw new Error(`expected a value, got: ${result.error}`)
  return result.value
}

describe('parsing display input back to SI', () => {
  test.each([
    ['psi typed by a US user', parsePressure('50', 'us'), 344.7378646584],
    ['kPa typed by an SI user', parsePressure('350', 'si'), 350],
    ['kPa named by a US user', parsePressure('350 kPa', 'us'), 350],
    ['psi named by an SI user', parsePressure('50psi', 'si'), 344.7378646584],
    ['number from a numeric input', parsePressure(50, 'us'), 344.7378646584],
    ['gpm', parseFlow('20', 'us'), 1.261803928],
    ['L/s named', parseFlow('1.5 L/s', 'us'), 1.5],
    ['feet', parseLength('100', 'us'), 30.48],
    ['feet with a mark', parseLength("10'", 'si'), 3.048],
    ['ft/s', parseVelocity('8 ft/s', 'si'), 2.4384],
    ['inches', parseDiameter('1.025', 'us'), 26.035],
    ['negative elevation', parseElevation('-10', 'us'), -3.048],
    ['leading point', parseLength('.5', 'si'), 0.5],
  ])('%s', (_name, result, expected) => {
    expect(value(result)).toBeCloseTo(expected, 9)
  })

  test.each([
    [parsePressure('', 'us', 'Supply pressure'), 'Supply pressure is required'],
    [parsePressure(null, 'us', 'Supply pressure'), 'Supply pressure is required'],
    [parseFlow('lots', 'si', 'Equipment flow'), 'Equipment flow must be a number, got "lots"'],
    [parsePressure('-5', 'si', 'Set pressure'), 'Set pressure cannot be negative'],
    [parsePressure('5 bar', 'si'), 'Pressure: unknown unit "bar" (use kPa or psi)'],
    [parseLength('1,5', 'si'), 'Length: use a point for decimals and no thousands separator'],
    [parseFlow(Number.NaN, 'si'), 'Flow must be a finite number'],
    [parseFlow(Number.POSITIVE_INFINITY, 'si'), 'Flow must be a finite number'],
  ])('rejects with a message naming the field: %j', (result, error) => {
    expect(result).toEqual({ ok: false, error })
  })
})
