import { describe, expect, test } from 'vitest'
import {
  formatDiameter,
  formatElevation,
  formatFlow,
  formatLength,
  formatLoad,
  formatPressure,
  formatQuantity,
  formatVelocity,
  roundForDisplay,
} from '@shared/units/format.ts'

describe('roundForDisplay', () => {
  test.each([
    [1.2618, 3, 2, '1.26'],
    [12.618, 3, 2, '12.6'],
    [126.18, 3, 2, '126'],
    [1261.8, 3, 2, '1262'],
    [0.0456, 3, 2, '0.05'],
    [9.996, 3, 2, '10.0'],
    [-0.001, 3, 2, '0.00'],
    [0, 3, 2, '0'],
    [-12.34, 3, 1, '-12.3'],
  ])('%d to %i significant, at most %i decimals → %s', (value, sig, max, expected) => {
    expect(roundForDisplay(value, sig, max)).toBe(expected)
  })
})

describe('formatters', () => {
  test.each([
    ['flow SI', formatFlow(1.2618, 'si'), '1.26 L/s'],
    ['flow US', formatFlow(1.2618, 'us'), '20.0 gpm'],
    ['flow large US', formatFlow(9.4635, 'us'), '150 gpm'],
    ['flow small US', formatFlow(0.0315, 'us'), '0.5 gpm'],
    ['pressure SI', formatPressure(344.74, 'si'), '345 kPa'],
    ['pressure SI small', formatPressure(8.53, 'si'), '8.5 kPa'],
    ['pressure US', formatPressure(344.74, 'us'), '50.0 psi'],
    ['negative residual pressure', formatPressure(-20.68, 'us'), '-3.0 psi'],
    ['length SI', formatLength(12.5, 'si'), '12.5 m'],
    ['length US', formatLength(12.5, 'us'), '41.0 ft'],
    ['velocity SI', formatVelocity(1.92, 'si'), '1.92 m/s'],
    ['velocity US', formatVelocity(1.92, 'us'), '6.3 ft/s'],
    ['diameter SI', formatDiameter(26.04, 'si'), '26.0 mm'],
    ['diameter US', formatDiameter(26.035, 'us'), '1.025 in'],
    ['elevation SI keeps two decimals', formatElevation(3.5, 'si'), '3.50 m'],
    ['elevation US keeps one decimal', formatElevation(3.5, 'us'), '11.5 ft'],
    ['elevation below grade', formatElevation(-3.048, 'us'), '-10.0 ft'],
  ])('%s', (_name, actual, expected) => {
    expect(actual).toBe(expected)
  })

  test.each([null, undefined, Number.NaN, Number.POSITIVE_INFINITY])('%s shows a dash', (value) => {
    expect(formatFlow(value, 'si')).toBe('—')
    expect(formatPressure(value, 'us')).toBe('—')
    expect(formatLoad(value)).toBe('—')
  })

  test('can leave the unit off', () => {
    expect(formatQuantity('pressure', 344.74, 'us', { unit: false })).toBe('50.0')
  })

  test.each([
    [58, '58 FU'],
    [2.5, '2.5 FU'],
    [57.54, '57.5 FU'],
    [0.7, '0.7 FU'],
    [0, '0 FU'],
  ])('load %d → %s', (fu, expected) => {
    expect(formatLoad(fu)).toBe(expected)
  })
})
