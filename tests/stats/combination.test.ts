import { describe, expect, it } from 'vitest';
import { equivalentSingleRegion } from '../../src/stats/autoMethod.js';
import { combinedUpperLimit } from '../../src/stats/combination.js';
import { exactLimits } from '../../src/stats/clsExact.js';
import { upperLimit } from '../../src/stats/upperLimit.js';
import { BAND_KEYS } from '../../src/stats/types.js';
import { expectClose } from '../helpers.js';

describe('combination of disjoint regions (limits on the signal strength mu)', () => {
  it('two identical regions give a stronger limit than either alone (toys and asymptotic)', () => {
    const region = { observed: 4, background: 3, backgroundUncertainty: 0.8, signal: 1 };
    for (const method of ['toys', 'asymptotic'] as const) {
      const alone = upperLimit(region, { method });
      const together = combinedUpperLimit([region, { ...region }], { method, seed: 3 });
      expect(together.observed, method).toBeLessThan(alone.observed);
      expect(together.expected.median, method).toBeLessThan(alone.expected.median);
    }
  });

  it('n = 0 in two identical regions: CLs = e^-2mu, so mu = 1.498 (doc example)', () => {
    const result = combinedUpperLimit([{ observed: 0, background: 1, signal: 1 }, { observed: 0, background: 1, signal: 1 }], { method: 'toys' });
    // The estimate is a Monte Carlo one: the reported CLs error sets the scale (d ln CLs / d mu = -2).
    expectClose(result.observed, 2.995732273553991 / 2, { abs: 0.01 + result.clsAtLimitError / 0.05 / 2 });
  });

  it('pseudo-experiments for two identical regions without uncertainty equal the exact limit of one region with doubled counts', () => {
    // With identical weights the test statistic is n1 + n2 ~ Poisson(2 (mu s + b)) (Junk 1999 statistic).
    const combined = combinedUpperLimit([{ observed: 4, background: 3, signal: 1 }, { observed: 4, background: 3, signal: 1 }], { method: 'toys', seed: 8 });
    const doubled = exactLimits(8, 6, 0.95);
    expectClose(combined.observed, doubled.observed / 2, { rel: 0.03 });
    expectClose(combined.expected.median, doubled.expected.median / 2, { rel: 0.03 });
  });

  it('one region: the combination is the single-region limit divided by its signal', () => {
    const single = upperLimit({ observed: 5, background: 2.5 });
    const combined = combinedUpperLimit([{ observed: 5, background: 2.5, signal: 4 }]);
    expectClose(combined.observed, single.observed / 4, { rel: 1e-12 });
    for (const key of BAND_KEYS) expectClose(combined.expected[key], single.expected[key] / 4, { rel: 1e-12 });
  });

  it('correlated background uncertainties (a shared group) give a weaker limit than independent ones', () => {
    const regions = [
      { observed: 6, background: 5, backgroundUncertainty: 2, signal: 1 },
      { observed: 6, background: 5, backgroundUncertainty: 2, signal: 1 },
    ];
    for (const method of ['toys', 'asymptotic'] as const) {
      const independent = combinedUpperLimit(regions, { method, seed: 4 });
      const correlated = combinedUpperLimit(regions.map((r) => ({ ...r, group: 'fakes' })), { method, seed: 4 });
      expect(correlated.observed, method).toBeGreaterThan(independent.observed);
    }
  });

  it('a region without signal changes nothing when uncorrelated; the same seed gives the same combination', () => {
    const base = [
      { observed: 3, background: 2, backgroundUncertainty: 0.5, signal: 1 },
      { observed: 9, background: 7, backgroundUncertainty: 2, signal: 2 },
    ];
    const a = combinedUpperLimit(base, { method: 'asymptotic' });
    const b = combinedUpperLimit([...base, { observed: 40, background: 30, backgroundUncertainty: 5, signal: 0 }], { method: 'asymptotic' });
    expectClose(b.observed, a.observed, { rel: 1e-8 });
    const toysA = combinedUpperLimit(base, { method: 'toys', seed: 21 });
    const toysB = combinedUpperLimit(base, { method: 'toys', seed: 21 });
    expect(toysB).toEqual(toysA);
  });

  it('auto: asymptotic when the equivalent single region is large, pseudo-experiments otherwise', () => {
    const large = [{ observed: 60, background: 55, backgroundUncertainty: 5, signal: 1 }, { observed: 70, background: 65, backgroundUncertainty: 6, signal: 1 }];
    expect(combinedUpperLimit(large).method).toBe('asymptotic');
    const small = [{ observed: 1, background: 0.4, backgroundUncertainty: 0.1, signal: 3 }, ...large];
    expect(equivalentSingleRegion(small).background).toBeLessThan(50);
    expect(combinedUpperLimit(small).method).toBe('toys');
    expect(equivalentSingleRegion([{ observed: 5, background: 4, signal: 1 }, { observed: 5, background: 4, signal: 1 }])).toEqual({ observed: 10, background: 8 });
  });

  it('signal uncertainties weaken the combination; truncated Gaussian groups with a zero background work; the error meets the tolerance', () => {
    const regions = [
      { observed: 2, background: 0, backgroundUncertainty: 0.4, signal: 1, group: 'g' },
      { observed: 5, background: 3.5, backgroundUncertainty: 1.2, signal: 1.5, group: 'g' },
      { observed: 1, background: 1.1, backgroundUncertainty: 0.3, signal: 0.5 },
    ];
    for (const uncertaintyModel of ['lognormal', 'gaussian'] as const) {
      const plain = combinedUpperLimit(regions, { method: 'toys', uncertaintyModel, seed: 6 });
      const withSignal = combinedUpperLimit(regions.map((r) => ({ ...r, signalUncertainty: 0.4 })), { method: 'toys', uncertaintyModel, seed: 6 });
      expect(withSignal.observed, uncertaintyModel).toBeGreaterThan(plain.observed);
      expect(plain.clsAtLimitError).toBeLessThanOrEqual(0.0025);
      for (let k = 1; k < BAND_KEYS.length; k++) expect(withSignal.expected[BAND_KEYS[k]]).toBeGreaterThanOrEqual(withSignal.expected[BAND_KEYS[k - 1]]);
    }
  });

  it('rejects exact for several regions, and bad regions with their index and name', () => {
    const two = [{ observed: 1, background: 1, signal: 1 }, { observed: 1, background: 1, signal: 1 }];
    expect(() => combinedUpperLimit(two, { method: 'exact' })).toThrow(/exact method handles one region/);
    expect(() => combinedUpperLimit([])).toThrow(/at least one region/);
    expect(() => combinedUpperLimit([{ observed: 1, background: 1, signal: 0 }])).toThrow(/signal > 0/);
    try {
      combinedUpperLimit([two[0], { observed: 1, background: -2, signal: 1, name: 'SR7' }]);
      expect.fail('no error');
    } catch (error) {
      expect(error).toMatchObject({ code: 'bad_input', key: 'regions[1].background' });
      expect((error as Error).message).toMatch(/background must be >= 0, got -2 \(region "SR7"\)/);
    }
  });
});
