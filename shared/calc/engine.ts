/**
 * The calculation state behind computeDiagram and the live calculation. It keeps everything in
 * typed arrays indexed by pipe and node so that one edit touches only the pipes on the edited
 * node's paths to the supply. Mutable on purpose (the editor recomputes on every keystroke);
 * callers see it only through compute.ts, incremental.ts and result.ts.
 */
import type { Diagram, DiagramNode, Pipe } from '../document/model.ts'
import { contributionOf, type Contribution } from './contributions.ts'
import { demandLps } from './demand.ts'
import { DEMAND_TABLES, IPC_DEMAND_TABLE, type DemandPoint } from './demand-tables.ts'
import { darcyWeisbachKPa, minDiameterMm } from './friction.ts'
import { compileGraph, type CompiledGraph } from './graph.ts'
import { MarginTree } from './margin-tree.ts'
import { MATERIALS, sizeIndex, type Material } from './materials.ts'
import { seriesLoad } from './series.ts'
import type { CalcIssue } from './types.ts'
import { FLOW_SCALE, KPA_PER_METRE, LOAD_SCALE } from './units.ts'
import { pipeMaterialKey, validateDiagram } from './validate.ts'

/** Water temperature assumed in hot pipes for Darcy-Weisbach (common practice, no source). */
export const HOT_WATER_TEMP_C = 60
/** Margin (kPa) the incremental path needs at every fixture to skip the pressure budget pass. */
const FAST_MARGIN_KPA = 1e-6
// Per material: Hazen-Williams factor per size so the loss is factor · L · Q^1.852 (Q in m³/s).
const hwCache = new Map<string, Float64Array>()
function hwFactors(m: Material): Float64Array {
  let f = hwCache.get(m.key)
  if (!f) {
    const c = m.hazenWilliamsC ** 1.852
    f = Float64Array.from(
      m.sizes,
      (s) => (KPA_PER_METRE * 10.67) / (c * (s.insideDiameterMm / 1000) ** 4.87),
    )
    hwCache.set(m.key, f)
  }
  return f
}

/** How an update was carried out. */
export type UpdateMode = 'none' | 'incremental' | 'budget' | 'recompute'

export class Engine {
  readonly doc: Diagram
  readonly issues: CalcIssue[]
  readonly structuralOk: boolean
  readonly hasErrors: boolean
  readonly g: CompiledGraph
  readonly pipeIds: string[]
  readonly nodeIds: string[]
  readonly tableKey = IPC_DEMAND_TABLE
  private readonly columns: [DemandPoint[], DemandPoint[]]
  private readonly series: boolean
  private readonly limitCold: number
  private readonly limitHot: number
  private readonly darcy: boolean

  // Per node.
  readonly contrib: Contribution[]
  readonly req: Float64Array
  readonly devLoss: Float64Array
  readonly prvIn: Float64Array
  // Per pipe: inputs.
  readonly material: (Material | null)[]
  readonly locked: Int32Array
  readonly invalid: Uint8Array
  readonly leq: Float64Array
  readonly rise: Float64Array
  // Per pipe: own contribution of the node it feeds, then sums over the subtree.
  private readonly oC: Float64Array
  private readonly oH: Float64Array
  private readonly oB: Float64Array
  private readonly oWC: Float64Array
  private readonly oU: Float64Array
  private readonly oFV: Float64Array
  private readonly oEq: Float64Array
  readonly sC: Float64Array
  readonly sH: Float64Array
  readonly sB: Float64Array
  readonly sWC: Float64Array
  readonly sU: Float64Array
  readonly sFV: Float64Array
  readonly sEq: Float64Array
  // Per pipe: results.
  readonly load: Float64Array
  readonly flushValve: Uint8Array
  readonly beyondTable: Uint8Array
  readonly fixtureFlow: Float64Array
  readonly flow: Float64Array
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
  private readonly tree: MarginTree
  private readonly leaves: Float64Array
  private upsized: number[] = []
  private givenUpCount = 0
  private unsizedCount = 0
  /** True when outP/known lag behind an incremental edit (the margin tree is current). */
  stale = false
  private stamp: Int32Array
  private stampNo = 0

  constructor(doc: Diagram) {
    this.doc = doc
    const v = validateDiagram(doc)
    this.issues = v.issues
    this.structuralOk = v.structuralOk
    this.hasErrors = v.issues.some((i) => i.severity === 'error')
    this.pipeIds = doc.pipes.map((p) => p.id)
    this.nodeIds = doc.nodes.map((n) => n.id)
    const nN = this.structuralOk ? doc.nodes.length : 0
    const nP = this.structuralOk ? doc.pipes.length : 0
    this.g = compileGraph(
      this.structuralOk ? doc : { ...doc, nodes: [], pipes: [] },
      v.nodeIndex,
      v.pipeIndex,
    )
    const table = DEMAND_TABLES[this.tableKey]!
    this.columns = [table.columns['flush-tank'], table.columns['flush-valve']]
    this.series = doc.settings.loadBasis === 'flush-valve-series'
    this.limitCold = doc.settings.velocityLimits.cold
    this.limitHot = doc.settings.velocityLimits.hot
    this.darcy = doc.settings.frictionMethod === 'darcy-weisbach'
    const f64 = () => new Float64Array(nP)
    this.contrib = new Array<Contribution>(nN)
    this.req = new Float64Array(nN)
    this.devLoss = new Float64Array(nN)
    this.prvIn = new Float64Array(nN)
    this.material = new Array<Material | null>(nP).fill(null)
    this.locked = new Int32Array(nP).fill(-1)
    this.invalid = new Uint8Array(nP)
    this.leq = f64()
    this.rise = f64()
    this.oC = f64()
    this.oH = f64()
    this.oB = f64()
    this.oWC = f64()
    this.oU = f64()
    this.oFV = f64()
    this.oEq = f64()
    ;[this.sC, this.sH, this.sB, this.sWC, this.sU, this.sFV, this.sEq] = Array.from(
      { length: 7 },
      f64,
    )
    this.load = f64()
    this.flushValve = new Uint8Array(nP)
    this.beyondTable = new Uint8Array(nP)
    this.fixtureFlow = f64()
    this.flow = f64()
    this.base = new Int32Array(nP)
    this.up = new Int32Array(nP)
    this.size = new Int32Array(nP)
    this.velocity = f64()
    this.friction = f64()
    this.drop = f64()
    this.outP = f64()
    this.known = new Uint8Array(nP)
    this.staticOut = f64()
    this.givenUp = new Uint8Array(nP)
    this.tree = new MarginTree(nP)
    this.leaves = f64()
    this.stamp = new Int32Array(nP)
    if (!this.structuralOk) return
    for (let i = 0; i < nN; i++) this.readNode(i)
    for (let q = 0; q < nP; q++) this.readPipe(q)
    this.recomputeAll()
  }

  /** Node data → per-node arrays and the own contribution of its inlet pipes. */
  readNode(i: number): void {
    const node = this.doc.nodes[i]!
    const prev = this.contrib[i]
    const c = contributionOf(node, this.doc.settings)
    this.contrib[i] = c
    this.req[i] = c.requiredKPa
    this.devLoss[i] =
      node.kind === 'meter' || node.kind === 'backflow-preventer' || node.kind === 'water-heater'
        ? node.lossKPa
        : 0
    const { oC, oH, oB, oWC, oU, oFV, oEq } = this
    const qc = this.g.inCold[i]!
    const qh = this.g.inHot[i]!
    const inlet = qc >= 0 ? qc : qh
    if (node.kind === 'equipment' && inlet >= 0) oEq[inlet] = c.flow
    if (node.kind !== 'fixture') return
    if (qc >= 0) {
      oC[qc] = c.cold
      oWC[qc] = c.closets
      oU[qc] = c.urinals
      oFV[qc] = c.otherValves
    }
    if (qh >= 0) oH[qh] = c.hot
    // Several fixtures may merge at one pipe: take back this node's previous share first.
    const l = this.g.lca[i]!
    if (l >= 0) oB[l]! += c.total - c.cold - c.hot - (prev ? prev.total - prev.cold - prev.hot : 0)
  }

  /** Pipe data → per-pipe inputs. */
  readPipe(q: number): void {
    const pipe = this.doc.pipes[q]!
    const m = MATERIALS[pipeMaterialKey(this.doc, pipe)] ?? null
    this.material[q] = m
    const lockedIdx = m && pipe.nominal !== undefined ? sizeIndex(m, pipe.nominal) : -1
    this.locked[q] = lockedIdx
    const badSize = pipe.nominal !== undefined && lockedIdx < 0
    const badLength = !(Number.isFinite(pipe.lengthM) && pipe.lengthM > 0)
    this.invalid[q] = !m || badSize || badLength ? 1 : 0
    this.leq[q] = badLength ? 0 : pipe.lengthM * (1 + this.doc.settings.fittingAllowance)
    const nodes = this.doc.nodes
    this.rise[q] = nodes[this.g.to[q]!]!.elevationM - nodes[this.g.from[q]!]!.elevationM
  }

  /** Sums, sizes and pressures from scratch. */
  recomputeAll(): void {
    const { order, parent } = this.g
    const { sC, sH, sB, sWC, sU, sFV, sEq } = this
    sC.set(this.oC)
    sH.set(this.oH)
    sB.set(this.oB)
    sWC.set(this.oWC)
    sU.set(this.oU)
    sFV.set(this.oFV)
    sEq.set(this.oEq)
    for (let k = order.length - 1; k >= 0; k--) {
      const q = order[k]!
      const p = parent[q]!
      if (p < 0) continue
      sC[p]! += sC[q]!
      sH[p]! += sH[q]!
      sB[p]! += sB[q]!
      sWC[p]! += sWC[q]!
      sU[p]! += sU[q]!
      sFV[p]! += sFV[q]!
      sEq[p]! += sEq[q]!
    }
    this.up.fill(0)
    this.upsized = []
    this.unsizedCount = 0
    for (let q = 0; q < order.length; q++) {
      this.hydraulics(q)
      if (this.size[q]! < 0 && !this.invalid[q]) this.unsizedCount++
    }
    this.budget()
  }

  /** Load, flow, size and friction of pipe q from its sums. */
  hydraulics(q: number): void {
    const milli = this.sC[q]! + this.sH[q]! + this.sB[q]!
    let load = milli / LOAD_SCALE
    if (this.series) load += seriesLoad('closet', this.sWC[q]!) + seriesLoad('urinal', this.sU[q]!)
    const fv = this.sWC[q]! + this.sU[q]! + this.sFV[q]! > 0 ? 1 : 0
    const column = this.columns[fv]!
    const lps = demandLps(column, load)
    const flow = lps + this.sEq[q]! / FLOW_SCALE
    this.load[q] = load
    this.flushValve[q] = fv
    this.beyondTable[q] = load > column[column.length - 1]!.load ? 1 : 0
    this.fixtureFlow[q] = lps
    this.flow[q] = flow
    const m = this.material[q]
    if (this.invalid[q] || !m) {
      this.base[q] = -1
      this.size[q] = -1
    } else {
      const sizes = m.sizes
      let b = this.locked[q]!
      if (b < 0) {
        const limit = this.g.hot[q] ? this.limitHot : this.limitCold
        const dMin = minDiameterMm(flow, limit)
        b = 0
        while (b < sizes.length && sizes[b]!.insideDiameterMm < dMin) b++
        if (b === sizes.length) b = -1
      }
      this.base[q] = b
      this.size[q] = b < 0 ? -1 : Math.min(b + this.up[q]!, sizes.length - 1)
    }
    this.sizeHydraulics(q)
  }

  private sizeHydraulics(q: number): void {
    const s = this.size[q]!
    const m = this.material[q]
    const flow = this.flow[q]!
    let fr = 0
    if (s >= 0 && m) {
      const id = m.sizes[s]!.insideDiameterMm
      const d = id / 1000
      this.velocity[q] = flow / 1000 / ((Math.PI * d * d) / 4)
      if (flow > 0) {
        fr = this.darcy
          ? darcyWeisbachKPa(flow, id, this.leq[q]!, m.roughnessMm, this.tempC(q))
          : hwFactors(m)[s]! * this.leq[q]! * (flow / 1000) ** 1.852
      }
    } else {
      this.velocity[q] = NaN
    }
    this.friction[q] = fr
    this.drop[q] = fr + KPA_PER_METRE * this.rise[q]!
  }

  /** Water temperature of pipe q for Darcy-Weisbach, °C. */
  tempC(q: number): number {
    return this.g.hot[q] ? HOT_WATER_TEMP_C : this.doc.settings.waterTempC
  }

  /** Residual pressure leaving node v given the pressure arriving at it. */
  nodeOut(v: number, inP: number): number {
    const node = this.doc.nodes[v]!
    if (node.kind === 'supply') return node.pressureKPa
    if (node.kind === 'pressure-reducing-valve') return Math.min(inP, node.setKPa)
    return inP - this.devLoss[v]!
  }

  /** Static pressure leaving node v (no flow: no device losses). */
  nodeOutStatic(v: number, inP: number): number {
    const node = this.doc.nodes[v]!
    if (node.kind === 'supply') return node.pressureKPa
    if (node.kind === 'pressure-reducing-valve') return Math.min(inP, node.setKPa)
    return inP
  }

  private leafValue(q: number): number {
    const r = this.req[this.g.to[q]!]!
    return this.known[q] && r === r && !this.givenUp[q] ? this.outP[q]! - r : Infinity
  }

  /** Exact pre-order pass: residual and static pressure at every pipe outlet; rebuilds the tree. */
  pressurePass(): void {
    const { order, parent, from, supply } = this.g
    for (let k = 0; k < order.length; k++) this.pressureAt(order[k]!, parent, from, supply)
    for (let k = 0; k < order.length; k++) this.leaves[k] = this.leafValue(order[k]!)
    this.tree.build(this.leaves)
    for (const v of this.g.prvs) this.prvIn[v] = this.outP[this.inletOf(v)]!
    this.stale = false
  }

  private pressureAt(q: number, parent: Int32Array, from: Int32Array, supply: number): void {
    const v = from[q]!
    const p = parent[q]!
    let base = 0
    let sBase = 0
    let kb = 0
    if (p < 0) {
      if (v === supply) {
        base = sBase = (this.doc.nodes[v] as { pressureKPa: number }).pressureKPa
        kb = 1
      }
    } else {
      base = this.nodeOut(v, this.outP[p]!)
      sBase = this.nodeOutStatic(v, this.staticOut[p]!)
      kb = this.known[p]!
    }
    this.outP[q] = base - this.drop[q]!
    this.staticOut[q] = sBase - KPA_PER_METRE * this.rise[q]!
    this.known[q] = kb && this.size[q]! >= 0 ? 1 : 0
  }

  /** The inlet pipe of node v (cold first), or -1. */
  inletOf(v: number): number {
    const c = this.g.inCold[v]!
    return c >= 0 ? c : this.g.inHot[v]!
  }

  /** Exact residual pressure at pipe q's outlet by walking its path (for stale reads). */
  pathPressure(q: number): number {
    const path: number[] = []
    for (let x = q; x >= 0; x = this.g.parent[x]!) path.push(x)
    const root = path[path.length - 1]!
    const v0 = this.g.from[root]!
    let p = v0 === this.g.supply ? this.nodeOut(v0, 0) : 0
    p -= this.drop[root]!
    for (let i = path.length - 2; i >= 0; i--) {
      const x = path[i]!
      p = this.nodeOut(this.g.from[x]!, p) - this.drop[x]!
    }
    return p
  }

  /**
   * Pressure budget: while some fixture is below its minimum, enlarge by one size the unlocked
   * pipe on its path with the largest friction loss per metre (ties: lowest pipe id). A fixture
   * whose path has nothing left to enlarge is given up on and reported. Each round either
   * enlarges a pipe or gives up a fixture, so the loop ends.
   */
  budget(): void {
    for (const q of this.upsized) {
      this.up[q] = 0
      this.hydraulics(q)
    }
    this.upsized = []
    this.givenUp.fill(0)
    this.givenUpCount = 0
    this.pressurePass()
    if (this.unsizedCount > 0) return
    const { order, parent, from, supply, pos, end } = this.g
    while (this.tree.min() < 0) {
      const leaf = this.tree.argMin()
      const q = order[leaf]!
      let best = -1
      let bestRate = 0
      for (let x = q; x >= 0; x = parent[x]!) {
        const m = this.material[x]
        if (
          this.locked[x]! >= 0 ||
          !m ||
          this.size[x]! < 0 ||
          this.size[x] === m.sizes.length - 1
        ) {
          continue
        }
        const rate = this.friction[x]! / this.leq[x]!
        if (
          rate > bestRate ||
          (rate === bestRate && best >= 0 && this.pipeIds[x]! < this.pipeIds[best]!)
        ) {
          best = x
          bestRate = rate
        }
      }
      if (best < 0) {
        this.givenUp[q] = 1
        this.givenUpCount++
        this.tree.set(leaf, Infinity)
        continue
      }
      if (this.up[best] === 0) this.upsized.push(best)
      this.up[best]!++
      this.size[best]!++
      this.sizeHydraulics(best)
      for (let k = pos[best]!; k < end[best]!; k++) {
        const x = order[k]!
        this.pressureAt(x, parent, from, supply)
        this.tree.set(k, this.leafValue(x))
      }
      for (const v of this.g.prvs) this.prvIn[v] = this.outP[this.inletOf(v)]!
    }
  }

  /** Fixtures given up by the budget pass (nothing left to enlarge on their path). */
  get givenUpTotal(): number {
    return this.givenUpCount
  }

  /** Pipes enlarged beyond their velocity size by the budget pass. */
  get upsizedPipes(): readonly number[] {
    return this.upsized
  }

  // ---- Incremental updates ----

  private nextStamp(): number {
    if (++this.stampNo === 0x7fffffff) {
      this.stamp.fill(0)
      this.stampNo = 1
    }
    return this.stampNo
  }

  /** Re-reads node i after a property edit and updates what depends on it. */
  updateNode(i: number, node: DiagramNode): { mode: UpdateMode; pipes: number[] } {
    const old = this.doc.nodes[i]!
    ;(this.doc.nodes as DiagramNode[])[i] = node
    const global =
      node.elevationM !== old.elevationM ||
      node.kind === 'supply' ||
      node.kind === 'pressure-reducing-valve'
    if (global) {
      for (let q = 0; q < this.doc.pipes.length; q++) this.readPipe(q)
      this.readNode(i)
      this.recomputeAll()
      return { mode: 'recompute', pipes: Array.from(this.g.order) }
    }
    const clean = this.isClean()
    const touched: number[] = []
    const st = this.nextStamp()
    const mark = (x: number) => {
      if (this.stamp[x] !== st) {
        this.stamp[x] = st
        touched.push(x)
      }
    }
    const oldC = this.contrib[i]!
    const oldLoss = this.devLoss[i]!
    // Undo the node's own contribution, re-read it, then push the differences up both paths.
    const qc = this.g.inCold[i]!
    const qh = this.g.inHot[i]!
    const l = this.g.lca[i]!
    this.readNode(i)
    const c = this.contrib[i]!
    const inlet = qc >= 0 ? qc : qh
    if (qc >= 0) {
      const dC = c.cold - oldC.cold
      const dWC = c.closets - oldC.closets
      const dU = c.urinals - oldC.urinals
      const dFV = c.otherValves - oldC.otherValves
      const dEq = node.kind === 'equipment' ? c.flow - oldC.flow : 0
      if (dC || dWC || dU || dFV || dEq) {
        for (let x = qc; x >= 0; x = this.g.parent[x]!) {
          this.sC[x]! += dC
          this.sWC[x]! += dWC
          this.sU[x]! += dU
          this.sFV[x]! += dFV
          this.sEq[x]! += dEq
          mark(x)
        }
      }
    }
    if (qh >= 0) {
      const dH = c.hot - oldC.hot
      const dEq = node.kind === 'equipment' && qc < 0 ? c.flow - oldC.flow : 0
      if (dH || dEq) {
        for (let x = qh; x >= 0; x = this.g.parent[x]!) {
          this.sH[x]! += dH
          this.sEq[x]! += dEq
          mark(x)
        }
      }
    }
    const dB = c.total - c.cold - c.hot - (oldC.total - oldC.cold - oldC.hot)
    if (l >= 0 && dB) {
      for (let x = l; x >= 0; x = this.g.parent[x]!) {
        this.sB[x]! += dB
        mark(x)
      }
    }
    // Required pressure changed: shift the node's leaves by the difference.
    const dReq = c.requiredKPa - oldC.requiredKPa
    if (dReq && dReq === dReq) {
      for (const q of [qc, qh])
        if (q >= 0) this.tree.rangeAdd(this.g.pos[q]!, this.g.pos[q]! + 1, -dReq)
    }
    // A device loss shifts everything downstream of the node.
    const dLoss = this.devLoss[i]! - oldLoss
    if (dLoss && inlet >= 0) this.tree.rangeAdd(this.g.pos[inlet]! + 1, this.g.end[inlet]!, -dLoss)
    return this.finish(touched, clean)
  }

  /** Re-reads pipe q after an edit of its length, material or locked size. */
  updatePipe(q: number, pipe: Pipe): { mode: UpdateMode; pipes: number[] } {
    ;(this.doc.pipes as Pipe[])[q] = pipe
    const clean = this.isClean()
    this.readPipe(q)
    return this.finish([q], clean)
  }

  private isClean(): boolean {
    return this.upsized.length === 0 && this.givenUpCount === 0 && this.unsizedCount === 0
  }

  // Resizes the touched pipes, moves their pressure drops into the tree, corrects for
  // pressure-reducing valves, then either stops (every fixture keeps its minimum) or re-runs the
  // budget pass so the result stays equal to a full recompute.
  private finish(touched: number[], clean: boolean): { mode: UpdateMode; pipes: number[] } {
    const { pos, end } = this.g
    for (const q of touched) {
      const oldDrop = this.drop[q]!
      const wasUnsized = this.size[q]! < 0 && !this.invalid[q]
      this.hydraulics(q)
      const isUnsized = this.size[q]! < 0 && !this.invalid[q]
      this.unsizedCount += (isUnsized ? 1 : 0) - (wasUnsized ? 1 : 0)
      const d = this.drop[q]! - oldDrop
      if (d !== 0) this.tree.rangeAdd(pos[q]!, end[q]!, -d)
    }
    for (const v of this.g.prvs) {
      const qin = this.inletOf(v)
      const set = (this.doc.nodes[v] as { setKPa: number }).setKPa
      const now = this.pathPressure(qin)
      const was = this.prvIn[v]!
      if (now === was) continue
      const corr = Math.min(now, set) - Math.min(was, set) - (now - was)
      this.tree.rangeAdd(pos[qin]! + 1, end[qin]!, corr)
      this.prvIn[v] = now
    }
    if (clean && this.unsizedCount === 0 && this.tree.min() >= FAST_MARGIN_KPA) {
      this.stale = true
      return { mode: 'incremental', pipes: touched }
    }
    this.budget()
    return { mode: 'budget', pipes: touched }
  }

  /** Brings outP/known up to date after incremental edits. */
  refreshPressures(): void {
    if (this.stale) this.pressurePass()
  }

  /** Node index by id. */
  nodeAt(id: string): number | undefined {
    return this.g.nodeIndex.get(id)
  }
}
