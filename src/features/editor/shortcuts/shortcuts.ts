/**
 * The editor's keyboard shortcuts, in one table: the help dialog lists it and the key handler
 * matches against it, so the two can never disagree.
 */
export type ShortcutAction =
  'undo' | 'redo' | 'remove' | 'copy' | 'paste' | 'selectAll' | 'layout' | 'fit' | 'help' | 'escape'

export interface Shortcut {
  action: ShortcutAction
  /** Keys as shown to the user. */
  label: string
  description: string
  /** Whether the action changes the document (disabled when read-only). */
  edits: boolean
  match: (e: Pick<KeyboardEvent, 'key' | 'ctrlKey' | 'metaKey' | 'shiftKey' | 'altKey'>) => boolean
}

const mod = (e: { ctrlKey: boolean; metaKey: boolean }) => e.ctrlKey || e.metaKey
const plain = (e: { ctrlKey: boolean; metaKey: boolean; altKey: boolean }) =>
  !e.ctrlKey && !e.metaKey && !e.altKey

export const SHORTCUTS: readonly Shortcut[] = [
  {
    action: 'undo',
    label: 'Ctrl+Z',
    description: 'Undo the last change',
    edits: true,
    match: (e) => mod(e) && !e.shiftKey && e.key.toLowerCase() === 'z',
  },
  {
    action: 'redo',
    label: 'Ctrl+Shift+Z or Ctrl+Y',
    description: 'Redo',
    edits: true,
    match: (e) =>
      mod(e) && ((e.shiftKey && e.key.toLowerCase() === 'z') || e.key.toLowerCase() === 'y'),
  },
  {
    action: 'remove',
    label: 'Delete or Backspace',
    description: 'Delete the selected nodes and pipes',
    edits: true,
    match: (e) => plain(e) && (e.key === 'Delete' || e.key === 'Backspace'),
  },
  {
    action: 'copy',
    label: 'Ctrl+C',
    description: 'Copy the selected nodes (with the pipes between them)',
    edits: false,
    match: (e) => mod(e) && e.key.toLowerCase() === 'c',
  },
  {
    action: 'paste',
    label: 'Ctrl+V',
    description: 'Paste a copy beside the original',
    edits: true,
    match: (e) => mod(e) && e.key.toLowerCase() === 'v',
  },
  {
    action: 'selectAll',
    label: 'Ctrl+A',
    description: 'Select everything',
    edits: false,
    match: (e) => mod(e) && e.key.toLowerCase() === 'a',
  },
  {
    action: 'layout',
    label: 'L',
    description: 'Tidy the layout, keeping every node on its level',
    edits: true,
    match: (e) => plain(e) && e.key.toLowerCase() === 'l',
  },
  {
    action: 'fit',
    label: 'F',
    description: 'Fit the whole diagram in view',
    edits: false,
    match: (e) => plain(e) && e.key.toLowerCase() === 'f',
  },
  {
    action: 'help',
    label: '?',
    description: 'Show this list',
    edits: false,
    match: (e) => !mod(e) && e.key === '?',
  },
  {
    action: 'escape',
    label: 'Esc',
    description: 'Clear the selection',
    edits: false,
    match: (e) => e.key === 'Escape',
  },
  // Shift-drag draws a selection box; Shift/Ctrl-click adds to the selection (Vue Flow).
]

/** The action bound to a key press, or null. */
export function shortcutFor(e: Parameters<Shortcut['match']>[0]): Shortcut | null {
  return SHORTCUTS.find((s) => s.match(e)) ?? null
}
