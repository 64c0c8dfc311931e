import { afterEach, describe, expect, test } from 'vitest'
import type { VueWrapper } from '@vue/test-utils'
import type { CalcIssue, PipeResult } from '@shared/calc/types.ts'
import type { UnitSystem } from '@shared/units/system.ts'
import type { RemoteSelection } from '@/features/editor/canvas-data.ts'
import { flowNode, flowPipe, mountCanvas } from '../nodes/mount-canvas.ts'
import { pipeResult } from './pipe-result.ts'

let wrapper: VueWrapper | undefined
afterEach(() => {
  wrapper?.unmount()
  wrapper = undefined
})

interface PipeCase {
  selectedBy?: RemoteSelection[]
  system?: 'cold' | 'hot'
  nominal?: string
  result?: PipeResult
  problems?: CalcIssue[]
  units?: UnitSystem
}

async function renderPipe({
  system = 'cold',
  nominal,
  result,
  problems,
  units = 'si',
  selectedBy,
}: PipeCase) {
  const from = flowNode({ id: 'j1', kind: 'junction' }, { units })
  const to = flowNode(
    { id: 'f1', kind: 'fixture', fixture: 'lavatory' },
    { units, x: 300, y: -200 },
  )
  const pipe = flowPipe({ id: 'p1', system, lengthM: 12, nominal }, from, to, {
    result,
    problems,
    units,
    selectedBy,
  })
  wrapper = await mountCanvas([from, to], [pipe])
  return wrapper
}

describe('PipeEdge label', () => {
  test('shows load, flow, size and velocity in SI', async () => {
    const w = await renderPipe({ result: pipeResult() })
    expect(w.find('[data-testid="pipe-label-p1"]').text()).toBe(
      '58 FU · 3.90 L/s · DN50 · 1.92 m/s',
    )
  })

  test('shows load, flow, size and velocity in US units', async () => {
    const w = await renderPipe({ result: pipeResult(), units: 'us' })
    expect(w.find('[data-testid="pipe-label-p1"]').text()).toBe('58 FU · 61.8 gpm · 2" · 6.3 ft/s')
  })

  test('a locked size carries the lock mark', async () => {
    const w = await renderPipe({ nominal: '2', result: pipeResult({ locked: true }) })
    expect(w.find('[data-testid="pipe-lock-p1"]').exists()).toBe(true)
    expect(w.find('[data-testid="pipe-label-p1"]').attributes('title')).toContain('(locked)')
  })

  test('a size chosen by the calculation has no lock mark', async () => {
    const w = await renderPipe({ result: pipeResult() })
    expect(w.find('[data-testid="pipe-lock-p1"]').exists()).toBe(false)
  })

  test('before any result, a locked size still shows with its mark', async () => {
    const w = await renderPipe({ nominal: '1-1/4', units: 'us' })
    expect(w.find('[data-testid="pipe-text-p1"]').text()).toBe('1-1/4"')
    expect(w.find('[data-testid="pipe-lock-p1"]').exists()).toBe(true)
  })

  test('a problem marks the label red, adds the mark and a halo, and lists the message', async () => {
    const problems: CalcIssue[] = [
      {
        severity: 'warning',
        code: 'velocity',
        message: 'Velocity 2.6 m/s above 2.4 m/s',
        ids: ['p1'],
      },
    ]
    const w = await renderPipe({ result: pipeResult({ velocityMps: 2.6 }), problems })
    const label = w.find('[data-testid="pipe-label-p1"]')
    expect(label.classes()).toContain('pipe-label--problem')
    expect(label.attributes('data-severity')).toBe('warning')
    expect(w.find('[data-testid="pipe-problem-p1"]').exists()).toBe(true)
    expect(w.find('[data-testid="pipe-halo-p1"]').exists()).toBe(true)
    expect(label.attributes('title')).toContain('Warning: Velocity 2.6 m/s above 2.4 m/s')
  })

  test('a pipe without problems has no halo and no mark', async () => {
    const w = await renderPipe({ result: pipeResult() })
    expect(w.find('[data-testid="pipe-halo-p1"]').exists()).toBe(false)
    expect(w.find('[data-testid="pipe-problem-p1"]').exists()).toBe(false)
  })
})

describe('PipeEdge selected by co-editors', () => {
  test('draws one band per person in their colour, named in its title', async () => {
    const w = await renderPipe({
      result: pipeResult(),
      selectedBy: [
        { name: 'Robin Vale', color: '#2a9d8f' },
        { name: 'Sam Ito', color: 'url(javascript:alert(1))' },
      ],
    })
    const group = w.find('[data-testid="pipe-remote-p1"]')
    expect(group.find('title').text()).toBe('Selected by Robin Vale, Sam Ito')
    const bands = group.findAll('path').map((p) => p.attributes())
    // Widest (the second person's, a malformed colour drawn neutral) first, under the first's.
    expect(bands.map((b) => [b.stroke, b['stroke-width']])).toEqual([
      ['#17405e', '11'],
      ['#2a9d8f', '7'],
    ])
  })

  test('nobody else selecting it: no band', async () => {
    const w = await renderPipe({ result: pipeResult() })
    expect(w.find('[data-testid="pipe-remote-p1"]').exists()).toBe(false)
  })
})

describe('PipeEdge line', () => {
  test('cold is a solid line in the cold colour', async () => {
    const w = await renderPipe({ result: pipeResult() })
    const path = w.find('path#p1').element as SVGPathElement
    expect(path.style.stroke).toBe('#1f6fb2')
    expect(path.style.strokeDasharray).toBe('')
  })

  test('hot is a dashed line in the hot colour, and its label is dashed too', async () => {
    const w = await renderPipe({ system: 'hot', result: pipeResult({ system: 'hot' }) })
    const path = w.find('path#p1').element as SVGPathElement
    expect(path.style.stroke).toBe('#c2482b')
    expect(path.style.strokeDasharray).toBe('7 4')
    expect(w.find('[data-testid="pipe-label-p1"]').classes()).toContain('pipe-label--hot')
  })

  function pathPoints(d: string): number[][] {
    return [...d.matchAll(/(-?\d+(?:\.\d+)?)[ ,](-?\d+(?:\.\d+)?)/g)].map((m) => [
      Number(m[1]),
      Number(m[2]),
    ])
  }

  test('leaves a junction on the side facing its other end', async () => {
    // Fixture 300 px right and 200 px up: the run is mostly across, so the pipe leaves the dot
    // to the right (x grows first, y unchanged).
    const w = await renderPipe({ result: pipeResult() })
    const [start, second] = pathPoints(w.find('path#p1').attributes('d')!)
    expect(second![0]).toBeGreaterThan(start![0]!)
    expect(second![1]).toBe(start![1])
  })

  test('a riser between two junctions is one straight vertical line', async () => {
    const below = flowNode({ id: 'j1', kind: 'junction' })
    const above = flowNode({ id: 'j2', kind: 'junction' }, { y: -300 })
    const riser = flowPipe({ id: 'r1', system: 'cold', lengthM: 3 }, below, above, {
      result: pipeResult({ id: 'r1' }),
    })
    wrapper = await mountCanvas([below, above], [riser])
    const points = pathPoints(wrapper.find('path#r1').attributes('d')!)
    expect(new Set(points.map(([x]) => x))).toEqual(new Set([points[0]![0]]))
    expect(points.at(-1)![1]).toBeLessThan(points[0]![1]!)
  })
})
