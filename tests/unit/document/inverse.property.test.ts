import fc from 'fast-check'
import { describe, expect, test } from 'vitest'
import { applyWithInverse, invertOperation } from '@shared/document/history'
import { applyOperation } from '@shared/document/operations'
import { anyOpArb, diagramArb, expectSound, realizeAny } from './arbitraries'

describe('inverse operations (property)', () => {
  test('apply(apply(doc, op), invert(doc, op)) deep-equals doc, for every op type', () => {
    fc.assert(
      fc.property(diagramArb, anyOpArb, (doc, seeds) => {
        const op = realizeAny(doc, seeds)
        const after = applyOperation(doc, op)
        // The inverse must survive the wire as JSON.
        const inverse = JSON.parse(JSON.stringify(invertOperation(doc, op)))
        expect(applyOperation(after, inverse)).toEqual(doc)
      }),
      { numRuns: 400 },
    )
  })

  test('applying a valid op keeps the document valid and never mutates the input', () => {
    fc.assert(
      fc.property(diagramArb, anyOpArb, (doc, seeds) => {
        const op = realizeAny(doc, seeds)
        const frozen = structuredClone(doc)
        const after = applyOperation(doc, op)
        expect(doc).toEqual(frozen)
        expectSound(after)
      }),
      { numRuns: 300 },
    )
  })

  test('applyWithInverse agrees with applyOperation and invertOperation', () => {
    fc.assert(
      fc.property(diagramArb, anyOpArb, (doc, seeds) => {
        const op = realizeAny(doc, seeds)
        const both = applyWithInverse(doc, op)
        expect(both.doc).toEqual(applyOperation(doc, op))
        expect(both.inverse).toEqual(invertOperation(doc, op))
      }),
      { numRuns: 100 },
    )
  })
})
