import { afterEach, beforeEach, describe, expect, test } from 'vitest'
import type { VueWrapper } from '@vue/test-utils'
import { MPS_PER_FPS } from '@shared/units/factors'
import SettingsDrawer from '@/features/editor/panels/SettingsDrawer.vue'
import SettingsForm from '@/features/editor/panels/settings/SettingsForm.vue'
import type { useDocumentStore } from '@/stores/document'
import {
  choose,
  fieldError,
  mountPanel,
  openPanelDiagram,
  selected,
  typeAndCommit,
} from './panel-diagram'

let store: ReturnType<typeof useDocumentStore>
let drawer: VueWrapper | undefined

beforeEach(() => {
  store = openPanelDiagram()
})
afterEach(() => {
  drawer?.unmount()
  drawer = undefined
  store.unload()
})

/** Opens the drawer; its content is teleported, so tests work on the form inside it. */
function render(units: 'si' | 'us' = 'si', readOnly = false) {
  drawer = mountPanel(SettingsDrawer, { show: true, units, readOnly }) as VueWrapper
  return drawer.findComponent(SettingsForm) as unknown as VueWrapper
}

describe('settings drawer', () => {
  test('closed, it renders no form', () => {
    drawer = mountPanel(SettingsDrawer, { show: false, units: 'si', readOnly: false }) as VueWrapper
    expect(drawer.findComponent(SettingsForm).exists()).toBe(false)
  })

  test('the velocity limit changes the settings with one op and the result follows', async () => {
    const form = render()
    const depth = store.history.past.length
    await typeAndCommit(form, 'settings-velocity-cold', '1.2')
    expect(store.doc.settings.velocityLimits).toEqual({ cold: 1.2, hot: 1.5 })
    expect(store.history.past.length).toBe(depth + 1)
    const sized = Object.values(store.result.pipes).filter(
      (r) => r.system === 'cold' && r.velocityMps !== null && !r.locked,
    )
    expect(sized.length).toBeGreaterThan(0)
    for (const result of sized) expect(result.velocityMps!).toBeLessThanOrEqual(1.2 + 1e-9)
  })

  test('a velocity limit in ft/s is stored in m/s, and its bound is shown in ft/s', async () => {
    const form = render('us')
    await typeAndCommit(form, 'settings-velocity-hot', '5')
    expect(store.doc.settings.velocityLimits.hot).toBeCloseTo(5 * MPS_PER_FPS, 9)
    const before = store.doc
    await typeAndCommit(form, 'settings-velocity-hot', '40')
    expect(fieldError('settings-velocity-hot')).toBe(
      'Velocity limit, hot must be at most 32.8 ft/s',
    )
    expect(store.doc).toBe(before)
  })

  test.each([
    ['abc', 'Fitting allowance must be a number, got "abc"'],
    ['-5', 'Fitting allowance must be at least 0 %'],
    ['400', 'Fitting allowance must be at most 300 %'],
  ])('fitting allowance %j is refused', async (text, message) => {
    const form = render()
    const before = store.doc
    await typeAndCommit(form, 'settings-fitting-allowance', text)
    expect(fieldError('settings-fitting-allowance')).toBe(message)
    expect(store.doc).toBe(before)
  })

  test('fitting allowance is typed as a percentage and stored as a fraction', async () => {
    const form = render()
    await typeAndCommit(form, 'settings-fitting-allowance', '40')
    expect(store.doc.settings.fittingAllowance).toBeCloseTo(0.4, 12)
  })

  test('selects change the basis, occupancy, material and friction method', async () => {
    const form = render()
    await choose(form, 'settings-load-basis', 'per-fixture')
    await choose(form, 'settings-occupancy', 'private')
    await choose(form, 'settings-material', 'pex')
    expect(store.doc.settings).toMatchObject({
      loadBasis: 'per-fixture',
      occupancy: 'private',
      material: 'pex',
    })
    expect(form.find('[data-testid="settings-water-temp"]').exists()).toBe(false)
    await choose(form, 'settings-friction', 'darcy-weisbach')
    expect(selected(form, 'settings-friction')).toBe('darcy-weisbach')
    await typeAndCommit(form, 'settings-water-temp', '60')
    expect(store.doc.settings).toMatchObject({ frictionMethod: 'darcy-weisbach', waterTempC: 60 })
    await typeAndCommit(form, 'settings-water-temp', '0')
    expect(fieldError('settings-water-temp')).toBe('Water temperature must be at least 1 °C')
    expect(store.doc.settings.waterTempC).toBe(60)
  })

  test('supply pressure edits the supply node; without one the drawer says so', async () => {
    const form = render('us')
    await typeAndCommit(form, 'settings-supply-pressure-S1', '50')
    const supply = store.doc.nodes.find((n) => n.id === 'S1') as { pressureKPa: number }
    expect(supply.pressureKPa).toBeCloseTo(344.7, 1)
    expect(form.find('[data-testid="settings-no-supply"]').exists()).toBe(false)
    store.apply({ type: 'node.remove', id: 'S1' })
    await form.vm.$nextTick()
    expect(form.find('[data-testid="settings-no-supply"]').exists()).toBe(true)
  })

  test('read-only disables every input and button', () => {
    const form = render('si', true)
    for (const input of form.findAll('input')) expect(input.attributes('disabled')).toBeDefined()
    expect(form.find('[data-testid="level-add"]').attributes('disabled')).toBeDefined()
  })

  test('shows the design-aid caution', () => {
    const form = render()
    expect(form.find('[data-testid="design-aid-notice"]').text()).toContain(
      'Results are a design aid.',
    )
  })
})

describe('levels', () => {
  test('add creates "Level N" one storey above the highest', async () => {
    const form = render()
    await form.find('[data-testid="level-add"]').trigger('click')
    expect(store.doc.levels.at(-1)).toEqual({ id: 'L4', name: 'Level 4', elevationM: 9.5 })
    expect(form.find('[data-testid="level-row-L4"]').exists()).toBe(true)
  })

  test('rename and change elevation, each as one op', async () => {
    const form = render('us')
    await typeAndCommit(form, 'level-name-L3', 'Roof plant')
    await typeAndCommit(form, 'level-elevation-L3', '30')
    expect(store.doc.levels.find((l) => l.id === 'L3')).toMatchObject({
      name: 'Roof plant',
      elevationM: 9.144,
    })
    const before = store.doc
    await typeAndCommit(form, 'level-name-L3', '   ')
    expect(fieldError('level-name-L3')).toBe('Level name cannot be empty')
    expect(store.doc).toBe(before)
  })

  test('remove an unused level', async () => {
    const form = render()
    await form.find('[data-testid="level-remove-L3"]').trigger('click')
    expect(store.doc.levels.map((l) => l.id)).toEqual(['L1', 'L2'])
    expect(form.find('[data-testid="level-row-L3"]').exists()).toBe(false)
  })

  test('removing a level in use is refused with the reason and nothing changes', async () => {
    const form = render()
    const before = store.doc
    await form.find('[data-testid="level-remove-L2"]').trigger('click')
    expect(store.doc).toBe(before)
    const error = form.find('[data-testid="level-remove-L2-error"]').text()
    expect(error).toContain('still used by node J2, F1')
  })
})
