import type { Diagram } from '../../../shared/document/model.ts'

/**
 * The last committed document per diagram in this process, so a commit after the row lock only
 * re-reads the JSONB document when another process (or a REST save) moved the revision on.
 * Documents are immutable values, so sharing them is safe.
 */
export class DocumentCache {
  private readonly entries = new Map<string, { revision: number; doc: Diagram }>()
  constructor(private readonly capacity = 200) {}

  /** The newest document this process knows for a diagram, whatever its revision. */
  latest(diagramId: string): { revision: number; doc: Diagram } | undefined {
    return this.entries.get(diagramId)
  }

  set(diagramId: string, revision: number, doc: Diagram): void {
    this.entries.delete(diagramId)
    this.entries.set(diagramId, { revision, doc })
    if (this.entries.size > this.capacity) {
      this.entries.delete(this.entries.keys().next().value!)
    }
  }

  forget(diagramId: string): void {
    this.entries.delete(diagramId)
  }
}
