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
import {
  createDemandMemo,
  MEMO_ROWS,
  MEMO_SIZES,
  sizingClass,
  type DemandMemo,
} from './demand-memo.ts'
import { DEMAND_TABLES, IPC_DEMAND_TABLE } from './demand-tables.ts'
import { FIXTURES } from './fixtures.ts'
import { waterProperties } from './friction.ts'
import { compileGraph, type CompiledGraph } from './graph.ts'
import { hydraulicsAt, recomputeAll } from './hydraulics.ts'
import { MarginTree } from './margin-tree.ts'
import { sizeAtLeast, sizeIndex, type Material } from './materials.ts'
import {
  AFTER_DEVICE,
  CLASS,
  FLAGS,
  FLOW,
  IREC,
  LEQ,
  PARENT,
  REC,
  REQ,
  RISE,
} from './pipe-record.ts'
import { budget, nodeOut, pressurePass, staticPass } from './pressures.ts'
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
// Capacity rows of both systems and every material's sizes must fit a sizing class.
if (
  2 * SIZE_TABLES.area.length >= MEMO_ROWS ||
  SIZE_TABLES.materials.some((m) => m.sizes.length >= MEMO_SIZES)
) {
  throw new Error('too many sizes for the demand memo')
}

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
  /**
   * Flow capacity, L/s, of every flat size at the cold velocity limit, then of every flat size
   * at the hot limit: a pipe's sizes start at capStart.
   */
  readonly capacity: Float64Array
  /** Per engine: (load, curve, sizing class) → flow, base size, friction per metre (demand-memo.ts). */
  readonly memo: DemandMemo
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
  /** Index in `capacity` of the material's first size in the pipe's system, or -1. */
  readonly capStart: Int32Array
  readonly matCount: Int32Array
  readonly locked: Int32Array
  /** Smallest size index allowed by the fixture the pipe supplies (0 when none). */
  readonly minSize: Int32Array
  readonly invalid: Uint8Array
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
  /**
   * Per pipe, interleaved (pipe-record.ts): equivalent length, rise, a copy of the required
   * pressure of the node the pipe feeds, flow, friction and residual pressure in `rec`; sizing
   * class, budget enlargement, size, flags and a copy of the parent link in `irec`.
   */
  readonly rec: Float64Array
  readonly irec: Int32Array
  /** Probable flow of the fixtures alone, L/s: written once some equipment has a flow. */
  readonly fixtureFlow: Float64Array
  /** Static pressure at each pipe outlet, kPa (pressures.ts staticPass). */
  readonly staticOut: Float64Array
  readonly tree: MarginTree
  upsized: number[] = []
  givenUpCount = 0
  unsizedCount = 0
  /** Pipes without a fitting size met by the last sweep (hydraulics.ts). */
  sweepUnsized = 0
  /** The smallest margin the last sweep met (hydraulics.ts). */
  sweepMargin = Infinity
  /** True when residual pressures lag behind an incremental edit (the margin tree is current). */
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
    const capCold = capacities(this.sizes, s.velocityLimits.cold)
    this.capacity = new Float64Array(2 * capCold.length)
    this.capacity.set(capCold)
    this.capacity.set(capacities(this.sizes, s.velocityLimits.hot), capCold.length)
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
    this.capStart = i32().fill(-1)
    this.matCount = i32()
    this.locked = i32().fill(-1)
    this.minSize = i32()
    this.invalid = new Uint8Array(nP)
    ;[this.oLoad, this.oWC, this.oU, this.oFV, this.oEq] = [f64(), f64(), f64(), f64(), f64()]
    ;[this.sLoad, this.sWC, this.sU, this.sFV, this.sEq] = [f64(), f64(), f64(), f64(), f64()]
    this.rec = new Float64Array(nP * REC)
    this.irec = new Int32Array(nP * IREC)
    for (let q = 0; q < nP; q++) this.irec[q * IREC + PARENT] = this.g.parent[q]!
    this.fixtureFlow = f64()
    this.staticOut = f64()
    this.tree = new MarginTree(nP)
    this.stamp = i32()
    this.memo = createDemandMemo(nP)
    if (!ok) return
    for (let i = 0; i < nN; i++) this.readNode(i)
    for (let q = 0; q < nP; q++) this.readPipe(q)
    staticPass(this)
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
    const device = this.cap[i] !== Infinity || this.devLoss[i] !== 0 ? AFTER_DEVICE : 0
    for (let j = outStart[i]!; j < outStart[i + 1]!; j++) {
      const f = outPipes[j]! * IREC + FLAGS
      this.irec[f] = (this.irec[f]! & ~AFTER_DEVICE) | device
    }
    const qc = this.g.inCold[i]!
    const qh = this.g.inHot[i]!
    // -Infinity where nothing is required, so that the margin is +Infinity without a test.
    const req = c.requiredKPa === c.requiredKPa ? c.requiredKPa : -Infinity
    if (qc >= 0) this.rec[qc * REC + REQ] = req
    if (qh >= 0) this.rec[qh * REC + REQ] = req
    const inlet = qc >= 0 ? qc : qh
    if (k === 'equipment' && inlet >= 0) {
      this.oEq[inlet] = c.flow
      if (c.flow !== 0 && !this.equipmentOn) {
        // Until now fixture flow equalled flow and was not stored (hydraulics.ts).
        this.equipmentOn = true
        for (let q = 0; q < this.g.pipeCount; q++) this.fixtureFlow[q] = this.rec[q * REC + FLOW]!
      }
    }
    if (k !== 'fixture') return
    if (qc >= 0) {
      this.oLoad[qc] = c.cold
      this.oWC[qc] = c.closets
      this.oU[qc] = c.urinals
      this.oFV[qc] = c.otherValves
      if (c.closets + c.urinals + c.otherValves > 0) this.valvesOn = true
      this.minSize[qc] = this.fixtureMinimum(qc)
      this.classify(qc)
    }
    if (qh >= 0) {
      this.oLoad[qh] = c.hot
      this.minSize[qh] = this.fixtureMinimum(qh)
      this.classify(qh)
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
    const hotRows = this.g.hot[q] ? this.sizes.area.length : 0
    this.capStart[q] = mi === undefined ? -1 : this.sizes.start[mi]! + hotRows
    this.matCount[q] = mi === undefined ? 0 : this.sizes.count[mi]!
    const lockedIdx = m && pipe.nominal !== undefined ? sizeIndex(m, pipe.nominal) : -1
    this.locked[q] = lockedIdx
    const badSize = pipe.nominal !== undefined && lockedIdx < 0
    const badLength = !(Number.isFinite(pipe.lengthM) && pipe.lengthM > 0)
    this.invalid[q] = !m || badSize || badLength ? 1 : 0
    this.rec[q * REC + LEQ] = badLength
      ? 0
      : pipe.lengthM * (1 + this.doc.settings.fittingAllowance)
    const nodes = this.doc.nodes
    const rise = nodes[this.g.to[q]!]!.elevationM - nodes[this.g.from[q]!]!.elevationM
    this.rec[q * REC + RISE] = KPA_PER_METRE * rise
    this.minSize[q] = this.fixtureMinimum(q)
    this.classify(q)
  }

  /** Pipe q's sizing class from its capacity row, locked size and fixture minimum. */
  classify(q: number): void {
    const row = this.invalid[q] ? -1 : this.capStart[q]!
    this.irec[q * IREC + CLASS] = sizingClass(row, this.locked[q]!, this.minSize[q]!)
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

  /** Brings residual pressures up to date after incremental edits. */
  refreshPressures(): void {
    if (this.stale) pressurePass(this)
  }

  /** Node index by id. */
  nodeAt(id: string): number | undefined {
    return this.g.nodeIndex.get(id)
  }
}
