import { describe, expect, it } from 'vitest'
import { shortcutFor } from '../../../../src/features/editor/shortcuts/shortcuts'

const key = (
  k: string,
  mods: Partial<Record<'ctrlKey' | 'metaKey' | 'shiftKey' | 'altKey', boolean>> = {},
) => ({
  key: k,
  ctrlKey: false,
  metaKey: false,
  shiftKey: false,
  altKey: false,
  ...mods,
})

describe('editor shortcuts', () => {
  it.each([
    [key('z', { ctrlKey: true }), 'undo'],
    [key('Z', { ctrlKey: true, shiftKey: true }), 'redo'],
    [key('z', { metaKey: true, shiftKey: true }), 'redo'],
    [key('y', { ctrlKey: true }), 'redo'],
    [key('Delete'), 'remove'],
    [key('Backspace'), 'remove'],
    [key('c', { ctrlKey: true }), 'copy'],
    [key('v', { metaKey: true }), 'paste'],
    [key('a', { ctrlKey: true }), 'selectAll'],
    [key('l'), 'layout'],
    [key('f'), 'fit'],
    [key('?', { shiftKey: true }), 'help'],
    [key('Escape'), 'escape'],
  ])('maps %j to %s', (event, action) => {
    expect(shortcutFor(event)?.action).toBe(action)
  })

  it('leaves other keys alone', () => {
    expect(shortcutFor(key('l', { ctrlKey: true }))).toBeNull()
    expect(shortcutFor(key('x'))).toBeNull()
  })
})
