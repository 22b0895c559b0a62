/**
 * Checkpoints of a scan: one JSON file per finished point under
 * `<out>/points/`, written atomically, so a killed scan resumes where it
 * stopped and shards of one scan merge by copying files. Each file carries
 * the scan's fingerprint: points made from other inputs are never reused.
 */
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { TamisError } from '../../errors.js';
import { writeFileAtomic } from '../../io/atomicWrite.js';
import type { PointResult } from '../types.js';

export interface PointCheckpoint {
  fingerprint: string;
  scan: string;
  index: number;
  parameters: Record<string, number>;
  result: PointResult;
}

const NUMBER_TAG = '__tamis_number__:';

/** JSON text that keeps NaN and infinities (JSON itself cannot). */
export function encodeJson(value: unknown): string {
  return `${JSON.stringify(value, (_k, v: unknown) => (typeof v === 'number' && !Number.isFinite(v) ? `${NUMBER_TAG}${v}` : v))}\n`;
}

export function decodeJson<T>(text: string): T {
  return JSON.parse(text, (_k, v: unknown) => (typeof v === 'string' && v.startsWith(NUMBER_TAG) ? Number(v.slice(NUMBER_TAG.length)) : v)) as T;
}

export function pointsFolder(outFolder: string): string {
  return join(outFolder, 'points');
}

export function checkpointFile(outFolder: string, index: number): string {
  return join(pointsFolder(outFolder), `point-${String(index).padStart(6, '0')}.json`);
}

export function writeCheckpoint(outFolder: string, checkpoint: PointCheckpoint): void {
  writeFileAtomic(checkpointFile(outFolder, checkpoint.index), encodeJson(checkpoint));
}

/**
 * The checkpoints found in `outFolder` (index -> checkpoint). A checkpoint of
 * another scan (other fingerprint) is an error naming the file, unless
 * `ignoreForeign` is set, when it is skipped.
 */
export function readCheckpoints(outFolder: string, fingerprint: string | undefined, ignoreForeign = false): Map<number, PointCheckpoint> {
  const found = new Map<number, PointCheckpoint>();
  const folder = pointsFolder(outFolder);
  if (!existsSync(folder)) return found;
  for (const name of readdirSync(folder).sort()) {
    if (!/^point-\d+\.json$/.test(name)) continue;
    const file = join(folder, name);
    let checkpoint: PointCheckpoint;
    try {
      checkpoint = decodeJson<PointCheckpoint>(readFileSync(file, 'utf8'));
    } catch (error) {
      throw new TamisError('bad_file', `not a readable scan checkpoint: ${(error as Error).message}`, { file, suggestion: 'delete the file to recompute that point' });
    }
    if (typeof checkpoint.index !== 'number' || typeof checkpoint.fingerprint !== 'string' || checkpoint.result === undefined) {
      throw new TamisError('bad_file', 'not a scan checkpoint (missing index, fingerprint or result)', { file });
    }
    if (fingerprint !== undefined && checkpoint.fingerprint !== fingerprint) {
      if (ignoreForeign) continue;
      throw new TamisError('bad_input', 'this folder holds points of a scan made from other inputs (scan, model, analyses or tamis version changed)', {
        file,
        suggestion: 'use another --out folder, or run again with --fresh to discard the old points',
      });
    }
    found.set(checkpoint.index, checkpoint);
  }
  return found;
}
