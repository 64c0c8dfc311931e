import { describe, expect, test } from 'vitest'
import { computeDiagram } from '@shared/calc/compute'
import { FIXTURES } from '@shared/calc/fixtures'
import { MATERIALS } from '@shared/calc/materials'
import { fernhollowHallDiagram } from '@shared/demo/fernhollow-hall'
import { applyOperation } from '@shared/document/operations'
import type { Diagram } from '@shared/document/model'
import { buildReportModel, type ReportInput } from '@shared/report/report-model'
import { DESIGN_AID_CAUTION, NOT_SUBMITTED } from '@shared/report/review-status'
import { formatQuantity } from '@shared/units/format'
import type { UnitSystem } from '@shared/units/system'
import { sampleDiagram } from '../document/sample'

const input = (doc: Diagram, units: UnitSystem = 'si'): ReportInput => ({
  doc,
  result: computeDiagram(doc),
  project: { name: 'Fernhollow Community Hall', description: '', units },
  diagram: {
    name: 'Domestic water',
    revision: 7,
    updatedAt: '2026-11-30T10:20:00.000Z',
    updatedBy: 'Blake',
  },
  review: NOT_SUBMITTED,
  generatedAt: '2026-12-01T08:00:00.000Z',
})

describe('report model', () => {
  test.each(['si', 'us'] as const)(
    'the pipe schedule is one row per pipe in document order, in the units, locked sizes marked (%s)',
    (units) => {
      const core = fernhollowHallDiagram.pipes.findIndex((p) => p.id === 'c-core')
      const doc = {
        ...fernhollowHallDiagram,
        pipes: fernhollowHallDiagram.pipes.map((p, i) => (i === core ? { ...p, nominal: '2' } : p)),
      }
      const model = buildReportModel(input(doc, units))
      expect(model.schedule.rows.map((cells) => cells[0])).toEqual(doc.pipes.map((p) => p.id))
      const size = model.schedule.columns.findIndex((c) => c.title === 'Size')
      expect(model.schedule.rows[core]![size]).toBe(
        units === 'si' ? 'DN50 (locked)' : '2" (locked)',
      )
      expect(model.schedule.rows[core - 1]![size]).not.toContain('locked')
      expect(model.schedule.columns.map((c) => c.title)).toContain(
        units === 'si' ? 'Flow\n(L/s)' : 'Flow\n(gpm)',
      )
      const flow = model.schedule.columns.findIndex((c) => c.title.startsWith('Flow'))
      const first = computeDiagram(doc).pipes[doc.pipes[0]!.id]!
      expect(model.schedule.rows[0]![flow]).toBe(
        formatQuantity('flow', first.flowLps, units, { unit: false }),
      )
    },
  )

  test('a pipe named by a problem is marked with its worst severity and lists the codes once', () => {
    const doc = {
      ...fernhollowHallDiagram,
      settings: { ...fernhollowHallDiagram.settings, velocityLimits: { cold: 0.3, hot: 0.3 } },
    }
    const model = buildReportModel(input(doc))
    const status = model.schedule.columns.findIndex((c) => c.title === 'Status')
    const marked = model.schedule.marks.filter((m) => m !== null)
    expect(marked.length).toBeGreaterThan(0)
    model.schedule.rows.forEach((cells, i) => {
      const codes = cells[status]!.split(', ')
      expect(new Set(codes).size).toBe(codes.length)
      if (model.schedule.marks[i] === null) expect(cells[status]).toBe('ok')
    })
  })

  test('the title block names project, diagram, revision and dates; the caution and review status are carried', () => {
    const model = buildReportModel(input(sampleDiagram()))
    expect(model.identity).toEqual(
      expect.arrayContaining([
        { label: 'Project', value: 'Fernhollow Community Hall' },
        { label: 'Revision', value: '7' },
        { label: 'Last saved', value: '2026-11-30 10:20 UTC by Blake' },
        { label: 'Report made', value: '2026-12-01 08:00 UTC' },
      ]),
    )
    expect(model.caution).toBe(DESIGN_AID_CAUTION)
    expect(model.caution).toBe(
      'Results are a design aid. The plumbing code adopted by the local authority and a licensed professional decide.',
    )
    expect(model.review.label).toBe('Not yet submitted for review')
  })

  test('node pressures come from the result, in the project units', () => {
    const doc = sampleDiagram()
    const result = computeDiagram(doc)
    const model = buildReportModel(input(doc, 'us'))
    const f1 = model.nodes.rows.find((row) => row[0] === 'F1')!
    expect(f1[1]).toBe('Lavatory')
    expect(f1[5]).toBe(
      formatQuantity('pressure', result.nodes.F1!.pressureKPa, 'us', { unit: false }),
    )
    expect(model.nodes.columns[5]!.title).toBe('Residual pressure\n(psi)')
  })

  test('a marked row follows the issues naming the element', () => {
    const doc = applyOperation(sampleDiagram(), {
      type: 'pipe.update',
      id: 'P5',
      patch: { lengthM: -1 },
    })
    const model = buildReportModel(input(doc))
    const at = doc.pipes.findIndex((p) => p.id === 'P5')
    expect(model.schedule.marks[at]).toBe('error')
    expect(model.schedule.rows[at]!.at(-1)).not.toBe('ok')
    expect(model.problems[0]!.severity).toBe('error')
  })

  test('sources list the catalogue texts of exactly the fixtures, tables and materials used', () => {
    const doc = applyOperation(sampleDiagram(), {
      type: 'pipe.update',
      id: 'P6',
      patch: { material: 'pex' },
    })
    const model = buildReportModel(input(doc))
    const text = model.sources.flatMap((g) => g.entries).join('\n')
    // Per-fixture basis: the IPC column of the lavatory, not the UPC one.
    expect(text).toContain(`${FIXTURES.lavatory!.ipc.source} — Lavatory`)
    expect(text).toContain(FIXTURES.lavatory!.minPressureSource)
    expect(text).toContain(FIXTURES.lavatory!.minNominalSource)
    expect(text).toContain(MATERIALS.pex!.source)
    expect(text).toContain(MATERIALS['copper-l']!.source)
    expect(text).not.toContain(MATERIALS.cpvc!.source)
    expect(text).not.toContain('Kitchen sink')
    expect(text).toContain('IPC Table E103.3(3)')
    expect(model.statusTags.map((t) => t.tag)).toEqual(['C', 'C*', 'M', 'X', '[Sxx]'])
  })

  test('the flush valve series basis cites the series and the UPC column', () => {
    const model = buildReportModel(input(fernhollowHallDiagram))
    const loads = model.sources.find((g) => g.topic.startsWith('Fixture loads'))!
    expect(loads.topic).toBe('Fixture loads (flush valve series basis)')
    expect(loads.entries[0]).toMatch(/^Flush valve series .*C\* \[S18\]/)
    expect(loads.entries.join('\n')).toContain(FIXTURES['water-closet-tank']!.upc.source)
    expect(model.loadBasis.name).toBe('Flush valve series')
  })

  test('the picture holds every node inside its bounds; nodes without a position are listed', () => {
    const doc = applyOperation(sampleDiagram(), {
      type: 'node.add',
      node: { id: 'J8', kind: 'junction', label: '', elevationM: 0 },
    })
    const { picture } = buildReportModel(input(doc))
    expect(picture.unplaced).toEqual(['J8'])
    for (const node of picture.nodes) {
      expect(node.x).toBeGreaterThan(picture.bounds.minX)
      expect(node.x).toBeLessThan(picture.bounds.maxX)
      expect(node.y).toBeGreaterThan(picture.bounds.minY)
      expect(node.y).toBeLessThan(picture.bounds.maxY)
    }
    // Cold pipes run to the fixture's centre, hot ones beside it so both drops show.
    const p5 = picture.pipes.find((p) => p.id === 'P5')!
    const p6 = picture.pipes.find((p) => p.id === 'P6')!
    expect(p5.points.at(-1)).toEqual({ x: 100, y: 400 })
    expect(p6.points.at(-1)!.x).toBeGreaterThan(100)
    expect(p5.size).toMatch(/^DN\d+$/)
  })

  test('a document never drawn on the canvas gets no picture, only the list of its nodes', () => {
    const doc = {
      ...sampleDiagram(),
      nodes: sampleDiagram().nodes.map(({ position: _p, ...n }) => n),
    }
    const { picture } = buildReportModel(input(doc))
    expect(picture.nodes).toEqual([])
    expect(picture.pipes).toEqual([])
    expect(picture.unplaced).toEqual(doc.nodes.map((n) => n.id))
  })
})
