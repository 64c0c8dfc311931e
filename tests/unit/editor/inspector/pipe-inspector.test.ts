import { afterEach, beforeEach, describe, expect, test } from 'vitest'
import { flushPromises, mount, type VueWrapper } from '@vue/test-utils'
import { createPinia, setActivePinia, type Pinia } from 'pinia'
import PipeInspector from '@/features/editor/panels/PipeInspector.vue'
import { useDocumentStore } from '@/stores/document'
import { scheduleDiagram } from '../schedule/schedule-doc.ts'

let pinia: Pinia
let wrapper: VueWrapper | undefined

beforeEach(() => {
  pinia = createPinia()
  setActivePinia(pinia)
})
afterEach(() => {
  wrapper?.unmount()
  wrapper = undefined
})

async function render(pipeId: string, units: 'si' | 'us' = 'si', doc = scheduleDiagram()) {
  expect(useDocumentStore().load('d-1', doc, 1)).toEqual({ ok: true })
  wrapper = mount(PipeInspector, { props: { pipeId, units }, global: { plugins: [pinia] } })
  await flushPromises()
  return wrapper
}

const lines = (w: VueWrapper, section: string) =>
  w
    .findAll(`[data-testid="inspector-${section}"] [data-testid="inspector-line"]`)
    .map((l) => l.text())

describe('PipeInspector', () => {
  test('renders the breakdown of a pipe serving a flush valve battery', async () => {
    const w = await render('p3')
    expect(w.find('[data-testid="pipe-inspector"]').exists()).toBe(true)
    expect(w.find('[data-testid="inspector-pipe-id"]').text()).toBe('p3')
    expect(w.find('[data-testid="inspector-route"]').text()).toBe(
      'j1 (Riser A, level 1) → wc (WC battery)',
    )
    const load = lines(w, 'load')
    expect(load).toContain(
      'Water closet, flush valve × 4 (wc): counted in the flush valve closet series',
    )
    expect(load.join('\n')).toContain('4 on this pipe → 40 + 30 + 20 + 15 = 105 FU')
    expect(load.at(-1)).toBe('Load on this pipe: 105 FU')
    expect(lines(w, 'demand').join('\n')).toContain(
      'between the rows 100 FU → 67.5 gpm and 120 FU → 73.0 gpm',
    )
    expect(lines(w, 'size').join('\n')).toContain('DN50 is the smallest size')
    expect(lines(w, 'problems')).toEqual(['None: every check on this pipe passes.'])
    expect(w.find('[data-testid="inspector-notice"]').exists()).toBe(false)
  })

  test('follows the units and the selected pipe', async () => {
    const w = await render('p3', 'us')
    expect(lines(w, 'demand').at(-1)).toBe('Design flow: 68.9 gpm.')
    await w.setProps({ pipeId: 'p10', units: 'si' })
    expect(w.find('[data-testid="inspector-pipe-id"]').text()).toBe('p10')
    expect(lines(w, 'size').join('\n')).toContain('DN20 is locked by the designer')
  })

  test('says plainly when the document has no result for the pipe', async () => {
    const doc = scheduleDiagram()
    const broken = { ...doc, pipes: [...doc.pipes, { ...doc.pipes[0]!, id: 'p99', to: 'ghost' }] }
    const w = await render('p2', 'si', broken)
    expect(w.find('[data-testid="inspector-notice"]').text()).toMatch(/^No results for this pipe/)
    expect(w.find('[data-testid="inspector-load"]').exists()).toBe(false)
  })
})
