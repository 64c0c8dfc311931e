import { afterEach, beforeEach, describe, expect, test } from 'vitest'
import type { VueWrapper } from '@vue/test-utils'
import PropertiesPanel from '@/features/editor/panels/PropertiesPanel.vue'
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

const pipe = (id: string) => store.doc.pipes.find((p) => p.id === id)!

describe('pipe', () => {
  test('shows its ends and the live result', () => {
    store.select([], ['P6'])
    const w = render()
    expect(w.find('[data-testid="prop-ends"]').text()).toBe('J2 → F1')
    expect(w.find('[data-testid="result-load"]').text()).toMatch(/FU$/)
    expect(w.find('[data-testid="result-size"]').text()).toMatch(/^DN\d+$/)
  })

  test.each([
    ['-2', 'Developed length cannot be negative'],
    ['0', 'Developed length must be more than 0'],
    ['abc', 'Developed length must be a number, got "abc"'],
  ])('length %j is refused and the document is unchanged', async (text, message) => {
    store.select([], ['P5'])
    const w = render()
    const before = store.doc
    await typeAndCommit(w, 'prop-length', text)
    expect(fieldError('prop-length')).toBe(message)
    expect(store.doc).toBe(before)
  })

  test('length typed in feet is stored in metres', async () => {
    store.select([], ['P5'])
    const w = render('us')
    await typeAndCommit(w, 'prop-length', '20')
    expect(pipe('P5').lengthM).toBeCloseTo(6.096, 9)
  })

  test('locking a size and clearing it', async () => {
    store.select([], ['P5'])
    const w = render()
    expect(selected(w, 'prop-size')).toBe(':auto')
    await choose(w, 'prop-size', '2')
    expect(pipe('P5').nominal).toBe('2')
    expect(store.result.pipes.P5).toMatchObject({ nominal: '2', locked: true })
    expect(w.find('[data-testid="result-size"]').text()).toBe('DN50 (locked)')
    await choose(w, 'prop-size', ':auto')
    expect(pipe('P5')).not.toHaveProperty('nominal')
    expect(store.result.pipes.P5!.locked).toBe(false)
  })

  test('material: a choice, then back to the diagram default', async () => {
    store.select([], ['P5'])
    const w = render('us')
    await choose(w, 'prop-material', 'pex')
    expect(pipe('P5').material).toBe('pex')
    await choose(w, 'prop-material', ':default')
    expect(pipe('P5')).not.toHaveProperty('material')
  })
})
