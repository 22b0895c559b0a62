/**
 * Exact CLs for one counting region with a known background (A. L. Read,
 * J. Phys. G 28 (2002) 2693; T. Junk, Nucl. Instrum. Meth. A434 (1999) 435),
 * with the observed count as test statistic:
 *
 *   CLs(s) = P(N <= n | s + b) / P(N <= n | b),
 *
 * which is also Helene's flat-prior formula (O. Helene, Nucl. Instrum. Meth.
 * 212 (1983) 319). The upper limit solves CLs(s) = 1 - cl. ln CLs(s) is
 * concave in s (the Poisson cumulative probability is the survival function of
 * a Gamma(n + 1) variable, whose density is log-concave), so a Newton step
 * from below the root lands beyond it and Newton's method then converges from
 * above; the bisection safeguard is there for rounding.
 *
 * Expected limits: the band edge at probability p is the limit at n_p, the
 * smallest count whose background-only cumulative probability reaches p (the
 * p-quantile of the discrete distribution of limits, since the limit grows
 * with n; `expectedBands.ts`). Discreteness makes bands coincide at small b
 * (all equal 3.00 at b = 0).
 */
import { logPoissonCdf, logPoissonPmf, poissonQuantile } from './poisson.js';
import { findRootNewtonFromGuess } from './newtonRootFinding.js';
import type { ValueAndSlope } from './rootFinding.js';
import { bandProbabilities } from './expectedBands.js';
import { BAND_KEYS, type ExpectedLimits } from './types.js';

/**
 * CLs(s) for n observed events, known background b and signal s.
 *
 * @example
 * exactCls(0, 3, 1) // 0.36787944117144233 (e^-1 for any b)
 */
export function exactCls(observed: number, background: number, signal: number): number {
  return Math.exp(logPoissonCdf(observed, signal + background) - logPoissonCdf(observed, background));
}

/**
 * The exact CLs upper limit on the signal count at confidence level `cl`.
 *
 * @example
 * exactUpperLimit(0, 0, 0.95) // 2.995732273553991 (-ln 0.05)
 */
export function exactUpperLimit(observed: number, background: number, cl: number): number {
  const target = Math.log1p(-cl) + logPoissonCdf(observed, background);
  const evaluate = (s: number, out: ValueAndSlope): void => {
    const mean = s + background;
    const logCdf = logPoissonCdf(observed, mean);
    out.value = logCdf - target;
    // d/ds ln P(N <= n | s + b) = -P(N = n) / P(N <= n).
    out.slope = -Math.exp(logPoissonPmf(observed, mean) - logCdf);
  };
  // A guess a little above the usual reach; Newton from either side then
  // brackets the root (from below it overshoots, by concavity).
  const guess = Math.max(observed - background, 0) + 2 * Math.sqrt(observed + 1) + 1;
  return findRootNewtonFromGuess(evaluate, guess, -Math.log1p(-cl), { absolute: 1e-13, relative: 1e-12 });
}

/**
 * Observed and expected exact CLs limits on the signal count for a known background.
 *
 * @example
 * exactLimits(0, 0, 0.95).expected.median // 2.995732273553991
 */
export function exactLimits(observed: number, background: number, cl: number): { observed: number; expected: ExpectedLimits } {
  const cache = new Map<number, number>();
  const limitAt = (n: number): number => {
    let limit = cache.get(n);
    if (limit === undefined) {
      limit = exactUpperLimit(n, background, cl);
      cache.set(n, limit);
    }
    return limit;
  };
  const expected = { minus2: 0, minus1: 0, median: 0, plus1: 0, plus2: 0 };
  bandProbabilities().forEach((p, k) => {
    expected[BAND_KEYS[k]] = limitAt(poissonQuantile(p, background));
  });
  return { observed: limitAt(observed), expected };
}
