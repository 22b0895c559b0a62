/**
 * Adaptive importance sampling on the unit hypercube: the VEGAS algorithm of
 * G. P. Lepage, J. Comput. Phys. 27 (1978) 192.
 *
 * The grid is separable: in each dimension the unit interval is cut into N
 * bins of equal probability but unequal width, so the sampling density is a
 * product of one-dimensional step functions. After each adapting iteration the
 * bin edges move so that every bin carries an equal share of the smoothed,
 * damped sum of (f J)^2 (Lepage's refinement with smoothing over neighbouring
 * bins and damping exponent alpha, default 1.5). Stratified sampling (the
 * later "vegas+" refinements) is not used: plain importance sampling is what
 * the hard sampler needs for unweighting against the same grid.
 *
 * Estimates: a frozen grid makes every point an independent draw from one
 * density, so the production estimate is the plain mean of all weights f J
 * with its standard error; the chi^2 per degree of freedom of the per-iteration
 * estimates around that mean is reported as a consistency check.
 */
import { TamisError } from '../errors.js';
import type { RandomStream } from '../physics/random.js';

/** Default number of bins per dimension (common practice: 50 to 100). */
export const DEFAULT_BINS = 50;
/** Default damping exponent of the refinement (Lepage 1978 recommends 1 to 2). */
export const DEFAULT_ALPHA = 1.5;

/** A function on the unit hypercube; the argument array is reused between calls. */
export type Integrand = (x: Float64Array) => number;

/** The separable VEGAS grid. */
export class VegasGrid {
  readonly dimensions: number;
  readonly bins: number;
  /** Bin edges, (bins + 1) per dimension, from 0 to 1. */
  readonly edges: Float64Array;

  constructor(dimensions: number, bins: number = DEFAULT_BINS) {
    if (!(Number.isInteger(dimensions) && dimensions >= 1)) throw new TamisError('bad_input', `dimensions must be a positive integer, got ${dimensions}`);
    if (!(Number.isInteger(bins) && bins >= 2)) throw new TamisError('bad_input', `bins must be an integer >= 2, got ${bins}`);
    this.dimensions = dimensions;
    this.bins = bins;
    this.edges = new Float64Array(dimensions * (bins + 1));
    for (let d = 0; d < dimensions; d++) for (let i = 0; i <= bins; i++) this.edges[d * (bins + 1) + i] = i / bins;
  }

  /** A copy with the same edges. */
  clone(): VegasGrid {
    const copy = new VegasGrid(this.dimensions, this.bins);
    copy.edges.set(this.edges);
    return copy;
  }

  /**
   * Maps uniform numbers `u` in [0, 1)^d to a point `x` of the hypercube,
   * writes the bin of each coordinate, and returns the Jacobian
   * prod_d N (x_{i+1} - x_i): the weight of the point is f(x) times it.
   */
  map(u: Float64Array, x: Float64Array, binIndex: Int32Array): number {
    const n = this.bins;
    let jacobian = 1;
    for (let d = 0; d < this.dimensions; d++) {
      const t = u[d]! * n;
      let i = Math.floor(t);
      if (i >= n) i = n - 1;
      const o = d * (n + 1) + i;
      const lo = this.edges[o]!;
      const width = this.edges[o + 1]! - lo;
      x[d] = lo + (t - i) * width;
      binIndex[d] = i;
      jacobian *= n * width;
    }
    return jacobian;
  }

  /**
   * Moves the edges so that each bin holds an equal share of the smoothed and
   * damped importance r_i = ((1 - d_i/D) / ln(D/d_i))^alpha, d_i the sum of (f J)^2
   * in bin i (Lepage 1978). `accumulated` holds `bins` values per dimension.
   */
  refine(accumulated: Float64Array, alpha: number = DEFAULT_ALPHA): void {
    const n = this.bins;
    const smoothed = new Float64Array(n);
    const importance = new Float64Array(n);
    const newEdges = new Float64Array(n + 1);
    for (let d = 0; d < this.dimensions; d++) {
      const a = d * n;
      let total = 0;
      for (let i = 0; i < n; i++) {
        const left = i > 0 ? accumulated[a + i - 1]! : accumulated[a + i]!;
        const right = i < n - 1 ? accumulated[a + i + 1]! : accumulated[a + i]!;
        // Edges average two bins, inner bins three (Lepage's smoothing).
        smoothed[i] = i === 0 || i === n - 1 ? (accumulated[a + i]! + (i === 0 ? right : left)) / 2 : (left + accumulated[a + i]! + right) / 3;
        total += smoothed[i]!;
      }
      if (!(total > 0) || !Number.isFinite(total)) continue;
      let sumImportance = 0;
      for (let i = 0; i < n; i++) {
        const f = smoothed[i]! / total;
        let r = 0;
        if (f >= 1 - 1e-15) r = 1;
        else if (f > 0) r = ((1 - f) / -Math.log(f)) ** alpha;
        importance[i] = r;
        sumImportance += r;
      }
      if (!(sumImportance > 0)) continue;
      const share = sumImportance / n;
      const e = d * (n + 1);
      newEdges[0] = 0;
      newEdges[n] = 1;
      let k = -1;
      let accumulatedShare = 0;
      let lo = 0;
      let hi = 0;
      for (let i = 1; i < n; i++) {
        while (accumulatedShare < share && k < n - 1) {
          k++;
          accumulatedShare += importance[k]!;
          lo = this.edges[e + k]!;
          hi = this.edges[e + k + 1]!;
        }
        accumulatedShare -= share;
        newEdges[i] = hi - ((hi - lo) * accumulatedShare) / importance[k]!;
      }
      for (let i = 0; i <= n; i++) this.edges[e + i] = newEdges[i]!;
    }
  }
}

/** Result of one iteration. */
export interface VegasIteration {
  estimate: number;
  /** Standard error of `estimate`. */
  error: number;
  calls: number;
}

export interface VegasResult {
  integral: number;
  error: number;
  /** chi^2 per degree of freedom of the iteration estimates (0 with one iteration). */
  chi2PerDof: number;
  calls: number;
  iterations: VegasIteration[];
  /** Largest single weight f J seen in the production iterations. */
  maxWeight: number;
}

export interface VegasRunOptions {
  /** Calls per iteration. */
  callsPerIteration: number;
  /** Stop when error / |integral| falls below this (after `minIterations`). */
  targetRelativeError: number;
  minIterations?: number;
  maxIterations: number;
}

/** Drives a grid over an integrand: adaptation, then production with the grid frozen. */
export class VegasIntegrator {
  readonly grid: VegasGrid;
  private readonly integrand: Integrand;
  private readonly u: Float64Array;
  private readonly x: Float64Array;
  private readonly binIndex: Int32Array;
  private readonly accumulated: Float64Array;

  constructor(integrand: Integrand, grid: VegasGrid) {
    this.integrand = integrand;
    this.grid = grid;
    this.u = new Float64Array(grid.dimensions);
    this.x = new Float64Array(grid.dimensions);
    this.binIndex = new Int32Array(grid.dimensions);
    this.accumulated = new Float64Array(grid.dimensions * grid.bins);
  }

  /**
   * One iteration of `calls` points drawn from `rng`. With `adapt` the grid is
   * refined afterwards. `maxWeight` receives the largest weight seen.
   */
  iterate(calls: number, rng: RandomStream, adapt: boolean, alpha: number = DEFAULT_ALPHA): VegasIteration & { maxWeight: number } {
    const { grid, u, x, binIndex, accumulated } = this;
    const dims = grid.dimensions;
    const n = grid.bins;
    if (adapt) accumulated.fill(0);
    let sum = 0;
    let sum2 = 0;
    let maxWeight = 0;
    for (let k = 0; k < calls; k++) {
      for (let d = 0; d < dims; d++) u[d] = rng.uniform();
      const jacobian = grid.map(u, x, binIndex);
      const w = this.integrand(x) * jacobian;
      if (!Number.isFinite(w)) throw new TamisError('numeric', `the integrand returned ${w} at (${Array.from(x).join(', ')})`);
      sum += w;
      sum2 += w * w;
      if (w > maxWeight) maxWeight = w;
      if (adapt) {
        const w2 = w * w;
        for (let d = 0; d < dims; d++) accumulated[d * n + binIndex[d]!] += w2;
      }
    }
    const mean = sum / calls;
    const variance = Math.max(0, sum2 / calls - mean * mean) / Math.max(1, calls - 1);
    if (adapt) grid.refine(accumulated, alpha);
    return { estimate: mean, error: Math.sqrt(variance), calls, maxWeight };
  }

  /** Adapting iterations whose estimates are discarded. */
  adapt(iterations: number, calls: number, rng: RandomStream, alpha: number = DEFAULT_ALPHA): void {
    for (let i = 0; i < iterations; i++) this.iterate(calls, rng, true, alpha);
  }

  /** Production with the grid frozen until the target relative error or the iteration cap. */
  integrate(options: VegasRunOptions, rng: RandomStream): VegasResult {
    const iterations: VegasIteration[] = [];
    let sum = 0;
    let sumSquaredErrors = 0;
    let calls = 0;
    let maxWeight = 0;
    const minIterations = options.minIterations ?? 2;
    for (let i = 0; i < options.maxIterations; i++) {
      const it = this.iterate(options.callsPerIteration, rng, false);
      iterations.push({ estimate: it.estimate, error: it.error, calls: it.calls });
      sum += it.estimate * it.calls;
      sumSquaredErrors += (it.error * it.calls) ** 2;
      calls += it.calls;
      if (it.maxWeight > maxWeight) maxWeight = it.maxWeight;
      const integral = sum / calls;
      const error = Math.sqrt(sumSquaredErrors) / calls;
      if (iterations.length >= minIterations && error <= options.targetRelativeError * Math.abs(integral)) break;
    }
    const integral = sum / calls;
    const error = Math.sqrt(sumSquaredErrors) / calls;
    let chi2 = 0;
    for (const it of iterations) if (it.error > 0) chi2 += ((it.estimate - integral) / it.error) ** 2;
    return { integral, error, chi2PerDof: iterations.length > 1 ? chi2 / (iterations.length - 1) : 0, calls, iterations, maxWeight };
  }
}
