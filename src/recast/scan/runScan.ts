/**
 * `tamis scan` as a library call: load the scan, skip the points already in
 * the output folder (checkpoints), run the others on worker threads (one
 * point per task), checkpoint each as it finishes, and write the tables,
 * plots and report once every point of the scan is there. With a shard, only
 * that shard's points run; `mergeScans` assembles the shards.
 */
import { existsSync, readFileSync, rmSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { TamisError } from '../../errors.js';
import { removeStaleTemporaries, writeFileAtomic } from '../../io/atomicWrite.js';
import { defaultWorkers } from '../runRecast.js';
import { compiledModuleUrl, runTasks } from '../workerPool.js';
import type { PointResult } from '../types.js';
import { decodeJson, encodeJson, pointsFolder, readCheckpoints, writeCheckpoint, type PointCheckpoint } from './checkpoints.js';
import { loadScan, type Scan } from './loadScan.js';
import { runScanPoint, type ScanPointTask } from './scanPointTask.js';
import { inShard, WHOLE_SCAN, type Shard } from './shard.js';
import { writeScanOutputs, type ScanDescription } from './writeScanOutputs.js';

export interface RunScanOptions {
  scanFile: string;
  outFolder: string;
  workers?: number;
  shard?: Shard;
  /** Discard the checkpoints of an earlier run in the folder. */
  fresh?: boolean;
  /** Progress: points finished (this run and earlier) out of the points to do. */
  onProgress?: (done: number, total: number) => void;
}

export interface ScanRun {
  scan: Scan;
  /** Points of this shard that were already done before this run. */
  resumed: number;
  /** Points run now. */
  computed: number;
  /** Whether every point of the scan is in the folder (then the outputs were written). */
  complete: boolean;
  files: string[];
}

/** The scan description stored beside the checkpoints (`scan.json`), read by `tamis merge`. */
export interface StoredScan {
  scan: ScanDescription;
  points: number;
}

export function describeScan(scan: Scan): ScanDescription {
  return { name: scan.name, description: scan.description, modelFile: scan.modelFile, axes: scan.axes, seed: scan.seed, events: scan.events, fingerprint: scan.fingerprint };
}

export function readStoredScan(folder: string): StoredScan {
  const file = join(folder, 'scan.json');
  if (!existsSync(file)) throw new TamisError('bad_file', 'not a scan output folder (no scan.json)', { file: folder, suggestion: 'give folders written by tamis scan' });
  try {
    return decodeJson<StoredScan>(readFileSync(file, 'utf8'));
  } catch (error) {
    throw new TamisError('bad_file', `cannot read the scan description: ${(error as Error).message}`, { file });
  }
}

function taskOf(scan: Scan, index: number): ScanPointTask {
  const point = scan.points[index]!;
  const task: ScanPointTask = {
    index,
    parameters: point.parameters,
    modelText: point.modelText,
    modelFile: scan.modelFile,
    analysisFiles: scan.analyses.map((a) => resolve(a.file)),
    energies: scan.energies,
    events: scan.events,
    seed: scan.seed,
    precision: scan.precision,
    cl: scan.limits.cl,
    method: scan.limits.method,
    uncertaintyModel: scan.limits.uncertainty_model,
  };
  if (scan.limits.combination_method !== undefined) task.combinationMethod = scan.limits.combination_method;
  return task;
}

export async function runScan(options: RunScanOptions): Promise<ScanRun> {
  const scan = loadScan(options.scanFile);
  const shard = options.shard ?? WHOLE_SCAN;
  const out = options.outFolder;
  if (options.fresh) rmSync(pointsFolder(out), { recursive: true, force: true });
  removeStaleTemporaries(pointsFolder(out));
  removeStaleTemporaries(out);
  const done = readCheckpoints(out, scan.fingerprint);
  const stored: StoredScan = { scan: describeScan(scan), points: scan.points.length };
  writeFileAtomic(join(out, 'scan.json'), encodeJson(stored));
  const mine = scan.points.filter((p) => inShard(p.index, shard)).map((p) => p.index);
  const todo = mine.filter((i) => !done.has(i));
  const resumed = mine.length - todo.length;
  let finished = resumed;
  options.onProgress?.(finished, mine.length);
  await runTasks<ScanPointTask, PointResult>({
    tasks: todo.map((i) => taskOf(scan, i)),
    workers: options.workers ?? defaultWorkers(),
    script: () => compiledModuleUrl('recast/scanWorker.js'),
    handle: runScanPoint,
    onResult: (k, result) => {
      const index = todo[k]!;
      const checkpoint: PointCheckpoint = { fingerprint: scan.fingerprint, scan: scan.name, index, parameters: scan.points[index]!.parameters, result };
      writeCheckpoint(out, checkpoint);
      done.set(index, checkpoint);
      options.onProgress?.(++finished, mine.length);
    },
  });
  const complete = scan.points.every((p) => done.has(p.index));
  const files = complete ? await writeScanOutputs(out, stored.scan, scan.points.map((p) => done.get(p.index)!)) : [];
  return { scan, resumed, computed: todo.length, complete, files };
}
