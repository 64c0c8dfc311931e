import { afterEach, describe, expect, test } from 'vitest'
import type { VueWrapper } from '@vue/test-utils'
import type { CalcIssue } from '@shared/calc/types.ts'
import type { UnitSystem } from '@shared/units/system.ts'
import { flowNode, mountCanvas } from './mount-canvas.ts'

let wrapper: VueWrapper | undefined
afterEach(() => {
  wrapper?.unmount()
  wrapper = undefined
})

async function render(
  input: Record<string, unknown>,
  options: Parameters<typeof flowNode>[1] = {},
) {
  wrapper = await mountCanvas([flowNode(input, options)])
  return wrapper
}

function text(w: VueWrapper, testId: string): string | undefined {
  const el = w.find(`[data-testid="${testId}"]`)
  return el.exists() ? el.text() : undefined
}

function handles(w: VueWrapper, id: string) {
  return w
    .findAll(`[data-nodeid="${id}"].vue-flow__handle`)
    .map((h) => `${h.classes('source') ? 'source' : 'target'}:${h.attributes('data-handleid')}`)
    .sort()
}

describe('node components: label and key value', () => {
  // [document input, units, label, value, count]
  const cases: [Record<string, unknown>, UnitSystem, string, string | undefined, string?][] = [
    [{ id: 'n', kind: 'supply', pressureKPa: 413.685 }, 'si', 'Supply', '414 kPa'],
    [
      { id: 'n', kind: 'supply', pressureKPa: 413.685, label: 'City main' },
      'us',
      'City main',
      '60.0 psi',
    ],
    [{ id: 'n', kind: 'meter', lossKPa: 34.5 }, 'si', 'Water meter', 'loss 34.5 kPa'],
    [{ id: 'n', kind: 'meter', lossKPa: 34.47 }, 'us', 'Water meter', 'loss 5.0 psi'],
    [
      { id: 'n', kind: 'backflow-preventer', lossKPa: 82.7 },
      'si',
      'Backflow preventer',
      'loss 82.7 kPa',
    ],
    [
      { id: 'n', kind: 'pressure-reducing-valve', setKPa: 482.6 },
      'us',
      'Pressure-reducing valve',
      'set 70.0 psi',
    ],
    [{ id: 'n', kind: 'water-heater', lossKPa: 10 }, 'si', 'Water heater', 'loss 10.0 kPa'],
    [
      { id: 'n', kind: 'equipment', flowLps: 0.5, label: 'Cooling tower' },
      'si',
      'Cooling tower',
      '0.50 L/s',
    ],
    [
      { id: 'n', kind: 'equipment', flowLps: 0.6309, label: 'Boiler fill' },
      'us',
      'Boiler fill',
      '10.0 gpm',
    ],
    [
      { id: 'n', kind: 'fixture', fixture: 'lavatory', count: 6 },
      'si',
      'Lavatory',
      undefined,
      '×6',
    ],
    [{ id: 'n', kind: 'fixture', fixture: 'shower' }, 'us', 'Shower', undefined, undefined],
    [
      {
        id: 'n',
        kind: 'fixture',
        fixture: 'water-closet-flush-valve',
        count: 12,
        label: 'Core WCs',
      },
      'si',
      'Core WCs',
      undefined,
      '×12',
    ],
  ]

  test.each(cases)('%j in %s', async (input, units, label, value, count) => {
    const w = await render(input, { units })
    expect(text(w, 'node-label-n')).toBe(label)
    expect(text(w, 'node-value-n')).toBe(value)
    expect(text(w, 'node-count-n')).toBe(count)
    expect(w.find('[data-testid="node-n"]').attributes('data-kind')).toBe(input.kind)
  })
})

describe('node components: live pressure, problems, remote selection', () => {
  test('shows the residual pressure when the calculation reached the node', async () => {
    const w = await render(
      { id: 'n', kind: 'fixture', fixture: 'lavatory' },
      { units: 'us', result: { id: 'n', pressureKPa: 206.84, staticPressureKPa: 300 } },
    )
    expect(text(w, 'node-pressure-n')).toBe('res. 30.0 psi')
  })

  test('shows no pressure when no supply reaches the node', async () => {
    const w = await render(
      { id: 'n', kind: 'meter' },
      { result: { id: 'n', pressureKPa: null, staticPressureKPa: null } },
    )
    expect(text(w, 'node-pressure-n')).toBeUndefined()
  })

  const error: CalcIssue = {
    severity: 'error',
    code: 'no-supply',
    message: 'No supply reaches f1',
    ids: ['n'],
  }
  const warning: CalcIssue = {
    severity: 'warning',
    code: 'low-pressure',
    message: 'Residual pressure below 55 kPa',
    ids: ['n'],
  }

  test('an error gives a red outline and a mark whose title lists the problems', async () => {
    const w = await render(
      { id: 'n', kind: 'fixture', fixture: 'lavatory' },
      { problems: [warning, error] },
    )
    const card = w.find('[data-testid="node-n"]')
    expect(card.classes()).toContain('node-card--problem')
    expect(card.attributes('data-severity')).toBe('error')
    const mark = w.find('[data-testid="node-problem-n"]')
    expect(mark.attributes('data-severity')).toBe('error')
    expect(mark.attributes('title')).toBe(
      'Error: No supply reaches f1\nWarning: Residual pressure below 55 kPa',
    )
    expect(mark.find('circle').exists()).toBe(true)
  })

  test('a warning alone marks the node as a warning', async () => {
    const w = await render({ id: 'n', kind: 'supply', pressureKPa: 300 }, { problems: [warning] })
    expect(w.find('[data-testid="node-n"]').attributes('data-severity')).toBe('warning')
    expect(w.find('[data-testid="node-problem-n"]').attributes('data-severity')).toBe('warning')
  })

  test('no problems, no mark and no outline', async () => {
    const w = await render({ id: 'n', kind: 'supply', pressureKPa: 300 })
    expect(w.find('[data-testid="node-problem-n"]').exists()).toBe(false)
    expect(w.find('[data-testid="node-n"]').classes()).not.toContain('node-card--problem')
  })

  test('remote selections draw a ring per person and name them', async () => {
    const w = await render(
      { id: 'n', kind: 'water-heater' },
      {
        selectedBy: [
          { name: 'Ana', color: '#7c4dbe' },
          { name: 'Ben', color: 'url(javascript:alert(1))' },
        ],
      },
    )
    const card = w.find('[data-testid="node-n"]')
    const shadow = (card.element as HTMLElement).style.boxShadow
    expect(shadow).toContain('#7c4dbe')
    expect(shadow).not.toContain('javascript')
    expect(text(w, 'node-selected-by-n')).toBe('Ana, Ben')
    expect(card.attributes('title')).toContain('Selected by Ana, Ben')
  })
})

describe('node components: handles', () => {
  test.each([
    [{ id: 'n', kind: 'supply', pressureKPa: 300 }, ['source:out']],
    [{ id: 'n', kind: 'meter' }, ['source:out', 'target:in']],
    [{ id: 'n', kind: 'backflow-preventer' }, ['source:out', 'target:in']],
    [{ id: 'n', kind: 'pressure-reducing-valve', setKPa: 350 }, ['source:out', 'target:in']],
    [{ id: 'n', kind: 'water-heater' }, ['source:out', 'target:in']],
    [{ id: 'n', kind: 'junction' }, ['source:out', 'target:in']],
    [{ id: 'n', kind: 'equipment', flowLps: 1 }, ['target:in']],
    [{ id: 'n', kind: 'fixture', fixture: 'lavatory' }, ['target:cold', 'target:hot']],
    [{ id: 'n', kind: 'fixture', fixture: 'water-closet-flush-valve' }, ['target:cold']],
    [{ id: 'n', kind: 'fixture', fixture: 'not-in-catalogue' }, ['target:cold', 'target:hot']],
  ])('%j has %j', async (input, expected) => {
    const w = await render(input)
    expect(handles(w, 'n')).toEqual(expected)
  })

  test('an unknown fixture shows its key as the label', async () => {
    const w = await render({ id: 'n', kind: 'fixture', fixture: 'not-in-catalogue' })
    expect(text(w, 'node-label-n')).toBe('not-in-catalogue')
  })
})

describe('junction', () => {
  test('is a dot with its pressure and problems in the title', async () => {
    const w = await render(
      { id: 'n', kind: 'junction', label: 'R1 base' },
      {
        result: { id: 'n', pressureKPa: 310, staticPressureKPa: 400 },
        problems: [{ severity: 'warning', code: 'x', message: 'Velocity above limit', ids: ['n'] }],
      },
    )
    const root = w.find('[data-testid="node-n"]')
    expect(root.find('.junction__dot').exists()).toBe(true)
    expect(text(w, 'node-label-n')).toBe('R1 base')
    expect(root.attributes('title')).toBe(
      'R1 base\nResidual pressure 310 kPa\nWarning: Velocity above limit',
    )
    expect(root.classes()).toContain('junction--problem')
    expect(w.find('[data-testid="node-problem-n"]').exists()).toBe(true)
  })

  test('without a label shows no text', async () => {
    const w = await render({ id: 'n', kind: 'junction' })
    expect(w.find('[data-testid="node-label-n"]').exists()).toBe(false)
    expect(w.find('[data-testid="node-n"]').attributes('title')).toBe('Junction')
  })
})
