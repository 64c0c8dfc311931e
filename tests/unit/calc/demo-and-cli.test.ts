// The Fernhollow Community Hall demo, the JSON fixture, the CLI and the live API's guard rails.
import { execFileSync, spawnSync } from 'node:child_process'
import { readFileSync } from 'node:fs'
import { describe, expect, test } from 'vitest'
import { computeDiagram } from '../../../shared/calc/compute.ts'
import { explainPipe } from '../../../shared/calc/explain.ts'
import { createLiveCalculation } from '../../../shared/calc/incremental.ts'
import { parseDiagram } from '../../../shared/calc/validate.ts'
import { fernhollowHallDiagram as hall } from '../../../shared/demo/fernhollow-hall.ts'

const FIXTURE = 'tests/fixtures/diagrams/fernhollow-hall.json'

describe('Fernhollow Community Hall', () => {
  const r = computeDiagram(hall)
  test('computes with no issues, velocities within limits, positive pressures', () => {
    expect(r.issues).toEqual([])
    expect(r.ok).toBe(true)
    expect(hall.nodes.length).toBeGreaterThanOrEqual(30)
    for (const p of Object.values(r.pipes)) {
      expect(p.velocityMps!, p.id).toBeLessThanOrEqual(hall.settings.velocityLimits[p.system])
      expect(p.outletPressureKPa!, p.id).toBeGreaterThan(0)
    }
  })
  test('service load: 7 flush valve closets (135) + 2 urinals (35) + 31.5 WSFU of other fixtures', () => {
    expect(r.pipes['c-service']!).toMatchObject({
      load: 201.5,
      flushValveClosets: 7,
      flushValveUrinals: 2,
    })
    expect(r.pipes['c-heater']!.load).toBeCloseTo(12.375, 9)
  })
  test('every node has a position and a level', () => {
    for (const n of hall.nodes) {
      expect(n.position, n.id).toBeDefined()
      expect(['ground', 'upper']).toContain(n.levelId)
    }
    const y = (id: string) => hall.nodes.find((n) => n.id === id)!.position!.y
    expect(y('riser-c-top')).toBeLessThan(y('riser-c-base'))
  })
  test('the JSON fixture is the same document', () => {
    const parsed = parseDiagram(JSON.parse(readFileSync(FIXTURE, 'utf8')))
    expect(parsed.ok && parsed.doc).toEqual(hall)
  })
  test('explain: a reviewer-readable breakdown for every pipe', () => {
    for (const id of Object.keys(r.pipes)) {
      const x = explainPipe(hall, r, id)!
      expect(x.lines.length).toBeGreaterThan(4)
      const sum =
        x.fixtures.reduce((s, f) => s + f.load, 0) + x.series.reduce((s, k) => s + k.total, 0)
      expect(sum, id).toBeCloseTo(r.pipes[id]!.load, 9)
    }
    expect(explainPipe(hall, r, 'nope')).toBeNull()
  })
})

describe('CLI', () => {
  const run = (...args: string[]) =>
    spawnSync('node', ['--import', 'tsx', 'scripts/calc.ts', ...args], { encoding: 'utf8' })
  test('--json prints only JSON with the documented fields', () => {
    const out = execFileSync('node', ['--import', 'tsx', 'scripts/calc.ts', FIXTURE, '--json'], {
      encoding: 'utf8',
    })
    const json = JSON.parse(out)
    expect(Object.keys(json)).toEqual(['pipes', 'nodes', 'issues'])
    expect(Object.keys(json.pipes[0]).sort()).toEqual(
      [
        'id',
        'system',
        'load',
        'flushValveClosets',
        'flushValveUrinals',
        'flowLps',
        'nominal',
        'insideDiameterMm',
        'velocityMps',
        'lossKPa',
      ].sort(),
    )
    expect(json.nodes[0]).toEqual({ id: 'supply', pressureKPa: 380 })
  })
  test('an invalid document exits 1 and names the ids', () => {
    const res = run('tests/fixtures/diagrams/invalid-missing-node.json', '--json')
    expect(res.status).toBe(1)
    expect(
      JSON.parse(res.stdout)
        .issues.map((i: { ids: string[] }) => i.ids)
        .flat(),
    ).toContain('p-lost')
    expect(res.stderr).toContain('p-lost')
  }, 20_000)
  test('without --json prints a table', () => {
    const res = run(FIXTURE)
    expect(res.status).toBe(0)
    expect(res.stdout).toContain('c-service')
    expect(res.stdout).toContain('no issues')
  }, 20_000)
})

describe('live calculation guard rails', () => {
  test('bad edits are rejected with the id named, the state kept', () => {
    const live = createLiveCalculation(hall)
    const before = live.result()
    const bad = live.apply({ type: 'node.update', id: 'wc-g-men', patch: { count: -2 } })
    expect(bad.mode).toBe('rejected')
    expect(bad.issues[0]!.message).toContain('wc-g-men')
    expect(live.apply({ type: 'node.update', id: 'ghost', patch: {} }).mode).toBe('rejected')
    expect(live.result()).toEqual(before)
    expect(hall.nodes.find((n) => n.id === 'wc-g-men')).toMatchObject({ count: 3 })
  })
  test('a one-fixture edit touches only its paths and matches a full recompute', () => {
    const live = createLiveCalculation(hall)
    const u = live.apply({ type: 'node.update', id: 'lav-u-men', patch: { count: 3 } })
    expect(u.mode).toBe('incremental')
    expect(u.pipes).toContain('c-riser')
    expect(u.pipes).toContain('h-riser')
    expect(u.pipes).not.toContain('c-wc-g-men')
    expect(live.pipe('c-riser')).toEqual(computeDiagram(live.doc).pipes['c-riser'])
    expect(live.result()).toEqual(computeDiagram(live.doc))
  })
  test('an edit that breaks the document is reported by the rebuilt result', () => {
    const live = createLiveCalculation(hall)
    expect(
      live.apply({ type: 'node.update', id: 'df-lobby', patch: { fixture: 'fountainz' } }).mode,
    ).toBe('rebuild')
    expect(live.result().ok).toBe(false)
    expect(live.result().issues[0]!.ids).toEqual(['df-lobby'])
  })
})
