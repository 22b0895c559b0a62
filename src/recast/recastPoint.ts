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
import { limitSettingsOf } from './analysisOutcome.js';
import { runLimitTask, type LimitTask } from './limitTask.js';
import { requirementCosts, type RequirementCost } from './requirementCosts.js';
import { groupByDetector, runChunk, sha256, type ChunkResult, type ChunkTask, type ModelSource } from './eventChunks.js';
import type { AnalysisOutcome, EnergyCrossSection, PointResult } from './types.js';
import { compiledModuleUrl, WorkerPool } from './workerPool.js';

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

type RecastTask = ChunkTask | LimitTask;
type RecastReply = ChunkResult | AnalysisOutcome;

function recastPool(workers: number): WorkerPool<RecastTask, RecastReply> {
  return new WorkerPool<RecastTask, RecastReply>({
    workers,
    script: () => compiledModuleUrl('recast/recastWorker.js'),
    handle: (task) => (task.kind === 'limits' ? runLimitTask(task) : runChunk(task)),
    // A thread keeps to one energy: it prepares that energy's generator once.
    affinity: (task) => (task.kind === 'chunk' ? `energy ${task.energyTeV}` : `limits ${task.analysisFile}`),
  });
}

type Selection = SelectedPoint['selections'][number];

/**
 * Submits the event chunks of every energy to `pool`; each energy's promise
 * resolves with its cross section and merged selections once its chunks are
 * back (merged in chunk order, whatever order they finished in).
 */
function submitEnergies(options: RecastOptions, pool: WorkerPool<RecastTask, RecastReply>): { modelName: string; energies: Promise<{ xs: EnergyCrossSection; selections: Selection[] }>[] } {
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
  const total = energies.length * chunksPerEnergy;
  let done = 0;
  const perEnergy = energies.map(async (energyTeV) => {
    const analyses = options.analyses.filter((a) => Math.abs(a.energyTev - energyTeV) < 1e-9);
    const analysisFiles = analyses.map((a) => resolve(a.file));
    const replies = await Promise.all(
      Array.from({ length: chunksPerEnergy }, (_, chunk) =>
        pool
          .submit({ kind: 'chunk', model: options.model, energyTeV, events: options.events, seed: options.seed, pointId, targetRelativeError: target, analysisFiles, chunk, requirementCosts: withCosts })
          .then((reply) => {
            options.onProgress?.(++done, total);
            return reply as ChunkResult;
          }),
      ),
    );
    const xs = replies[0]?.crossSection;
    if (xs === undefined) throw new TamisError('internal', `no cross section came back for ${energyTeV} TeV`);
    const selections = groupByDetector(analyses).flatMap((group, g) => {
      const merged = mergeSelectionResults(replies.map((c) => c.groups[g]!.results));
      const variants = withCosts ? mergeSelectionResults(replies.map((c) => c.groups[g]!.variants!)) : undefined;
      const byId = new Map((variants?.analyses ?? []).map((r) => [r.id, r]));
      return group.analyses.map((analysis, a) => ({
        analysis,
        selected: merged.analyses[a]!,
        crossSectionPb: xs.sigmaPb,
        requirementCosts: withCosts ? requirementCosts(analysis, byId) : [],
      }));
    });
    return { xs, selections };
  });
  return { modelName: model.name, energies: perEnergy };
}

/** Analyses in the order they were given. */
function inGivenOrder<X extends { analysis: Analysis }>(options: RecastOptions, items: X[]): X[] {
  const order = new Map(options.analyses.map((a, i) => [a.id, i]));
  return items.sort((x, y) => order.get(x.analysis.id)! - order.get(y.analysis.id)!);
}

/** Generates the point at each energy and runs every analysis (no limits). */
export async function selectPoint(options: RecastOptions): Promise<SelectedPoint> {
  const pool = recastPool(options.workers ?? 1);
  try {
    const submitted = submitEnergies(options, pool);
    const done = await Promise.all(submitted.energies);
    return { modelName: submitted.modelName, energies: done.map((d) => d.xs), selections: inGivenOrder(options, done.flatMap((d) => d.selections)) };
  } finally {
    await pool.close();
  }
}

/**
 * Runs one model point with limits; see the module comment. The limits of an
 * energy's analyses start on the same threads as soon as that energy's events
 * are done.
 */
export async function recastPoint(options: RecastOptions): Promise<PointResult> {
  const settings = limitSettingsOf(options);
  const pool = recastPool(options.workers ?? 1);
  try {
    const submitted = submitEnergies(options, pool);
    const perEnergy = await Promise.all(
      submitted.energies.map(async (energy) => {
        const { xs, selections } = await energy;
        const outcomes = await Promise.all(
          selections.map(async (s) => {
            const outcome = (await pool.submit({ kind: 'limits', analysisFile: resolve(s.analysis.file), selected: s.selected, crossSectionPb: s.crossSectionPb, settings })) as AnalysisOutcome;
            return { analysis: s.analysis, outcome: { ...outcome, requirementCosts: s.requirementCosts } };
          }),
        );
        return { xs, outcomes };
      }),
    );
    return {
      model: { name: submitted.modelName, file: options.model.file, sha256: sha256(options.model.text), parameters: { ...(options.parameters ?? {}) } },
      seed: options.seed,
      eventsPerEnergy: options.events,
      cl: settings.cl,
      energies: perEnergy.map((e) => e.xs),
      analyses: inGivenOrder(options, perEnergy.flatMap((e) => e.outcomes)).map((x) => x.outcome),
    };
  } finally {
    await pool.close();
  }
}
