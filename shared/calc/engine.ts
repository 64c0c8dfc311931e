/**
 * The calculation state behind computeDiagram and the live calculation: everything in typed arrays
 * indexed by pipe (in pre-order, see graph.ts) and node, so that a full recompute is a few passes
 * over flat arrays and one edit touches only the pipes on the edited node's paths to the supply.
 * Mutable on purpose (the editor recomputes on every keystroke); callers see it only through
 * compute.ts, incremental.ts and result.ts. This file holds the state and reads the document
 * into it; the passes live in hydraulics.ts, pressures.ts and updates.ts.
 */
import type { Diagram, DiagramNode, Pipe } from '../document/model.ts'
import { contributionOf, type Contribution } from './contributions.ts'
import { compileColumn, type DemandColumn } from './demand-lookup.ts'
import { DEMAND_TABLES, IPC_DEMAND_TABLE } from './demand-tables.ts'
import { FIXTURES } from './fixtures.ts'
import { waterProperties } from './friction.ts'
import { compileGraph, type CompiledGraph } from './graph.ts'
import { hydraulicsAt, recomputeAll } from './hydraulics.ts'
import { MarginTree } from './margin-tree.ts'
import { sizeAtLeast, sizeIndex, type Material } from './materials.ts'
import { budget, nodeOut, pressurePass } from './pressures.ts'
import { capacities, SIZE_TABLES } from './size-tables.ts'
import type { CalcIssue } from './types.ts'
import { KPA_PER_METRE } from './units.ts'
import { updateNode, updatePipe, type UpdateResult } from './updates.ts'
import { pipeMaterialKey, validateDiagram } from './validate.ts'

/** Water temperature assumed in hot pipes for Darcy-Weisbach (common practice, no source). */
export const HOT_WATER_TEMP_C = 60

/** How an update was carried out. */
export type UpdateMode = 'none' | 'incremental' | 'budget' | 'recompute'

// The catalogue's demand columns, compiled once.
const TABLE = DEMAND_TABLES[IPC_DEMAND_TABLE]!
const COLUMNS = [
  compileColumn(TABLE.columns['flush-tank']),
  compileColumn(TABLE.columns['flush-valve']),
]

/** Engine state; see the file comment. Fields are public for the pass modules. */
export class Engine {
  readonly doc: Diagram
  readonly issues: CalcIssue[]
  readonly structuralOk: boolean
  readonly hasErrors: boolean
  readonly g: CompiledGraph
  /** Pipe ids by internal index. */
  readonly pipeIds: string[]
  readonly nodeIds: string[]
  readonly tableKey = IPC_DEMAND_TABLE
  readonly sizes = SIZE_TABLES
  readonly columns: DemandColumn[] = COLUMNS
  readonly series: boolean
  readonly darcy: boolean
  /** Flow capacity of every flat size at the cold and hot velocity limits, L/s. */
  readonly capCold: Float64Array
  readonly capHot: Float64Array
  /** Water viscosity (m²/s) and density (kg/m³) in cold and hot pipes, for Darcy-Weisbach. */
  readonly water: { cold: { nu: number; rho: number }; hot: { nu: number; rho: number } }

  // Per node.
  readonly contrib: Contribution[]
  readonly req: Float64Array
  readonly devLoss: Float64Array
  /** A pressure-reducing valve's set pressure; +Infinity for every other node. */
  readonly cap: Float64Array
  readonly prvIn: Float64Array
  // Per pipe: inputs.
  readonly material: (Material | null)[]
  /** Flat index (size-tables.ts) of the material's first size, or -1. */
  readonly matStart: Int32Array
  readonly matCount: Int32Array
  readonly locked: Int32Array
  /** Smallest size index allowed by the fixture the pipe supplies (0 when none). */
  readonly minSize: Int32Array
  readonly invalid: Uint8Array
  readonly leq: Float64Array
  /** Static head change over the pipe, kPa (9.81 kPa per metre of rise). */
  readonly riseKPa: Float64Array
  // Per pipe: copies of node values, so the pressure sweep reads front to back: the cap and
  // device loss of the node the pipe leaves, the required pressure of the node it feeds.
  readonly inCap: Float64Array
  readonly inLoss: Float64Array
  readonly outReq: Float64Array
  // Per pipe: own contribution of the node it feeds (loads in milli-WSFU), then subtree sums.
  readonly oLoad: Float64Array
  readonly oWC: Float64Array
  readonly oU: Float64Array
  readonly oFV: Float64Array
  readonly oEq: Float64Array
  readonly sLoad: Float64Array
  readonly sWC: Float64Array
  readonly sU: Float64Array
  readonly sFV: Float64Array
  readonly sEq: Float64Array
  /** Set once any node has flush valves / equipment flow: until then those sums stay zero. */
  valvesOn = false
  equipmentOn = false
  // Per pipe: results.
  readonly load: Float64Array
  readonly flushValve: Uint8Array
  readonly beyondTable: Uint8Array
  readonly fixtureFlow: Float64Array
  readonly flow: Float64Array
  /** flow^1.852 with flow in m³/s, for Hazen-Williams at whatever size the pipe ends up. */
  readonly flowPow: Float64Array
  /** Smallest size within the velocity limit (-1: none), before any fixture minimum. */
  readonly velSize: Int32Array
  readonly base: Int32Array
  readonly up: Int32Array
  readonly size: Int32Array
  readonly velocity: Float64Array
  readonly friction: Float64Array
  readonly drop: Float64Array
  readonly outP: Float64Array
  readonly known: Uint8Array
  readonly staticOut: Float64Array
  readonly givenUp: Uint8Array
  readonly tree: MarginTree
  readonly leaves: Float64Array
  upsized: number[] = []
  givenUpCount = 0
  unsizedCount = 0
  /** True when outP/known lag behind an incremental edit (the margin tree is current). */
  stale = false
  readonly stamp: Int32Array
  stampNo = 0

  /** Compiles `doc` (which it then owns) and, unless `compute` is false, computes it. */
  constructor(doc: Diagram, compute = true) {
    this.doc = doc
    const v = validateDiagram(doc)
    this.issues = v.issues
    this.structuralOk = v.structuralOk
    this.hasErrors = v.issues.some((i) => i.severity === 'error')
    this.nodeIds = doc.nodes.map((n) => n.id)
    const ok = this.structuralOk
    this.g = compileGraph(ok ? doc : { ...doc, nodes: [], pipes: [] }, v.nodeIndex)
    this.pipeIds = Array.from(this.g.pipeDoc, (d) => doc.pipes[d]!.id)
    const s = doc.settings
    this.series = s.loadBasis === 'flush-valve-series'
    this.darcy = s.frictionMethod === 'darcy-weisbach'
    this.capCold = capacities(this.sizes, s.velocityLimits.cold)
    this.capHot = capacities(this.sizes, s.velocityLimits.hot)
    this.water = { cold: waterProperties(s.waterTempC), hot: waterProperties(HOT_WATER_TEMP_C) }
    const nN = ok ? doc.nodes.length : 0
    const nP = ok ? doc.pipes.length : 0
    const f64 = () => new Float64Array(nP)
    const i32 = () => new Int32Array(nP)
    this.contrib = new Array<Contribution>(nN)
    this.req = new Float64Array(nN)
    this.devLoss = new Float64Array(nN)
    this.cap = new Float64Array(nN).fill(Infinity)
    this.prvIn = new Float64Array(nN)
    this.material = new Array<Material | null>(nP).fill(null)
    this.matStart = i32().fill(-1)
    this.matCount = i32()
    this.locked = i32().fill(-1)
    this.minSize = i32()
    this.invalid = new Uint8Array(nP)
    this.leq = f64()
    this.riseKPa = f64()
    this.inCap = f64()
    this.inLoss = f64()
    this.outReq = f64()
    ;[this.oLoad, this.oWC, this.oU, this.oFV, this.oEq] = [f64(), f64(), f64(), f64(), f64()]
    ;[this.sLoad, this.sWC, this.sU, this.sFV, this.sEq] = [f64(), f64(), f64(), f64(), f64()]
    this.load = f64()
    this.flushValve = new Uint8Array(nP)
    this.beyondTable = new Uint8Array(nP)
    this.fixtureFlow = f64()
    this.flow = f64()
    this.flowPow = f64()
    ;[this.velSize, this.base, this.up, this.size] = [i32(), i32(), i32(), i32()]
    ;[this.velocity, this.friction, this.drop, this.outP] = [f64(), f64(), f64(), f64()]
    this.known = new Uint8Array(nP)
    this.staticOut = f64()
    this.givenUp = new Uint8Array(nP)
    this.tree = new MarginTree(nP)
    this.leaves = f64()
    this.stamp = i32()
    if (!ok) return
    for (let i = 0; i < nN; i++) this.readNode(i)
    for (let q = 0; q < nP; q++) this.readPipe(q)
    if (compute) this.recomputeAll()
  }

  /** Node data → per-node arrays and the own contribution of its inlet pipes. */
  readNode(i: number): void {
    const node = this.doc.nodes[i]!
    const prev = this.contrib[i]
    const c = contributionOf(node, this.doc.settings)
    this.contrib[i] = c
    this.req[i] = c.requiredKPa
    const k = node.kind
    this.devLoss[i] =
      k === 'meter' || k === 'backflow-preventer' || k === 'water-heater' ? node.lossKPa : 0
    this.cap[i] = k === 'pressure-reducing-valve' ? node.setKPa : Infinity
    const { outStart, outPipes } = this.g
    for (let j = outStart[i]!; j < outStart[i + 1]!; j++) {
      this.inCap[outPipes[j]!] = this.cap[i]!
      this.inLoss[outPipes[j]!] = this.devLoss[i]!
    }
    const qc = this.g.inCold[i]!
    const qh = this.g.inHot[i]!
    if (qc >= 0) this.outReq[qc] = c.requiredKPa
    if (qh >= 0) this.outReq[qh] = c.requiredKPa
    const inlet = qc >= 0 ? qc : qh
    if (k === 'equipment' && inlet >= 0) {
      this.oEq[inlet] = c.flow
      if (c.flow !== 0) this.equipmentOn = true
    }
    if (k !== 'fixture') return
    if (qc >= 0) {
      this.oLoad[qc] = c.cold
      this.oWC[qc] = c.closets
      this.oU[qc] = c.urinals
      this.oFV[qc] = c.otherValves
      if (c.closets + c.urinals + c.otherValves > 0) this.valvesOn = true
      this.minSize[qc] = this.fixtureMinimum(qc)
    }
    if (qh >= 0) {
      this.oLoad[qh] = c.hot
      this.minSize[qh] = this.fixtureMinimum(qh)
    }
    // Several fixtures may merge at one pipe: take back this node's previous share first.
    const l = this.g.lca[i]!
    if (l >= 0) {
      this.oLoad[l]! += c.total - c.cold - c.hot - (prev ? prev.total - prev.cold - prev.hot : 0)
    }
  }

  /** Pipe data → per-pipe inputs. */
  readPipe(q: number): void {
    const pipe = this.docPipe(q)
    const mi = this.sizes.materialIndex.get(pipeMaterialKey(this.doc, pipe))
    const m = mi === undefined ? null : this.sizes.materials[mi]!
    this.material[q] = m
    this.matStart[q] = mi === undefined ? -1 : this.sizes.start[mi]!
    this.matCount[q] = mi === undefined ? 0 : this.sizes.count[mi]!
    const lockedIdx = m && pipe.nominal !== undefined ? sizeIndex(m, pipe.nominal) : -1
    this.locked[q] = lockedIdx
    const badSize = pipe.nominal !== undefined && lockedIdx < 0
    const badLength = !(Number.isFinite(pipe.lengthM) && pipe.lengthM > 0)
    this.invalid[q] = !m || badSize || badLength ? 1 : 0
    this.leq[q] = badLength ? 0 : pipe.lengthM * (1 + this.doc.settings.fittingAllowance)
    const nodes = this.doc.nodes
    const rise = nodes[this.g.to[q]!]!.elevationM - nodes[this.g.from[q]!]!.elevationM
    this.riseKPa[q] = KPA_PER_METRE * rise
    this.minSize[q] = this.fixtureMinimum(q)
  }

  /** Size index of the minimum supply of the fixture pipe q feeds (0 when it feeds none). */
  fixtureMinimum(q: number): number {
    const m = this.material[q]
    const node = this.doc.nodes[this.g.to[q]!]!
    if (!m || node.kind !== 'fixture') return 0
    const spec = FIXTURES[node.fixture]
    if (!spec) return 0
    return sizeAtLeast(m, this.g.hot[q] ? spec.minNominalHot : spec.minNominal)
  }

  /** The document pipe at internal index q. */
  docPipe(q: number): Pipe {
    return this.doc.pipes[this.g.pipeDoc[q]!]!
  }

  /** Sums, sizes and pressures from scratch. */
  recomputeAll(): void {
    recomputeAll(this)
  }

  /** Load, flow, size and friction of pipe q from its sums. */
  hydraulics(q: number): void {
    hydraulicsAt(this, q)
  }

  /** Exact pre-order pressure pass (rebuilds the margin tree). */
  pressurePass(): void {
    pressurePass(this)
  }

  /** The pressure budget pass (pressures.ts). */
  budget(): void {
    budget(this)
  }

  /** Residual pressure leaving node v given the pressure arriving at it. */
  nodeOut(v: number, inP: number): number {
    return nodeOut(this, v, inP)
  }

  /** Static pressure leaving node v (no flow: no device losses). */
  nodeOutStatic(v: number, inP: number): number {
    const node = this.doc.nodes[v]!
    return node.kind === 'supply' ? node.pressureKPa : Math.min(inP, this.cap[v]!)
  }

  /** Re-reads node i after a property edit and updates what depends on it. */
  updateNode(i: number, node: DiagramNode): UpdateResult {
    return updateNode(this, i, node)
  }

  /** Re-reads pipe q after an edit of its length, material or locked size. */
  updatePipe(q: number, pipe: Pipe): UpdateResult {
    return updatePipe(this, q, pipe)
  }

  /** Brings outP/known up to date after incremental edits. */
  refreshPressures(): void {
    if (this.stale) pressurePass(this)
  }

  /** Node index by id. */
  nodeAt(id: string): number | undefined {
    return this.g.nodeIndex.get(id)
  }
}
