import fc from 'fast-check'
import { describe, expect, test } from 'vitest'
import { fernhollowHallDiagram } from '@shared/demo/fernhollow-hall'
import { applyWithInverse } from '@shared/document/history'
import { applyOperation, OperationError } from '@shared/document/operations'
import { diagramFileName, exportDiagramJson, parseDiagramJson } from '@shared/import/diagram-json'
import { replaceDocumentOperation } from '@shared/import/replace-diagram'
import { diagramArb } from '../document/arbitraries'
import { sampleDiagram } from '../document/sample'

describe('diagram JSON round trip', () => {
  test('the demo: export → import is deep-equal, also without undefined keys', () => {
    const outcome = parseDiagramJson(exportDiagramJson(fernhollowHallDiagram))
    expect(outcome).toStrictEqual({
      ok: true,
      doc: JSON.parse(JSON.stringify(fernhollowHallDiagram)),
    })
    expect(outcome.ok && outcome.doc).toEqual(fernhollowHallDiagram)
  })

  test('any valid document round-trips', () => {
    fc.assert(
      fc.property(diagramArb, (doc) => {
        const back = parseDiagramJson(exportDiagramJson(doc))
        expect(back.ok && back.doc).toEqual(doc)
      }),
      { numRuns: 60 },
    )
  })

  test('export is readable JSON with a trailing newline', () => {
    const text = exportDiagramJson(sampleDiagram())
    expect(text.startsWith('{\n  "format": "tributary-diagram",\n  "version": 1,')).toBe(true)
    expect(text.endsWith('}\n')).toBe(true)
  })

  test.each([
    ['{"format": "tributary-diagram", ', /^The file is not valid JSON( at line 1, column \d+)?\.$/],
    ['[1, 2]', /^This is not a Tributary diagram file: "format" must be "tributary-diagram"\.$/],
    [
      '{"format":"tributary-diagram","version":2,"nodes":[],"pipes":[]}',
      /format version 2; this version of Tributary reads version 1/,
    ],
  ])('refuses %s', (text, message) => {
    const outcome = parseDiagramJson(text)
    expect(outcome.ok).toBe(false)
    expect(!outcome.ok && outcome.errors[0]).toMatch(message)
  })

  test('schema errors name the field path and the element id', () => {
    const doc = JSON.parse(exportDiagramJson(sampleDiagram()))
    doc.pipes[1].lengthM = 'long'
    doc.nodes[0].pressureKPa = -3
    const outcome = parseDiagramJson(JSON.stringify(doc))
    expect(!outcome.ok && outcome.errors).toEqual([
      expect.stringMatching(/^nodes\.0\.pressureKPa: .* \(S1\)$/),
      expect.stringMatching(/^pipes\.1\.lengthM: .* \(P2\)$/),
    ])
  })

  test('file names keep letters and digits and drop path characters', () => {
    expect(diagramFileName('Domestic water / Block B', 'json')).toBe(
      'Domestic water - Block B.json',
    )
    expect(diagramFileName('  ', 'pdf')).toBe('diagram.pdf')
  })
})

describe('replaceDocumentOperation', () => {
  test('turns the open document into the imported one in one undoable batch, keeping the name', () => {
    const current = sampleDiagram()
    const next = fernhollowHallDiagram
    const { doc: after, inverse } = applyWithInverse(
      current,
      replaceDocumentOperation(current, next),
    )
    expect(after).toEqual({ ...next, name: current.name })
    expect(applyOperation(after, inverse)).toEqual(current)
  })

  test('refuses a replacement too large for one step, pointing to a new diagram instead', () => {
    const many = {
      ...sampleDiagram(),
      pipes: [],
      nodes: Array.from({ length: 10_001 }, (_, i) => ({
        id: `J${i}`,
        kind: 'junction' as const,
        label: '',
        elevationM: 0,
      })),
    }
    expect(() => replaceDocumentOperation(sampleDiagram(), many)).toThrow(OperationError)
    expect(() => replaceDocumentOperation(sampleDiagram(), many)).toThrow(
      /open the file as a new diagram/,
    )
  })
})
