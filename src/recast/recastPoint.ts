/**
 * One model point end to end: the cross section at each energy, events in
 * chunks on worker threads, the detector and every analysis of that energy in
 * one pass, then limits per analysis. The result is plain data (`PointResult`)
 * from which every output is written.
 */
import { resolve } from 'node:path';
import { TamisError } from '../errors.js';
import { EVENTS_PER_CHUNK } from '../generator/generateEvents.js';
import { parseModel } from '../generator/model/loader.js';
import type { Analysis } from '../selection/analysis.js';
import { mergeSelectionResults, type AnalysisResult } from '../selection/results.js';
import type { LimitMethod, UncertaintyModel } from '../stats/index.js';
import { analysisOutcome } from './analysisOutcome.js';
import type { LimitTask } from './limitTask.js';
import { requirementCosts, type RequirementCost } from './requirementCosts.js';
import { groupByDetector, runChunk, sha256, type ChunkResult, type ChunkTask, type ModelSource } from './eventChunks.js';
import type { AnalysisOutcome, EnergyCrossSection, PointResult } from './types.js';
import { compiledModuleUrl, runTasks } from './workerPool.js';

export interface RecastOptions {
  model: ModelSource;
  /** Analyses to run (loaded); those at energies not in `energies` are left out. */
  analyses: readonly Analysis[];
  /** Collider energies in TeV. @default every energy of the analyses */
  energies?: readonly number[];
  /** Generated events per energy. */
  events: number;
  seed: number;
  /** Scan parameters of this point, recorded in the result. @default {} */
  parameters?: Record<string, number>;
  /** Ids of the point in a scan (part of every random stream). @default [] */
  pointId?: readonly number[];
  /** Worker threads for the event chunks. @default 1 */
  workers?: number;
  /** Confidence level. @default 0.95 */
  cl?: number;
  method?: LimitMethod;
  /** Method of each analysis's combination of regions. @default `method` */
  combinationMethod?: LimitMethod;
  uncertaintyModel?: UncertaintyModel;
  /** Relative MC error of the cross-section integration. @default 0.01 */
  targetRelativeError?: number;
  /** Also measure what each requirement costs each analysis (see requirementCosts.ts). @default true */
  requirementCosts?: boolean;
  /** Progress in chunks done out of all chunks. */
  onProgress?: (done: number, total: number) => void;
}

/**
 * Default relative MC error of the cross section in a recast: 1%, well below
 * the scale uncertainty (about ±8% at leading order) and half the integration
 * time of `tamis xsec`'s 0.5%.
 */
export const RECAST_TARGET_RELATIVE_ERROR = 0.01;

/** Energies to run: the requested ones (each must have an analysis) or all of the analyses'. */
export function energiesToRun(analyses: readonly Analysis[], requested?: readonly number[]): number[] {
  const available = [...new Set(analyses.map((a) => a.energyTev))].sort((a, b) => a - b);
  if (requested === undefined) return available;
  for (const e of requested) {
    if (!available.some((a) => Math.abs(a - e) < 1e-9)) {
      throw new TamisError('bad_input', `no analysis at ${e} TeV among the ones given (energies: ${available.join(', ')} TeV)`, { key: '--energy' });
    }
  }
  return [...requested].sort((a, b) => a - b);
}

/** The selection results of one model point, before any limit. */
export interface SelectedPoint {
  modelName: string;
  energies: EnergyCrossSection[];
  /** Per analysis (in the order given), its merged selection results. */
  selections: { analysis: Analysis; selected: AnalysisResult; crossSectionPb: number; requirementCosts: RequirementCost[] }[];
}

/** Generates the point at each energy and runs every analysis (no limits). */
export async function selectPoint(options: RecastOptions): Promise<SelectedPoint> {
  // Parse here as well: model errors surface before any worker starts.
  const model = parseModel(options.model.text, options.model.file);
  const energies = energiesToRun(options.analyses, options.energies);
  if (!(Number.isInteger(options.events) && options.events >= 1)) {
    throw new TamisError('bad_input', `number of events must be a whole number >= 1, got ${options.events}`, { key: '--events' });
  }
  const pointId = [...(options.pointId ?? [])];
  const target = options.targetRelativeError ?? RECAST_TARGET_RELATIVE_ERROR;
  const chunksPerEnergy = Math.ceil(options.events / EVENTS_PER_CHUNK);
  const withCosts = options.requirementCosts ?? true;
  const tasks: ChunkTask[] = [];
  const analysesAt = energies.map((e) => options.analyses.filter((a) => Math.abs(a.energyTev - e) < 1e-9));
  energies.forEach((energyTeV, i) => {
    const analysisFiles = analysesAt[i]!.map((a) => resolve(a.file));
    for (let chunk = 0; chunk < chunksPerEnergy; chunk++) {
      tasks.push({ kind: 'chunk', model: options.model, energyTeV, events: options.events, seed: options.seed, pointId, targetRelativeError: target, analysisFiles, chunk, requirementCosts: withCosts });
    }
  });
  let done = 0;
  const chunks = await runTasks<ChunkTask, ChunkResult>({
    tasks,
    workers: options.workers ?? 1,
    script: () => compiledModuleUrl('recast/recastWorker.js'),
    handle: runChunk,
    onResult: () => options.onProgress?.(++done, tasks.length),
    // A thread keeps to one energy: it prepares that energy's generator once.
    affinity: (task) => String(task.energyTeV),
  });
  const sigmas: EnergyCrossSection[] = [];
  const selections = energies.flatMap((energyTeV, i) => {
    const mine = chunks.filter((c, k) => tasks[k]!.energyTeV === energyTeV).sort((a, b) => a.chunk - b.chunk);
    const xs = mine[0]?.crossSection;
    if (xs === undefined) throw new TamisError('internal', `no cross section came back for ${energyTeV} TeV`);
    sigmas.push(xs);
    return groupByDetector(analysesAt[i]!).flatMap((group, g) => {
      const merged = mergeSelectionResults(mine.map((c) => c.groups[g]!.results));
      const variants = withCosts ? mergeSelectionResults(mine.map((c) => c.groups[g]!.variants!)) : undefined;
      const byId = new Map((variants?.analyses ?? []).map((r) => [r.id, r]));
      return group.analyses.map((analysis, a) => ({
        analysis,
        selected: merged.analyses[a]!,
        crossSectionPb: xs.sigmaPb,
        requirementCosts: withCosts ? requirementCosts(analysis, byId) : [],
      }));
    });
  });
  // Analyses in the order they were given.
  const order = new Map(options.analyses.map((a, i) => [a.id, i]));
  selections.sort((x, y) => order.get(x.analysis.id)! - order.get(y.analysis.id)!);
  return { modelName: model.name, energies: sigmas, selections };
}

/** Runs one model point with limits; see the module comment. */
export async function recastPoint(options: RecastOptions): Promise<PointResult> {
  const point = await selectPoint(options);
  const settings = {
    cl: options.cl ?? 0.95,
    method: options.method ?? 'auto',
    ...(options.combinationMethod === undefined ? {} : { combinationMethod: options.combinationMethod }),
    uncertaintyModel: options.uncertaintyModel ?? 'lognormal',
    seed: options.seed,
    pointId: [...(options.pointId ?? [])],
  };
  // Limits per analysis, spread over the workers (pseudo-experiments are the slow part).
  const limitTasks: LimitTask[] = point.selections.map((s) => ({ kind: 'limits', analysisFile: resolve(s.analysis.file), selected: s.selected, crossSectionPb: s.crossSectionPb, settings }));
  const outcomes = await runTasks<LimitTask, AnalysisOutcome>({
    tasks: limitTasks,
    workers: options.workers ?? 1,
    script: () => compiledModuleUrl('recast/recastWorker.js'),
    handle: (task) => {
      const s = point.selections.find((x) => resolve(x.analysis.file) === task.analysisFile && x.selected === task.selected)!;
      return analysisOutcome(s.analysis, s.selected, s.crossSectionPb, settings);
    },
  });
  return {
    model: { name: point.modelName, file: options.model.file, sha256: sha256(options.model.text), parameters: { ...(options.parameters ?? {}) } },
    seed: options.seed,
    eventsPerEnergy: options.events,
    cl: settings.cl,
    energies: point.energies,
    analyses: outcomes.map((o, i) => ({ ...o, requirementCosts: point.selections[i]!.requirementCosts })),
  };
}
