import type { CommentTarget } from '@shared/api/comments'
import type { Diagram } from '@shared/document/model'

/** A readable name of what a thread is pinned to, from the current document. */
export function targetLabel(doc: Diagram, target: CommentTarget): string {
  if (target.kind === 'node') {
    const node = doc.nodes.find((n) => n.id === target.id)
    return node ? node.label || `${node.kind} ${node.id}` : `Deleted node ${target.id}`
  }
  const pipe = doc.pipes.find((p) => p.id === target.id)
  if (!pipe) return `Deleted pipe ${target.id}`
  const end = (id: string) => doc.nodes.find((n) => n.id === id)?.label || id
  return `Pipe ${end(pipe.from)} → ${end(pipe.to)}`
}

/** Whether the thread's node or pipe is still in the document (live, as others edit). */
export function targetExists(doc: Diagram, target: CommentTarget): boolean {
  return target.kind === 'node'
    ? doc.nodes.some((n) => n.id === target.id)
    : doc.pipes.some((p) => p.id === target.id)
}
