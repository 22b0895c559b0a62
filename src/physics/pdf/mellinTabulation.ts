/**
 * Tabulates x f(x, Q) on many (x, Q) points at once by Mellin inversion.
 *
 * The x range is split into bands, each with one contour tuned for it
 * (./lesHouchesContours.ts). Within a band the evolved moments at the contour
 * points are computed once for all scales, and every x of the band reuses
 * them: the cost is (contour points x scales) evolutions plus one
 * multiply-add per (point, x, scale, column) in a typed-array loop.
 */
import { TamisError } from '../../errors.js';
import type { Complex } from './complex.js';
import { COLUMN_COUNT } from './flavours.js';
import { type ContourShape, inversionFactors, mellinContour } from './mellinInversion.js';

/** A contour used for every x up to and including `xMax` (and above the previous band's xMax). */
export interface ContourBand {
  readonly xMax: number;
  readonly shape: ContourShape;
}

/**
 * Moments of every column for `targetCount` targets (scales) at one complex N,
 * as [(target * COLUMN_COUNT + column) * 2 + (0 re | 1 im)] (the layout of evolveMoments).
 */
export type MomentSource = (n: Complex) => Float64Array;

/**
 * x f(x) for every column, target and x: the inverse Mellin transform of `momentsAt`.
 * Returns one Float64Array per column (order of FLAVOUR_KEYS), indexed [target * xs.length + ix].
 * @throws TamisError('bad_input') for x outside (0, last band's xMax].
 */
export function tabulateByMellinInversion(
  bands: readonly ContourBand[],
  xs: ArrayLike<number>,
  targetCount: number,
  momentsAt: MomentSource,
): Float64Array[] {
  const nx = xs.length;
  const nq = targetCount;
  const columns = Array.from({ length: COLUMN_COUNT }, () => new Float64Array(nx * nq));
  const lastXMax = bands.length > 0 ? bands[bands.length - 1]!.xMax : 0;
  for (let ix = 0; ix < nx; ix++) {
    const x = xs[ix]!;
    if (!(x > 0 && x <= lastXMax)) {
      throw new TamisError('bad_input', `x must be in (0, ${lastXMax}] for Mellin inversion, got ${x}`);
    }
  }
  let previous = 0;
  for (const band of bands) {
    const members: number[] = [];
    for (let ix = 0; ix < nx; ix++) if (xs[ix]! > previous && xs[ix]! <= band.xMax) members.push(ix);
    previous = band.xMax;
    if (members.length === 0) continue;
    const contour = mellinContour(band.shape);
    const points = contour.points.length;
    // Evolved moments, interleaved (re, im): [((column * nq + iq) * points + j) * 2].
    const moments = new Float64Array(COLUMN_COUNT * nq * points * 2);
    for (let j = 0; j < points; j++) {
      const evolved = momentsAt(contour.points[j]!);
      for (let iq = 0; iq < nq; iq++) {
        for (let column = 0; column < COLUMN_COUNT; column++) {
          const at = ((column * nq + iq) * points + j) * 2;
          const from = (iq * COLUMN_COUNT + column) * 2;
          moments[at] = evolved[from]!;
          moments[at + 1] = evolved[from + 1]!;
        }
      }
    }
    const factors = inversionFactors(contour, members.map((ix) => xs[ix]!));
    const blockLength = points * 2;
    for (let column = 0; column < COLUMN_COUNT; column++) {
      const out = columns[column]!;
      for (let iq = 0; iq < nq; iq++) {
        const base = (column * nq + iq) * blockLength;
        // A heavy quark below its threshold has zero moments; a quark equal to its antiquark
        // (s = sbar in the toy input) has the same moments as an earlier column: reuse.
        if (isZeroBlock(moments, base, blockLength)) continue;
        const twin = earlierTwin(moments, column, iq, nq, blockLength);
        if (twin >= 0) {
          for (const ix of members) out[iq * nx + ix] = columns[twin]![iq * nx + ix]!;
          continue;
        }
        for (let m = 0; m < members.length; m++) {
          const factorBase = m * points * 2;
          let sum = 0;
          for (let j = 0; j < 2 * points; j += 2) {
            sum += factors[factorBase + j]! * moments[base + j + 1]! + factors[factorBase + j + 1]! * moments[base + j]!;
          }
          out[iq * nx + members[m]!] = sum;
        }
      }
    }
  }
  return columns;
}

function isZeroBlock(moments: Float64Array, base: number, length: number): boolean {
  for (let k = 0; k < length; k++) if (moments[base + k] !== 0) return false;
  return true;
}

/** An earlier column whose moments at target iq are identical to those of `column`, or -1. */
function earlierTwin(moments: Float64Array, column: number, iq: number, nq: number, length: number): number {
  const base = (column * nq + iq) * length;
  for (let other = 0; other < column; other++) {
    const otherBase = (other * nq + iq) * length;
    let same = true;
    for (let k = 0; k < length && same; k++) same = moments[base + k] === moments[otherBase + k];
    if (same) return other;
  }
  return -1;
}
