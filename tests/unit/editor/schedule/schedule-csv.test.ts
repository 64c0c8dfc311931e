import Papa from 'papaparse'
import { describe, expect, test } from 'vitest'
import { computeDiagram } from '@shared/calc/compute.ts'
import { diagramSchema } from '@shared/document/model.ts'
import {
  csvNumber,
  scheduleCsv,
  scheduleCsvHeaders,
  scheduleFileName,
} from '@/features/editor/schedule/schedule-csv.ts'
import { buildScheduleRows } from '@shared/schedule/schedule-rows.ts'
import { scheduleDiagram } from './schedule-doc.ts'

const doc = scheduleDiagram()
const result = computeDiagram(doc)

/** Parses the CSV back into records keyed by header. */
function records(csv: string) {
  const parsed = Papa.parse<Record<string, string>>(csv, { header: true, skipEmptyLines: true })
  expect(parsed.errors).toEqual([])
  return parsed.data
}

function csvFor(units: 'si' | 'us') {
  return scheduleCsv(buildScheduleRows(doc, result, units), units)
}

describe('scheduleCsv', () => {
  test('SI headers name SI units', () => {
    expect(scheduleCsvHeaders('si')).toEqual([
      'Pipe',
      'From',
      'From label',
      'To',
      'To label',
      'System',
      'Load (FU)',
      'Flush valve closets',
      'Flush valve urinals',
      'Demand curve',
      'Flow (L/s)',
      'Material',
      'Size',
      'Size locked',
      'Inside diameter (mm)',
      'Velocity (m/s)',
      'Developed length (m)',
      'Equivalent length (m)',
      'Friction loss (kPa)',
      'Inlet pressure (kPa)',
      'Outlet pressure (kPa)',
      'Status',
    ])
  })

  test('US headers name US units', () => {
    const headers = scheduleCsvHeaders('us')
    for (const h of [
      'Flow (gpm)',
      'Inside diameter (in)',
      'Velocity (ft/s)',
      'Developed length (ft)',
      'Equivalent length (ft)',
      'Friction loss (psi)',
      'Inlet pressure (psi)',
    ]) {
      expect(headers).toContain(h)
    }
    expect(headers.some((h) => /L\/s|kPa|\(m\)|mm/.test(h))).toBe(false)
  })

  test('the first line is the header row, then one line per pipe', () => {
    const lines = csvFor('si').split('\r\n')
    expect(lines[0]).toBe(scheduleCsvHeaders('si').join(','))
    expect(lines).toHaveLength(1 + doc.pipes.length)
  })

  test('US values are the SI numbers converted, rounded sensibly', () => {
    const p1 = result.pipes.p1!
    const row = records(csvFor('us')).find((r) => r.Pipe === 'p1')!
    expect(Number(row['Flow (gpm)'])).toBeCloseTo(p1.flowLps / 0.0630902, 2)
    expect(row['Flow (gpm)']).toMatch(/^\d+(\.\d{1,2})?$/)
    expect(Number(row['Inlet pressure (psi)'])).toBeCloseTo(p1.inletPressureKPa! / 6.894757, 2)
    expect(Number(row['Velocity (ft/s)'])).toBeCloseTo(p1.velocityMps! / 0.3048, 2)
    expect(Number(row['Developed length (ft)'])).toBeCloseTo(10 / 0.3048, 1)
    expect(Number(row['Inside diameter (in)'])).toBeCloseTo(1.985, 3)
    expect(row.Size).toBe('2"')
  })

  test('SI values keep their numbers and a locked size says so', () => {
    const rows = records(csvFor('si'))
    const p1 = rows.find((r) => r.Pipe === 'p1')!
    expect(Number(p1['Flow (L/s)'])).toBe(Number(result.pipes.p1!.flowLps.toFixed(3)))
    expect(p1).toMatchObject({
      Size: 'DN50',
      'Size locked': 'no',
      'Load (FU)': '108',
      Status: 'ok',
    })
    const p4 = rows.find((r) => r.Pipe === 'p4')!
    expect(p4['Size locked']).toBe('yes')
    expect(p4.Status!.split(', ')).toContain('velocity-exceeded')
  })

  test('a label with a comma is quoted and survives a round trip', () => {
    const csv = csvFor('si')
    expect(csv).toContain('"Riser A, level 1"')
    expect(records(csv).find((r) => r.Pipe === 'p2')!['To label']).toBe('Riser A, level 1')
  })

  test('a label that looks like a formula is escaped', () => {
    const risky = diagramSchema.parse({
      ...doc,
      nodes: doc.nodes.map((n) => (n.id === 'm' ? { ...n, label: '=HYPERLINK("x")' } : n)),
    })
    const csv = scheduleCsv(buildScheduleRows(risky, computeDiagram(risky), 'si'), 'si')
    expect(records(csv).find((r) => r.Pipe === 'p1')!['To label']).toBe(`'=HYPERLINK("x")`)
  })

  test('results the calculation could not produce are empty cells', () => {
    const broken = diagramSchema.parse({
      ...doc,
      pipes: [...doc.pipes, { id: 'p99', from: 'j1', to: 'ghost', system: 'cold', lengthM: 2 }],
    })
    const rows = records(scheduleCsv(buildScheduleRows(broken, computeDiagram(broken), 'si'), 'si'))
    expect(rows.find((r) => r.Pipe === 'p1')).toMatchObject({
      'Flow (L/s)': '',
      Status: 'not computed',
    })
  })

  test('csvNumber rounds per quantity and system', () => {
    expect(csvNumber('flow', 1.23456, 'si')).toBe(1.235)
    expect(csvNumber('pressure', 344.7379, 'us')).toBe(50)
    expect(csvNumber('load', 2.255, 'si')).toBeCloseTo(2.25, 9)
    expect(csvNumber('flow', null, 'us')).toBeNull()
    expect(Object.is(csvNumber('length', -0.0001, 'si'), -0)).toBe(false)
  })
})

describe('scheduleFileName', () => {
  test.each([
    ['Fernbrook Clinic, east wing', 'si', 'fernbrook-clinic-east-wing-pipe-schedule-si.csv'],
    ['Café Bâtiment B', 'us', 'cafe-batiment-b-pipe-schedule-us.csv'],
    ['  ', 'si', 'diagram-pipe-schedule-si.csv'],
    ['***', 'us', 'diagram-pipe-schedule-us.csv'],
  ] as const)('%j in %s → %s', (name, units, expected) => {
    expect(scheduleFileName(name, units)).toBe(expected)
  })
})
