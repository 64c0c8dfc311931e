import type { PresenceMember } from '@shared/protocol/server-messages'
import { createPinia, setActivePinia } from 'pinia'
import { beforeEach, describe, expect, test } from 'vitest'
import { usePresenceStore } from '@/stores/presence'

const DIAGRAM = 'd-1'
const person = (
  userId: string,
  name: string,
  nodes: string[],
  color = '#d1495b',
  pipes: string[] = [],
): PresenceMember => ({
  userId,
  name,
  initials: name
    .split(' ')
    .map((w) => w[0])
    .join(''),
  color,
  role: 'editor',
  selection: { nodes, pipes },
})

beforeEach(() => setActivePinia(createPinia()))

describe('presence store', () => {
  test('remote selections map each node to the other people who selected it, never me', () => {
    const presence = usePresenceStore()
    presence.open(DIAGRAM, 'u-me')
    presence.setMembers(DIAGRAM, [
      person('u-me', 'Me Myself', ['J1']),
      person('u-2', 'Robin Vale', ['J1', 'F1'], '#2a9d8f'),
      person('u-3', 'Sam Ito', ['F1']),
    ])
    expect(presence.others.map((m) => m.name)).toEqual(['Robin Vale', 'Sam Ito'])
    expect(presence.remoteSelections.get('J1')).toEqual([{ name: 'Robin Vale', color: '#2a9d8f' }])
    expect(presence.remoteSelections.get('F1')?.map((s) => s.name)).toEqual([
      'Robin Vale',
      'Sam Ito',
    ])
    expect(presence.remoteSelections.has('J2')).toBe(false)
  })

  test('remote pipe selections map each pipe to the other people who selected it', () => {
    const presence = usePresenceStore()
    presence.open(DIAGRAM, 'u-me')
    presence.setMembers(DIAGRAM, [
      person('u-me', 'Me Myself', [], '#d1495b', ['P1']),
      person('u-2', 'Robin Vale', ['P2'], '#2a9d8f', ['P1', 'P3']),
    ])
    expect(presence.remotePipeSelections.get('P1')).toEqual([
      { name: 'Robin Vale', color: '#2a9d8f' },
    ])
    expect(presence.remotePipeSelections.has('P2')).toBe(false) // a node id, not a pipe
    expect([...presence.remotePipeSelections.keys()]).toEqual(['P1', 'P3'])
    expect(presence.remoteSelections.has('P1')).toBe(false)
  })

  test("cursors: others' only, for this diagram, gone when their owner leaves or we go offline", () => {
    const presence = usePresenceStore()
    presence.open(DIAGRAM, 'u-me')
    presence.setMembers(DIAGRAM, [person('u-me', 'Me', []), person('u-2', 'Robin Vale', [])])
    const at = { diagramId: DIAGRAM, color: '#2a9d8f', x: 10, y: 20 }
    presence.moveCursor({ ...at, userId: 'u-2' }, 1000)
    presence.moveCursor({ ...at, userId: 'u-me' }, 1000)
    presence.moveCursor({ ...at, userId: 'u-2', diagramId: 'd-other', x: 99 }, 1000)
    expect([...presence.cursors.values()]).toEqual([
      { userId: 'u-2', name: 'Robin Vale', color: '#2a9d8f', x: 10, y: 20, at: 1000 },
    ])
    presence.setMembers(DIAGRAM, [person('u-me', 'Me', [])])
    expect(presence.cursors.size).toBe(0)

    presence.setMembers(DIAGRAM, [person('u-2', 'Robin Vale', ['J1'])])
    presence.moveCursor({ ...at, userId: 'u-2' }, 2000)
    presence.disconnected()
    expect(presence.cursors.size).toBe(0)
    expect(presence.remoteSelections.size).toBe(0)
  })

  test('a member list for another diagram is ignored; cursors go out only through the outbox', () => {
    const presence = usePresenceStore()
    presence.open(DIAGRAM, 'u-me')
    presence.setMembers('d-other', [person('u-2', 'Robin Vale', ['J1'])])
    expect(presence.members).toEqual([])
    const sent: [number, number][] = []
    presence.sendCursor(1, 2) // no channel yet: dropped, not queued
    presence.attach({ cursor: (x, y) => sent.push([x, y]) })
    presence.sendCursor(3, 4)
    presence.sendCursor(Number.NaN, 4)
    expect(sent).toEqual([[3, 4]])
  })
})
