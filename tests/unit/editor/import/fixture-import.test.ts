import { mount } from '@vue/test-utils'
import { createPinia, setActivePinia } from 'pinia'
import { beforeEach, describe, expect, test } from 'vitest'
import { previewFixtureCsv } from '@shared/import/fixture-csv'
import FixturePreviewTable from '@/features/editor/import/FixturePreviewTable.vue'
import { useFixtureImport } from '@/features/editor/import/useFixtureImport'
import { useDocumentStore } from '@/stores/document'
import { sampleDiagram } from '../../document/sample'

const CSV = [
  'room,level,fixture,count,occupancy',
  'Washroom 2.01,First,water-closet-flush-valve,3,public',
  'Washroom 2.01,First,lavatory,2,',
  'Washroom 2.01,First,lav,2,',
  'Plant room,Ground,hose-bibb,1,',
].join('\n')
const file = (text: string, name = 'schedule.csv') => new File([text], name, { type: 'text/csv' })

beforeEach(() => setActivePinia(createPinia()))

function openStore() {
  const store = useDocumentStore()
  expect(store.load('d-1', sampleDiagram(), 3)).toEqual({ ok: true })
  return store
}

describe('useFixtureImport with the document store', () => {
  test('nothing applies until every room has a feed and the bad row is explicitly left out', async () => {
    const store = openStore()
    const state = useFixtureImport(() => store.doc)
    await state.read(file(CSV))
    expect(state.preview.value!.accepted).toBe(3)
    expect(state.plan.value).toBeNull()
    expect(state.blockers.value).toEqual([
      'Room "Washroom 2.01" (First): choose the junction that feeds it cold water (row 2)',
      '1 row has errors: correct the file, or confirm leaving them out.',
    ])
    const [washroom, plant] = state.preview.value!.rooms
    state.setFeed(washroom!.key, 'cold', 'J2')
    state.setFeed(plant!.key, 'cold', 'J1')
    expect(state.blockers.value).toEqual([
      '1 row has errors: correct the file, or confirm leaving them out.',
    ])
    state.skipRejected.value = true
    expect(state.blockers.value).toEqual([])
    const before = store.doc
    expect(store.apply(state.plan.value!.op)).toEqual({ ok: true })
    expect(store.doc.nodes.filter((n) => n.kind === 'fixture')).toHaveLength(1 + 3)
    // One import, one undo step.
    expect(store.undo()).toEqual({ ok: true })
    expect(store.doc).toEqual(before)
    expect(store.canUndo).toBe(false)
  })

  test('a file above the size limit is refused with its size, not read', async () => {
    const store = openStore()
    const state = useFixtureImport(() => store.doc)
    await state.read(file('x'.repeat(2 * 1_048_576 + 1), 'huge.csv'))
    expect(state.readError.value).toMatch(
      /^huge\.csv is 2\.0 MB; the import reads files up to 2 MB$/,
    )
    expect(state.preview.value).toBeNull()
  })

  test('a file with a header problem shows the problem and offers nothing to apply', async () => {
    const store = openStore()
    const state = useFixtureImport(() => store.doc)
    await state.read(file('room,fixture\nWC,lavatory\n'))
    expect(state.blockers.value[0]).toMatch(/lacks columns "level", "count"/)
    expect(state.plan.value).toBeNull()
  })
})

describe('FixturePreviewTable', () => {
  test('shows each row accepted or with its errors naming row and column', async () => {
    const preview = previewFixtureCsv(CSV, sampleDiagram())
    const wrapper = mount(FixturePreviewTable, { props: { rows: preview.rows } })
    const row = (line: number) => wrapper.find(`[data-testid="preview-row-${line}"]`)
    expect(row(2).attributes('data-status')).toBe('accepted')
    expect(row(2).text()).toContain('Accepted')
    expect(row(4).attributes('data-status')).toBe('error')
    expect(row(4).text()).toContain(
      'Row 4, column "fixture": "lav" is not in the fixture catalogue',
    )
    await wrapper.find('[data-testid="only-error-rows"]').trigger('click')
    expect(
      wrapper.findAll('[data-testid^="preview-row-"]').map((r) => r.attributes('data-testid')),
    ).toEqual(['preview-row-4'])
  })
})
