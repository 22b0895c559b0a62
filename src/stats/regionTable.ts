/**
 * Limits for a table of regions (as read by `regionsCsv.ts`): each region
 * alone, the best-expected region, and the combination of all of them on
 * the signal strength mu (multiples of each region's `signal`).
 * Randomness: region i uses stream (seed, i), the combination (seed, count).
 */
import { RandomStream } from '../physics/random.js';
import { combinedUpperLimit } from './combination.js';
import { bestExpectedRegion } from './physicsLimits.js';
import type { RegionRow } from './regionsCsv.js';
import type { LimitOptions, UpperLimitResult } from './types.js';
import { upperLimit } from './upperLimit.js';

export interface RegionTableLimits {
  /** Per region: limits on its signal events. */
  regions: { row: RegionRow; limit: UpperLimitResult }[];
  /** Limits on mu for all regions together (absent for a single region). */
  combined?: UpperLimitResult;
  /** Index of the region with the smallest expected limit on mu (median N95 / signal), -1 if none has signal. */
  bestExpected: number;
}

/**
 * Limits for every region of a table and for their combination.
 * `signalUncertainty` applies to rows without their own value.
 *
 * @example
 * regionTableLimits([{ name: 'A', observed: 0, background: 1, backgroundUncertainty: 0, signal: 1, line: 2 }], {}).regions[0].limit.observed
 * // 2.995732273553991
 */
export function regionTableLimits(rows: readonly RegionRow[], options: LimitOptions, signalUncertainty = 0): RegionTableLimits {
  const seed = options.seed ?? 1;
  const streamFor = (index: number): RandomStream => (options.rng !== undefined ? options.rng.split() : RandomStream.forStream(seed, index));
  const regions = rows.map((row, i) => ({
    row,
    limit: upperLimit({ ...row, signalUncertainty: row.signalUncertainty ?? signalUncertainty }, { ...options, rng: streamFor(i) }),
  }));
  const bestExpected = bestExpectedRegion(regions.map((r) => (r.row.signal > 0 ? r.limit.expected.median / r.row.signal : Number.POSITIVE_INFINITY)));
  const result: RegionTableLimits = { regions, bestExpected };
  if (rows.length > 1) {
    // The exact method has no combination: the combination then runs pseudo-experiments.
    const method = options.method === 'exact' ? 'toys' : options.method;
    result.combined = combinedUpperLimit(
      rows.map((row) => ({ ...row, signalUncertainty: row.signalUncertainty ?? signalUncertainty })),
      { ...options, method, rng: streamFor(rows.length) },
    );
  }
  return result;
}
