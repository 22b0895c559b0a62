import { describe, expect, it } from 'vitest';
import jStat from 'jstat';
import { asymptoticCls, asymptoticLimits, bandSignificance, normalUpperTail } from '../../src/stats/clsAsymptotic.js';
import { CountingModel, type ModelRegion } from '../../src/stats/countingModel.js';
import { ProfileFit } from '../../src/stats/profileFit.js';
import { ProfileLikelihoodRatio } from '../../src/stats/profileLikelihoodRatio.js';
import { BAND_KEYS, BAND_SIGMAS } from '../../src/stats/types.js';
import { expectClose } from '../helpers.js';

function region(observed: number, background: number, backgroundUncertainty = 0, signalUncertainty = 0, group = 0, signal = 1): ModelRegion {
  return { observed, background, backgroundUncertainty, signal, signalUncertainty, group };
}

/** Plain bisection for an increasing function g with g(low) < 0 < g(high). */
function bisect(g: (x: number) => number, low: number, high: number): number {
  for (let i = 0; i < 200; i++) {
    const middle = 0.5 * (low + high);
    if (g(middle) < 0) low = middle;
    else high = middle;
  }
  return 0.5 * (low + high);
}

/** Minimum of a unimodal function on [low, high] by golden-section search. */
function goldenMinimum(f: (x: number) => number, low: number, high: number): number {
  const ratio = (Math.sqrt(5) - 1) / 2;
  let a = low;
  let b = high;
  for (let i = 0; i < 200; i++) {
    const c = b - ratio * (b - a);
    const d = a + ratio * (b - a);
    if (f(c) < f(d)) b = d;
    else a = c;
  }
  return f(0.5 * (a + b));
}

describe('asymptotic CLs (Cowan, Cranmer, Gross, Vitells, Eur. Phys. J. C 71 (2011) 1554)', () => {
  it('doc examples: 1 - Phi(1.96) = 0.025, CLs = 0.05 at q = q_A = 1.96^2, median band significance 1.96', () => {
    expectClose(normalUpperTail(1.959963984540054), 0.025, { rel: 1e-12 });
    expectClose(asymptoticCls(1.959963984540054 ** 2, 1.959963984540054 ** 2), 0.05, { rel: 1e-12 });
    expectClose(bandSignificance(0.95, 0), 1.959963984540054, { rel: 1e-12 });
    expect(asymptoticCls(0, 0)).toBe(1);
  });

  it('uses the two branches of the q~ distribution: continuous at q = q_A', () => {
    for (const qA of [0.5, 4, 20]) expectClose(asymptoticCls(qA * (1 - 1e-9), qA), asymptoticCls(qA * (1 + 1e-9), qA), { rel: 1e-6 });
    // q > q_A branch: CLs = [1 - Phi((q + qA) / (2 sqrt qA))] / [1 - Phi((q - qA) / (2 sqrt qA))]
    const q = 9;
    const qA = 4;
    const expected = (1 - jStat.normal.cdf((q + qA) / 4, 0, 1)) / (1 - jStat.normal.cdf((q - qA) / 4, 0, 1));
    expectClose(asymptoticCls(q, qA), expected, { rel: 1e-9 });
  });

  it('known background: median and bands solve sqrt(q_A) = Phi^-1(1 - alpha Phi(N)) + N with q_A = 2 (mu s - b ln(1 + mu s / b))', () => {
    for (const b of [0.5, 3, 25, 400]) {
      const { expected } = asymptoticLimits(new CountingModel([region(Math.round(b), b)], 'lognormal'), 0.95);
      BAND_KEYS.forEach((key, k) => {
        const N = BAND_SIGMAS[k];
        const target = jStat.normal.inv(1 - 0.05 * jStat.normal.cdf(N, 0, 1), 0, 1) + N;
        const reference = bisect((mu) => Math.sqrt(2 * (mu - b * Math.log1p(mu / b))) - target, 0, 1e4);
        expectClose(expected[key], reference, { rel: 1e-7 }, `b=${b} ${key}`);
      });
    }
  });

  it('known background: the observed limit solves CLs(q~, q_A) = 0.05 with the closed-form q~', () => {
    for (const [n, b] of [[3, 3], [10, 4], [2, 6], [150, 130]]) {
      const muHat = Math.max(0, n - b);
      const deviance = (lambda: number): number => (n > 0 ? lambda - n - n * Math.log(lambda / n) : lambda);
      const qTilde = (mu: number): number => (mu <= muHat ? 0 : 2 * (deviance(mu + b) - deviance(muHat + b)));
      const qAsimov = (mu: number): number => 2 * (mu - b * Math.log1p(mu / b));
      const reference = bisect((mu) => 0.05 - asymptoticCls(qTilde(mu), qAsimov(mu)), 1e-9, 1e4);
      const { observed } = asymptoticLimits(new CountingModel([region(n, b)], 'lognormal'), 0.95);
      expectClose(observed, reference, { rel: 1e-7 }, `n=${n} b=${b}`);
      const ratio = new ProfileLikelihoodRatio(new CountingModel([region(n, b)], 'lognormal'), new Float64Array([n]));
      expectClose(ratio.muHat, muHat, { abs: 1e-9 });
    }
  });

  it('the Asimov data set reproduces the median expected limit as its observed limit (the Asimov property of Cowan et al. 2011)', () => {
    const model = new CountingModel([region(0, 37.5, 6)], 'gaussian');
    const { observed } = asymptoticLimits(new CountingModel([region(37.5, 37.5, 6)], 'gaussian'), 0.95);
    expectClose(observed, asymptoticLimits(model, 0.95).expected.median, { rel: 1e-6 });
  });

  it('profiles a background nuisance to the brute-force minimum (log-normal and truncated Gaussian)', () => {
    for (const model of ['lognormal', 'gaussian'] as const) {
      for (const [n, b, db, mu] of [[5, 3, 1, 2], [0, 4, 3, 1], [40, 30, 9, 0], [2, 0.5, 2, 0.5], [100, 50, 50, 10]]) {
        const counting = new CountingModel([region(n, b, db)], model);
        const fit = new ProfileFit(counting, new Float64Array([n]));
        const kappa = Math.log1p(db / b);
        const nll = (theta: number): number => {
          const background = model === 'lognormal' ? b * Math.exp(kappa * theta) : Math.max(0, b + db * theta);
          const lambda = mu + background;
          return (n > 0 ? lambda - n - n * Math.log(lambda / n) : lambda) + 0.5 * theta * theta;
        };
        const lowest = model === 'gaussian' ? -b / db : -20;
        expectClose(fit.profiledNll(mu), goldenMinimum(nll, lowest, 20), { abs: 1e-9 }, `${model} n=${n} b=${b} db=${db}`);
      }
    }
  });

  it('profiles background and signal nuisances together to the brute-force minimum', () => {
    const [n, b, db, r, mu] = [9, 4, 1.5, 0.3, 3];
    const counting = new CountingModel([region(n, b, db, r)], 'lognormal');
    const fit = new ProfileFit(counting, new Float64Array([n]));
    const nll = (theta: number, thetaSignal: number): number => {
      const lambda = mu * Math.exp(Math.log1p(r) * thetaSignal) + b * Math.exp(Math.log1p(db / b) * theta);
      return lambda - n - n * Math.log(lambda / n) + 0.5 * (theta * theta + thetaSignal * thetaSignal);
    };
    const brute = goldenMinimum((theta) => goldenMinimum((ts) => nll(theta, ts), -10, 10), -10, 10);
    expectClose(fit.profiledNll(mu), brute, { abs: 1e-8 });
  });

  it('two identical regions with fully correlated backgrounds equal one region with doubled counts', () => {
    const pair = new CountingModel([region(8, 6, 2, 0, 0), region(8, 6, 2, 0, 0)], 'lognormal');
    const doubled = new CountingModel([region(16, 12, 4, 0, 0, 2)], 'lognormal');
    const a = asymptoticLimits(pair, 0.95);
    const b = asymptoticLimits(doubled, 0.95);
    expectClose(a.observed, b.observed, { rel: 1e-6 });
    for (const key of BAND_KEYS) expectClose(a.expected[key], b.expected[key], { rel: 1e-6 });
  });

  it('independent background uncertainties give a stronger combined limit than fully correlated ones', () => {
    const correlated = asymptoticLimits(new CountingModel([region(8, 6, 2, 0, 0), region(8, 6, 2, 0, 0)], 'lognormal'), 0.95);
    const independent = asymptoticLimits(new CountingModel([region(8, 6, 2, 0, 0), region(8, 6, 2, 0, 1)], 'lognormal'), 0.95);
    expect(independent.observed).toBeLessThan(correlated.observed);
    expect(independent.expected.median).toBeLessThan(correlated.expected.median);
  });
});
