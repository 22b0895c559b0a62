/**
 * The machine-readable shape of limit results (the JSON printed by
 * `tamis limit --json`; scripts rely on these keys) and the rows of its
 * terminal tables. Numbers stay numbers here; the CLI formats them.
 */
import type { RegionTableLimits } from './regionTable.js';
import type { ExpectedLimits, UpperLimitResult } from './types.js';

export interface LimitJson {
  cl: number;
  method: string;
  observed_limit: number;
  expected_limit: ExpectedLimits;
  cls_at_limit_error: number;
  toys: number;
}

/**
 * The JSON object of one limit result (limits in signal events for one region).
 *
 * @example
 * limitJson(upperLimit({ observed: 0, background: 0 })).observed_limit // 2.995732273553991
 */
export function limitJson(result: UpperLimitResult): LimitJson {
  return {
    cl: result.cl,
    method: result.method,
    observed_limit: result.observed,
    expected_limit: { ...result.expected },
    cls_at_limit_error: result.clsAtLimitError,
    toys: result.toys,
  };
}

/** The JSON object of a region table: per-region limits (events), the combination (signal strength) and the best-expected region. */
export function regionTableJson(table: RegionTableLimits, cl: number, requestedMethod: string): object {
  const best = table.regions[table.bestExpected];
  return {
    cl,
    method: requestedMethod,
    regions: table.regions.map(({ row, limit }) => ({ name: row.name, ...withoutCl(limitJson(limit)) })),
    combined: table.combined === undefined ? null : { ...withoutCl(limitJson(table.combined)), unit: 'signal strength (multiples of the signal column)' },
    best_expected_region: best === undefined ? null : best.row.name,
  };
}

function withoutCl(json: LimitJson): Omit<LimitJson, 'cl'> {
  const { cl: _cl, ...rest } = json;
  return rest;
}

/** Column headers of the limit rows. */
export const LIMIT_COLUMNS = ['observed', 'expected', '-2σ', '-1σ', '+1σ', '+2σ'] as const;

/** [observed, median, -2σ, -1σ, +1σ, +2σ] of a result, in the order of LIMIT_COLUMNS. */
export function limitRow(result: UpperLimitResult): number[] {
  const e = result.expected;
  return [result.observed, e.median, e.minus2, e.minus1, e.plus1, e.plus2];
}
