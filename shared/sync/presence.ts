/**
 * Pure helpers for presence: avatar initials and colours, and merging several tabs of one
 * person into one member.
 */
import type { Selection } from '../protocol/client-messages.ts'

/** Our own palette: distinct hues that stay readable on the light canvas. */
export const PRESENCE_COLORS = [
  '#1f77b4',
  '#d1495b',
  '#2a9d8f',
  '#8e5ec8',
  '#e08a1e',
  '#3d7d3a',
  '#c2577f',
  '#51708f',
] as const

/**
 * One or two capital letters for an avatar.
 * @example
 * initialsOf('Ada Lovelace') // 'AL'
 * initialsOf('ren') // 'R'
 */
export function initialsOf(name: string): string {
  const words = name.trim().split(/\s+/).filter(Boolean)
  if (!words.length) return '?'
  const first = words[0]![0]!
  const last = words.length > 1 ? words[words.length - 1]![0]! : ''
  return (first + last).toUpperCase()
}

/**
 * A stable colour for a user id: everyone sees the same person in the same colour.
 * @example
 * colorFor('2f1c…') // '#2a9d8f'
 */
export function colorFor(userId: string): string {
  let hash = 0
  for (const char of userId) hash = (hash * 31 + char.charCodeAt(0)) >>> 0
  return PRESENCE_COLORS[hash % PRESENCE_COLORS.length]!
}

/**
 * The union of several selections (one person in two tabs), without repeats.
 * @example
 * mergeSelections([{ nodes: ['J1'], pipes: [] }, { nodes: ['J1', 'F2'], pipes: ['P3'] }])
 * // { nodes: ['J1', 'F2'], pipes: ['P3'] }
 */
export function mergeSelections(selections: readonly Selection[]): Selection {
  return {
    nodes: [...new Set(selections.flatMap((s) => s.nodes))],
    pipes: [...new Set(selections.flatMap((s) => s.pipes))],
  }
}
