/**
 * Explains one pipe's numbers in a form a reviewer can check by hand: which fixtures it serves
 * and through which supply, each fixture's catalogue load, the flush valve series steps, the
 * demand table and curve, the size chosen and the pressures at both ends.
 */
import type { Diagram } from '../document/model.ts'
import { contributionOf } from './contributions.ts'
import { DEMAND_TABLES } from './demand-tables.ts'
import { FIXTURES } from './fixtures.ts'
import { nominalInches } from './materials.ts'
import { FLUSH_VALVE_SERIES, seriesLoad, seriesStep } from './series.ts'
import type { DiagramResult, PipeResult } from './types.ts'
import { KPA_PER_METRE, LOAD_SCALE } from './units.ts'

/** One fixture node served by the pipe. */
export interface ServedFixture {
  id: string
  fixture: string
  count: number
  /** Which of the fixture's supplies pass through this pipe. */
  via: 'cold' | 'hot' | 'both'
  /** Load per fixture used on this pipe (total, cold or hot by `via`), WSFU. */
  each: number
  /** Load the node adds on this pipe (each × count, or 0 when a series carries it), WSFU. */
  load: number
  /** The flush valve series it joins on this pipe, if any. */
  series: 'closet' | 'urinal' | null
  source: string
}

/** A reviewer's breakdown of one pipe. */
export interface PipeExplanation {
  pipe: PipeResult
  fixtures: ServedFixture[]
  equipment: { id: string; flowLps: number }[]
  series: { kind: 'closet' | 'urinal'; count: number; steps: number[]; total: number }[]
  demandTable: { key: string; label: string; source: string }
  elevationChangeM: number
  staticChangeKPa: number
  lines: string[]
}

const f2 = (v: number) => (Math.round(v * 100) / 100).toString()

/** Explains pipe `pipeId` of `doc` using `result` (from computeDiagram of the same document). */
export function explainPipe(
  doc: Diagram,
  result: DiagramResult,
  pipeId: string,
): PipeExplanation | null {
  const pipe = result.pipes[pipeId]
  const docPipe = doc.pipes.find((p) => p.id === pipeId)
  if (!pipe || !docPipe) return null
  const nodes = new Map(doc.nodes.map((n) => [n.id, n]))
  const inlets = new Map<string, typeof doc.pipes>()
  for (const p of doc.pipes) inlets.set(p.to, [...(inlets.get(p.to) ?? []), p])
  const outlets = new Map<string, typeof doc.pipes>()
  for (const p of doc.pipes) outlets.set(p.from, [...(outlets.get(p.from) ?? []), p])

  // Everything downstream of the pipe, and for each fixture which supplies reach it this way.
  const reach = new Map<string, Set<'cold' | 'hot'>>()
  const equipment: { id: string; flowLps: number }[] = []
  const stack: { node: string; system: 'cold' | 'hot' }[] = [
    { node: docPipe.to, system: docPipe.system },
  ]
  const seen = new Set<string>()
  while (stack.length > 0) {
    const { node, system } = stack.pop()!
    const key = `${node}|${system}`
    if (seen.has(key)) continue
    seen.add(key)
    const n = nodes.get(node)
    if (!n) continue
    if (n.kind === 'fixture') reach.set(n.id, (reach.get(n.id) ?? new Set()).add(system))
    if (n.kind === 'equipment') equipment.push({ id: n.id, flowLps: n.flowLps })
    const next = n.kind === 'water-heater' ? 'hot' : system
    for (const p of outlets.get(node) ?? [])
      if (p.system === next) stack.push({ node: p.to, system: next })
  }

  const seriesBasis = doc.settings.loadBasis === 'flush-valve-series'
  const fixtures: ServedFixture[] = []
  const counts = { closet: 0, urinal: 0 }
  for (const [id, via] of [...reach].sort(([a], [b]) => (a < b ? -1 : 1))) {
    const n = nodes.get(id)!
    if (n.kind !== 'fixture') continue
    const c = contributionOf(n, doc.settings)
    const both = via.size === 2
    const viaKey = both ? 'both' : via.has('cold') ? 'cold' : 'hot'
    const perNode = both ? c.total : viaKey === 'cold' ? c.cold : c.hot
    const spec = FIXTURES[n.fixture]
    const kind = via.has('cold') && spec?.flushValve && !n.load ? spec.flushValve : null
    if (kind) counts[kind] += n.count
    const inSeries = kind !== null && seriesBasis
    fixtures.push({
      id,
      fixture: n.fixture,
      count: n.count,
      via: viaKey,
      each: perNode / LOAD_SCALE / n.count,
      load: perNode / LOAD_SCALE,
      series: inSeries ? kind : null,
      source: n.load
        ? 'load given on the node'
        : spec
          ? spec[seriesBasis ? 'upc' : 'ipc'].source
          : 'unknown',
    })
  }
  const series = seriesBasis
    ? (['closet', 'urinal'] as const)
        .filter((k) => counts[k] > 0)
        .map((kind) => ({
          kind,
          count: counts[kind],
          steps: Array.from({ length: counts[kind] }, (_, i) => seriesStep(kind, i + 1)),
          total: seriesLoad(kind, counts[kind]),
        }))
    : []
  const table = DEMAND_TABLES[pipe.demandTable]!
  const rise = (nodes.get(docPipe.to)?.elevationM ?? 0) - (nodes.get(docPipe.from)?.elevationM ?? 0)
  const explanation: PipeExplanation = {
    pipe,
    fixtures,
    equipment,
    series,
    demandTable: { key: table.key, label: table.label, source: table.source },
    elevationChangeM: rise,
    staticChangeKPa: -KPA_PER_METRE * rise,
    lines: [],
  }
  explanation.lines = describe(explanation, doc)
  return explanation
}

function describe(x: PipeExplanation, doc: Diagram): string[] {
  const p = x.pipe
  const lines = [`Pipe ${p.id} (${p.system}) serves ${x.fixtures.length} fixture connection(s).`]
  for (const f of x.fixtures) {
    const what = f.via === 'both' ? 'total (cold and hot pass here)' : `${f.via} only`
    if (f.series) {
      const extra = f.load > 0 ? `, plus ${f2(f.load)} WSFU for its other fittings` : ''
      lines.push(
        `  ${f.id}: ${f.count} × ${f.fixture} — counted in the flush valve ${f.series} series${extra} [${f.source}]`,
      )
    } else {
      lines.push(
        `  ${f.id}: ${f.count} × ${f.fixture} at ${f2(f.each)} WSFU ${what} = ${f2(f.load)} WSFU [${f.source}]`,
      )
    }
  }
  for (const s of x.series) {
    const rule = FLUSH_VALVE_SERIES[s.kind]
    lines.push(
      `  Flush valve ${s.kind}s: ${s.count} on this pipe → ${s.steps.join(' + ')} = ${s.total} WSFU ` +
        `(series ${rule.steps.join(', ')}, then ${rule.then} each; C* [S18])`,
    )
  }
  lines.push(`  Load on the pipe: ${f2(p.load)} WSFU.`)
  lines.push(
    `  Demand: ${x.demandTable.label}, ${p.curve === 'flush-valve' ? 'flush valve' : 'flush tank'} curve ` +
      `→ ${p.fixtureFlowLps.toFixed(3)} L/s` +
      (p.equipmentFlowLps > 0 ? ` + equipment ${p.equipmentFlowLps.toFixed(3)} L/s` : '') +
      ` = ${p.flowLps.toFixed(3)} L/s.`,
  )
  const limit = doc.settings.velocityLimits[p.system]
  if (p.nominal === null) {
    lines.push(`  Size: none of ${p.material} keeps the flow within ${limit} m/s.`)
  } else {
    lines.push(
      `  Size: ${p.nominal} ${p.material}${p.locked ? ' (locked)' : ''}, ID ${p.insideDiameterMm!.toFixed(2)} mm, ` +
        `velocity ${p.velocityMps!.toFixed(2)} m/s (limit ${limit} m/s).`,
    )
    const min = p.fixtureMinimum
    if (min && p.sizeBasis === 'fixture-minimum') {
      lines.push(
        `  Raised to ${min.nominal} in, the minimum supply for a ${min.label.toLowerCase()} ` +
          `(${min.nodeId}), ${min.source}.`,
      )
    } else if (min && p.locked && nominalInches(p.nominal) < nominalInches(min.nominal)) {
      lines.push(
        `  Locked below ${min.nominal} in, the minimum supply for a ${min.label.toLowerCase()} ` +
          `(${min.nodeId}), ${min.source}.`,
      )
    }
    if (p.sizeBasis === 'pressure-budget') {
      lines.push('  Enlarged by the pressure budget so the fixtures beyond keep their minimum.')
    }
    lines.push(
      `  Friction (${doc.settings.frictionMethod}): ${p.lossKPa!.toFixed(2)} kPa over ` +
        `${p.equivalentLengthM.toFixed(2)} m (length + ${doc.settings.fittingAllowance * 100} % fittings).`,
    )
  }
  lines.push(
    `  Elevation change ${f2(x.elevationChangeM)} m → ${f2(x.staticChangeKPa)} kPa at ${KPA_PER_METRE} kPa/m.`,
  )
  if (p.inletPressureKPa !== null && p.outletPressureKPa !== null) {
    lines.push(
      `  Pressure ${p.inletPressureKPa.toFixed(1)} kPa at the inlet, ${p.outletPressureKPa.toFixed(1)} kPa at the outlet.`,
    )
  }
  return lines
}
