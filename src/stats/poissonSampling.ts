/**
 * Poisson random counts for pseudo-experiments.
 *
 * - `samplePoisson`: sequential-search inversion below a mean of 10 (L. Devroye,
 *   "Non-Uniform Random Variate Generation", Springer 1986; section from
 *   memory: X.3.3) and
 *   the transformed rejection with squeeze "PTRS" at and above 10 (W. Hörmann,
 *   "The transformed rejection method for generating Poisson random variables",
 *   Insurance: Mathematics and Economics 12 (1993) 39), which is exact and
 *   costs O(1) whatever the mean.
 * - `poissonInverse`: the exact inverse of the cumulative distribution for a
 *   given uniform number. The same uniform gives a count that never decreases
 *   when the mean grows, so pseudo-experiments re-evaluated at several signal
 *   strengths with the same uniforms give a CLs curve without random jitter
 *   (common random numbers).
 */
import type { RandomStream } from '../physics/random.js';
import { logFactorial, logPoissonCdf, logPoissonPmf } from './poisson.js';

/** Below this mean, sequential search is faster than PTRS (Hörmann 1993 recommends PTRS from 10). */
const PTRS_MIN_MEAN = 10;
/** Below this mean, `poissonInverse` searches from zero; above, it starts near the mean. */
const INVERSE_SEARCH_FROM_ZERO_MAX_MEAN = 30;

/**
 * A Poisson-distributed count with the given mean (>= 0), drawn from `rng`.
 *
 * @example
 * samplePoisson(RandomStream.forStream(1), 0) // 0
 */
export function samplePoisson(rng: RandomStream, mean: number): number {
  if (mean <= 0) return 0;
  if (mean < PTRS_MIN_MEAN) return poissonInverse(rng.uniform(), mean);
  const sqrtMean = Math.sqrt(mean);
  const logMean = Math.log(mean);
  // Constants of algorithm PTRS (Hörmann 1993), recalled from memory; the
  // chi-square tests against the Poisson pmf check the resulting distribution.
  const b = 0.931 + 2.53 * sqrtMean;
  const a = -0.059 + 0.02483 * b;
  const logInvAlpha = Math.log(1.1239 + 1.1328 / (b - 3.4));
  const vr = 0.9277 - 3.6224 / (b - 2);
  for (;;) {
    const u = rng.uniform() - 0.5;
    const v = rng.uniform();
    const us = 0.5 - Math.abs(u);
    const k = Math.floor(((2 * a) / us + b) * u + mean + 0.43);
    if (us >= 0.07 && v <= vr) return k;
    if (k < 0 || (us < 0.013 && v > us)) continue;
    if (Math.log(v) + logInvAlpha - Math.log(a / (us * us) + b) <= -mean + k * logMean - logFactorial(k)) return k;
  }
}

/**
 * The smallest whole k with P(N <= k | mean) >= u: the Poisson count that a
 * uniform number u in [0, 1) maps to by inversion.
 *
 * @example
 * poissonInverse(0.5, 3) // 3
 */
export function poissonInverse(u: number, mean: number): number {
  if (mean <= 0) return 0;
  if (mean < INVERSE_SEARCH_FROM_ZERO_MAX_MEAN) {
    let probability = Math.exp(-mean);
    let cumulative = probability;
    let k = 0;
    // The cap stops the walk where rounding keeps the sum just below a u near 1.
    const cap = mean + 40 * Math.sqrt(mean) + 40;
    while (cumulative < u && k < cap) {
      k++;
      probability *= mean / k;
      cumulative += probability;
    }
    return k;
  }
  // Large means: start at floor(mean) with the exact cumulative probability and step.
  let k = Math.floor(mean);
  let cumulative = Math.exp(logPoissonCdf(k, mean));
  let probability = Math.exp(logPoissonPmf(k, mean));
  if (cumulative >= u) {
    while (k > 0 && cumulative - probability >= u) {
      cumulative -= probability;
      probability *= k / mean;
      k--;
    }
    return k;
  }
  const cap = mean + 40 * Math.sqrt(mean) + 40;
  while (cumulative < u && k < cap) {
    k++;
    probability *= mean / k;
    cumulative += probability;
  }
  return k;
}
