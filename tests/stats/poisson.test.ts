import { describe, expect, it } from 'vitest';
import jStat from 'jstat';
import { logFactorial, logPoissonCdf, logPoissonPmf, poissonCdf, poissonQuantile } from '../../src/stats/poisson.js';
import { expectClose } from '../helpers.js';

/** P(N <= n | mean) by the plain finite sum: all terms positive, accurate while nothing under- or overflows. */
function directCdf(n: number, mean: number): number {
  let term = 1;
  let sum = 1;
  for (let j = 1; j <= n; j++) {
    term *= mean / j;
    sum += term;
  }
  return Math.exp(-mean) * sum;
}

describe('Poisson probabilities', () => {
  it('logFactorial matches jstat log-gamma and the doc example ln 120', () => {
    expectClose(logFactorial(5), Math.log(120), { rel: 1e-15 });
    for (const k of [0, 1, 2, 10, 100, 1023, 1024, 5000, 1e6]) expectClose(logFactorial(k), jStat.gammaln(k + 1), { rel: 1e-12, abs: 1e-12 }, `k=${k}`);
  });

  it('logPoissonPmf is k ln(mean) - mean - ln k! and handles mean 0', () => {
    expect(logPoissonPmf(0, 3)).toBe(-3);
    expect(logPoissonPmf(0, 0)).toBe(0);
    expect(logPoissonPmf(2, 0)).toBe(Number.NEGATIVE_INFINITY);
    expectClose(Math.exp(logPoissonPmf(4, 2.5)), jStat.poisson.pdf(4, 2.5), { rel: 1e-12 });
  });

  it('the cumulative probability agrees with the direct sum to 1e-12 wherever both are representable', () => {
    for (let n = 0; n <= 600; n += n < 30 ? 1 : 41) {
      for (const factor of [0.01, 0.3, 0.8, 0.95, 1, 1.05, 1.2, 2, 5]) {
        const mean = Math.max(1e-3, (n + 1) * factor);
        if (mean > 650) continue;
        expectClose(poissonCdf(n, mean), directCdf(n, mean), { rel: 1e-12 }, `n=${n}, mean=${mean}`);
      }
    }
  });

  it('agrees with jstat (1 - lower regularised gamma) where the upper tail is not small', () => {
    // jstat computes P(N <= n) = 1 - P(n+1, mean), exact enough only when the result is not tiny.
    for (const [n, mean] of [[3, 2.5], [10, 12], [150, 140], [1000, 1030], [5000, 4990]]) {
      expectClose(poissonCdf(n, mean), 1 - jStat.lowRegGamma(n + 1, mean), { rel: 1e-9 }, `n=${n}`);
    }
  });

  it('stays finite in log space far in the tails (n = 0 with mean 1e6 has ln P = -1e6)', () => {
    expect(logPoissonCdf(0, 1e6)).toBe(-1e6);
    expectClose(logPoissonCdf(5, 1e6), logPoissonPmf(5, 1e6) + Math.log1p(5 / 1e6 + 20 / 1e12), { rel: 1e-12 });
    expect(logPoissonCdf(2_000_000, 1e6)).toBeLessThanOrEqual(0);
    expect(logPoissonCdf(2_000_000, 1e6)).toBeGreaterThan(-1e-100);
    expect(Number.isFinite(logPoissonCdf(1_019_837, 1e20))).toBe(true);
    expect(Number.isFinite(logPoissonCdf(1_000_000, 999_900))).toBe(true);
  });

  it('is monotone in n and in the mean (property)', () => {
    for (const mean of [0.5, 7, 300, 2e4]) {
      let previous = Number.NEGATIVE_INFINITY;
      for (let n = Math.max(0, Math.floor(mean - 5 * Math.sqrt(mean))); n < mean + 5 * Math.sqrt(mean) + 5; n += Math.max(1, Math.floor(Math.sqrt(mean) / 4))) {
        const value = logPoissonCdf(n, mean);
        expect(value).toBeGreaterThan(previous);
        previous = value;
      }
    }
    for (const n of [0, 4, 120]) {
      let previous = 0.5;
      for (let mean = 0.1; mean < 400; mean *= 1.3) {
        const value = logPoissonCdf(n, mean);
        expect(value).toBeLessThanOrEqual(previous);
        previous = value;
      }
    }
  });

  it('poissonQuantile returns the smallest count reaching the probability', () => {
    expect(poissonQuantile(0.5, 3)).toBe(3);
    expect(poissonQuantile(0.5, 0)).toBe(0);
    for (const mean of [0.2, 3, 9.5, 50, 1e4, 1e6]) {
      for (const p of [0.02275, 0.1587, 0.5, 0.8413, 0.97725]) {
        const k = poissonQuantile(p, mean);
        expect(poissonCdf(k, mean)).toBeGreaterThanOrEqual(p);
        if (k > 0) expect(poissonCdf(k - 1, mean)).toBeLessThan(p);
      }
    }
  });
});
