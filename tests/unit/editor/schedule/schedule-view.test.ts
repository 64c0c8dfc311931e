import { afterEach, beforeEach, describe, expect, test, vi } from 'vitest'
import { flushPromises, mount, type VueWrapper } from '@vue/test-utils'
import { createPinia, setActivePinia, type Pinia } from 'pinia'
import { NDataTable } from 'naive-ui'
import Papa from 'papaparse'
import { diagramSchema } from '@shared/document/model.ts'
import ScheduleView from '@/features/editor/schedule/ScheduleView.vue'
import { useDocumentStore } from '@/stores/document'
import { scheduleDiagram } from './schedule-doc.ts'

let pinia: Pinia
let wrapper: VueWrapper | undefined

beforeEach(() => {
  pinia = createPinia()
  setActivePinia(pinia)
  expect(useDocumentStore().load('d-1', scheduleDiagram(), 1)).toEqual({ ok: true })
})
afterEach(() => {
  wrapper?.unmount()
  wrapper = undefined
  useDocumentStore().unload()
  vi.restoreAllMocks()
})

async function render(units: 'si' | 'us' = 'si') {
  wrapper = mount(ScheduleView, {
    props: { units, fileName: 'Fernbrook Clinic' },
    global: { plugins: [pinia] },
    attachTo: document.body,
  })
  await flushPromises()
  return wrapper
}

const shownIds = (w: VueWrapper) =>
  w.findAll('[data-testid^="schedule-pipe-"]').map((c) => c.text())

describe('ScheduleView', () => {
  test('renders one row per pipe with its id, size and count', async () => {
    const w = await render()
    expect(w.find('[data-testid="pipe-schedule"]').exists()).toBe(true)
    expect(shownIds(w)).toEqual(['p1', 'p2', 'p3', 'p4', 'p5', 'p10'])
    expect(w.find('[data-testid="schedule-row-p1"]').text()).toContain('DN50')
    expect(w.find('[data-testid="schedule-count"]').text()).toBe('6 pipes')
    expect(w.find('[data-testid="design-aid-notice"]').exists()).toBe(true)
  })

  test('headers carry the display units', async () => {
    const w = await render('us')
    const header = w.find('thead').text()
    expect(header).toContain('Flow (gpm)')
    expect(header).toContain('Velocity (ft/s)')
    expect(w.find('[data-testid="schedule-row-p1"]').text()).toContain('2"')
  })

  test('filters by system', async () => {
    const w = await render()
    await w.find('[data-testid="schedule-system-hot"] input').setValue(true)
    await flushPromises()
    expect(shownIds(w)).toEqual(['p10'])
    expect(w.find('[data-testid="schedule-count"]').text()).toBe('1 of 6 pipes')
    await w.find('[data-testid="schedule-system-cold"] input').setValue(true)
    await flushPromises()
    expect(shownIds(w)).toEqual(['p1', 'p2', 'p3', 'p4', 'p5'])
  })

  test('filters by text and by problems', async () => {
    const w = await render()
    await w.find('[data-testid="schedule-search"] input').setValue('wc battery')
    await flushPromises()
    expect(shownIds(w)).toEqual(['p3'])
    await w.find('[data-testid="schedule-search"] input').setValue('')
    await w.find('[data-testid="schedule-problems-only"]').trigger('click')
    await flushPromises()
    expect(shownIds(w)).toEqual(['p4'])
    expect(w.find('[data-testid="schedule-row-p4"]').text()).toContain('velocity-exceeded')
  })

  test('clicking a row emits focus with the pipe id', async () => {
    const w = await render()
    await w.find('[data-testid="schedule-row-p3"]').trigger('click')
    expect(w.emitted('focus')).toEqual([['p3']])
  })

  test('clicking a header sorts by its SI number, largest first, then smallest first', async () => {
    const w = await render()
    const flowHeader = () => w.findAll('th').find((th) => th.text() === 'Flow (L/s)')!
    await flowHeader().trigger('click')
    await flushPromises()
    // 108 FU on p1 and p2, 105 on p3, 2.25 on the rest; equal flows stay in id order.
    expect(shownIds(w)).toEqual(['p1', 'p2', 'p3', 'p4', 'p5', 'p10'])
    await flowHeader().trigger('click')
    await flushPromises()
    expect(shownIds(w)).toEqual(['p4', 'p5', 'p10', 'p3', 'p1', 'p2'])
  })

  test('Export CSV downloads the shown rows under the slugified name', async () => {
    const blobs: Blob[] = []
    vi.spyOn(URL, 'createObjectURL').mockImplementation((blob) => {
      blobs.push(blob as Blob)
      return 'blob:schedule'
    })
    vi.spyOn(URL, 'revokeObjectURL').mockImplementation(() => undefined)
    const names: string[] = []
    vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(function (
      this: HTMLAnchorElement,
    ) {
      names.push(this.download)
    })
    const w = await render('us')
    await w.find('[data-testid="schedule-system-hot"] input').setValue(true)
    await flushPromises()
    await w.find('[data-testid="export-csv"]').trigger('click')
    expect(names).toEqual(['fernbrook-clinic-pipe-schedule-us.csv'])
    const parsed = Papa.parse<Record<string, string>>(await blobs[0]!.text(), { header: true })
    expect(parsed.data.map((r) => r.Pipe)).toEqual(['p10'])
    expect(parsed.meta.fields).toContain('Flow (gpm)')
  })

  test('says plainly when the document errors leave pipes without results', async () => {
    const store = useDocumentStore()
    const doc = scheduleDiagram()
    store.load(
      'd-1',
      { ...doc, pipes: [...doc.pipes, { ...doc.pipes[0]!, id: 'p99', to: 'ghost' }] },
      1,
    )
    const w = await render()
    expect(w.find('[data-testid="schedule-missing"]').text()).toContain(
      '7 of 7 pipes have no results',
    )
    expect(shownIds(w)).toHaveLength(7)
  })

  test('a large schedule switches to virtual scrolling', async () => {
    const count = 400
    const big = diagramSchema.parse({
      format: 'tributary-diagram',
      version: 1,
      nodes: [
        { id: 's', kind: 'supply', pressureKPa: 500 },
        ...Array.from({ length: count }, (_, i) => ({
          id: `f${i}`,
          kind: 'fixture',
          fixture: 'hose-bibb',
        })),
      ],
      pipes: Array.from({ length: count }, (_, i) => ({
        id: `p${i}`,
        from: 's',
        to: `f${i}`,
        system: 'cold',
        lengthM: 2,
      })),
    })
    useDocumentStore().load('d-2', big, 1)
    const w = await render()
    expect(w.find('[data-testid="schedule-count"]').text()).toBe(`${count} pipes`)
    expect(w.findComponent(NDataTable).props('virtualScroll')).toBe(true)
    await w.find('[data-testid="schedule-search"] input').setValue('p39')
    await flushPromises()
    // p39 and p390-p399: few enough to render every row again.
    expect(w.findComponent(NDataTable).props('virtualScroll')).toBe(false)
    expect(shownIds(w)).toEqual(['p39', ...Array.from({ length: 10 }, (_, i) => `p39${i}`)])
  })
})
