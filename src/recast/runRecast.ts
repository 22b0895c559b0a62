/**
 * `tamis recast` as a library call: read the model and the analyses, recast
 * the point, write the outputs. The CLI only parses options and prints.
 */
import { availableParallelism } from 'node:os';
import { resolve } from 'node:path';
import { readTextFile } from '../io/yamlFile.js';
import { loadAnalyses } from '../selection/loader.js';
import type { LimitMethod, UncertaintyModel } from '../stats/index.js';
import { RECAST_TARGET_RELATIVE_ERROR, recastPoint } from './recastPoint.js';
import type { PointResult } from './types.js';
import { writeRecastOutputs } from './writeRecastOutputs.js';

export interface RunRecastOptions {
  modelFile: string;
  /** Analysis files or folders. */
  analyses: readonly string[];
  energies?: readonly number[];
  events: number;
  seed: number;
  workers?: number;
  outFolder: string;
  cl?: number;
  /** Relative MC error of the cross sections. @default RECAST_TARGET_RELATIVE_ERROR */
  precision?: number;
  method?: LimitMethod;
  uncertaintyModel?: UncertaintyModel;
  /** The command line, recorded in summary.json. */
  command?: string;
  onProgress?: (done: number, total: number) => void;
}

export const DEFAULT_RECAST_EVENTS = 50_000;

/** Worker threads used when none are asked for: one per available core. */
export function defaultWorkers(): number {
  return Math.max(1, availableParallelism());
}

export async function runRecast(options: RunRecastOptions): Promise<{ result: PointResult; files: string[] }> {
  const text = readTextFile(options.modelFile);
  const analyses = loadAnalyses(options.analyses);
  const result = await recastPoint({
    model: { text, file: options.modelFile },
    analyses,
    ...(options.energies ? { energies: options.energies } : {}),
    events: options.events,
    seed: options.seed,
    workers: options.workers ?? defaultWorkers(),
    ...(options.cl !== undefined ? { cl: options.cl } : {}),
    ...(options.precision !== undefined ? { targetRelativeError: options.precision } : {}),
    ...(options.method ? { method: options.method } : {}),
    ...(options.uncertaintyModel ? { uncertaintyModel: options.uncertaintyModel } : {}),
    ...(options.onProgress ? { onProgress: options.onProgress } : {}),
  });
  const used = analyses.filter((a) => result.analyses.some((o) => o.id === a.id));
  const files = await writeRecastOutputs(options.outFolder, result, {
    command: options.command ?? 'tamis recast',
    modelFile: options.modelFile,
    analysisFiles: used.map((a) => a.file),
    detectorFiles: [...new Set(used.map((a) => a.detectorFile))],
    settings: {
      seed: options.seed,
      events_per_energy: options.events,
      energies_tev: result.energies.map((e) => e.energyTeV),
      cl: result.cl,
      cross_section_precision: options.precision ?? RECAST_TARGET_RELATIVE_ERROR,
      limit_method: options.method ?? 'auto',
      uncertainty_model: options.uncertaintyModel ?? 'lognormal',
    },
  });
  return { result, files: files.map((f) => resolve(f)) };
}
