import { describeSource } from '../../../../shared/calc/sources'
import { afterEach, beforeEach, describe, expect, test } from 'vitest'
import type { VueWrapper } from '@vue/test-utils'
import { FIXTURES } from '@shared/calc/fixtures'
import { KPA_PER_PSI } from '@shared/units/factors'
import PropertiesPanel from '@/features/editor/panels/PropertiesPanel.vue'
import type { useDocumentStore } from '@/stores/document'
import { choose, fieldError, mountPanel, openPanelDiagram, typeAndCommit } from './panel-diagram'

let store: ReturnType<typeof useDocumentStore>
let wrapper: VueWrapper | undefined

beforeEach(() => {
  store = openPanelDiagram()
})
afterEach(() => {
  wrapper?.unmount()
  wrapper = undefined
  store.unload()
})

function render(units: 'si' | 'us' = 'si', readOnly = false) {
  wrapper = mountPanel(PropertiesPanel, { units, readOnly }) as VueWrapper
  return wrapper
}

const node = (id: string) => store.doc.nodes.find((n) => n.id === id)!

describe('selection', () => {
  test('nothing selected shows a hint', () => {
    const w = render()
    expect(w.find('[data-testid="properties-empty"]').exists()).toBe(true)
  })

  test('several selected shows the count', async () => {
    store.select(['F1', 'J2'], ['P6'])
    const w = render()
    expect(w.find('[data-testid="properties-multiple"]').text()).toContain('3 items selected')
  })

  test('one node shows its id and kind, not editable', () => {
    store.select(['F1'])
    const w = render()
    expect(w.find('[data-testid="prop-id"]').text()).toBe('F1')
    expect(w.find('[data-testid="prop-kind"]').text()).toBe('Fixture')
    expect(w.find('input[data-testid="prop-id"]').exists()).toBe(false)
  })
})

describe('fixture node', () => {
  test('editing the count applies one op and the result updates', async () => {
    store.select(['F1'])
    const w = render()
    const loadBefore = store.result.pipes.P6!.load
    const depth = store.history.past.length
    await typeAndCommit(w, 'prop-count', '8')
    expect(node('F1')).toMatchObject({ count: 8 })
    expect(store.history.past.length).toBe(depth + 1)
    expect(store.history.past.at(-1)!.forward).toEqual({
      type: 'node.update',
      id: 'F1',
      patch: { count: 8 },
    })
    expect(store.result.pipes.P6!.load).toBeCloseTo(loadBefore * 2, 6)
    expect(fieldError('prop-count')).toBeNull()
  })

  test.each([
    ['0', 'Count must be at least 1'],
    ['2.5', 'Count must be a whole number'],
    ['501', 'Count must be at most 500'],
    ['abc', 'Count must be a number, got "abc"'],
    ['', 'Count is required'],
  ])('count %j is refused with "%s" and the document is unchanged', async (text, message) => {
    store.select(['F1'])
    const w = render()
    const before = store.doc
    await typeAndCommit(w, 'prop-count', text)
    expect(fieldError('prop-count')).toBe(message)
    expect(store.doc).toBe(before)
    // The input keeps what was typed until it is fixed or Esc.
    const input = w.find<HTMLInputElement>('input[data-testid="prop-count"]')
    expect(input.element.value).toBe(text)
    await input.trigger('keydown', { key: 'Escape' })
    expect(input.element.value).toBe('4')
    expect(fieldError('prop-count')).toBeNull()
  })

  test('a refused draft can be fixed and then applies', async () => {
    store.select(['F1'])
    const w = render()
    await typeAndCommit(w, 'prop-count', '0')
    await typeAndCommit(w, 'prop-count', '2')
    expect(node('F1')).toMatchObject({ count: 2 })
    expect(fieldError('prop-count')).toBeNull()
  })

  test('blur commits like Enter; focusing and leaving without typing changes nothing', async () => {
    store.select(['F1'])
    const w = render()
    const input = w.find('input[data-testid="prop-count"]')
    const before = store.doc
    await input.trigger('blur')
    expect(store.doc).toBe(before)
    await input.setValue('6')
    expect(node('F1')).toMatchObject({ count: 4 }) // not per keystroke
    await input.trigger('blur')
    expect(node('F1')).toMatchObject({ count: 6 })
  })

  test('the catalogue load is shown with its source and the override starts from it', async () => {
    store.select(['F1'])
    const w = render()
    // Default settings: per-fixture basis (the IPC column), public occupancy.
    const { public: listed, source } = FIXTURES.lavatory!.ipc
    const catalogue = w.find('[data-testid="prop-catalogue-load"]').text()
    expect(catalogue).toContain('public')
    expect(catalogue).toContain(describeSource(source))
    expect(catalogue).toContain(
      `cold ${listed.cold} FU, hot ${listed.hot} FU, total ${listed.total} FU`,
    )
    await w.find('[data-testid="prop-load-override"]').trigger('click')
    expect(node('F1')).toMatchObject({ load: listed })
    await typeAndCommit(w, 'prop-load-total', '3')
    expect(node('F1')).toMatchObject({ load: { ...listed, total: 3 } })
    await typeAndCommit(w, 'prop-load-cold', '-1')
    expect(fieldError('prop-load-cold')).toBe('Cold load must be at least 0')
    expect(node('F1')).toMatchObject({ load: { ...listed, total: 3 } })
    await w.find('[data-testid="prop-load-override"]').trigger('click')
    expect(node('F1')).not.toHaveProperty('load')
  })

  test('the catalogue line follows the load basis and the occupancy', async () => {
    store.select(['F1'])
    const w = render()
    store.apply({ type: 'settings.update', patch: { loadBasis: 'per-fixture' } })
    await choose(w, 'prop-occupancy', 'private')
    const catalogue = w.find('[data-testid="prop-catalogue-load"]').text()
    expect(catalogue).toContain('private')
    expect(catalogue).toContain(describeSource(FIXTURES.lavatory!.ipc.source))
  })

  test('occupancy inherits from the settings until set, and can go back', async () => {
    store.select(['F1'])
    const w = render()
    await choose(w, 'prop-occupancy', 'private')
    expect(node('F1')).toMatchObject({ occupancy: 'private' })
    await choose(w, 'prop-occupancy', ':inherit')
    expect(node('F1')).not.toHaveProperty('occupancy')
  })

  test('an optional minimum pressure is set and cleared by emptying it', async () => {
    store.select(['F1'])
    const w = render()
    await typeAndCommit(w, 'prop-min-pressure', '140')
    expect(node('F1')).toMatchObject({ minPressureKPa: 140 })
    await typeAndCommit(w, 'prop-min-pressure', '')
    expect(node('F1')).not.toHaveProperty('minPressureKPa')
  })
})

describe('units and other node kinds', () => {
  test('US units: 50 psi typed for the supply is stored as kPa', async () => {
    store.select(['S1'])
    const w = render('us')
    await typeAndCommit(w, 'prop-supply-pressure', '50')
    const stored = (node('S1') as { pressureKPa: number }).pressureKPa
    expect(stored).toBeCloseTo(344.7, 1)
    expect(stored).toBeCloseTo(50 * KPA_PER_PSI, 9)
    const input = w.find<HTMLInputElement>('input[data-testid="prop-supply-pressure"]')
    expect(input.element.value).toBe('50.0')
  })

  test('US units: a negative pressure names the field and keeps the document', async () => {
    store.select(['M1'])
    const w = render('us')
    const before = store.doc
    await typeAndCommit(w, 'prop-loss', '-3')
    expect(fieldError('prop-loss')).toBe('Pressure loss cannot be negative')
    expect(store.doc).toBe(before)
  })

  test('equipment flow typed in gpm is stored in L/s', async () => {
    store.select(['EQ1'])
    const w = render('us')
    await typeAndCommit(w, 'prop-equipment-flow', '10')
    expect((node('EQ1') as { flowLps: number }).flowLps).toBeCloseTo(0.6309, 4)
  })

  test('moving to another level keeps the height above the floor', async () => {
    store.select(['F1'])
    const w = render()
    await choose(w, 'prop-level', 'L3')
    expect(node('F1')).toMatchObject({ levelId: 'L3', elevationM: 6.8 })
  })

  test('read-only disables every input', () => {
    store.select(['F1'])
    const w = render('si', true)
    const inputs = w.findAll('input')
    expect(inputs.length).toBeGreaterThan(0)
    for (const input of inputs) expect(input.attributes('disabled')).toBeDefined()
    expect(w.find('[data-testid="properties-read-only"]').exists()).toBe(true)
  })
})
