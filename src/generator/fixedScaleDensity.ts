/**
 * The parton densities at one fixed factorisation scale, tabulated once in
 * t = ln(x / (1 - x)) and interpolated with 4-point Lagrange polynomials.
 *
 * Why: a channel with a fixed scale (the default: the pair's average mass)
 * calls the densities at one Q for every point, twice per point, millions of
 * times. One table lookup costs a fraction of a full (x, Q) interpolation, and
 * the table reproduces the built-in densities to better than 1e-5 relative
 * (node spacing 0.01 in t; measured 2.2e-6 at worst in
 * tests/generator/fixedScaleDensity.test.ts, where the underlying grid
 * interpolation has its own kinks), far below the Monte Carlo errors. Points
 * outside the table (below the lowest x asked for, or within 1e-6 of x = 1)
 * go to the densities directly.
 */
import type { PartonDensity } from '../physics/partonDensity.js';

/** Node spacing in t = ln(x/(1-x)). */
const STEP = 0.01;
/** Largest tabulated x. */
const X_TOP = 1 - 1e-6;
const FLAVOURS = 13;

export class FixedScaleDensity {
  readonly pdf: PartonDensity;
  /** Scale in GeV. */
  readonly q: number;
  private readonly t0: number;
  private readonly nodes: number;
  /** values[node * 13 + flavour + 6] = x f at the node. */
  private readonly values: Float64Array;

  /**
   * @param pdf the densities to tabulate
   * @param q the fixed scale, GeV
   * @param xLowest the smallest x that will be asked for (e.g. tau_min of the channel)
   */
  constructor(pdf: PartonDensity, q: number, xLowest: number) {
    this.pdf = pdf;
    this.q = q;
    const low = Math.min(Math.max(xLowest, 1e-12), 0.5);
    // One node of margin below the lowest x, and the table always spans at least to X_TOP.
    this.t0 = Math.log(low / (1 - low)) - 2 * STEP;
    const t1 = Math.log(X_TOP / (1 - X_TOP));
    this.nodes = Math.ceil((t1 - this.t0) / STEP) + 3;
    this.values = new Float64Array(this.nodes * FLAVOURS);
    const row = new Float64Array(FLAVOURS);
    for (let i = 0; i < this.nodes; i++) {
      const t = this.t0 + i * STEP;
      const x = 1 / (1 + Math.exp(-t));
      pdf.xfxAll(x, q, row);
      this.values.set(row, i * FLAVOURS);
    }
  }

  /** x f(x, q) for all flavours into `out[flavour + 6]`, like `PartonDensity.xfxAll`. */
  xfxAll(x: number, out: Float64Array): void {
    this.xfxAllAt(x, x > 0 && x < 1 ? Math.log(x / (1 - x)) : 0, out);
  }

  /** As `xfxAll`, with t = ln(x / (1 - x)) already known (saves a logarithm in hot loops). */
  xfxAllAt(x: number, t: number, out: Float64Array): void {
    if (!(x > 0 && x < X_TOP)) {
      this.pdf.xfxAll(x, this.q, out);
      return;
    }
    const u = (t - this.t0) / STEP;
    if (!(u >= 1)) {
      // Below the tabulated range: ask the densities.
      this.pdf.xfxAll(x, this.q, out);
      return;
    }
    let i = Math.floor(u) - 1;
    if (i > this.nodes - 4) i = this.nodes - 4;
    // Lagrange weights for nodes i..i+3 at offset d = u - i in [0, 3].
    const d = u - i;
    const d1 = d - 1;
    const d2 = d - 2;
    const d3 = d - 3;
    const w0 = (-d1 * d2 * d3) / 6;
    const w1 = (d * d2 * d3) / 2;
    const w2 = (-d * d1 * d3) / 2;
    const w3 = (d * d1 * d2) / 6;
    const v = this.values;
    const a = i * FLAVOURS;
    const b = a + FLAVOURS;
    const c = b + FLAVOURS;
    const e = c + FLAVOURS;
    for (let f = 0; f < FLAVOURS; f++) {
      const value = w0 * v[a + f]! + w1 * v[b + f]! + w2 * v[c + f]! + w3 * v[e + f]!;
      // Densities are non-negative; the polynomial may undershoot by rounding where they vanish.
      out[f] = value > 0 ? value : 0;
    }
  }
}
