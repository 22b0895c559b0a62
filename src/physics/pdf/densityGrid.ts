/**
 * Parton densities tabulated on an (x, Q) grid, with interpolation.
 *
 * Interpolation (tamis's own scheme, accuracy tested in tests/physics/pdfGrid.test.ts):
 * bicubic Lagrange interpolation of ln(x f) in t = ln(x / (1 - x)) and ln Q^2.
 * In t both the small-x power law (ln xf ~ -lambda ln x) and the large-x fall-off
 * (ln xf ~ beta ln(1 - x)) are close to linear. A heavy quark that is zero up to
 * a threshold row and positive above it (detected from the values) is
 * interpolated as ln(x f / L), L = ln(Q^2 / m^2), which is smooth through the
 * threshold where x f itself starts linearly in L; the threshold row holds the
 * limit of x f / L, given by the grid's maker or extrapolated from the rows above.
 * Stencils never cross a segment boundary in Q (flavour thresholds), and shift
 * inwards at the edges. If a stencil holds a zero elsewhere (a user grid), x f is
 * interpolated linearly in value instead.
 *
 * Outside the grid: x f = 0 for x >= 1 and x <= 0; for x between 0 and the first
 * node, or between the last node and 1, ln(x f) continues linearly in t from the
 * two outermost nodes (a power law at small x, (1-x)^beta near x = 1). Q is
 * clamped to [qMin, qMax]. Results are never negative.
 */
import { TamisError } from '../../errors.js';
import type { PartonDensity } from '../partonDensity.js';
import { COLUMN_COUNT, OUTPUT_SLOT_OF_COLUMN, columnOfFlavour } from './flavours.js';
import { InterpolationAxis, VALUE_SLOT, newStencil } from './lagrangeStencil.js';

/** The numbers a grid is made of. */
export interface DensityGridData {
  /** Momentum fractions, strictly increasing, in (0, 1). */
  readonly x: Float64Array;
  /** Scales in GeV, strictly increasing. */
  readonly q: Float64Array;
  /** x f(x, Q) per column (order of FLAVOUR_KEYS), each indexed [iq * x.length + ix]. */
  readonly values: readonly Float64Array[];
  /** Indices of Q nodes that start a new interpolation segment (flavour thresholds); may be empty. */
  readonly segmentStarts: readonly number[];
  /**
   * Optional, per column: the limit of x f / ln(Q^2 / Q_thr^2) at the column's
   * threshold row, per x. Without it the limit is extrapolated from the rows above.
   */
  readonly thresholdSlopes?: readonly (Float64Array | undefined)[];
}

/** Row at which column `values` turns on: the last all-zero row before a non-zero row, or -1. */
export function thresholdRowOf(values: Float64Array, nx: number, nq: number): number {
  let row = -1;
  while (row + 1 < nq) {
    const start = (row + 1) * nx;
    let zero = true;
    for (let ix = 0; ix < nx && zero; ix++) zero = values[start + ix] === 0;
    if (!zero) break;
    row += 1;
  }
  return row === nq - 1 ? -1 : row;
}

/**
 * A PartonDensity backed by a grid. Built by `lesHouchesToyDensities()` and
 * `readDensityGridCsv(file)`; one instance is not re-entrant (it keeps its stencils),
 * which is fine in one thread (each worker thread builds its own).
 *
 * @example
 * lesHouchesToyDensities().xfx(21, 0.1, 100) // x g(0.1, Q = 100 GeV) = 0.84359
 */
export class InterpolatedDensityGrid implements PartonDensity {
  readonly name: string;
  readonly xMin: number;
  readonly qMin: number;
  readonly qMax: number;
  readonly data: DensityGridData;
  private readonly coupling: (q: number) => number;
  private readonly xAxis: InterpolationAxis;
  private readonly qAxis: InterpolationAxis;
  /** ln(x f), or ln(x f / L) above a threshold row; -Infinity for zeros. */
  private readonly logValues: Float64Array[];
  /** Threshold row per column, -1 for none. */
  private readonly thresholdRow: Int32Array;
  private readonly xStencil = newStencil();
  private readonly qStencil = newStencil();
  /** The x and Q of the current stencils (NaN before the first lookup). */
  private readonly lastPoint = Float64Array.of(Number.NaN, Number.NaN);
  private readonly scratch = new Float64Array(1);

  constructor(name: string, data: DensityGridData, coupling: (q: number) => number) {
    const nx = data.x.length;
    const nq = data.q.length;
    if (nx < 2 || nq < 1 || data.values.length !== COLUMN_COUNT || data.values.some((v) => v.length !== nx * nq)) {
      throw new TamisError('internal', `inconsistent density grid: ${nx} x values, ${nq} q values, ${data.values.length} columns`);
    }
    this.name = name;
    this.data = data;
    this.coupling = coupling;
    this.xMin = data.x[0]!;
    this.qMin = data.q[0]!;
    this.qMax = data.q[nq - 1]!;
    const lnQ2 = Float64Array.from(data.q, (q) => Math.log(q * q));
    this.thresholdRow = Int32Array.from(data.values, (v) => thresholdRowOf(v, nx, nq));
    const starts = [...data.segmentStarts, ...Array.from(this.thresholdRow).filter((row) => row > 0)];
    this.xAxis = new InterpolationAxis(Float64Array.from(data.x, (x) => Math.log(x / (1 - x))));
    this.qAxis = new InterpolationAxis(lnQ2, starts);
    this.logValues = data.values.map((column, c) => this.reducedLogs(column, c, lnQ2));
  }

  /** x f(x, Q) for one PDG flavour (21 or 0 gluon; top gives 0). Q in GeV. */
  xfx(flavour: number, x: number, q: number): number {
    const column = columnOfFlavour(flavour);
    if (column < 0 || !(x > 0 && x < 1)) return 0;
    this.prepare(x, q);
    this.interpolateInto(column, this.scratch, 0);
    return this.scratch[0]!;
  }

  /** x f(x, Q) for flavours -6..6 into out[flavour + 6] (index 6 the gluon; top slots 0). */
  xfxAll(x: number, q: number, out: Float64Array): void {
    out[0] = 0;
    out[12] = 0;
    if (!(x > 0 && x < 1)) {
      out.fill(0, 0, 13);
      return;
    }
    this.prepare(x, q);
    for (let column = 0; column < COLUMN_COUNT; column++) this.interpolateInto(column, out, OUTPUT_SLOT_OF_COLUMN[column]!);
  }

  /** x f(x, Q) for the 11 grid columns (order of FLAVOUR_KEYS) into out[0..10]. */
  xfxColumns(x: number, q: number, out: Float64Array): void {
    if (!(x > 0 && x < 1)) {
      out.fill(0, 0, COLUMN_COUNT);
      return;
    }
    this.prepare(x, q);
    for (let column = 0; column < COLUMN_COUNT; column++) this.interpolateInto(column, out, column);
  }

  alphaS(q: number): number {
    return this.coupling(q);
  }

  /** ln of the interpolated quantity for one column (see the file comment). */
  private reducedLogs(column: Float64Array, c: number, lnQ2: Float64Array): Float64Array {
    const nx = this.data.x.length;
    const nq = lnQ2.length;
    const thr = this.thresholdRow[c]!;
    const logs = new Float64Array(column.length);
    for (let iq = 0; iq < nq; iq++) {
      const divisor = thr >= 0 && iq > thr ? lnQ2[iq]! - lnQ2[thr]! : 1;
      for (let ix = 0; ix < nx; ix++) {
        const v = column[iq * nx + ix]! / divisor;
        logs[iq * nx + ix] = v > 0 ? Math.log(v) : Number.NEGATIVE_INFINITY;
      }
    }
    if (thr >= 0) {
      const given = this.data.thresholdSlopes?.[c];
      for (let ix = 0; ix < nx; ix++) {
        logs[thr * nx + ix] = given !== undefined ? (given[ix]! > 0 ? Math.log(given[ix]!) : Number.NEGATIVE_INFINITY) : this.extrapolateToThreshold(logs, thr, ix, lnQ2);
      }
    }
    return logs;
  }

  /** Lagrange extrapolation of ln(x f / L) to the threshold row from up to four rows above it. */
  private extrapolateToThreshold(logs: Float64Array, thr: number, ix: number, lnQ2: Float64Array): number {
    const nx = this.data.x.length;
    const rows: number[] = [];
    for (let iq = thr + 1; iq < lnQ2.length && rows.length < 4; iq++) rows.push(iq);
    let sum = 0;
    for (const a of rows) {
      let weight = 1;
      for (const b of rows) if (b !== a) weight *= (lnQ2[thr]! - lnQ2[b]!) / (lnQ2[a]! - lnQ2[b]!);
      sum += weight * logs[a * nx + ix]!;
    }
    return sum;
  }

  /**
   * Sets up the x and Q stencils for one point. A repeated x or Q (the two partons of one
   * phase-space point share Q; several flavours share x) reuses the previous stencil.
   */
  private prepare(x: number, q: number): void {
    const last = this.lastPoint;
    if (x !== last[0]) {
      const t = Math.log(x / (1 - x));
      const xNodes = this.xAxis.nodes;
      this.xStencil.weights[VALUE_SLOT] = t;
      if (t >= xNodes[0]! && t <= xNodes[xNodes.length - 1]!) this.xAxis.fill(this.xStencil);
      else this.xAxis.fillLinearEdge(this.xStencil);
      last[0] = x;
    }
    if (q !== last[1]) {
      const qNodes = this.qAxis.nodes;
      let lnQ2 = Math.log(q * q);
      if (!(lnQ2 >= qNodes[0]!)) lnQ2 = qNodes[0]!;
      else if (lnQ2 > qNodes[qNodes.length - 1]!) lnQ2 = qNodes[qNodes.length - 1]!;
      this.qStencil.weights[VALUE_SLOT] = lnQ2;
      this.qAxis.fill(this.qStencil);
      last[1] = q;
    }
  }

  /**
   * Writes the interpolated x f of one column to out[slot]. Results go to an array rather
   * than a return value: V8 boxes a double returned from a call it does not inline, and
   * that allocation per column would dominate a lookup.
   */
  private interpolateInto(column: number, out: Float64Array, slot: number): void {
    const thr = this.thresholdRow[column]!;
    let factor = 1;
    if (thr >= 0) {
      factor = this.qStencil.weights[VALUE_SLOT]! - this.qAxis.nodes[thr]!;
      if (!(factor > 0)) {
        out[slot] = 0;
        return;
      }
    }
    const logs = this.logValues[column]!;
    const nx = this.xAxis.nodes.length;
    const xs = this.xStencil;
    const qs = this.qStencil;
    const xw = xs.weights;
    const qw = qs.weights;
    let sum = 0;
    let row = qs.first * nx + xs.first;
    if (xs.size === 4) {
      // The common case, unrolled: four x weights per Q row.
      const x0 = xw[0]!;
      const x1 = xw[1]!;
      const x2 = xw[2]!;
      const x3 = xw[3]!;
      for (let b = 0; b < qs.size; b++, row += nx) {
        sum += qw[b]! * (x0 * logs[row]! + x1 * logs[row + 1]! + x2 * logs[row + 2]! + x3 * logs[row + 3]!);
      }
    } else {
      for (let b = 0; b < qs.size; b++, row += nx) {
        let inner = 0;
        for (let a = 0; a < xs.size; a++) inner += xw[a]! * logs[row + a]!;
        sum += qw[b]! * inner;
      }
    }
    // A zero in the stencil makes the sum infinite or NaN: fall back to values.
    if (sum > Number.NEGATIVE_INFINITY && sum < Number.POSITIVE_INFINITY) out[slot] = Math.exp(sum) * factor;
    else this.interpolateValuesInto(column, out, slot);
  }

  private interpolateValuesInto(column: number, out: Float64Array, slot: number): void {
    const values = this.data.values[column]!;
    const nx = this.xAxis.nodes.length;
    const xs = this.xStencil;
    const qs = this.qStencil;
    let sum = 0;
    for (let b = 0; b < qs.size; b++) {
      const row = (qs.first + b) * nx + xs.first;
      for (let a = 0; a < xs.size; a++) sum += qs.weights[b]! * xs.weights[a]! * values[row + a]!;
    }
    out[slot] = sum > 0 ? sum : 0;
  }
}
