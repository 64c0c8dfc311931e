import { describe, expect, test } from 'vitest'
import type { CalcIssue } from '@shared/calc/types.ts'
import { pipeSchema } from '@shared/document/model.ts'
import type { PipeEdgeData } from '@/features/editor/canvas-data.ts'
import { isSizeLocked, pipeLabelText, pipeLabelTitle } from '@/features/editor/edges/pipe-label.ts'
import { pipeResult } from './pipe-result.ts'

function data(
  overrides: Partial<PipeEdgeData> = {},
  pipe: Record<string, unknown> = {},
): PipeEdgeData {
  return {
    pipe: pipeSchema.parse({ id: 'p1', from: 'a', to: 'b', system: 'cold', lengthM: 12, ...pipe }),
    problems: [],
    units: 'si',
    ...overrides,
  }
}

describe('pipe label text', () => {
  test.each([
    ['full result', data({ result: pipeResult() }), '58 FU · 3.90 L/s · DN50 · 1.92 m/s'],
    ['US units', data({ result: pipeResult(), units: 'us' }), '58 FU · 61.8 gpm · 2" · 6.3 ft/s'],
    [
      'fractional load',
      data({ result: pipeResult({ load: 7.5 }) }),
      '7.5 FU · 3.90 L/s · DN50 · 1.92 m/s',
    ],
    [
      'no size fits',
      data({ result: pipeResult({ nominal: null, velocityMps: null }) }),
      '58 FU · 3.90 L/s · no size',
    ],
    ['no result yet', data(), '—'],
    ['no result, locked size', data({}, { nominal: '3/4' }), 'DN20'],
  ])('%s', (_name, input, expected) => {
    expect(pipeLabelText(input)).toBe(expected)
  })
})

describe('pipe lock', () => {
  test('follows the result, else the document', () => {
    expect(isSizeLocked(data({ result: pipeResult({ locked: true }) }))).toBe(true)
    expect(isSizeLocked(data({ result: pipeResult({ locked: false }) }))).toBe(false)
    expect(isSizeLocked(data({}, { nominal: '1' }))).toBe(true)
    expect(isSizeLocked(data())).toBe(false)
  })
})

describe('pipe tooltip', () => {
  test('spells out every figure and then the problems', () => {
    const problems: CalcIssue[] = [
      { severity: 'error', code: 'unreachable', message: 'No supply reaches p1', ids: ['p1'] },
    ]
    const title = pipeLabelTitle(
      data({
        result: pipeResult({ equipmentFlowLps: 0.5, fixtureFlowLps: 3.4, locked: true }),
        problems,
      }),
    )
    expect(title.split('\n')).toEqual([
      'Cold pipe p1 · 12.0 m',
      'Load 58 FU',
      'Flow 3.90 L/s (fixtures 3.40 L/s + equipment 0.50 L/s)',
      'Size DN50 (locked) copper-l, inside 50.4 mm',
      'Velocity 1.92 m/s',
      'Loss 4.2 kPa over 15.0 m equivalent',
      'Pressure 320 kPa → 316 kPa',
      'Error: No supply reaches p1',
    ])
  })

  test('before a result it names only the pipe', () => {
    expect(pipeLabelTitle(data({ units: 'us' }, { system: 'hot' }))).toBe('Hot pipe p1 · 39.4 ft')
  })
})
