import type { ProjectRole } from '../../../shared/auth/roles.ts'
import type { Diagram } from '../../../shared/document/model.ts'

/** What this process last committed (or read under the lock) for one diagram. */
export interface CachedDiagram {
  revision: number
  doc: Diagram
  /**
   * Authors' roles as last read in a transaction. Only a guess: the optimistic commit
   * (operations.fast-path.ts) writes nothing unless the database still agrees with it.
   */
  roles: ReadonlyMap<string, ProjectRole>
}

/**
 * The last committed document per diagram in this process, so a commit can skip the row lock
 * and the document re-read while no other process (or REST save) has moved the revision on.
 * Documents are immutable values, so sharing them is safe.
 */
export class DocumentCache {
  private readonly entries = new Map<string, CachedDiagram>()
  constructor(private readonly capacity = 200) {}

  /** The newest document this process knows for a diagram, whatever its revision. */
  latest(diagramId: string): CachedDiagram | undefined {
    return this.entries.get(diagramId)
  }

  set(
    diagramId: string,
    revision: number,
    doc: Diagram,
    roles: ReadonlyMap<string, ProjectRole> = new Map(),
  ): void {
    this.entries.delete(diagramId)
    this.entries.set(diagramId, { revision, doc, roles })
    if (this.entries.size > this.capacity) {
      this.entries.delete(this.entries.keys().next().value!)
    }
  }

  forget(diagramId: string): void {
    this.entries.delete(diagramId)
  }
}
