import { describe, expect, it } from 'vitest';
import jStat from 'jstat';
import { exactCls, exactLimits, exactUpperLimit } from '../../src/stats/clsExact.js';
import { BAND_KEYS } from '../../src/stats/types.js';
import { expectClose } from '../helpers.js';

// PDG Review of Particle Physics, Statistics review, table of one-sided upper
// limits for a Poisson mean with no background (e.g. Table 40.3 in the
// 2020-2024 editions), as copied in ../shared/checks.md section 2:
// 95% column [S][C]; 90% column [C] (printed values from memory).
const PDG_95 = [3.0, 4.74, 6.3, 7.75, 9.15, 10.51, 11.84, 13.15, 14.43, 15.71, 16.96];
const PDG_90 = [2.3, 3.89, 5.32, 6.68, 7.99, 9.27, 10.53, 11.77, 12.99, 14.21, 15.41];

/**
 * Helene's upper limit (O. Helene, Nucl. Instrum. Meth. 212 (1983) 319):
 * 1 - CL = sum_{k<=n} P(k | s + b) / sum_{k<=n} P(k | b), written here
 * independently of tamis (plain sums, plain bisection).
 */
function heleneLimit(n: number, b: number, cl: number): number {
  const tail = (mean: number): number => {
    let term = Math.exp(-mean);
    let sum = term;
    for (let k = 1; k <= n; k++) {
      term *= mean / k;
      sum += term;
    }
    return sum;
  };
  const denominator = tail(b);
  let low = 0;
  let high = 200;
  for (let i = 0; i < 200; i++) {
    const middle = 0.5 * (low + high);
    if (tail(middle + b) / denominator > 1 - cl) low = middle;
    else high = middle;
  }
  return 0.5 * (low + high);
}

describe('exact CLs, known background', () => {
  it('reproduces the PDG zero-background upper limits for n = 0..10 at 95% and 90% CL within 0.5%', () => {
    for (let n = 0; n <= 10; n++) {
      expectClose(exactUpperLimit(n, 0, 0.95), PDG_95[n], { rel: 5e-3 }, `95% n=${n}`);
      expectClose(exactUpperLimit(n, 0, 0.9), PDG_90[n], { rel: 5e-3 }, `90% n=${n}`);
    }
  });

  it('equals 0.5 F^-1_chi2(CL; 2(n+1)) at b = 0 to 1e-9 (PDG statistics review; jstat chi-square quantile)', () => {
    for (let n = 0; n <= 30; n++) {
      for (const cl of [0.68, 0.9, 0.95, 0.99]) {
        expectClose(exactUpperLimit(n, 0, cl), 0.5 * jStat.chisquare.inv(cl, 2 * (n + 1)), { rel: 1e-9 }, `n=${n} cl=${cl}`);
      }
    }
  });

  it('gives -ln(0.05) = 2.9957 for n = 0 whatever the background (Bityukov and Krasnikov, physics/0009064)', () => {
    for (const b of [0, 0.5, 3, 10, 100, 1e6]) expectClose(exactUpperLimit(0, b, 0.95), 2.995732273553991, { rel: 1e-9 }, `b=${b}`);
    expectClose(exactCls(0, 3, 1), Math.exp(-1), { rel: 1e-14 });
  });

  it("equals Helene's formula to 1e-6 on a table of (n, b) (identity stated in E. Busato, arXiv:1404.1340)", () => {
    for (const n of [0, 1, 2, 3, 5, 8, 10, 15, 25]) {
      for (const b of [0, 0.5, 1, 2.5, 5, 10, 20]) {
        for (const cl of [0.9, 0.95]) expectClose(exactUpperLimit(n, b, cl), heleneLimit(n, b, cl), { rel: 1e-6 }, `n=${n} b=${b} cl=${cl}`);
      }
    }
  });

  it('decreases with the background, and s_up(n, b) is close to s_up(n, 0) - b for b well below n (checks.md, recomputed)', () => {
    for (const n of [1, 4, 10]) {
      let previous = Number.POSITIVE_INFINITY;
      for (const b of [0, 0.2, 0.5, 1, 2, 4, 8]) {
        const limit = exactUpperLimit(n, b, 0.95);
        expect(limit).toBeLessThan(previous);
        previous = limit;
      }
    }
    // n = 20, b = 0.5: the background is 20 standard deviations of nothing below n.
    expectClose(exactUpperLimit(20, 0.5, 0.95), exactUpperLimit(20, 0, 0.95) - 0.5, { abs: 0.01 });
  });

  it('stays finite and sensible in the corners: b = 1e6, n far above and below b', () => {
    // n = b = 1e6: Gaussian regime, limit ~ 1.96 sqrt(b) (CLs at the median is 2 (1 - Phi(s / sqrt(b)))).
    expectClose(exactUpperLimit(1e6, 1e6, 0.95), 1.96 * 1000, { rel: 0.01 });
    // n = 2e6 against b = 1e6: the limit is the excess plus ~1.64 sqrt(n).
    expectClose(exactUpperLimit(2e6, 1e6, 0.95), 1e6 + 1.645 * Math.sqrt(2e6), { rel: 1e-3 });
    // n = 5 far below b = 1e6: CLs protects, the limit tends to that of b = 0... of n = 0 (about 3).
    const deficit = exactUpperLimit(5, 1e6, 0.95);
    expect(deficit).toBeGreaterThan(2.99);
    expect(deficit).toBeLessThan(3.01);
    expect(Number.isFinite(exactUpperLimit(1019837, 1e6, 0.95))).toBe(true);
  });

  it('bands: the limits at the background-only quantiles of n, ordered, all 3.00 at b = 0', () => {
    const zero = exactLimits(0, 0, 0.95);
    for (const key of BAND_KEYS) expectClose(zero.expected[key], 2.995732273553991, { rel: 1e-9 });
    for (const b of [0.3, 2, 7.5, 40, 1e4]) {
      const { expected } = exactLimits(Math.round(b), b, 0.95);
      for (let k = 1; k < BAND_KEYS.length; k++) expect(expected[BAND_KEYS[k]]).toBeGreaterThanOrEqual(expected[BAND_KEYS[k - 1]]);
      if (b > 100) continue;
      // the median band edge is the limit at the median count of Poisson(b) (median from jstat's Poisson cdf)
      let median = 0;
      while (jStat.poisson.cdf(median, b) < 0.5) median++;
      expectClose(expected.median, exactUpperLimit(median, b, 0.95), { rel: 1e-9 }, `b=${b}`);
    }
  });
});
