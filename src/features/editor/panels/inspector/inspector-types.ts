/** What the pipe inspector shows: titled sections of plain sentences a reviewer can check. */

/** One sentence; `tone` marks a running total, a side note or a problem. */
export interface InspectorLine {
  text: string
  tone?: 'total' | 'note' | 'problem'
}

/** A titled group of sentences; `key` doubles as the data-testid suffix. */
export interface InspectorSection {
  key: 'load' | 'demand' | 'size' | 'pressure' | 'problems'
  title: string
  lines: InspectorLine[]
}

/** Everything the inspector renders for one pipe. */
export interface PipeInspection {
  pipeId: string
  /** Absent when the pipe is not in the diagram. */
  system: 'cold' | 'hot' | null
  /** "from → to" with labels, or '' when the pipe is not in the diagram. */
  route: string
  /** Why there is no breakdown (invalid document, unknown pipe); null when there is one. */
  notice: string | null
  sections: InspectorSection[]
}

export const line = (text: string, tone?: InspectorLine['tone']): InspectorLine =>
  tone ? { text, tone } : { text }

/** A number of fixture units: whole numbers plain, others to at most two decimals. */
export function fu(value: number): string {
  return `${Number(value.toFixed(2))} FU`
}
