/**
 * Conventions shared by the expected-limit bands.
 *
 * Band edges N = -2, -1, 0, +1, +2 sit at probabilities Phi(N) of the
 * background-only distribution: 0.02275, 0.1587, 0.5, 0.8413, 0.97725. For the
 * exact and pseudo-experiment methods of one region the edge is the limit at
 * the smallest count whose background-only cumulative probability reaches
 * Phi(N) (the quantile of the discrete distribution of limits); the asymptotic
 * method uses the Cowan et al. band formula (`clsAsymptotic.ts`).
 */
import jStat from 'jstat';
import { BAND_KEYS, BAND_SIGMAS, type ExpectedLimits } from './types.js';

/**
 * Phi(N) for the band edges N = -2, -1, 0, +1, +2.
 *
 * @example
 * bandProbabilities()[2] // 0.5
 */
export function bandProbabilities(): number[] {
  return BAND_SIGMAS.map((n) => jStat.normal.cdf(n, 0, 1));
}

/**
 * Replaces each band edge by the running maximum from minus2 upwards. Edges
 * computed from one fixed set of pseudo-experiments can only cross through
 * Monte Carlo noise where two edges coincide (discrete counts), so this moves
 * an edge by no more than that noise.
 */
export function makeMonotone(expected: ExpectedLimits): ExpectedLimits {
  let previous = Number.NEGATIVE_INFINITY;
  for (const key of BAND_KEYS) {
    previous = Math.max(previous, expected[key]);
    expected[key] = previous;
  }
  return expected;
}
