/**
 * Copy and paste of part of a diagram. A fragment is plain JSON, so it can travel through the
 * system clipboard between tabs and diagrams; pasting always goes through {@link parseFragment}.
 */
import { z } from 'zod'
import { createIdAllocator } from './ids.ts'
import { nodeSchema, pipeSchema, type Diagram, type DiagramNode, type Pipe } from './model.ts'
import { OPS, OperationError, type BatchOperation, type Operation } from './operations.ts'

export const FRAGMENT_FORMAT = 'tributary-fragment'

export const fragmentSchema = z.object({
  format: z.literal(FRAGMENT_FORMAT),
  nodes: z.array(nodeSchema),
  pipes: z.array(pipeSchema),
})
export type Fragment = z.infer<typeof fragmentSchema>

/** Pasted copies land down and to the right of the originals so both stay visible. */
export const PASTE_OFFSET = { x: 40, y: 40 } as const

/**
 * The chosen nodes and the pipes running between two of them. Ids no longer in the document are
 * skipped (the selection may be stale after a collaborator's delete).
 * @example
 * const fragment = copySelection(doc, ['J2', 'F3', 'F4'])
 */
export function copySelection(doc: Diagram, nodeIds: readonly string[]): Fragment {
  const chosen = new Set(nodeIds)
  return {
    format: FRAGMENT_FORMAT,
    nodes: doc.nodes.filter((node) => chosen.has(node.id)),
    pipes: doc.pipes.filter((pipe) => chosen.has(pipe.from) && chosen.has(pipe.to)),
  }
}

/**
 * Checks a fragment from outside (the system clipboard); errors name the bad field or id.
 * @example
 * const fragment = parseFragment(JSON.parse(text))
 */
export function parseFragment(input: unknown): Fragment {
  const parsed = fragmentSchema.safeParse(input)
  if (!parsed.success) {
    const issue = parsed.error.issues[0]!
    throw new OperationError(
      'invalid',
      `clipboard: ${issue.path.join('.') || 'fragment'}: ${issue.message}`,
    )
  }
  const ids = parsed.data.nodes.map((node) => node.id)
  const twice = ids.filter((id, i) => ids.indexOf(id) !== i)
  if (twice.length)
    throw new OperationError('invalid', `clipboard: node ${twice[0]} appears twice`, twice)
  for (const pipe of parsed.data.pipes) {
    const outside = [pipe.from, pipe.to].filter((id) => !ids.includes(id))
    if (outside.length) {
      throw new OperationError(
        'invalid',
        `clipboard: pipe ${pipe.id} connects ${outside.join(', ')}, which is not in the fragment`,
        [pipe.id, ...outside],
      )
    }
  }
  return parsed.data
}

export interface PasteResult {
  op: BatchOperation
  /** The new ids, in fragment order, so the editor can select what was pasted. */
  nodeIds: string[]
  pipeIds: string[]
}

/**
 * One batch that adds the fragment with fresh ids, positions moved by `offset`. A node whose
 * level does not exist in this document is pasted without a level rather than refused.
 * @example
 * const { op, nodeIds } = pasteFragment(doc, fragment)
 * doc = applyOperation(doc, op)
 */
export function pasteFragment(
  doc: Diagram,
  fragment: Fragment,
  offset: { x: number; y: number } = PASTE_OFFSET,
): PasteResult {
  const { nodes, pipes } = parseFragment(fragment)
  const allocate = createIdAllocator(doc)
  const levels = new Set(doc.levels.map((level) => level.id))
  const renamed = new Map(nodes.map((node) => [node.id, allocate(node.kind)]))
  const nodeOps = nodes.map((node): Operation => {
    const { levelId, position, ...rest } = node
    const copy = { ...rest, id: renamed.get(node.id)! } as DiagramNode
    if (position) copy.position = { x: position.x + offset.x, y: position.y + offset.y }
    if (levelId !== undefined && levels.has(levelId)) copy.levelId = levelId
    return { type: OPS.nodeAdd, node: copy }
  })
  const newPipes = pipes.map((pipe): Pipe => ({
    ...pipe,
    id: allocate('pipe'),
    from: renamed.get(pipe.from)!,
    to: renamed.get(pipe.to)!,
  }))
  const pipeOps = newPipes.map((pipe): Operation => ({ type: OPS.pipeAdd, pipe }))
  return {
    op: { type: OPS.batch, ops: [...nodeOps, ...pipeOps] },
    nodeIds: [...renamed.values()],
    pipeIds: newPipes.map((pipe) => pipe.id),
  }
}
