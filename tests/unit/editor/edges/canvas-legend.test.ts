import { describe, expect, test } from 'vitest'
import { mount } from '@vue/test-utils'
import { NODE_KINDS } from '@shared/document/model.ts'
import CanvasLegend from '@/features/editor/legend/CanvasLegend.vue'

describe('CanvasLegend', () => {
  test('tells cold from hot by line pattern as well as colour', () => {
    const w = mount(CanvasLegend)
    const cold = w.find('[data-testid="legend-cold"] line')
    const hot = w.find('[data-testid="legend-hot"] line')
    expect(cold.attributes('stroke-dasharray')).toBeUndefined()
    expect(hot.attributes('stroke-dasharray')).toBe('7 4')
    expect(cold.attributes('stroke')).not.toBe(hot.attributes('stroke'))
  })

  test('shows a sample pipe label in the current units, plus the lock and problem marks', () => {
    expect(mount(CanvasLegend).find('[data-testid="legend-label"]').text()).toBe(
      '58 FU · 2.50 L/s · DN50 · 1.25 m/s',
    )
    const us = mount(CanvasLegend, { props: { units: 'us' } })
    expect(us.find('[data-testid="legend-label"]').text()).toBe('58 FU · 39.6 gpm · 2" · 4.1 ft/s')
    expect(us.find('[data-testid="legend-lock"]').text()).toBe('Size locked by the designer')
    expect(us.find('[data-testid="legend-problem"]').text()).toContain('problem')
  })

  test('lists every node kind with its symbol', () => {
    const w = mount(CanvasLegend)
    for (const kind of NODE_KINDS) {
      expect(w.find(`[data-testid="legend-kind-${kind}"] svg`).exists()).toBe(true)
    }
    expect(w.find('[data-testid="legend-kind-pressure-reducing-valve"]').text()).toBe(
      'Pressure-reducing valve',
    )
  })
})
