import { describe, expect, test } from 'vitest'
import { createIdAllocator, ID_PREFIXES, nextId } from '@shared/document/ids'
import { emptyDiagram } from '@shared/document/model'
import { sampleDiagram } from './sample'

describe('ids', () => {
  test.each([
    ['junction', 'J3'],
    ['fixture', 'F2'],
    ['water-heater', 'WH2'],
    ['pipe', 'P7'],
    ['level', 'L4'],
    ['equipment', 'EQ1'],
    ['pressure-reducing-valve', 'RV1'],
  ] as const)('next %s id in the sample is %s', (kind, expected) => {
    expect(nextId(sampleDiagram(), kind)).toBe(expected)
  })

  test('an empty diagram starts at 1', () => {
    expect(nextId(emptyDiagram(), 'supply')).toBe('S1')
  })

  test('the allocator never hands out the same id twice and skips past gaps, not into them', () => {
    const doc = sampleDiagram()
    doc.nodes.push({ id: 'J10', kind: 'junction', label: '', elevationM: 0 })
    const next = createIdAllocator(doc)
    expect([next('junction'), next('junction'), next('pipe')]).toEqual(['J11', 'J12', 'P7'])
  })

  test('is deterministic for the same document', () => {
    expect(nextId(sampleDiagram(), 'fixture')).toBe(nextId(sampleDiagram(), 'fixture'))
  })

  test('prefixes are distinct', () => {
    const prefixes = Object.values(ID_PREFIXES)
    expect(new Set(prefixes).size).toBe(prefixes.length)
  })
})
