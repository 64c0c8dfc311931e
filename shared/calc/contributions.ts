/**
 * What one node adds to the pipes that feed it: fixture loads resolved from the catalogue for the
 * project's load basis and the fixture's occupancy, flush valve counts, equipment flow and the
 * minimum pressure the node needs. Loads are integer milli-WSFU and flows integer µL/s so that
 * pipe sums are exact whatever the order they are added in.
 */
import type { DiagramNode, Settings } from '../document/model.ts'
import { FIXTURES, type LoadValues } from './fixtures.ts'
import { FLOW_SCALE, LOAD_SCALE } from './units.ts'

/** A node's contribution; all zero for nodes that draw no water. */
export interface Contribution {
  cold: number
  hot: number
  total: number
  /** Flush valve water closets / urinals counted on the node's cold supply. */
  closets: number
  urinals: number
  /** Flush valves whose load was overridden: they choose the curve but join no series. */
  otherValves: number
  flow: number
  /** Required residual pressure, kPa, or NaN when the node has none. */
  requiredKPa: number
  /** Per-fixture catalogue loads used (before count), for explanations. */
  each: LoadValues | null
}

const ZERO: Contribution = {
  cold: 0,
  hot: 0,
  total: 0,
  closets: 0,
  urinals: 0,
  otherValves: 0,
  flow: 0,
  requiredKPa: NaN,
  each: null,
}

const milli = (v: number) => Math.round(v * LOAD_SCALE)

/** Resolves a node's contribution under the project settings. */
export function contributionOf(node: DiagramNode, settings: Settings): Contribution {
  if (node.kind === 'equipment') {
    return {
      ...ZERO,
      flow: Math.round(node.flowLps * FLOW_SCALE),
      requiredKPa: node.minPressureKPa ?? settings.minPressureKPa,
    }
  }
  if (node.kind !== 'fixture') return ZERO
  const spec = FIXTURES[node.fixture]
  const occupancy = node.occupancy ?? settings.occupancy
  const series = settings.loadBasis === 'flush-valve-series'
  const count = node.count
  const catalogueMin = spec?.minPressureKPa ?? 0
  const requiredKPa = node.minPressureKPa ?? Math.max(settings.minPressureKPa, catalogueMin)
  let each: LoadValues | null = null
  let closets = 0
  let urinals = 0
  let otherValves = 0
  if (node.load) {
    each = node.load
    if (spec?.flushValve) otherValves = count
  } else if (spec) {
    each = spec[series ? 'upc' : 'ipc'][occupancy]
    if (spec.flushValve === 'closet') closets = count
    if (spec.flushValve === 'urinal') urinals = count
  }
  if (!each) return { ...ZERO, requiredKPa }
  return {
    cold: milli(each.cold) * count,
    hot: milli(each.hot) * count,
    total: milli(each.total) * count,
    closets,
    urinals,
    otherValves,
    flow: 0,
    requiredKPa,
    each,
  }
}
