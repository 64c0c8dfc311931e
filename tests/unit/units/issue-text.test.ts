import { describe, expect, test } from 'vitest'
import { computeDiagram } from '@shared/calc/compute.ts'
import { fernhollowHallDiagram } from '@shared/demo/fernhollow-hall.ts'
import { issueText } from '@shared/units/issue-text.ts'

const issue = (message: string) => ({ message })

describe('issue messages in the display units', () => {
  test('SI messages are shown as the engine wrote them', () => {
    const m = 'wc-1 gets 95.2 kPa; it needs 100.0 kPa.'
    expect(issueText(issue(m), 'si')).toBe(m)
  })

  test('US: pressures in psi, velocities in ft/s, flows in gpm, lengths in ft', () => {
    expect(issueText(issue('fixture wc-1 gets 95.2 kPa; it needs 100.0 kPa.'), 'us')).toBe(
      'fixture wc-1 gets 13.8 psi; it needs 14.5 psi.',
    )
    expect(issueText(issue('Pipe p-3 (locked 1/2) runs at 2.61 m/s, above 2.4 m/s.'), 'us')).toBe(
      'Pipe p-3 (locked 1/2) runs at 8.6 ft/s, above 7.9 ft/s.',
    )
    expect(
      issueText(issue('Pipe p-9: even 4 copper-l carries 31.55 L/s faster than 2.4 m/s.'), 'us'),
    ).toBe('Pipe p-9: even 4 copper-l carries 500 gpm faster than 7.9 ft/s.')
    expect(issueText(issue('Pipe p-2 has length -3 m; lengths must be above 0.'), 'us')).toBe(
      'Pipe p-2 has length -9.8 ft; lengths must be above 0.',
    )
  })

  test('leaves alone what is not a quantity: ids, nominal sizes, WSFU, millimetres', () => {
    const m = 'Pipe m-1 (locked 3/4) is smaller than the 1 in minimum for wc m2; 12.0 WSFU; 26 mm'
    expect(issueText(issue(m), 'us')).toBe(m)
  })

  test('every message the demo diagram produces reads without an SI unit in US', () => {
    const hot = {
      ...fernhollowHallDiagram,
      settings: { ...fernhollowHallDiagram.settings, minPressureKPa: 400, maxStaticKPa: 300 },
    }
    const issues = computeDiagram(hot).issues
    expect(issues.length).toBeGreaterThan(0)
    for (const i of issues) expect(issueText(i, 'us')).not.toMatch(/\d (kPa|m\/s|L\/s|m)\b/)
  })
})
