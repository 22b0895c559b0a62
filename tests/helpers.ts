/**
 * Shared test helpers. `expectClose` is the one way tests compare floating
 * values with a reference: relative tolerance by default, absolute on request.
 */
import { expect } from 'vitest';

export interface Tolerance {
  /** Relative tolerance |a - e| <= rel |e|. */
  rel?: number;
  /** Absolute tolerance |a - e| <= abs. */
  abs?: number;
}

/** Passes when |actual - expected| <= max(rel |expected|, abs). */
export function expectClose(actual: number, expected: number, tolerance: Tolerance = { rel: 1e-9 }, label = ''): void {
  const rel = tolerance.rel ?? 0;
  const abs = tolerance.abs ?? 0;
  const allowed = Math.max(rel * Math.abs(expected), abs);
  const difference = Math.abs(actual - expected);
  if (!(difference <= allowed)) {
    const relative = expected !== 0 ? ` (relative ${(difference / Math.abs(expected)).toExponential(2)})` : '';
    expect.fail(`${label ? label + ': ' : ''}expected ${actual} to be within ${allowed.toExponential(2)} of ${expected}, differs by ${difference.toExponential(2)}${relative}`);
  }
}
