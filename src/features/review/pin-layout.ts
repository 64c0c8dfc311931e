import type { CommentThread } from '@shared/api/comments'

export interface Box {
  x: number
  y: number
  width: number
  height: number
}

export interface Pin {
  key: string
  kind: 'node' | 'pipe'
  targetId: string
  /** Screen position inside the canvas, px. */
  left: number
  top: number
  /** Threads on this target (open ones when any, else all). */
  threadIds: string[]
  openCount: number
  total: number
}

/**
 * One pin per commented node or pipe, at the node's top-right corner or the pipe's midpoint,
 * in screen coordinates. Targets not on the canvas (deleted, orphaned threads) get no pin.
 */
export function layoutPins(
  threads: readonly CommentThread[],
  boxOf: (nodeId: string) => Box | null,
  endsOf: (pipeId: string) => { from: string; to: string } | null,
  viewport: { x: number; y: number; zoom: number },
): Pin[] {
  const groups = new Map<string, CommentThread[]>()
  for (const t of threads) {
    const key = `${t.target.kind}:${t.target.id}`
    groups.set(key, [...(groups.get(key) ?? []), t])
  }
  const pins: Pin[] = []
  for (const [key, list] of groups) {
    const target = list[0]!.target
    let point: { x: number; y: number } | null = null
    if (target.kind === 'node') {
      const box = boxOf(target.id)
      if (box) point = { x: box.x + box.width, y: box.y }
    } else {
      const ends = endsOf(target.id)
      const a = ends && boxOf(ends.from)
      const b = ends && boxOf(ends.to)
      if (a && b) {
        point = {
          x: (a.x + a.width / 2 + b.x + b.width / 2) / 2,
          y: (a.y + a.height / 2 + b.y + b.height / 2) / 2,
        }
      }
    }
    if (!point) continue
    const open = list.filter((t) => !t.resolvedAt)
    pins.push({
      key,
      kind: target.kind,
      targetId: target.id,
      left: point.x * viewport.zoom + viewport.x,
      top: point.y * viewport.zoom + viewport.y,
      threadIds: (open.length ? open : list).map((t) => t.id),
      openCount: open.length,
      total: list.length,
    })
  }
  return pins
}
