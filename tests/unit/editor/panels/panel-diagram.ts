/** A small riser for the panel tests: service, meter, heater, two floors, a fixture battery. */
import { mount } from '@vue/test-utils'
import { createPinia, setActivePinia } from 'pinia'
import { NSelect } from 'naive-ui'
import type { Component } from 'vue'
import {
  DIAGRAM_FORMAT,
  DIAGRAM_FORMAT_VERSION,
  diagramSchema,
  type Diagram,
} from '@shared/document/model'
import { useDocumentStore } from '@/stores/document'

export function panelDiagram(): Diagram {
  return diagramSchema.parse({
    format: DIAGRAM_FORMAT,
    version: DIAGRAM_FORMAT_VERSION,
    name: 'Mill Lane flats',
    levels: [
      { id: 'L1', name: 'Ground', elevationM: 0 },
      { id: 'L2', name: 'First', elevationM: 3 },
      { id: 'L3', name: 'Plant deck', elevationM: 6 },
    ],
    nodes: [
      { id: 'S1', kind: 'supply', pressureKPa: 450, levelId: 'L1' },
      { id: 'M1', kind: 'meter', lossKPa: 20, levelId: 'L1' },
      { id: 'J1', kind: 'junction', levelId: 'L1' },
      { id: 'WH1', kind: 'water-heater', levelId: 'L1' },
      { id: 'EQ1', kind: 'equipment', flowLps: 0.2, levelId: 'L1' },
      { id: 'J2', kind: 'junction', levelId: 'L2', elevationM: 3 },
      { id: 'F1', kind: 'fixture', fixture: 'lavatory', count: 4, levelId: 'L2', elevationM: 3.8 },
    ],
    pipes: [
      { id: 'P1', from: 'S1', to: 'M1', system: 'cold', lengthM: 10 },
      { id: 'P2', from: 'M1', to: 'J1', system: 'cold', lengthM: 3 },
      { id: 'P3', from: 'J1', to: 'WH1', system: 'cold', lengthM: 2 },
      { id: 'P4', from: 'J1', to: 'EQ1', system: 'cold', lengthM: 2 },
      { id: 'P5', from: 'J1', to: 'J2', system: 'cold', lengthM: 4 },
      { id: 'P6', from: 'J2', to: 'F1', system: 'cold', lengthM: 1.5 },
      { id: 'P7', from: 'WH1', to: 'F1', system: 'hot', lengthM: 6 },
    ],
  })
}

/** A fresh Pinia with the panel diagram open. */
export function openPanelDiagram() {
  setActivePinia(createPinia())
  const store = useDocumentStore()
  const loaded = store.load('d1', panelDiagram(), 0)
  if (!loaded.ok) throw new Error(loaded.error)
  return store
}

/** Mounts a panel component in the document body (Naive UI menus and drawers teleport there). */
export function mountPanel<C extends Component>(component: C, props: Record<string, unknown>) {
  return mount(component as Component, { props, attachTo: document.body })
}

type Wrapper = ReturnType<typeof mountPanel>

/** Types into an input by its test id and commits it the way a user does: Enter. */
export async function typeAndCommit(wrapper: Wrapper, testid: string, text: string) {
  const input = wrapper.find(`[data-testid="${testid}"]`)
  if (!input.exists()) throw new Error(`no input ${testid}`)
  await input.setValue(text)
  await input.trigger('keydown', { key: 'Enter' })
}

/** The error shown beside a field, or null. */
export function fieldError(testid: string): string | null {
  return document.querySelector(`[data-testid="${testid}-error"]`)?.textContent ?? null
}

/** Picks a value in a select by its test id, as choosing an option in its menu does. */
export async function choose(wrapper: Wrapper, testid: string, value: string) {
  const select = wrapper
    .findAllComponents(NSelect)
    .find((s) => s.attributes('data-testid') === testid)
  if (!select) throw new Error(`no select ${testid}`)
  select.vm.$emit('update:value', value, null)
  await wrapper.vm.$nextTick()
}

/** The value a select currently holds. */
export function selected(wrapper: Wrapper, testid: string): unknown {
  const select = wrapper
    .findAllComponents(NSelect)
    .find((s) => s.attributes('data-testid') === testid)
  return select?.props('value')
}
