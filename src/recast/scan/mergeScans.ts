/**
 * `tamis merge`: the shards of one scan (folders written with `--shard k/N`)
 * into one folder with every point, then the tables, plots and report. The
 * shards must come from the same inputs (same fingerprint) and together hold
 * every point.
 */
import { TamisError } from '../../errors.js';
import { writeFileAtomic } from '../../io/atomicWrite.js';
import { join } from 'node:path';
import { encodeJson, readCheckpoints, writeCheckpoint, type PointCheckpoint } from './checkpoints.js';
import { readStoredScan } from './runScan.js';
import { writeScanOutputs } from './writeScanOutputs.js';

export async function mergeScans(folders: readonly string[], outFolder: string): Promise<{ points: number; files: string[] }> {
  if (folders.length === 0) throw new TamisError('bad_input', 'give at least one scan folder to merge');
  const stored = readStoredScan(folders[0]!);
  const points = new Map<number, PointCheckpoint>();
  for (const folder of folders) {
    const other = readStoredScan(folder);
    if (other.scan.fingerprint !== stored.scan.fingerprint) {
      throw new TamisError('bad_input', `this folder holds another scan (inputs differ from ${folders[0]})`, { file: folder });
    }
    for (const [index, checkpoint] of readCheckpoints(folder, stored.scan.fingerprint)) points.set(index, checkpoint);
  }
  const missing: number[] = [];
  for (let i = 0; i < stored.points; i++) if (!points.has(i)) missing.push(i);
  if (missing.length > 0) {
    const list = missing.length > 10 ? `${missing.slice(0, 10).join(', ')}, ... (${missing.length} in all)` : missing.join(', ');
    throw new TamisError('bad_input', `the folders lack scan points ${list}`, { suggestion: 'run the missing shards (tamis scan SCAN --shard k/N) and merge again' });
  }
  writeFileAtomic(join(outFolder, 'scan.json'), encodeJson(stored));
  const ordered = [...points.keys()].sort((a, b) => a - b).map((i) => points.get(i)!);
  for (const checkpoint of ordered) writeCheckpoint(outFolder, checkpoint);
  const files = await writeScanOutputs(outFolder, stored.scan, ordered);
  return { points: ordered.length, files };
}
