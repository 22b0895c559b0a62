/**
 * Shards of a scan for batch-cluster array jobs: `--shard k/N` runs the points
 * whose index i has i mod N = k - 1. The split depends only on the indices, so
 * the shards cover the scan exactly once and `tamis merge` rebuilds it.
 */
import { TamisError } from '../../errors.js';

export interface Shard {
  /** 1-based shard number. */
  index: number;
  count: number;
}

export const WHOLE_SCAN: Shard = { index: 1, count: 1 };

/**
 * Parses "k/N" with 1 <= k <= N.
 *
 * @example
 * parseShard('2/8') // { index: 2, count: 8 }
 */
export function parseShard(text: string): Shard {
  const match = /^\s*(\d+)\s*\/\s*(\d+)\s*$/.exec(text);
  if (!match) throw new TamisError('bad_input', `expected k/N, e.g. 3/10, got "${text}"`, { key: '--shard' });
  const index = Number(match[1]);
  const count = Number(match[2]);
  if (!(count >= 1 && index >= 1 && index <= count)) throw new TamisError('bad_input', `shard number must be from 1 to ${count}, got ${index}`, { key: '--shard' });
  return { index, count };
}

export function inShard(pointIndex: number, shard: Shard): boolean {
  return pointIndex % shard.count === shard.index - 1;
}
