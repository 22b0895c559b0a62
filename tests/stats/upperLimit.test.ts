import { describe, expect, it } from 'vitest';
import { RandomStream } from '../../src/physics/random.js';
import { upperLimit } from '../../src/stats/upperLimit.js';
import { BAND_KEYS, type LimitMethod, type UpperLimitResult } from '../../src/stats/types.js';
import { expectClose } from '../helpers.js';

const MINUS_LN_005 = 2.995732273553991;

function expectOrderedFinite(result: UpperLimitResult, label: string): void {
  expect(Number.isFinite(result.observed), `${label} observed`).toBe(true);
  expect(result.observed, `${label} observed`).toBeGreaterThan(0);
  for (let k = 0; k < BAND_KEYS.length; k++) {
    const value = result.expected[BAND_KEYS[k]];
    expect(Number.isFinite(value), `${label} ${BAND_KEYS[k]}`).toBe(true);
    if (k > 0) expect(value, `${label} ${BAND_KEYS[k]}`).toBeGreaterThanOrEqual(result.expected[BAND_KEYS[k - 1]]);
  }
}

describe('upperLimit (one counting region)', () => {
  it('doc examples: n = 0 gives -ln 0.05 exactly; a small count with an uncertainty runs pseudo-experiments', () => {
    const zero = upperLimit({ observed: 0, background: 1.2 });
    expect(zero.method).toBe('exact');
    expectClose(zero.observed, MINUS_LN_005, { rel: 1e-12 });
    expect(upperLimit({ observed: 12, background: 9.5, backgroundUncertainty: 2.1 }, { seed: 7 }).method).toBe('toys');
  });

  it('auto picks exact without uncertainty, pseudo-experiments for small counts, asymptotic for large counts (autoMethod.ts rule)', () => {
    expect(upperLimit({ observed: 400, background: 380 }).method).toBe('exact');
    expect(upperLimit({ observed: 4, background: 3, backgroundUncertainty: 1 }).method).toBe('toys');
    expect(upperLimit({ observed: 49, background: 60, backgroundUncertainty: 6 }).method).toBe('toys');
    expect(upperLimit({ observed: 50, background: 50, backgroundUncertainty: 5 }).method).toBe('asymptotic');
    expect(upperLimit({ observed: 5, background: 3, signalUncertainty: 0.1 }).method).toBe('toys');
  });

  it('n = 0 gives 3.00 with pseudo-experiments for any background uncertainty (CLs = e^-s whatever the background draws)', () => {
    for (const model of ['lognormal', 'gaussian'] as const) {
      for (const [b, db] of [[0.5, 0.2], [3, 3], [10, 1], [100, 40]]) {
        const result = upperLimit({ observed: 0, background: b, backgroundUncertainty: db }, { method: 'toys', uncertaintyModel: model });
        expectClose(result.observed, MINUS_LN_005, { rel: 1e-6 }, `${model} b=${b}`);
      }
    }
  });

  it('pseudo-experiments without uncertainty reproduce the exact limits', () => {
    for (const [n, b] of [[0, 0], [3, 1.2], [7, 9.4], [25, 20]]) {
      const toys = upperLimit({ observed: n, background: b }, { method: 'toys' });
      const exact = upperLimit({ observed: n, background: b }, { method: 'exact' });
      expectClose(toys.observed, exact.observed, { rel: 1e-6 });
      for (const key of BAND_KEYS) expectClose(toys.expected[key], exact.expected[key], { rel: 1e-6 });
      expect(toys.clsAtLimitError).toBeLessThan(1e-9);
    }
  });

  it('the same seed gives the same limit; another seed moves it by about the reported error only', () => {
    const region = { observed: 7, background: 4.2, backgroundUncertainty: 1.6 };
    const a = upperLimit(region, { method: 'toys', seed: 11 });
    const b = upperLimit(region, { method: 'toys', seed: 11 });
    expect(b.observed).toBe(a.observed);
    expect(b.expected).toEqual(a.expected);
    const viaStream = upperLimit(region, { method: 'toys', rng: RandomStream.forStream(11) });
    expect(viaStream.observed).toBe(a.observed);
    const c = upperLimit(region, { method: 'toys', seed: 12 });
    expect(c.observed).not.toBe(a.observed);
    // 0.0025 CLs error at CLs = 0.05 is 5% of CLs, about 2% of the limit here: allow 3 sigma.
    expectClose(c.observed, a.observed, { rel: 0.06 });
    expect(a.clsAtLimitError).toBeLessThanOrEqual(0.0025);
    expect(a.toys).toBeGreaterThanOrEqual(1000);
  });

  it('the pseudo-experiment count grows until the CLs error at the limit meets the tolerance', () => {
    const region = { observed: 30, background: 25, backgroundUncertainty: 10 };
    const loose = upperLimit(region, { method: 'toys', toyTolerance: 0.005 });
    const tight = upperLimit(region, { method: 'toys', toyTolerance: 0.0005 });
    expect(loose.clsAtLimitError).toBeLessThanOrEqual(0.005);
    expect(tight.clsAtLimitError).toBeLessThanOrEqual(0.0005);
    expect(tight.toys).toBeGreaterThan(loose.toys);
    const capped = upperLimit(region, { method: 'toys', toyTolerance: 1e-6, minToys: 500, maxToys: 2000 });
    expect(capped.toys).toBe(2000);
    expect(capped.clsAtLimitError).toBeGreaterThan(1e-6);
  });

  it.each(['toys', 'asymptotic'] as LimitMethod[])('%s: limits grow monotonically with the background uncertainty (both constraint shapes)', (method) => {
    for (const model of ['lognormal', 'gaussian'] as const) {
      for (const [n, b] of [[6, 4], [60, 55]]) {
        let previous = upperLimit({ observed: n, background: b }, { method: method === 'toys' ? 'exact' : method });
        for (const relative of [0.05, 0.1, 0.2, 0.5, 1]) {
          const result = upperLimit({ observed: n, background: b, backgroundUncertainty: relative * b }, { method, uncertaintyModel: model, seed: 5 });
          expect(result.observed, `${model} n=${n} db/b=${relative}`).toBeGreaterThan(previous.observed);
          expect(result.expected.median, `${model} n=${n} db/b=${relative} median`).toBeGreaterThan(previous.expected.median * (1 - 1e-9));
          previous = result;
        }
      }
    }
  });

  it('a signal uncertainty weakens the limit', () => {
    for (const method of ['toys', 'asymptotic'] as const) {
      const without = upperLimit({ observed: 8, background: 5, backgroundUncertainty: 1 }, { method });
      const withSignal = upperLimit({ observed: 8, background: 5, backgroundUncertainty: 1, signalUncertainty: 0.3 }, { method });
      expect(withSignal.observed).toBeGreaterThan(without.observed);
    }
  });

  it.each(['exact', 'toys', 'asymptotic', 'auto'] as LimitMethod[])('%s: every corner gives finite limits with ordered bands', (method) => {
    const corners = [
      [0, 0], [0, 3], [3, 0], [40, 1], [1, 40], [0, 1e6], [1e6, 1e6], [1_003_000, 1e6], [999_000, 1e6],
    ];
    for (const [n, b] of corners) {
      for (const relative of method === 'exact' ? [0] : [0, 0.3, 1]) {
        if (method === 'toys' && b >= 1e6) continue; // large counts: covered below with a small ensemble
        const result = upperLimit({ observed: n, background: b, backgroundUncertainty: relative * b }, { method, seed: 2 });
        expectOrderedFinite(result, `${method} n=${n} b=${b} db=${relative * b}`);
      }
    }
  });

  it('pseudo-experiments stay finite at b = 1e6 with a 1% uncertainty (1000 draws)', () => {
    const region = { observed: 1e6, background: 1e6, backgroundUncertainty: 1e4 };
    const result = upperLimit(region, { method: 'toys', minToys: 1000, maxToys: 1000 });
    expectOrderedFinite(result, 'b=1e6');
    // Deep in the asymptotic regime: the two methods agree (6% allows for the 1000-draw Monte Carlo error).
    expectClose(result.observed, upperLimit(region, { method: 'asymptotic' }).observed, { rel: 0.06 });
  });

  it('a zero background with an uncertainty works with the log-normal default (it falls back to the truncated Gaussian)', () => {
    const lognormal = upperLimit({ observed: 2, background: 0, backgroundUncertainty: 0.5 }, { method: 'toys' });
    const gaussian = upperLimit({ observed: 2, background: 0, backgroundUncertainty: 0.5 }, { method: 'toys', uncertaintyModel: 'gaussian' });
    expect(lognormal.observed).toBe(gaussian.observed);
  });

  it('rejects bad input with a bad_input error naming the parameter', () => {
    const bad: [object, object, RegExp][] = [
      [{ observed: -1, background: 2 }, {}, /observed must be >= 0/],
      [{ observed: 2.5, background: 2 }, {}, /observed must be a whole number/],
      [{ observed: Number.NaN, background: 2 }, {}, /observed must be a finite number/],
      [{ observed: 2, background: -0.1 }, {}, /background must be >= 0/],
      [{ observed: 2, background: Number.POSITIVE_INFINITY }, {}, /background must be a finite number/],
      [{ observed: 2, background: 2, backgroundUncertainty: -1 }, {}, /backgroundUncertainty must be >= 0/],
      [{ observed: 2, background: 2, signalUncertainty: Number.NaN }, {}, /signalUncertainty must be a finite number/],
      [{ observed: 2, background: 2 }, { cl: 1 }, /cl must be strictly between 0 and 1/],
      [{ observed: 2, background: 2 }, { cl: 0 }, /cl must be strictly between 0 and 1/],
      [{ observed: 2, background: 2 }, { method: 'magic' }, /method must be one of/],
      [{ observed: 2, background: 2 }, { uncertaintyModel: 'flat' }, /uncertaintyModel must be one of/],
      [{ observed: 2, background: 2 }, { seed: -3 }, /seed must be a whole number/],
      [{ observed: 2, background: 2, backgroundUncertainty: 1 }, { method: 'exact' }, /exact method needs a known background/],
    ];
    for (const [region, options, message] of bad) {
      let caught: unknown;
      try {
        upperLimit(region as never, options as never);
      } catch (error) {
        caught = error;
      }
      expect(caught, String(message)).toMatchObject({ name: 'TamisError', code: 'bad_input' });
      expect((caught as Error).message).toMatch(message);
    }
  });

  it('a 90% CL limit is below the 95% CL limit', () => {
    const ninety = upperLimit({ observed: 4, background: 2, backgroundUncertainty: 0.5 }, { cl: 0.9 });
    const ninetyFive = upperLimit({ observed: 4, background: 2, backgroundUncertainty: 0.5 }, { cl: 0.95 });
    expect(ninety.observed).toBeLessThan(ninetyFive.observed);
    expect(ninety.cl).toBe(0.9);
  });
});
