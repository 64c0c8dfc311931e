/** What the catalogue says about a fixture node under the diagram's settings. */
import { FIXTURES, catalogueLoad, type LoadValues } from '@shared/calc/fixtures'
import type { NodeOfKind, Occupancy, Settings } from '@shared/document/model'
import { describeSource } from '@shared/calc/sources'

export interface CatalogueFacts {
  occupancy: Occupancy
  /** Loads the calculation uses when the node has no override; null for an unknown fixture. */
  load: LoadValues | null
  loadSource: string
  minPressureKPa: number | null
  minPressureSource: string
  /** What the calculation requires without an override: the larger of diagram and catalogue. */
  requiredKPa: number
}

/**
 * Loads come from the column the calculation reads: the per-fixture table, or the additions
 * that go with the flush valve series.
 */
export function catalogueFacts(fixture: NodeOfKind<'fixture'>, settings: Settings): CatalogueFacts {
  const occupancy = fixture.occupancy ?? settings.occupancy
  const spec = FIXTURES[fixture.fixture]
  if (!spec) {
    const unknown = `"${fixture.fixture}" is not in the fixture catalogue`
    return {
      occupancy,
      load: null,
      loadSource: unknown,
      minPressureKPa: null,
      minPressureSource: unknown,
      requiredKPa: settings.minPressureKPa,
    }
  }
  const column = settings.loadBasis === 'flush-valve-series' ? 'upc' : 'ipc'
  return {
    occupancy,
    load: catalogueLoad(spec, column, occupancy),
    loadSource: describeSource(spec[column].source),
    minPressureKPa: spec.minPressureKPa,
    minPressureSource: describeSource(spec.minPressureSource),
    requiredKPa: Math.max(settings.minPressureKPa, spec.minPressureKPa ?? 0),
  }
}
