/**
 * The upper limit on the signal count of one counting region: the entry
 * point that validates the inputs, resolves `auto` and runs one of the three
 * CLs methods.
 */
import { TamisError } from '../errors.js';
import { chooseMethod } from './autoMethod.js';
import { asymptoticLimits } from './clsAsymptotic.js';
import { exactLimits } from './clsExact.js';
import { toyLimitsSingleRegion } from './clsToysSingle.js';
import { CountingModel } from './countingModel.js';
import { BAND_KEYS, type CountingRegion, type ExpectedLimits, type LimitOptions, type ResolvedLimitMethod, type UpperLimitResult } from './types.js';
import { resolveOptions, resolveRegion, type ResolvedOptions, type ResolvedRegion } from './validate.js';

/** Throws an `internal` error unless the limits are finite and the bands ordered. */
export function checkLimits(observed: number, expected: ExpectedLimits, method: string): void {
  let previous = 0;
  for (const key of BAND_KEYS) {
    const value = expected[key];
    if (!Number.isFinite(value) || value < previous * (1 - 1e-9)) {
      throw new TamisError('internal', `${method} limits are not finite and ordered: ${JSON.stringify(expected)}`);
    }
    previous = value;
  }
  if (!Number.isFinite(observed) || observed < 0) throw new TamisError('internal', `${method} observed limit is ${observed}`);
}

/** Limits for a checked region and resolved options (shared with the combination of one region). */
export function upperLimitResolved(region: ResolvedRegion, options: ResolvedOptions): UpperLimitResult {
  const { observed, background, backgroundUncertainty, signalUncertainty } = region;
  const hasUncertainty = backgroundUncertainty > 0 || signalUncertainty > 0;
  let method: ResolvedLimitMethod = options.method === 'auto' ? chooseMethod(observed, background, hasUncertainty, true) : options.method;
  if (method === 'exact' && hasUncertainty) {
    throw new TamisError('bad_input', 'the exact method needs a known background and signal (uncertainties of 0)', {
      key: 'method',
      suggestion: 'use method "toys", "asymptotic" or "auto"',
    });
  }
  let result: { observed: number; expected: ExpectedLimits; clsAtLimitError?: number; toys?: number };
  if (method === 'exact') {
    result = exactLimits(observed, background, options.cl);
  } else if (method === 'asymptotic') {
    const model = new CountingModel([{ ...region, signal: 1, group: 0 }], options.uncertaintyModel);
    result = asymptoticLimits(model, options.cl);
  } else {
    method = 'toys';
    result = toyLimitsSingleRegion(observed, background, backgroundUncertainty, signalUncertainty, {
      cl: options.cl,
      uncertaintyModel: options.uncertaintyModel,
      rng: options.rng,
      tolerance: options.toyTolerance,
      minToys: options.minToys,
      maxToys: options.maxToys,
    });
  }
  checkLimits(result.observed, result.expected, method);
  return {
    observed: result.observed,
    expected: result.expected,
    method,
    cl: options.cl,
    clsAtLimitError: result.clsAtLimitError ?? 0,
    toys: result.toys ?? 0,
  };
}

/**
 * CLs upper limits on the number of signal events in one counting region:
 * observed, and expected (median with ±1σ and ±2σ bands) under the
 * background-only hypothesis. Throws `bad_input` for negative or non-finite
 * counts, a non-whole observed count, cl outside (0, 1), or `exact` with an
 * uncertainty.
 *
 * @example
 * upperLimit({ observed: 0, background: 1.2 }).observed // 2.995732273553991 (exact CLs, -ln 0.05)
 * upperLimit({ observed: 12, background: 9.5, backgroundUncertainty: 2.1 }, { seed: 7 }).method // 'toys'
 */
export function upperLimit(region: CountingRegion, options: LimitOptions = {}): UpperLimitResult {
  return upperLimitResolved(resolveRegion(region), resolveOptions(options));
}
