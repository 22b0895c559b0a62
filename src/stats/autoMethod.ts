/**
 * The `auto` rule: which CLs method to run for a region or a combination.
 *
 * 1. One region with no uncertainty at all: `exact`. Exact Poisson sums are
 *    exact at every count and cost microseconds, even at b = 1e6.
 * 2. Otherwise `asymptotic` when both the observed count and the background of
 *    the region (or of the combination's equivalent single region, below) are
 *    at least ASYMPTOTIC_MIN_COUNT; `toys` below. The asymptotic formulas rest
 *    on Wald's approximation, whose error shrinks like 1/sqrt(count)
 *    (Cowan et al. 2011); tamis's own comparison of the two methods
 *    (tests/stats/asymptoticVersusToys.test.ts, figures in DEVELOPERS.md)
 *    finds the observed and median limits within 5% from 50 events on, while
 *    at a few events the asymptotic limits are 10-40% too strong.
 *
 * Equivalent single region of a combination (a tamis convention): the region
 * with the same total signal S = sum s_i and the same sensitivity to a small
 * signal, S^2 / B = sum s_i^2 / b_i, so B = S^2 / sum(s_i^2 / b_i); its observed
 * count weights each region like the log-likelihood ratio does at small signal,
 * N = S sum(s_i n_i / b_i) / sum(s_i^2 / b_i). For one region these are b and n;
 * for R identical regions R b and R n; a combination whose sensitivity comes
 * from one nearly background-free region gets a small B, hence pseudo-experiments.
 */
import type { ResolvedLimitMethod } from './types.js';

/** Counts from which `auto` trusts the asymptotic formulas. */
export const ASYMPTOTIC_MIN_COUNT = 50;

/** Background floor in the equivalent-region weights (events), so b = 0 gives a finite, tiny B. */
const BACKGROUND_FLOOR = 1e-6;

/**
 * Observed count and background of the equivalent single region (see the module comment).
 *
 * @example
 * equivalentSingleRegion([{ observed: 5, background: 4, signal: 1 }, { observed: 5, background: 4, signal: 1 }]) // { observed: 10, background: 8 }
 */
export function equivalentSingleRegion(regions: readonly { observed: number; background: number; signal: number }[]): { observed: number; background: number } {
  let totalSignal = 0;
  let information = 0;
  let weightedObserved = 0;
  for (const r of regions) {
    if (!(r.signal > 0)) continue;
    const b = Math.max(r.background, BACKGROUND_FLOOR);
    totalSignal += r.signal;
    information += (r.signal * r.signal) / b;
    weightedObserved += (r.signal * r.observed) / b;
  }
  if (!(information > 0)) return { observed: 0, background: 0 };
  return { observed: (totalSignal * weightedObserved) / information, background: (totalSignal * totalSignal) / information };
}

/**
 * The method `auto` picks for a region (or an equivalent single region) with
 * these counts; `hasUncertainty` is false when no background or signal
 * uncertainty enters and `single` is true for one region.
 *
 * @example
 * chooseMethod(3, 2.5, false, true) // 'exact'
 */
export function chooseMethod(observed: number, background: number, hasUncertainty: boolean, single: boolean): ResolvedLimitMethod {
  if (single && !hasUncertainty) return 'exact';
  return Math.min(observed, background) >= ASYMPTOTIC_MIN_COUNT ? 'asymptotic' : 'toys';
}
