/**
 * Turns the engine's arrays into the result contract (types.ts) and the list of issues. The
 * issues are sorted (errors first, then by code and ids) so that the result does not depend on
 * the order of nodes and pipes in the document.
 */
import { FIXTURES } from './fixtures.ts'
import type { Engine } from './engine.ts'
import { baseSize, loadAt, velocitySize } from './hydraulics.ts'
import { FLAGS, FLOW, FRICTION, IREC, LEQ, OUT_P, REC, SIZE, VALVE_CURVE } from './pipe-record.ts'
import { KIND } from './graph.ts'
import { nominalInches } from './materials.ts'
import type {
  CalcIssue,
  DiagramResult,
  FixtureMinimum,
  NodeResult,
  PipeResult,
  SizeBasis,
} from './types.ts'

const kpa = (v: number) => `${v.toFixed(1)} kPa`

/** Pressure entering pipe q (leaving its from-node), or null when unknown. */
export function inletPressure(e: Engine, q: number): number | null {
  const p = e.g.parent[q]!
  const v = e.g.from[q]!
  if (p < 0) return v === e.g.supply ? e.nodeOut(v, 0) : null
  const outP = e.rec[p * REC + OUT_P]!
  return Number.isNaN(outP) ? null : e.nodeOut(v, outP)
}

/** The result of one pipe. */
export function pipeResult(e: Engine, q: number): PipeResult {
  const pipe = e.docPipe(q)
  const m = e.material[q]
  const o = q * REC
  const i = q * IREC
  const s = e.irec[i + SIZE]!
  const sized = s >= 0 && m !== null
  const flow = e.rec[o + FLOW]!
  const fixtureFlow = e.equipmentOn ? e.fixtureFlow[q]! : flow
  const known = !Number.isNaN(e.rec[o + OUT_P])
  return {
    id: pipe.id,
    system: pipe.system,
    load: loadAt(e, q),
    flushValveClosets: e.sWC[q]!,
    flushValveUrinals: e.sU[q]!,
    curve: e.irec[i + FLAGS]! & VALVE_CURVE ? 'flush-valve' : 'flush-tank',
    demandTable: e.tableKey,
    fixtureFlowLps: fixtureFlow,
    equipmentFlowLps: flow - fixtureFlow,
    flowLps: flow,
    material: m?.key ?? pipe.material ?? e.doc.settings.material,
    nominal: sized ? m.sizes[s]!.nominal : null,
    locked: pipe.nominal !== undefined,
    sizeBasis: sizeBasis(e, q),
    fixtureMinimum: fixtureMinimum(e, q),
    insideDiameterMm: sized ? m.sizes[s]!.insideDiameterMm : null,
    velocityMps: sized ? flow / 1000 / e.sizes.area[e.matStart[q]! + s]! : null,
    equivalentLengthM: e.rec[o + LEQ]!,
    lossKPa: sized ? e.rec[o + FRICTION]! : null,
    inletPressureKPa: known ? inletPressure(e, q) : null,
    outletPressureKPa: known ? e.rec[o + OUT_P]! : null,
  }
}

/** Whether pipe q's load lies beyond the last row of its demand column (extrapolated). */
function beyondTable(e: Engine, q: number): boolean {
  const rows = e.columns[e.irec[q * IREC + FLAGS]! & VALVE_CURVE ? 1 : 0]!.load
  return loadAt(e, q) > rows[rows.length - 1]!
}

function sizeBasis(e: Engine, q: number): SizeBasis {
  if (e.locked[q]! >= 0) return 'locked'
  const size = e.irec[q * IREC + SIZE]!
  if (size < 0) return 'none'
  const velSize = velocitySize(e, q, e.rec[q * REC + FLOW]!)
  const base = baseSize(e, q, velSize)
  if (size > base) return 'pressure-budget'
  return base > velSize ? 'fixture-minimum' : 'velocity'
}

/** The minimum supply size of the catalogue fixture pipe q feeds, or null. */
export function fixtureMinimum(e: Engine, q: number): FixtureMinimum | null {
  const node = e.doc.nodes[e.g.to[q]!]!
  const spec = node.kind === 'fixture' ? FIXTURES[node.fixture] : undefined
  if (!spec) return null
  return {
    nodeId: node.id,
    fixture: spec.key,
    label: spec.label,
    nominal: e.g.hot[q] ? spec.minNominalHot : spec.minNominal,
    source: spec.minNominalSource,
  }
}

/** The result of one node: flowing pressure on its outlet side (a fixture: its lower inlet). */
export function nodeResult(e: Engine, v: number): NodeResult {
  const id = e.nodeIds[v]!
  if (v === e.g.supply) {
    const p = e.nodeOut(v, 0)
    return { id, pressureKPa: p, staticPressureKPa: p }
  }
  let pressure: number | null = null
  let statics: number | null = null
  const kind = e.g.nodeKind[v]!
  for (let side = 0; side < 2; side++) {
    const q = side === 0 ? e.g.inCold[v]! : e.g.inHot[v]!
    if (q < 0 || !e.g.rooted[q]) continue
    const staticOut = e.staticOut[q]!
    const st = kind === KIND.fixture ? staticOut : e.nodeOutStatic(v, staticOut)
    statics = statics === null ? st : Math.max(statics, st)
    const outP = e.rec[q * REC + OUT_P]!
    if (Number.isNaN(outP)) continue
    const p = kind === KIND.fixture ? outP : e.nodeOut(v, outP)
    pressure = pressure === null ? p : Math.min(pressure, p)
  }
  return { id, pressureKPa: pressure, staticPressureKPa: statics }
}

/** Materialises the full result. */
export function buildResult(e: Engine): DiagramResult {
  const pipes: Record<string, PipeResult> = {}
  const nodes: Record<string, NodeResult> = {}
  const issues: CalcIssue[] = [...e.issues]
  if (e.structuralOk) {
    e.refreshPressures()
    // Document order, so that listings follow the file.
    const docPipe = e.g.docPipe
    for (let d = 0; d < docPipe.length; d++)
      pipes[e.pipeIds[docPipe[d]!]!] = pipeResult(e, docPipe[d]!)
    for (let v = 0; v < e.g.nodeCount; v++) nodes[e.nodeIds[v]!] = nodeResult(e, v)
    designIssues(e, pipes, nodes, issues)
  }
  issues.sort(compareIssues)
  return { ok: !issues.some((i) => i.severity === 'error'), pipes, nodes, issues }
}

function compareIssues(a: CalcIssue, b: CalcIssue): number {
  if (a.severity !== b.severity) return a.severity === 'error' ? -1 : 1
  const ka = `${a.code}\u0000${a.ids.join(',')}\u0000${a.message}`
  const kb = `${b.code}\u0000${b.ids.join(',')}\u0000${b.message}`
  return ka < kb ? -1 : ka > kb ? 1 : 0
}

function designIssues(
  e: Engine,
  pipes: Record<string, PipeResult>,
  nodes: Record<string, NodeResult>,
  issues: CalcIssue[],
): void {
  const warn = (code: string, message: string, ids: string[]) =>
    issues.push({ severity: 'warning', code, message, ids })
  const { settings } = e.doc
  for (let q = 0; q < e.g.pipeCount; q++) {
    const r = pipes[e.pipeIds[q]!]!
    if (e.invalid[q]) continue
    if (e.irec[q * IREC + SIZE]! < 0) {
      const limit = settings.velocityLimits[r.system]
      const largest = e.material[q]!.sizes.at(-1)!.nominal
      issues.push({
        severity: 'error',
        code: 'no-size-fits',
        message:
          `Pipe ${r.id}: even ${largest} ${r.material} carries ${r.flowLps.toFixed(2)} L/s ` +
          `faster than ${limit} m/s.`,
        ids: [r.id],
      })
      continue
    }
    const limit = settings.velocityLimits[r.system]
    if (r.locked && r.velocityMps! > limit) {
      warn(
        'velocity-exceeded',
        `Pipe ${r.id} (locked ${r.nominal}) runs at ${r.velocityMps!.toFixed(2)} m/s, above ${limit} m/s.`,
        [r.id],
      )
    }
    const min = r.locked ? r.fixtureMinimum : null
    if (min && nominalInches(r.nominal!) < nominalInches(min.nominal)) {
      warn(
        'below-fixture-minimum',
        `Pipe ${r.id} (locked ${r.nominal}) is smaller than the ${min.nominal} in minimum supply ` +
          `for ${min.label.toLowerCase()} ${min.nodeId} (${min.source}).`,
        [r.id, min.nodeId],
      )
    }
    if (beyondTable(e, q)) {
      warn(
        'load-beyond-table',
        `Pipe ${r.id}: ${r.load.toFixed(1)} WSFU is beyond the demand table; the last segment was extended.`,
        [r.id],
      )
    }
  }
  for (let v = 0; v < e.g.nodeCount; v++) {
    const node = e.doc.nodes[v]!
    const r = nodes[node.id]!
    if (v !== e.g.supply && r.staticPressureKPa === null) {
      warn('unreached', `${node.kind} ${node.id} is not reached from the supply.`, [node.id])
      continue
    }
    const need = e.req[v]!
    if (r.pressureKPa !== null && need === need && r.pressureKPa < need) {
      warn(
        'below-min-pressure',
        `${node.kind} ${node.id} gets ${kpa(r.pressureKPa)}; it needs ${kpa(need)}.`,
        [node.id],
      )
    }
    if (r.staticPressureKPa !== null && r.staticPressureKPa > settings.maxStaticKPa) {
      warn(
        'above-max-static',
        `${node.id} sees ${kpa(r.staticPressureKPa)} static, above ${kpa(settings.maxStaticKPa)}.`,
        [node.id],
      )
    }
    const spec = node.kind === 'fixture' && !node.load ? FIXTURES[node.fixture] : undefined
    if (
      spec &&
      ((e.g.inCold[v]! >= 0 && !spec.supplies.cold) || (e.g.inHot[v]! >= 0 && !spec.supplies.hot))
    ) {
      for (const system of ['cold', 'hot'] as const) {
        const q = system === 'cold' ? e.g.inCold[v]! : e.g.inHot[v]!
        if (q >= 0 && !spec.supplies[system]) {
          warn(
            'supply-not-used',
            `${spec.label} ${node.id} takes no ${system} water; pipe ${e.pipeIds[q]} carries none.`,
            [node.id, e.pipeIds[q]!],
          )
        }
      }
    }
  }
}
