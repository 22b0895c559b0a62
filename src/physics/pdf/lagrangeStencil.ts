/**
 * Lagrange interpolation stencils on a sorted axis of nodes (up to four nodes,
 * i.e. cubic), with the denominators prod_(b != a) (n_a - n_b) precomputed so that
 * a lookup costs a search and a dozen multiplications. Node sets may be split
 * into segments that a stencil never crosses (flavour thresholds).
 */

/** Largest stencil: four nodes, cubic interpolation. */
export const STENCIL_SIZE = 4;

/** A stencil: first node index, number of nodes and their weights (reused buffer). */
export interface Stencil {
  first: number;
  size: number;
  readonly weights: Float64Array;
}

export function newStencil(): Stencil {
  return { first: 0, size: 0, weights: new Float64Array(STENCIL_SIZE) };
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
  /** Node spacing when the nodes are uniform (a direct index instead of a search), else 0. */
  private readonly uniformStep: number;

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
    let uniform = n > 2 && starts.length === 2;
    const step = n > 1 ? (nodes[n - 1]! - nodes[0]!) / (n - 1) : 0;
    for (let k = 1; uniform && k < n; k++) uniform = Math.abs(nodes[k]! - nodes[k - 1]! - step) <= 1e-9 * Math.abs(step);
    this.uniformStep = uniform ? step : 0;
  }

  /** Index k of the interval [k, k+1] that holds `value`, clamped to the first and last interval. */
  interval(value: number): number {
    const nodes = this.nodes;
    const last = nodes.length - 2;
    if (last < 0) return 0;
    if (this.uniformStep > 0) {
      const k = Math.floor((value - nodes[0]!) / this.uniformStep);
      if (k < 0) return 0;
      if (k > last) return last;
      // Guard against rounding at node values.
      if (value < nodes[k]!) return k > 0 ? k - 1 : 0;
      if (k < last && value >= nodes[k + 1]!) return k + 1;
      return k;
    }
    let a = 0;
    let b = last + 1;
    while (b - a > 1) {
      const mid = (a + b) >> 1;
      if (nodes[mid]! <= value) a = mid;
      else b = mid;
    }
    return a;
  }

  /** Fills `stencil` with the Lagrange weights at `value` (which should lie inside the axis' range). */
  fill(value: number, stencil: Stencil): void {
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

  /** Two-node linear stencil on the first or last interval, for extrapolation beyond the nodes. */
  fillLinearEdge(value: number, stencil: Stencil): void {
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
