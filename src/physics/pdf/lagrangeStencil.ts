/**
 * Lagrange interpolation stencils on a sorted axis of nodes (up to four nodes,
 * i.e. cubic), with the denominators prod_(b != a) (n_a - n_b) precomputed so that
 * a lookup costs a search and a dozen multiplications. Node sets may be split
 * into segments that a stencil never crosses (flavour thresholds).
 */

/** Largest stencil: four nodes, cubic interpolation. */
export const STENCIL_SIZE = 4;
/** Upper bound on the bucket table of an axis (the lookup stays correct beyond it, just slower). */
const MAX_BUCKETS = 1 << 16;

/** Slot of `Stencil.weights` that holds the coordinate the stencil is for. */
export const VALUE_SLOT = STENCIL_SIZE;

/**
 * A stencil: first node index, number of nodes, and their weights in a reused buffer
 * whose slot VALUE_SLOT holds the coordinate. Doubles live in the typed array because
 * V8 allocates a box for a double stored in an object field or passed to a call it does
 * not inline, and a lookup must not allocate.
 */
export interface Stencil {
  first: number;
  size: number;
  readonly weights: Float64Array;
}

export function newStencil(): Stencil {
  return { first: 0, size: 0, weights: new Float64Array(STENCIL_SIZE + 1) };
}

/**
 * One interpolation axis: nodes (strictly increasing), segments and precomputed
 * inverse Lagrange denominators for the stencil that starts at each node.
 */
export class InterpolationAxis {
  readonly nodes: Float64Array;
  /** For each interval [k, k+1]: first and last node of its segment. */
  private readonly segmentLo: Int32Array;
  private readonly segmentHi: Int32Array;
  private readonly inverseDenominators: Float64Array;
  /**
   * Interval index at the left edge of each of many equal buckets no wider than the
   * smallest node spacing: an interval lookup is one index and at most one step.
   */
  private readonly bucketInterval: Int32Array;
  private readonly bucketsPerUnit: number;

  /** `segmentStarts` lists node indices that begin a new segment (the node is shared by both). */
  constructor(nodes: Float64Array, segmentStarts: readonly number[] = []) {
    const n = nodes.length;
    this.nodes = nodes;
    const intervals = Math.max(n - 1, 1);
    this.segmentLo = new Int32Array(intervals);
    this.segmentHi = new Int32Array(intervals);
    this.inverseDenominators = new Float64Array(n * STENCIL_SIZE);
    const inner = segmentStarts.filter((s) => s > 0 && s < n - 1);
    const starts = [...new Set([0, ...inner, n - 1])].sort((a, b) => a - b);
    for (let s = 0; s + 1 < starts.length; s++) {
      const lo = starts[s]!;
      const hi = starts[s + 1]!;
      const size = Math.min(STENCIL_SIZE, hi - lo + 1);
      for (let k = lo; k < hi; k++) {
        this.segmentLo[k] = lo;
        this.segmentHi[k] = hi;
      }
      for (let first = lo; first + size - 1 <= hi; first++) {
        for (let a = 0; a < size; a++) {
          let denominator = 1;
          for (let b = 0; b < size; b++) if (b !== a) denominator *= nodes[first + a]! - nodes[first + b]!;
          this.inverseDenominators[first * STENCIL_SIZE + a] = 1 / denominator;
        }
      }
    }
    let smallest = Infinity;
    for (let k = 1; k < n; k++) smallest = Math.min(smallest, nodes[k]! - nodes[k - 1]!);
    const range = n > 1 ? nodes[n - 1]! - nodes[0]! : 0;
    const buckets = n > 1 ? Math.min(MAX_BUCKETS, Math.ceil(range / smallest) + 1) : 1;
    this.bucketsPerUnit = n > 1 ? buckets / range : 0;
    this.bucketInterval = new Int32Array(buckets);
    let k = 0;
    for (let b = 0; b < buckets; b++) {
      const left = nodes[0]! + b / this.bucketsPerUnit;
      while (k < n - 2 && nodes[k + 1]! <= left) k++;
      this.bucketInterval[b] = k;
    }
  }

  /** Index k of the interval [k, k+1] that holds `value`, clamped to the first and last interval. */
  interval(value: number): number {
    const nodes = this.nodes;
    const last = nodes.length - 2;
    if (last < 0) return 0;
    const b = Math.floor((value - nodes[0]!) * this.bucketsPerUnit);
    if (!(b >= 0)) return 0;
    if (b >= this.bucketInterval.length) return last;
    let k = this.bucketInterval[b]!;
    // A bucket holds at most one node (more only if MAX_BUCKETS capped it); the second loop guards rounding.
    while (k < last && value >= nodes[k + 1]!) k++;
    while (k > 0 && value < nodes[k]!) k--;
    return k;
  }

  /** Fills `stencil` with the Lagrange weights at its coordinate (which should lie inside the axis' range). */
  fill(stencil: Stencil): void {
    const value = stencil.weights[VALUE_SLOT]!;
    const nodes = this.nodes;
    if (nodes.length === 1) {
      stencil.first = 0;
      stencil.size = 1;
      stencil.weights[0] = 1;
      return;
    }
    const k = this.interval(value);
    const lo = this.segmentLo[k]!;
    const hi = this.segmentHi[k]!;
    const size = Math.min(STENCIL_SIZE, hi - lo + 1);
    let first = k - ((size - 1) >> 1);
    if (first < lo) first = lo;
    if (first + size - 1 > hi) first = hi - size + 1;
    stencil.first = first;
    stencil.size = size;
    const w = stencil.weights;
    const base = first * STENCIL_SIZE;
    if (size === 4) {
      const d0 = value - nodes[first]!;
      const d1 = value - nodes[first + 1]!;
      const d2 = value - nodes[first + 2]!;
      const d3 = value - nodes[first + 3]!;
      const inv = this.inverseDenominators;
      w[0] = d1 * d2 * d3 * inv[base]!;
      w[1] = d0 * d2 * d3 * inv[base + 1]!;
      w[2] = d0 * d1 * d3 * inv[base + 2]!;
      w[3] = d0 * d1 * d2 * inv[base + 3]!;
      return;
    }
    for (let a = 0; a < size; a++) {
      let product = this.inverseDenominators[base + a]!;
      for (let b = 0; b < size; b++) if (b !== a) product *= value - nodes[first + b]!;
      w[a] = product;
    }
  }

  /** Two-node linear stencil on the first or last interval at the stencil's coordinate, for extrapolation beyond the nodes. */
  fillLinearEdge(stencil: Stencil): void {
    const value = stencil.weights[VALUE_SLOT]!;
    const nodes = this.nodes;
    const first = value < nodes[0]! ? 0 : nodes.length - 2;
    const n0 = nodes[first]!;
    const n1 = nodes[first + 1]!;
    stencil.first = first;
    stencil.size = 2;
    stencil.weights[0] = (n1 - value) / (n1 - n0);
    stencil.weights[1] = (value - n0) / (n1 - n0);
  }
}
