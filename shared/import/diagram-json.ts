/**
 * The diagram as an interchange file (docs/diagram-format.md): export writes the parsed document
 * as it is, import reads it back through `parseDiagram`, so export → import is deep-equal.
 */
import { parseDiagram } from '../calc/validate.ts'
import { DIAGRAM_FORMAT, DIAGRAM_FORMAT_VERSION, type Diagram } from '../document/model.ts'

export type DiagramFileOutcome = { ok: true; doc: Diagram } | { ok: false; errors: string[] }

/** At most this many schema messages are listed; the rest are counted. */
const MAX_LISTED = 20

/**
 * The file text of a document: two-space indented JSON ending in a newline.
 * @example exportDiagramJson(emptyDiagram('Block B')).startsWith('{\n  "format"') // true
 */
export function exportDiagramJson(doc: Diagram): string {
  return `${JSON.stringify(doc, null, 2)}\n`
}

/** A file name for a diagram: its name with anything unsafe in a file name replaced. */
export function diagramFileName(name: string, extension: string): string {
  const base = name
    .trim()
    .replace(/[^\p{L}\p{N} ._-]+/gu, '-')
    .replace(/\s+/g, ' ')
    .slice(0, 80)
  return `${base || 'diagram'}.${extension}`
}

/** Where in the text a JSON.parse failure sits, as "line 3, column 7", when the engine says. */
function position(text: string, error: unknown): string {
  const match = /position (\d+)/.exec(error instanceof Error ? error.message : '')
  if (!match) return ''
  const before = text.slice(0, Number(match[1]))
  const line = before.split('\n').length
  const column = before.length - before.lastIndexOf('\n')
  return ` at line ${line}, column ${column}`
}

/**
 * Reads a diagram file. Errors name the field path and the node or pipe id, as the calculation's
 * own checks do; a file of another kind or a later format version is named as such.
 * @example parseDiagramJson('{"format":"x"}') // { ok: false, errors: ['This is not a Tributary diagram file ...'] }
 */
export function parseDiagramJson(text: string): DiagramFileOutcome {
  let input: unknown
  try {
    input = JSON.parse(text.replace(/^\uFEFF/, ''))
  } catch (error) {
    return { ok: false, errors: [`The file is not valid JSON${position(text, error)}.`] }
  }
  const head = (typeof input === 'object' && input !== null ? input : {}) as Record<string, unknown>
  if (head.format !== DIAGRAM_FORMAT) {
    return {
      ok: false,
      errors: [`This is not a Tributary diagram file: "format" must be "${DIAGRAM_FORMAT}".`],
    }
  }
  if (typeof head.version === 'number' && head.version > DIAGRAM_FORMAT_VERSION) {
    return {
      ok: false,
      errors: [
        `The file is format version ${head.version}; this version of Tributary reads version ` +
          `${DIAGRAM_FORMAT_VERSION}.`,
      ],
    }
  }
  const parsed = parseDiagram(input)
  if (parsed.ok) return parsed
  const messages = parsed.issues.map((issue) =>
    issue.ids.length ? `${issue.message} (${issue.ids.join(', ')})` : issue.message,
  )
  const more = messages.length - MAX_LISTED
  return {
    ok: false,
    errors: more > 0 ? [...messages.slice(0, MAX_LISTED), `… and ${more} more`] : messages,
  }
}
