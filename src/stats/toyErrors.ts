/**
 * Monte Carlo error of a CLs value estimated from pseudo-experiments, by the
 * delta method for a ratio of two correlated sample means (common practice;
 * e.g. any text on error propagation): with per-experiment terms a_k (the
 * signal-plus-background tail) and c_k (the background-only tail),
 *
 *   Var(A/C) / (A/C)^2 = [Var a / A^2 + Var c / C^2 - 2 Cov(a, c) / (A C)] / K.
 */
import { mean, sampleCovariance, sampleVariance } from 'simple-statistics';

/** Typed-array views handed to simple-statistics, which only reads `length` and indices. */
function asArray(values: Float64Array): readonly number[] {
  return values as unknown as readonly number[];
}

/**
 * Standard error of `ratio` = mean(a) / mean(c) from the per-experiment terms.
 *
 * @example
 * ratioStandardError(new Float64Array([1, 0, 1, 0]), new Float64Array([1, 1, 1, 1]), 0.5) // 0.2886751345948129
 */
export function ratioStandardError(a: Float64Array, c: Float64Array, ratio: number): number {
  const size = a.length;
  if (size < 2) return Number.POSITIVE_INFINITY;
  const meanA = mean(asArray(a));
  const meanC = mean(asArray(c));
  // With no experiment in a tail, one experiment's worth is the honest scale of the error.
  if (!(meanA > 0) || !(meanC > 0)) return meanC > 0 ? 1 / (size * meanC) : Number.POSITIVE_INFINITY;
  const relativeVariance =
    (sampleVariance(asArray(a)) / (meanA * meanA) + sampleVariance(asArray(c)) / (meanC * meanC) -
      (2 * sampleCovariance(asArray(a), asArray(c))) / (meanA * meanC)) / size;
  return ratio * Math.sqrt(Math.max(0, relativeVariance));
}
