/** A complete pipe result for tests; override what the test is about. */
import type { PipeResult } from '@shared/calc/types.ts'

export function pipeResult(overrides: Partial<PipeResult> = {}): PipeResult {
  return {
    id: 'p1',
    system: 'cold',
    load: 58,
    flushValveClosets: 0,
    flushValveUrinals: 0,
    curve: 'flush-tank',
    demandTable: 'ipc-e103.3-3',
    fixtureFlowLps: 3.9,
    equipmentFlowLps: 0,
    flowLps: 3.9,
    material: 'copper-l',
    nominal: '2',
    locked: false,
    insideDiameterMm: 50.42,
    velocityMps: 1.92,
    equivalentLengthM: 15,
    lossKPa: 4.2,
    inletPressureKPa: 320,
    outletPressureKPa: 315.8,
    ...overrides,
  }
}
