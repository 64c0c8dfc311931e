import type { CommentThread } from '@shared/api/comments'
import { describe, expect, it } from 'vitest'
import { layoutPins } from '@/features/review/pin-layout'

const thread = (
  id: string,
  kind: 'node' | 'pipe',
  target: string,
  resolved = false,
): CommentThread => ({
  id,
  diagramId: 'd',
  target: { kind, id: target },
  createdAt: '2026-12-02T00:00:00.000Z',
  resolvedAt: resolved ? '2026-12-02T01:00:00.000Z' : null,
  resolvedBy: null,
  orphaned: false,
  comments: [],
})

const boxes: Record<string, { x: number; y: number; width: number; height: number }> = {
  a: { x: 0, y: 0, width: 100, height: 40 },
  b: { x: 0, y: 200, width: 100, height: 40 },
}
const boxOf = (id: string) => boxes[id] ?? null
const endsOf = (id: string) => (id === 'p1' ? { from: 'a', to: 'b' } : null)

describe('layoutPins', () => {
  it('puts node pins at the top-right corner and pipe pins at the midpoint, in screen px', () => {
    const pins = layoutPins(
      [thread('t1', 'node', 'a'), thread('t2', 'pipe', 'p1')],
      boxOf,
      endsOf,
      {
        x: 10,
        y: 20,
        zoom: 2,
      },
    )
    expect(pins.find((p) => p.targetId === 'a')).toMatchObject({ left: 210, top: 20 })
    expect(pins.find((p) => p.targetId === 'p1')).toMatchObject({ left: 110, top: 260 })
  })

  it('follows the node when it moves (position read on every layout)', () => {
    const moved: typeof boxes = { ...boxes, a: { ...boxes.a!, x: 300 } }
    const [pin] = layoutPins([thread('t1', 'node', 'a')], (id) => moved[id] ?? null, endsOf, {
      x: 0,
      y: 0,
      zoom: 1,
    })
    expect(pin!.left).toBe(400)
  })

  it('counts open threads per target, and draws no pin for a deleted target', () => {
    const pins = layoutPins(
      [thread('t1', 'node', 'a'), thread('t2', 'node', 'a', true), thread('t3', 'node', 'gone')],
      boxOf,
      endsOf,
      { x: 0, y: 0, zoom: 1 },
    )
    expect(pins).toHaveLength(1)
    expect(pins[0]).toMatchObject({ openCount: 1, total: 2, threadIds: ['t1'] })
  })
})
