import { describe, expect, test } from 'vitest'
import {
  batteryRequestSchema,
  PALETTE_DRAG_TYPE,
  readPaletteDrop,
} from '@/features/editor/palette/palette-item.ts'

function transfer(data: Record<string, string>) {
  return { getData: (type: string) => data[type] ?? '' }
}

describe('reading a palette drop', () => {
  test('reads a node kind and a fixture preset', () => {
    expect(readPaletteDrop(transfer({ [PALETTE_DRAG_TYPE]: '{"kind":"meter"}' }))).toEqual({
      ok: true,
      value: { kind: 'meter' },
    })
    expect(
      readPaletteDrop(transfer({ [PALETTE_DRAG_TYPE]: '{"kind":"fixture","fixture":"shower"}' })),
    ).toEqual({ ok: true, value: { kind: 'fixture', fixture: 'shower' } })
  })

  test('ignores drags that did not come from the palette', () => {
    expect(readPaletteDrop(null)).toBeNull()
    expect(readPaletteDrop(transfer({ 'text/plain': 'hello' }))).toBeNull()
  })

  test.each([
    ['not json', 'Dropped item is not valid JSON'],
    ['{"kind":"fixture"}', 'Dropped item: fixture: fixture is required when kind is "fixture"'],
    ['{"kind":"pump"}', 'Dropped item: kind: '],
    ['[]', 'Dropped item: item: '],
  ])('rejects %s with a message naming the field', (raw, error) => {
    const result = readPaletteDrop(transfer({ [PALETTE_DRAG_TYPE]: raw }))
    expect(result?.ok).toBe(false)
    if (result && !result.ok) expect(result.error.startsWith(error)).toBe(true)
  })
})

describe('battery request', () => {
  test.each([
    [{ fixture: 'lavatory', count: 1 }, true],
    [{ fixture: 'lavatory', count: 200 }, true],
    [{ fixture: 'lavatory', count: 0 }, false],
    [{ fixture: 'lavatory', count: 201 }, false],
    [{ fixture: 'lavatory', count: 2.5 }, false],
    [{ fixture: '', count: 2 }, false],
  ])('%j valid: %s', (input, valid) => {
    expect(batteryRequestSchema.safeParse(input).success).toBe(valid)
  })
})
