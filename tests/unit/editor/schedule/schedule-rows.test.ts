import { describe, expect, test } from 'vitest'
import { computeDiagram } from '@shared/calc/compute.ts'
import { diagramSchema } from '@shared/document/model.ts'
import { buildScheduleRows } from '@shared/schedule/schedule-rows.ts'
import {
  compareScheduleRows,
  filterScheduleRows,
  NO_FILTER,
  sortKey,
  sortScheduleRows,
} from '@/features/editor/schedule/schedule-query.ts'
import { scheduleDiagram } from './schedule-doc.ts'

const doc = scheduleDiagram()
const result = computeDiagram(doc)
const si = buildScheduleRows(doc, result, 'si')
const us = buildScheduleRows(doc, result, 'us')
const row = (rows: typeof si, id: string) => rows.find((r) => r.id === id)!

describe('buildScheduleRows', () => {
  test('one row per pipe, in document order, with both ends named', () => {
    expect(si.map((r) => r.id)).toEqual(['p1', 'p2', 'p3', 'p4', 'p5', 'p10'])
    expect(row(si, 'p2')).toMatchObject({
      from: { id: 'm', label: 'Meter' },
      to: { id: 'j1', label: 'Riser A, level 1' },
      system: 'cold',
    })
    expect(row(si, 'p2').text.to).toBe('j1 (Riser A, level 1)')
  })

  test('keeps the calculation in SI numbers, whatever the display units', () => {
    for (const id of ['p1', 'p3', 'p10']) {
      const r = result.pipes[id]!
      expect(row(us, id)).toMatchObject({
        load: r.load,
        closets: r.flushValveClosets,
        flowLps: r.flowLps,
        velocityMps: r.velocityMps,
        lossKPa: r.lossKPa,
        inletPressureKPa: r.inletPressureKPa,
        outletPressureKPa: r.outletPressureKPa,
      })
    }
    expect(row(si, 'p3')).toMatchObject({ load: 105, closets: 4, urinals: 0, curve: 'flush-valve' })
    expect(row(si, 'p2').lengthM).toBe(15)
    expect(row(si, 'p2').equivalentLengthM).toBeCloseTo(18.75, 9)
  })

  test('formats display text per unit system', () => {
    const p1 = result.pipes.p1!
    expect(row(si, 'p1').text).toMatchObject({
      load: '108',
      curve: 'flush valve',
      flow: p1.flowLps.toFixed(2),
      nominal: 'DN50',
      material: 'Copper tube, Type L',
      length: '10.0',
    })
    expect(row(us, 'p1').text).toMatchObject({ nominal: '2"', length: '32.8' })
    expect(Number(row(us, 'p1').text.flow)).toBeCloseTo(p1.flowLps / 0.0630902, 1)
    expect(row(si, 'p4').text.load).toBe('2.3')
  })

  test('status is ok, or the codes of the problems naming the pipe', () => {
    expect(row(si, 'p1')).toMatchObject({ status: 'ok', problems: [] })
    expect(row(si, 'p1').text.status).toBe('ok')
    expect(row(si, 'p4').status).toBe('warning')
    const named = result.issues.filter((i) => i.ids.includes('p4')).map((i) => i.code)
    expect(named).toContain('velocity-exceeded')
    expect(row(si, 'p4').text.status).toBe(named.join(', '))
    expect(row(si, 'p4').problems.map((p) => p.code)).toEqual(named)
    expect(row(si, 'p4')).toMatchObject({ locked: true, nominal: '3/8' })
  })

  test('a document whose errors stop the calculation gives rows marked not computed', () => {
    const broken = diagramSchema.parse({
      ...doc,
      pipes: [...doc.pipes, { id: 'p99', from: 'j1', to: 'ghost', system: 'cold', lengthM: 2 }],
    })
    const rows = buildScheduleRows(broken, computeDiagram(broken), 'si')
    expect(rows).toHaveLength(7)
    expect(rows.find((r) => r.id === 'p99')!.status).toBe('error')
    expect(row(rows, 'p1')).toMatchObject({
      computed: false,
      status: 'not-computed',
      flowLps: null,
    })
    expect(row(rows, 'p1').text.flow).toBe('—')
  })
})

describe('sorting', () => {
  test('ids sort naturally: p10 after p5', () => {
    const ids = sortScheduleRows(si, 'id', 'ascend').map((r) => r.id)
    expect(ids).toEqual(['p1', 'p2', 'p3', 'p4', 'p5', 'p10'])
  })

  test('sorts by the SI number, not the text', () => {
    expect(sortKey(row(us, 'p1'), 'flow')).toBe(result.pipes.p1!.flowLps)
    const byFlow = sortScheduleRows(us, 'flow', 'descend').map((r) => r.flowLps!)
    expect(byFlow).toEqual([...byFlow].sort((a, b) => b - a))
    expect(byFlow[0]).toBe(result.pipes.p1!.flowLps)
  })

  test('nominal sorts by inches; ties fall back to the pipe id', () => {
    const bySize = sortScheduleRows(si, 'nominal', 'ascend').map((r) => `${r.id}:${r.nominal}`)
    expect(bySize).toEqual(['p4:3/8', 'p5:1/2', 'p10:3/4', 'p1:2', 'p2:2', 'p3:2'])
  })

  test('status sorts the worst first when descending; missing values go last both ways', () => {
    expect(sortScheduleRows(si, 'status', 'descend')[0]!.id).toBe('p4')
    const blank = { ...row(si, 'p1'), id: 'p0', velocityMps: null }
    for (const order of ['ascend', 'descend'] as const) {
      const sorted = [blank, ...si].sort(compareScheduleRows('velocity', order))
      expect(sorted.at(-1)!.id).toBe('p0')
    }
  })

  test('no sort keeps the document order', () => {
    expect(sortScheduleRows(si, 'flow', false).map((r) => r.id)).toEqual(si.map((r) => r.id))
  })
})

describe('filterScheduleRows', () => {
  test.each([
    [{ system: 'hot' as const }, ['p10']],
    [{ system: 'cold' as const }, ['p1', 'p2', 'p3', 'p4', 'p5']],
    [{ problemsOnly: true }, ['p4']],
    [{ search: 'riser a' }, ['p2', 'p3', 'p4', 'p5']],
    [{ search: 'P10' }, ['p10']],
    [{ search: 'heater', system: 'cold' as const }, ['p5']],
    [{ search: 'nothing here' }, []],
  ])('%j keeps %j', (filter, ids) => {
    expect(filterScheduleRows(si, { ...NO_FILTER, ...filter }).map((r) => r.id)).toEqual(ids)
  })
})
