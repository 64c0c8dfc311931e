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
import { buildScheduleRows } from '@/features/editor/schedule/schedule-rows'
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
    'the pipe schedule says what the editor schedule says (%s)',
    (units) => {
      const doc = fernhollowHallDiagram
      const model = buildReportModel(input(doc, units))
      const editor = buildScheduleRows(doc, computeDiagram(doc), units)
      expect(model.schedule.rows).toHaveLength(doc.pipes.length)
      model.schedule.rows.forEach((cells, i) => {
        const t = editor[i]!.text
        expect(cells).toEqual([
          t.id,
          t.from,
          t.to,
          t.system,
          t.load,
          t.curve,
          t.flow,
          t.material,
          t.nominal,
          t.insideDiameter,
          t.velocity,
          t.length,
          t.equivalentLength,
          t.loss,
          t.inletPressure,
          t.outletPressure,
          t.status,
        ])
      })
      expect(model.schedule.columns.map((c) => c.title)).toContain(
        units === 'si' ? 'Flow\n(L/s)' : 'Flow\n(gpm)',
      )
    },
  )

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
