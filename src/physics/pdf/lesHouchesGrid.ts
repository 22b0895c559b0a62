/**
 * The built-in parton densities: the Les Houches LO benchmark evolution
 * (./lesHouchesEvolution.ts) tabulated on an (x, Q) grid and interpolated
 * (./densityGrid.ts). Built lazily, once per process.
 *
 * Grid (tamis's own layout, accuracy tested in tests/physics/pdfGrid.test.ts):
 * - x: uniform in t = ln(x / (1 - x)) from 1e-7 to 0.99 (the benchmark table
 *   starts at 1e-7); above 0.99 ln(x f) continues linearly in t.
 * - Q: three segments with flavour thresholds as boundaries: 1.4 GeV to
 *   sqrt(2) GeV (nf = 3; evolved backwards from mu0, charm zero), sqrt(2) to
 *   4.5 GeV (nf = 4) and 4.5 GeV to 10 TeV (nf = 5, also above m_t = 175 GeV:
 *   no top density). The nodes are graded in "evolution time" ln(1/alpha_s),
 *   densest just above mu0 (see LesHouchesGridLayout.gradedStep).
 */
import { lesHouchesAlphaS } from '../alphaS.js';
import type { PartonDensity } from '../partonDensity.js';
import { InterpolatedDensityGrid, thresholdRowOf } from './densityGrid.js';
import { LES_HOUCHES_MU0_SQUARED } from './lesHouchesInput.js';
import { LES_HOUCHES_CONTOUR_BANDS, LES_HOUCHES_X_TOP, lesHouchesEvolutionSetup } from './lesHouchesEvolution.js';
import { evolveMoments, heavyQuarkOnsetMoments } from './mellinEvolution.js';
import { tabulateByMellinInversion } from './mellinTabulation.js';

/** Name of the built-in densities, shown in tables and reports. */
export const LES_HOUCHES_DENSITY_NAME = 'LO toy densities (Les Houches 2001 benchmark input, hep-ph/0204316)';

/** Grid layout of the built-in densities. */
export interface LesHouchesGridLayout {
  /** Smallest x node. */
  readonly xMin: number;
  /** Largest x node. */
  readonly xMax: number;
  /** Node spacing in t = ln(x / (1 - x)). */
  readonly tStep: number;
  /** Q segment boundaries in GeV: [qMin, thresholds..., qMax]. */
  readonly qBoundaries: readonly number[];
  /**
   * Q nodes are uniform, inside each segment, in s = sqrt(|u - u0| + gradingOffset) with
   * u = ln(1 / alpha_s) and u0 its value at mu0: dense where the evolution starts,
   * where small-x and large-x densities change shape fastest. Step in s (at least 4 nodes per segment):
   */
  readonly gradedStep: number;
  /** Offset of the graded variable (limits the smallest spacing near mu0). */
  readonly gradingOffset: number;
}

/** The layout used by `lesHouchesToyDensities()`. */
export const LES_HOUCHES_GRID_LAYOUT: LesHouchesGridLayout = {
  xMin: 1e-7,
  xMax: LES_HOUCHES_X_TOP,
  tStep: 0.2,
  qBoundaries: [1.4, Math.SQRT2, 4.5, 10_000],
  gradedStep: 0.03,
  gradingOffset: 0.02,
};

/** x and Q nodes of a layout, with the indices of the Q nodes that start a segment. */
export function lesHouchesGridNodes(layout: LesHouchesGridLayout = LES_HOUCHES_GRID_LAYOUT): {
  x: Float64Array;
  q: Float64Array;
  segmentStarts: number[];
} {
  const t0 = Math.log(layout.xMin / (1 - layout.xMin));
  const t1 = Math.log(layout.xMax / (1 - layout.xMax));
  const nx = Math.ceil((t1 - t0) / layout.tStep) + 1;
  const x = new Float64Array(nx);
  for (let i = 0; i < nx; i++) {
    const t = t0 + ((t1 - t0) * i) / (nx - 1);
    x[i] = 1 / (1 + Math.exp(-t));
  }
  x[0] = layout.xMin;
  x[nx - 1] = layout.xMax;

  // Graded scale variable: s = sqrt(|u - u0| + offset), u = ln(1 / alpha_s), u0 at mu0.
  const u0 = -Math.log(lesHouchesAlphaS.alphaSAtQ2(LES_HOUCHES_MU0_SQUARED));
  const graded = (u: number): number => Math.sqrt(Math.abs(u - u0) + layout.gradingOffset);
  const q: number[] = [];
  const segmentStarts: number[] = [];
  const bounds = layout.qBoundaries;
  for (let s = 0; s + 1 < bounds.length; s++) {
    const qa = bounds[s]!;
    const qb = bounds[s + 1]!;
    // Inside one segment nf is fixed and 1/alpha_s is linear in ln Q^2 (one loop).
    const lnA = Math.log(qa * qa);
    const lnB = Math.log(qb * qb);
    const inverseA = 1 / lesHouchesAlphaS.alphaS(qa);
    const inverseB = 1 / lesHouchesAlphaS.alphaS(qb);
    const ua = Math.log(inverseA);
    const ub = Math.log(inverseB);
    const direction = ua + ub >= 2 * u0 ? 1 : -1;
    const sa = graded(ua);
    const sb = graded(ub);
    const intervals = Math.max(3, Math.ceil(Math.abs(sb - sa) / layout.gradedStep));
    if (s > 0) segmentStarts.push(q.length - 1);
    if (s === 0) q.push(qa);
    for (let k = 1; k < intervals; k++) {
      const sk = sa + ((sb - sa) * k) / intervals;
      const inverseAlpha = Math.exp(u0 + direction * (sk * sk - layout.gradingOffset));
      q.push(Math.exp((lnA + ((inverseAlpha - inverseA) / (inverseB - inverseA)) * (lnB - lnA)) / 2));
    }
    q.push(qb);
  }
  return { x, q: Float64Array.from(q), segmentStarts };
}

/**
 * Builds the grid of the built-in densities (uncached; about 0.1 s on a laptop core once compiled).
 * Most callers want `lesHouchesToyDensities()`.
 */
export function buildLesHouchesGrid(layout: LesHouchesGridLayout = LES_HOUCHES_GRID_LAYOUT): InterpolatedDensityGrid {
  const nodes = lesHouchesGridNodes(layout);
  const nx = nodes.x.length;
  const nq = nodes.q.length;
  const setup = lesHouchesEvolutionSetup;
  const lnQ2 = Array.from(nodes.q, (q) => Math.log(q * q));
  const values = tabulateByMellinInversion(LES_HOUCHES_CONTOUR_BANDS, nodes.x, nq, (n) => evolveMoments(setup, n, lnQ2));
  // The limit of x q_h / ln(Q^2 / m_h^2) where each heavy quark starts (the grid interpolates that ratio).
  const lnStarts = nodes.segmentStarts.map((row) => lnQ2[row]!);
  const onset = tabulateByMellinInversion(LES_HOUCHES_CONTOUR_BANDS, nodes.x, lnStarts.length, (n) => heavyQuarkOnsetMoments(setup, n, lnStarts));
  const thresholdSlopes = values.map((column, c) => {
    const k = nodes.segmentStarts.indexOf(thresholdRowOf(column, nx, nq));
    return k < 0 ? undefined : onset[c]!.slice(k * nx, (k + 1) * nx);
  });
  return new InterpolatedDensityGrid(
    LES_HOUCHES_DENSITY_NAME,
    { x: nodes.x, q: nodes.q, values, segmentStarts: nodes.segmentStarts, thresholdSlopes },
    (q) => lesHouchesAlphaS.alphaS(q),
  );
}

let cached: InterpolatedDensityGrid | undefined;

/**
 * The built-in LO toy densities with their alpha_s (the benchmark's), built on first use
 * and shared by every caller in the process.
 *
 * @example
 * lesHouchesToyDensities().xfx(2, 0.1, 100) // x u(0.1, Q = 100 GeV) = 0.66768 (x u_v 0.57166 + x ubar 0.09603)
 */
export function lesHouchesToyDensities(): InterpolatedDensityGrid & PartonDensity {
  cached ??= buildLesHouchesGrid();
  return cached;
}
