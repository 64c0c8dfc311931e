// Live calculation edge cases the random property test meets only by chance: the first edit after
// a full recompute (the margin tree is built lazily from state that edit changes), the first
// equipment flow in a diagram (fixture flows were not stored until then) and the first flush
// valve (the series and the flush valve curve start to apply).
import { describe, expect, it } from 'vitest'
import { computeDiagram } from '../../../shared/calc/compute.ts'
import { createLiveCalculation } from '../../../shared/calc/incremental.ts'
import { cold, diagram } from './helpers.ts'

// Supply → meter → main → branch → lavatory, plus a second branch to a sink and a boiler feed.
function building(
  feedLps: number,
  loadBasis: 'per-fixture' | 'flush-valve-series' = 'per-fixture',
) {
  return diagram(
    [
      { id: 'supply', kind: 'supply', elevationM: 0, pressureKPa: 300 },
      { id: 'meter', kind: 'meter', elevationM: 0, lossKPa: 20 },
      { id: 'tee', kind: 'junction', elevationM: 3 },
      { id: 'lav', kind: 'fixture', elevationM: 6, fixture: 'lavatory', count: 2 },
      { id: 'sink', kind: 'fixture', elevationM: 3, fixture: 'kitchen-sink' },
      { id: 'boiler', kind: 'equipment', elevationM: 0, flowLps: feedLps },
    ],
    [
      cold('service', 'supply', 'meter', 10),
      cold('main', 'meter', 'tee', 12),
      cold('to-lav', 'tee', 'lav', 8),
      cold('to-sink', 'tee', 'sink', 4),
      cold('to-boiler', 'meter', 'boiler', 6),
    ],
    { loadBasis },
  )
}

describe('live calculation', () => {
  it('lowers a required pressure as the first edit, then stays equal to a full recompute', () => {
    // Lowering the lavatory's minimum frees margin; growing the branch then eats it. At some
    // length the true margin is negative while a double-counted change would still say positive.
    for (let lengthM = 10; lengthM <= 400; lengthM += 15) {
      const live = createLiveCalculation(building(0.2))
      live.apply({ type: 'node.update', id: 'lav', patch: { minPressureKPa: 60 } })
      live.apply({ type: 'pipe.update', id: 'to-lav', patch: { lengthM } })
      expect(live.result(), `branch ${lengthM} m`).toEqual(computeDiagram(live.doc))
    }
  })

  it('keeps the fixture share of every flow when the first equipment flow appears', () => {
    const live = createLiveCalculation(building(0))
    live.apply({ type: 'node.update', id: 'boiler', patch: { flowLps: 0.5 } })
    const result = live.result()
    expect(result).toEqual(computeDiagram(live.doc))
    // Pipes that do not feed the boiler carry fixtures only.
    expect(result.pipes['main']!.fixtureFlowLps).toBe(result.pipes['main']!.flowLps)
    expect(result.pipes['main']!.fixtureFlowLps).toBeGreaterThan(0)
    expect(result.pipes['service']!.equipmentFlowLps).toBeCloseTo(0.5, 12)
  })

  it('counts the series and the flush valve curve from the first flush valve on', () => {
    const live = createLiveCalculation(building(0.2, 'flush-valve-series'))
    live.apply({ type: 'node.update', id: 'lav', patch: { count: 3 } })
    live.apply({ type: 'node.update', id: 'sink', patch: { fixture: 'water-closet-flush-valve' } })
    expect(live.result()).toEqual(computeDiagram(live.doc))
    const main = live.result().pipes['main']!
    // The first flush valve closet adds 40 WSFU [series.ts]; the lavatories keep their share.
    expect(main.flushValveClosets).toBe(1)
    expect(main.curve).toBe('flush-valve')
    expect(main.load).toBe(live.result().pipes['to-lav']!.load + 40)
    expect(live.result().pipes['to-lav']!.curve).toBe('flush-tank')
    live.apply({ type: 'node.update', id: 'lav', patch: { count: 1 } })
    expect(live.result()).toEqual(computeDiagram(live.doc))
  })
})
