import { describe, expect, it } from 'vitest';
import { findRootNewtonFromGuess, findRootNewtonSafe } from '../../src/stats/newtonRootFinding.js';
import { bracketNear, expandBracketUpward, findRootBisection, findRootBrent, type ValueAndSlope } from '../../src/stats/rootFinding.js';
import { expectClose } from '../helpers.js';

describe('root finding', () => {
  it('Brent finds sqrt(2) (doc example) and roots of steep and flat functions', () => {
    expectClose(findRootBrent((x) => x * x - 2, { low: 0, high: 2, fLow: -2, fHigh: 2 }), Math.SQRT2, { rel: 1e-10 });
    const steep = (x: number): number => Math.exp(50 * (x - 0.3)) - 1;
    expectClose(findRootBrent(steep, { low: 0, high: 1, fLow: steep(0), fHigh: steep(1) }), 0.3, { abs: 1e-10 });
    const cubic = (x: number): number => (x - 1.5) ** 3;
    expectClose(findRootBrent(cubic, { low: 0, high: 4, fLow: cubic(0), fHigh: cubic(4) }, { absolute: 1e-14, relative: 1e-14 }), 1.5, { abs: 1e-4 });
  });

  it('Brent copes with infinite values at a bracket end (sign only)', () => {
    const f = (x: number): number => (x === 0 ? Number.POSITIVE_INFINITY : 1 / x - 2);
    expectClose(findRootBrent(f, { low: 0, high: 10, fLow: Number.POSITIVE_INFINITY, fHigh: f(10) }), 0.5, { rel: 1e-9 });
  });

  it('rejects a bracket without a sign change and NaN values', () => {
    expect(() => findRootBrent((x) => x, { low: 1, high: 2, fLow: 1, fHigh: 2 })).toThrow(/does not change sign/);
    expect(() => findRootBrent(() => Number.NaN, { low: -1, high: 2, fLow: -1, fHigh: 2 })).toThrow(/undefined function value/);
  });

  it('expandBracketUpward doubles until the sign changes (doc example) and reports a missing sign change', () => {
    expect(expandBracketUpward((x) => 5 - x, 0, 1).high).toBe(8);
    const far = expandBracketUpward((x) => 1e40 - x, 0, 1);
    expect(far.fHigh).toBeLessThanOrEqual(0);
    expect(far.fLow).toBeGreaterThan(0);
    expect(() => expandBracketUpward(() => 1, 0, 1)).toThrow(/no sign change/);
  });

  it('bracketNear brackets from above and below a guess', () => {
    const f = (x: number): number => 5 - x;
    for (const guess of [0.01, 1, 4.99, 5.01, 80, 1e6]) {
      const bracket = bracketNear(f, guess, 5);
      expect(bracket.fLow).toBeGreaterThan(0);
      expect(bracket.fHigh).toBeLessThanOrEqual(0);
      expect(bracket.low).toBeLessThanOrEqual(5);
      expect(bracket.high).toBeGreaterThanOrEqual(5);
    }
  });

  it('bisection locates the jump of a step function', () => {
    const step = (x: number): number => (x < 1.25 ? 1 : -1);
    expectClose(findRootBisection(step, { low: 0, high: 2, fLow: 1, fHigh: -1 }, { relative: 1e-6 }), 1.25, { rel: 2e-6 });
  });

  it('safeguarded Newton converges on sqrt(2) (doc example) and survives a zero derivative', () => {
    const square = (x: number, out: ValueAndSlope): void => {
      out.value = x * x - 2;
      out.slope = 2 * x;
    };
    expectClose(findRootNewtonSafe(square, { low: 0, high: 2, fLow: -2, fHigh: 2 }, {}, 0), Math.SQRT2, { rel: 1e-10 });
    const flatStart = (x: number, out: ValueAndSlope): void => {
      out.value = Math.tanh(x - 3);
      out.slope = x > 10 ? 0 : 1 - Math.tanh(x - 3) ** 2;
    };
    expectClose(findRootNewtonSafe(flatStart, { low: 0, high: 100, fLow: Math.tanh(-3), fHigh: 1 }, {}, 100), 3, { abs: 1e-9 });
  });

  it('Newton from a guess finds the root of decreasing functions from either side', () => {
    const line = (x: number, out: ValueAndSlope): void => {
      out.value = 3 - x;
      out.slope = -1;
    };
    expectClose(findRootNewtonFromGuess(line, 1, 3), 3, { rel: 1e-12 });
    const logCurve = (x: number, out: ValueAndSlope): void => {
      out.value = Math.log(7) - Math.log(x + 1);
      out.slope = -1 / (x + 1);
    };
    for (const guess of [0.001, 1, 6, 6.000001, 50, 1e9]) expectClose(findRootNewtonFromGuess(logCurve, guess, Math.log(7)), 6, { rel: 1e-9 }, `guess ${guess}`);
  });
});
