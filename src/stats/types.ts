/**
 * Public types of the statistics library. Counts and limits are numbers of
 * signal events unless a name says otherwise (a combination's limits are on
 * the signal strength mu, the factor that multiplies every region's signal).
 */
import type { RandomStream } from '../physics/random.js';

/** How CLs is computed; `auto` chooses among the other three (see `chooseMethod`). */
export type LimitMethod = 'exact' | 'toys' | 'asymptotic' | 'auto';

/** The method that actually ran. */
export type ResolvedLimitMethod = 'exact' | 'toys' | 'asymptotic';

/** Shape of the background-uncertainty constraint. */
export type UncertaintyModel = 'lognormal' | 'gaussian';

/** One counting region as published: observed events and the background estimate. */
export interface CountingRegion {
  /** Observed events (a whole number >= 0). */
  observed: number;
  /** Expected background events (>= 0). */
  background: number;
  /** Absolute uncertainty on the background, in events. @default 0 */
  backgroundUncertainty?: number;
  /** Relative uncertainty on the signal (0.1 = 10%). @default 0 */
  signalUncertainty?: number;
}

/** A region entering a combination: the signal it would see at mu = 1. */
export interface CombinationRegion extends CountingRegion {
  /** Expected signal events at signal strength mu = 1 (>= 0; at least one region > 0). */
  signal: number;
  /** Regions sharing a group name have fully correlated background uncertainties. @default independent */
  group?: string;
  /** Used in error messages. */
  name?: string;
}

export interface LimitOptions {
  /** Confidence level of the upper limit, in (0, 1). @default 0.95 */
  cl?: number;
  /** @default 'auto' */
  method?: LimitMethod;
  /** @default 'lognormal' */
  uncertaintyModel?: UncertaintyModel;
  /** Random stream for pseudo-experiments; when absent, `RandomStream.forStream(seed)` is used. */
  rng?: RandomStream;
  /** Seed for pseudo-experiments when `rng` is absent. @default 1 */
  seed?: number;
  /** Pseudo-experiments are added until the standard error of CLs at the observed limit is below this (absolute). @default 0.05 * (1 - cl) */
  toyTolerance?: number;
  /** Fewest pseudo-experiments. @default 1000 */
  minToys?: number;
  /**
   * Most pseudo-experiments (the reported error says how far the tolerance was
   * reached); a combination also keeps at most 2e6 / regions of them in memory.
   * @default 1e6 for one region, 2e5 for a combination
   */
  maxToys?: number;
}

/** Median expected limit and the ±1σ and ±2σ band edges (minus2 <= minus1 <= median <= plus1 <= plus2). */
export interface ExpectedLimits {
  minus2: number;
  minus1: number;
  median: number;
  plus1: number;
  plus2: number;
}

export interface UpperLimitResult {
  /** Observed upper limit (signal events for one region, signal strength for a combination). */
  observed: number;
  expected: ExpectedLimits;
  method: ResolvedLimitMethod;
  cl: number;
  /** Monte Carlo standard error of CLs at the observed limit (0 for exact and asymptotic). */
  clsAtLimitError: number;
  /** Pseudo-experiments used (0 for exact and asymptotic). */
  toys: number;
}

/** The five band edges in order, with the standard-normal quantile N of each. */
export const BAND_KEYS = ['minus2', 'minus1', 'median', 'plus1', 'plus2'] as const;
export const BAND_SIGMAS = [-2, -1, 0, 1, 2] as const;
