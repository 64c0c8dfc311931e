import { describe, expect, test } from 'vitest'
import type { CalcIssue } from '@shared/calc/types.ts'
import { nodeSchema } from '@shared/document/model.ts'
import {
  fixtureCountText,
  nodeKeyValue,
  nodeTitle,
  problemSummary,
  worstSeverity,
} from '@/features/editor/nodes/node-display.ts'
import { HANDLE_SIDES, sourceHandleFor, targetHandleFor } from '@/features/editor/nodes/handles.ts'
import {
  safeColor,
  selectionRingShadow,
  selectionText,
} from '@/features/editor/nodes/selection-ring.ts'

const node = (input: Record<string, unknown>) => nodeSchema.parse({ id: 'n', ...input })
const issue = (severity: CalcIssue['severity'], message: string): CalcIssue => ({
  severity,
  code: 'c',
  message,
  ids: ['n'],
})

describe('node text', () => {
  test.each([
    [{ kind: 'supply', pressureKPa: 1 }, 'Supply'],
    [{ kind: 'supply', pressureKPa: 1, label: '  ' }, 'Supply'],
    [{ kind: 'junction', label: 'R2' }, 'R2'],
    [{ kind: 'fixture', fixture: 'kitchen-sink' }, 'Kitchen sink'],
    [{ kind: 'fixture', fixture: 'unlisted-basin' }, 'unlisted-basin'],
  ])('title of %j is %s', (input, title) => {
    expect(nodeTitle(node(input))).toBe(title)
  })

  test.each([
    [{ kind: 'supply', pressureKPa: 551.58 }, 'us', '80.0 psi'],
    [{ kind: 'meter', lossKPa: 20 }, 'si', 'loss 20.0 kPa'],
    [{ kind: 'pressure-reducing-valve', setKPa: 350 }, 'si', 'set 350 kPa'],
    [{ kind: 'equipment', flowLps: 1.2618 }, 'us', '20.0 gpm'],
    [{ kind: 'fixture', fixture: 'lavatory', count: 4 }, 'si', null],
    [{ kind: 'junction' }, 'si', null],
  ] as const)('key value of %j in %s is %s', (input, units, value) => {
    expect(nodeKeyValue(node(input), units)).toBe(value)
  })

  test('battery count', () => {
    expect(fixtureCountText(1)).toBeNull()
    expect(fixtureCountText(6)).toBe('×6')
  })

  test('worst severity and summary put errors first', () => {
    expect(worstSeverity([])).toBeNull()
    expect(worstSeverity([issue('warning', 'w')])).toBe('warning')
    expect(worstSeverity([issue('warning', 'w'), issue('error', 'e')])).toBe('error')
    expect(problemSummary([issue('warning', 'slow'), issue('error', 'dry')], 'si')).toBe(
      'Error: dry\nWarning: slow',
    )
  })

  test('the summary states pressures in the display units', () => {
    const short = issue('warning', 'fixture wc-1 gets 95.2 kPa; it needs 100.0 kPa.')
    expect(problemSummary([short], 'us')).toBe(
      'Warning: fixture wc-1 gets 13.8 psi; it needs 14.5 psi.',
    )
  })
})

describe('handles', () => {
  test.each([
    [{ kind: 'supply', pressureKPa: 1 }, 'out', null, null],
    [{ kind: 'meter' }, 'out', 'in', 'in'],
    [{ kind: 'water-heater' }, 'out', 'in', 'in'],
    [{ kind: 'junction' }, 'out', 'in', 'in'],
    [{ kind: 'equipment', flowLps: 1 }, null, 'in', 'in'],
    [{ kind: 'fixture', fixture: 'lavatory' }, null, 'cold', 'hot'],
    [{ kind: 'fixture', fixture: 'drinking-fountain' }, null, 'cold', null],
    [{ kind: 'fixture', fixture: 'unlisted-basin' }, null, 'cold', 'hot'],
  ])('%j: source %s, cold target %s, hot target %s', (input, source, cold, hot) => {
    const n = node(input)
    expect(sourceHandleFor(n)).toBe(source)
    expect(targetHandleFor(n, 'cold')).toBe(cold)
    expect(targetHandleFor(n, 'hot')).toBe(hot)
  })

  test('the service runs left to right, the heater sends hot water up, fixtures are fed from below', () => {
    expect(HANDLE_SIDES.supply).toEqual({ out: 'right' })
    expect(HANDLE_SIDES.meter).toEqual({ in: 'left', out: 'right' })
    expect(HANDLE_SIDES['water-heater']).toEqual({ in: 'left', out: 'top' })
    expect(HANDLE_SIDES.fixture).toEqual({ in: 'bottom' })
  })
})

describe('remote selection ring', () => {
  test('one ring per person outside a white gap', () => {
    expect(selectionRingShadow(undefined)).toBeUndefined()
    expect(selectionRingShadow([])).toBeUndefined()
    expect(
      selectionRingShadow([
        { name: 'A', color: '#123456' },
        { name: 'B', color: 'hsl(200, 50%, 40%)' },
      ]),
    ).toBe('0 0 0 2px #fff, 0 0 0 4px #123456, 0 0 0 6px hsl(200, 50%, 40%)')
  })

  test.each([
    ['#abc', '#abc'],
    [' rgb(1, 2, 3) ', 'rgb(1, 2, 3)'],
    ['red; background: url(x)', '#17405e'],
    ['', '#17405e'],
  ])('colour %j draws as %s', (input, output) => {
    expect(safeColor(input)).toBe(output)
  })

  test('names the people', () => {
    expect(selectionText([{ name: 'Ana', color: '#000' }])).toBe('Selected by Ana')
    expect(selectionText(undefined)).toBe('')
  })
})
