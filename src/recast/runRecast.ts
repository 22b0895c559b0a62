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
import { recastEventFile } from './recastEventFile.js';
import { TamisError } from '../errors.js';
import { parseModel } from '../generator/model/loader.js';
import type { Analysis } from '../selection/analysis.js';
import type { PointResult } from './types.js';
import { writeRecastOutputs } from './writeRecastOutputs.js';

export interface RunRecastOptions {
  /** Model to generate (or, with `eventFile`, only to name the result). */
  modelFile?: string;
  /** Les Houches file to recast instead of generating events. */
  eventFile?: string;
  /** Cross section of the event file's sample, pb (default: its init block). */
  crossSectionPb?: number;
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
  const analyses = loadAnalyses(options.analyses);
  const result = options.eventFile !== undefined ? await recastFile(options, options.eventFile, analyses) : await generateAndRecast(options, analyses);
  const used = analyses.filter((a) => result.analyses.some((o) => o.id === a.id));
  const files = await writeRecastOutputs(options.outFolder, result, {
    command: options.command ?? 'tamis recast',
    modelFile: options.eventFile ?? options.modelFile ?? '',
    analysisFiles: used.map((a) => a.file),
    detectorFiles: [...new Set(used.map((a) => a.detectorFile))],
    settings: {
      seed: options.seed,
      events_per_energy: result.eventsPerEnergy,
      energies_tev: result.energies.map((e) => e.energyTeV),
      cl: result.cl,
      ...(options.eventFile === undefined ? { cross_section_precision: options.precision ?? RECAST_TARGET_RELATIVE_ERROR } : { event_file: options.eventFile }),
      limit_method: options.method ?? 'auto',
      uncertainty_model: options.uncertaintyModel ?? 'lognormal',
    },
  });
  return { result, files: files.map((f) => resolve(f)) };
}

async function recastFile(options: RunRecastOptions, eventFile: string, analyses: Analysis[]): Promise<PointResult> {
  const modelName = options.modelFile !== undefined ? parseModel(readTextFile(options.modelFile), options.modelFile).name : undefined;
  return recastEventFile({
    eventFile,
    analyses,
    seed: options.seed,
    ...(modelName ? { modelName } : {}),
    ...(options.crossSectionPb !== undefined ? { crossSectionPb: options.crossSectionPb } : {}),
    ...(options.cl !== undefined ? { cl: options.cl } : {}),
    ...(options.method ? { method: options.method } : {}),
    ...(options.uncertaintyModel ? { uncertaintyModel: options.uncertaintyModel } : {}),
  });
}

async function generateAndRecast(options: RunRecastOptions, analyses: Analysis[]): Promise<PointResult> {
  if (options.modelFile === undefined) throw new TamisError('bad_input', 'give a model file to generate, or --events FILE.lhe to recast existing events', { key: 'model' });
  const text = readTextFile(options.modelFile);
  return recastPoint({
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
}
