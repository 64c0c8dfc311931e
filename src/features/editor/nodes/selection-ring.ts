/** Rings around a node that other people have selected, one ring per person. */

/** A remote user's selection as presence reports it. */
export interface RemoteSelection {
  name: string
  color: string
}

// Only plain colour notations reach a style attribute; anything else falls back.
const SAFE_COLOR = /^(#[0-9a-f]{3,8}|(rgb|hsl)a?\([\d\s.,%/-]+\))$/i
const FALLBACK_COLOR = '#17405e'

/** The colour to draw for a remote user, or a neutral fallback for a malformed one. */
export function safeColor(color: string): string {
  return SAFE_COLOR.test(color.trim()) ? color.trim() : FALLBACK_COLOR
}

/**
 * A `box-shadow` value with a 2 px ring per selecting user, outermost last, separated from the
 * node by a white gap; `undefined` when nobody else has the node selected.
 */
export function selectionRingShadow(selectedBy: readonly RemoteSelection[] | undefined) {
  if (!selectedBy || selectedBy.length === 0) return undefined
  const rings = selectedBy.map((user, i) => `0 0 0 ${4 + i * 2}px ${safeColor(user.color)}`)
  return ['0 0 0 2px #fff', ...rings].join(', ')
}

/** "Selected by Ana, Ben" for the title and the name tag. */
export function selectionText(selectedBy: readonly RemoteSelection[] | undefined): string {
  if (!selectedBy || selectedBy.length === 0) return ''
  return `Selected by ${selectedBy.map((u) => u.name).join(', ')}`
}
