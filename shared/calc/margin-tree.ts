/**
 * A min segment tree with range add, over pipes in pre-order. Each leaf holds the pressure margin
 * (residual − required) at a pipe's outlet, or +Infinity where nothing is checked. A pipe's
 * subtree is one contiguous range, so a change in one pipe's pressure drop is one range add and
 * "is any fixture short of pressure?" is one read — the incremental path's O(log n) check.
 * Lazy values stay on their node (no push-down): a node's min already includes its own lazy.
 * A full recompute hands over its leaves with `defer`; the tree is built from them on first use,
 * so a recompute that finds every fixture supplied never pays for a tree nobody reads.
 */
export class MarginTree {
  private readonly size: number
  private readonly mn: Float64Array
  private readonly lz: Float64Array
  /** Leaf values handed over by `defer` and not yet built. */
  private pending: ((i: number) => number) | null = null
  private readonly n: number

  /** A tree over `n` leaves, all +Infinity. */
  constructor(n: number) {
    let size = 1
    while (size < Math.max(1, n)) size <<= 1
    this.size = size
    this.n = n
    this.mn = new Float64Array(2 * size).fill(Infinity)
    this.lz = new Float64Array(2 * size)
  }

  /** Replaces every leaf: leaf i becomes leafOf(i). */
  build(leafOf: (i: number) => number): void {
    this.pending = null
    const { size, mn, lz, n } = this
    lz.fill(0)
    mn.fill(Infinity, size + n)
    for (let i = 0; i < n; i++) mn[size + i] = leafOf(i)
    for (let i = size - 1; i >= 1; i--) {
      const a = mn[2 * i]!
      const b = mn[2 * i + 1]!
      mn[i] = a < b ? a : b
    }
  }

  /** `build` on first use: leafOf must read state that stays unchanged until then. */
  defer(leafOf: (i: number) => number): void {
    this.pending = leafOf
  }

  /** Builds deferred leaves now (before the state they read changes). */
  ready(): void {
    if (this.pending) this.build(this.pending)
  }

  /** Adds `v` to leaves [l, r). */
  rangeAdd(l: number, r: number, v: number): void {
    this.ready()
    if (l < r && v !== 0) this.add(l, r, v, 1, 0, this.size)
  }

  private add(l: number, r: number, v: number, node: number, nl: number, nr: number): void {
    if (r <= nl || nr <= l) return
    const { mn, lz } = this
    if (l <= nl && nr <= r) {
      mn[node]! += v
      lz[node]! += v
      return
    }
    const mid = (nl + nr) >> 1
    this.add(l, r, v, 2 * node, nl, mid)
    this.add(l, r, v, 2 * node + 1, mid, nr)
    mn[node] = Math.min(mn[2 * node]!, mn[2 * node + 1]!) + lz[node]!
  }

  /** Smallest leaf value. */
  min(): number {
    this.ready()
    return this.mn[1]!
  }

  /** Position of the leftmost smallest leaf. */
  argMin(): number {
    this.ready()
    const { mn, lz, size } = this
    let node = 1
    while (node < size) {
      const target = mn[node]! - lz[node]!
      node = mn[2 * node]! <= target ? 2 * node : 2 * node + 1
    }
    return node - size
  }

  /** Sets leaf `i` to `value`. */
  set(i: number, value: number): void {
    this.ready()
    const { mn, lz, size } = this
    let node = (i + size) >> 1
    let above = 0
    while (node >= 1) {
      above += lz[node]!
      node >>= 1
    }
    node = i + size
    mn[node] = value - above
    lz[node] = 0
    for (node >>= 1; node >= 1; node >>= 1) {
      mn[node] = Math.min(mn[2 * node]!, mn[2 * node + 1]!) + lz[node]!
    }
  }

  /** Current value of leaf `i`. */
  get(i: number): number {
    this.ready()
    const { mn, lz, size } = this
    let node = i + size
    let v = mn[node]!
    for (node >>= 1; node >= 1; node >>= 1) v += lz[node]!
    return v
  }
}
