/** Binds the shortcut table to the window while the editor is open; typing in a field is left alone. */
import { onBeforeUnmount, onMounted, type Ref } from 'vue'
import { shortcutFor, type ShortcutAction } from '../shortcuts/shortcuts'

export type ShortcutHandlers = Record<ShortcutAction, () => void> & { readOnly: Ref<boolean> }

function isTyping(target: EventTarget | null): boolean {
  const el = target as HTMLElement | null
  if (!el) return false
  return el.isContentEditable || ['INPUT', 'TEXTAREA', 'SELECT'].includes(el.tagName)
}

export function useEditorShortcuts(handlers: ShortcutHandlers) {
  function onKey(event: KeyboardEvent) {
    if (isTyping(event.target)) return
    const shortcut = shortcutFor(event)
    if (!shortcut || (shortcut.edits && handlers.readOnly.value)) return
    event.preventDefault()
    handlers[shortcut.action]()
  }
  onMounted(() => window.addEventListener('keydown', onKey))
  onBeforeUnmount(() => window.removeEventListener('keydown', onKey))
}
