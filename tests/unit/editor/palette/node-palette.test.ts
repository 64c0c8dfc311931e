import { afterEach, describe, expect, test } from 'vitest'
import { mount, type VueWrapper } from '@vue/test-utils'
import { NInputNumber, NSelect } from 'naive-ui'
import NodePalette from '@/features/editor/palette/NodePalette.vue'
import { PALETTE_DRAG_TYPE } from '@/features/editor/palette/palette-item.ts'

let wrapper: VueWrapper<InstanceType<typeof NodePalette>> | undefined
afterEach(() => {
  wrapper?.unmount()
  wrapper = undefined
})

function render(props: { disabled?: boolean } = {}) {
  wrapper = mount(NodePalette, { props, attachTo: document.body })
  return wrapper
}

describe('NodePalette items', () => {
  test.each([
    ['supply', { kind: 'supply' }],
    ['meter', { kind: 'meter' }],
    ['backflow-preventer', { kind: 'backflow-preventer' }],
    ['pressure-reducing-valve', { kind: 'pressure-reducing-valve' }],
    ['water-heater', { kind: 'water-heater' }],
    ['junction', { kind: 'junction' }],
    ['equipment', { kind: 'equipment' }],
    ['lavatory', { kind: 'fixture', fixture: 'lavatory' }],
    ['water-closet-flush-valve', { kind: 'fixture', fixture: 'water-closet-flush-valve' }],
    ['urinal-flush-valve', { kind: 'fixture', fixture: 'urinal-flush-valve' }],
    ['kitchen-sink', { kind: 'fixture', fixture: 'kitchen-sink' }],
    ['service-sink', { kind: 'fixture', fixture: 'service-sink' }],
    ['hose-bibb', { kind: 'fixture', fixture: 'hose-bibb' }],
    ['shower', { kind: 'fixture', fixture: 'shower' }],
    ['drinking-fountain', { kind: 'fixture', fixture: 'drinking-fountain' }],
    ['dishwasher', { kind: 'fixture', fixture: 'dishwasher' }],
  ])('clicking %s emits add with %j', async (key, payload) => {
    const w = render()
    await w.find(`[data-testid="palette-item-${key}"]`).trigger('click')
    expect(w.emitted('add')).toEqual([[payload]])
  })

  test('labels come from the catalogue and the kind names, each with a symbol', () => {
    const w = render()
    const item = w.find('[data-testid="palette-item-water-closet-flush-valve"]')
    expect(item.text()).toBe('Water closet, flush valve')
    expect(item.find('svg').attributes('data-family')).toBe('flush')
    expect(w.find('[data-testid="palette-item-pressure-reducing-valve"]').text()).toBe(
      'Pressure-reducing valve',
    )
    expect(w.find('[data-testid="palette-item-fixture"]').exists()).toBe(false)
  })

  test('dragging puts the same payload on the drag data', async () => {
    const w = render()
    const stored: Record<string, string> = {}
    const dataTransfer = {
      setData: (type: string, value: string) => (stored[type] = value),
      effectAllowed: 'all',
    }
    const item = w.find('[data-testid="palette-item-shower"]')
    expect(item.attributes('draggable')).toBe('true')
    await item.trigger('dragstart', { dataTransfer })
    expect(JSON.parse(stored[PALETTE_DRAG_TYPE]!)).toEqual({ kind: 'fixture', fixture: 'shower' })
    expect(dataTransfer.effectAllowed).toBe('copy')
    expect(w.emitted('add')).toBeUndefined()
  })

  test('Enter on a focused item adds it', async () => {
    const w = render()
    await w.find('[data-testid="palette-item-meter"]').trigger('keydown', { key: 'Enter' })
    expect(w.emitted('add')).toEqual([[{ kind: 'meter' }]])
  })

  test('a disabled palette emits nothing and cannot be dragged', async () => {
    const w = render({ disabled: true })
    const item = w.find('[data-testid="palette-item-meter"]')
    await item.trigger('click')
    expect(item.attributes('draggable')).toBe('false')
    await w.find('[data-testid="palette-battery-add"]').trigger('click')
    expect(w.emitted('add')).toBeUndefined()
    expect(w.emitted('add-battery')).toBeUndefined()
  })
})

describe('NodePalette battery', () => {
  async function typeCount(w: VueWrapper, value: string) {
    const input = w.find('[data-testid="palette-battery-count"] input')
    await input.setValue(value)
    await input.trigger('blur')
  }

  test('emits add-battery with the chosen fixture and count', async () => {
    const w = render()
    w.findComponent(NSelect).vm.$emit('update:value', 'water-closet-flush-valve')
    await typeCount(w, '12')
    await w.find('[data-testid="palette-battery-add"]').trigger('click')
    expect(w.emitted('add-battery')).toEqual([[{ fixture: 'water-closet-flush-valve', count: 12 }]])
    expect(w.find('[data-testid="palette-battery-error"]').exists()).toBe(false)
  })

  test('offers the presets first, then the rest of the catalogue', () => {
    const w = render()
    const options = w.findComponent(NSelect).props('options') as { value: string }[]
    expect(options.slice(0, 3).map((o) => o.value)).toEqual([
      'lavatory',
      'water-closet-flush-valve',
      'urinal-flush-valve',
    ])
    expect(options.map((o) => o.value)).toContain('bathtub')
  })

  test('the count input is bounded 1–200 in whole numbers', () => {
    const w = render()
    const input = w.findComponent(NInputNumber)
    expect(input.props('min')).toBe(1)
    expect(input.props('max')).toBe(200)
    expect(input.props('precision')).toBe(0)
  })

  test('without a fixture it says so and emits nothing', async () => {
    const w = render()
    await w.find('[data-testid="palette-battery-add"]').trigger('click')
    expect(w.emitted('add-battery')).toBeUndefined()
    expect(w.find('[data-testid="palette-battery-error"]').text()).toBe('Choose a fixture')
  })

  test('an emptied count names the count', async () => {
    const w = render()
    w.findComponent(NSelect).vm.$emit('update:value', 'lavatory')
    w.findComponent(NInputNumber).vm.$emit('update:value', null)
    await w.vm.$nextTick()
    await w.find('[data-testid="palette-battery-add"]').trigger('click')
    expect(w.emitted('add-battery')).toBeUndefined()
    expect(w.find('[data-testid="palette-battery-error"]').text()).toBe('count must be a number')
  })

  test('a count above 200 is refused with a message', async () => {
    const w = render()
    w.findComponent(NSelect).vm.$emit('update:value', 'lavatory')
    w.findComponent(NInputNumber).vm.$emit('update:value', 250)
    await w.vm.$nextTick()
    await w.find('[data-testid="palette-battery-add"]').trigger('click')
    expect(w.emitted('add-battery')).toBeUndefined()
    expect(w.find('[data-testid="palette-battery-error"]').text()).toBe('count must be at most 200')
  })
})
