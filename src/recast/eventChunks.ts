/**
 * The unit of work of a recast: one chunk of generated events at one energy,
 * passed through the detector of every profile in use and through the
 * selection of every analysis at that energy. A chunk's result is plain data
 * (selection sums), so chunks run on any worker and merge in chunk order:
 * the same seed gives the same bytes whatever the number of workers.
 *
 * Random streams: the events of chunk k come from the generator's own
 * stream (seed, ...pointId, energy, events, k); the detector of a profile
 * draws from (seed, ...pointId, energy, STREAM_RECAST_DETECTOR, k, profile
 * hash), so adding or removing an analysis never changes another's numbers.
 */
import { createHash } from 'node:crypto';
import { createDetector, type Detector } from '../detector/detector.js';
import { loadDetectorProfile } from '../detector/profile/loader.js';
import { RecoEvent } from '../detector/recoEvent.js';
import { parseModel } from '../generator/model/loader.js';
import { prepareEventGeneration, type EventGenerator } from '../generator/generateEvents.js';
import { RandomStream, mix32 } from '../physics/random.js';
import type { Analysis } from '../selection/analysis.js';
import { createSelection } from '../selection/engine.js';
import { loadAnalysis } from '../selection/loader.js';
import type { SelectionResults } from '../selection/results.js';
import { requirementVariants } from './requirementCosts.js';
import type { EnergyCrossSection } from './types.js';

/** Stream tag of the recast's detector random numbers ("RDET"). */
export const STREAM_RECAST_DETECTOR = 0x52444554;

/** The model as text, so scan points with substituted parameters travel to workers unchanged. */
export interface ModelSource {
  text: string;
  /** File name for messages (the base model file of a scan). */
  file: string;
}

export interface ChunkTask {
  kind: 'chunk';
  model: ModelSource;
  energyTeV: number;
  /** Total events of the sample at this energy (fixes the chunk plan). */
  events: number;
  seed: number;
  pointId: number[];
  /** Relative MC error of the sampler's integration. */
  targetRelativeError: number;
  /** Analysis files (absolute paths) of this energy, in report order. */
  analysisFiles: string[];
  chunk: number;
  /** Also run the requirement variants of each analysis (see requirementCosts.ts). */
  requirementCosts: boolean;
}

/** Per detector profile, the selection results of its analyses for one chunk. */
export interface ChunkResult {
  chunk: number;
  events: number;
  /** The sample's cross section (chunk 0 only: every chunk shares the sampler). */
  crossSection?: EnergyCrossSection;
  /** One entry per detector profile, in the order the profiles first appear among the analyses. */
  groups: { detectorFile: string; results: SelectionResults; variants?: SelectionResults }[];
}

/** Hash of a text into a stream id (31 bits, stable across runs and platforms). */
export function streamIdOf(text: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) h = mix32(h ^ text.charCodeAt(i));
  return h >>> 1;
}

export function sha256(text: string): string {
  return createHash('sha256').update(text).digest('hex');
}

// Per-thread caches: a worker handles many chunks of the same model and energy.
const generators = new Map<string, EventGenerator>();
const analysesByFile = new Map<string, Analysis>();
const detectors = new Map<string, Detector>();

function generatorFor(task: ChunkTask): EventGenerator {
  const key = [sha256(task.model.text), task.energyTeV, task.events, task.seed, task.pointId.join('.'), task.targetRelativeError].join('|');
  let generator = generators.get(key);
  if (generator === undefined) {
    if (generators.size >= 4) generators.delete(generators.keys().next().value!);
    const model = parseModel(task.model.text, task.model.file);
    generator = prepareEventGeneration(model, {
      energyTeV: task.energyTeV,
      events: task.events,
      seed: task.seed,
      pointId: task.pointId,
      targetRelativeError: task.targetRelativeError,
    });
    generators.set(key, generator);
  }
  return generator;
}

function analysisFor(file: string): Analysis {
  let analysis = analysesByFile.get(file);
  if (analysis === undefined) {
    analysis = loadAnalysis(file);
    analysesByFile.set(file, analysis);
  }
  return analysis;
}

const variantCache = new Map<Analysis, Analysis[]>();

function variantsFor(analysis: Analysis): Analysis[] {
  let variants = variantCache.get(analysis);
  if (variants === undefined) {
    variants = requirementVariants(analysis);
    variantCache.set(analysis, variants);
  }
  return variants;
}

function detectorFor(file: string): Detector {
  let detector = detectors.get(file);
  if (detector === undefined) {
    detector = createDetector(loadDetectorProfile(file));
    detectors.set(file, detector);
  }
  return detector;
}

/** Groups analyses by detector profile, keeping first-appearance order. */
export function groupByDetector(analyses: readonly Analysis[]): { detectorFile: string; analyses: Analysis[] }[] {
  const groups: { detectorFile: string; analyses: Analysis[] }[] = [];
  for (const analysis of analyses) {
    let group = groups.find((g) => g.detectorFile === analysis.detectorFile);
    if (group === undefined) {
      group = { detectorFile: analysis.detectorFile, analyses: [] };
      groups.push(group);
    }
    group.analyses.push(analysis);
  }
  return groups;
}

/** Generates, reconstructs and selects the events of one chunk. */
export function runChunk(task: ChunkTask): ChunkResult {
  const generator = generatorFor(task);
  const groups = groupByDetector(task.analysisFiles.map(analysisFor)).map((group) => ({
    detectorFile: group.detectorFile,
    detector: detectorFor(group.detectorFile),
    selection: createSelection(group.analyses),
    // Requirement variants need no cut blame: a separate selection without it is much cheaper.
    variants: task.requirementCosts ? createSelection(group.analyses.flatMap(variantsFor), { blame: false }) : undefined,
    rng: RandomStream.forStream(task.seed, ...task.pointId, Math.round(1000 * task.energyTeV), STREAM_RECAST_DETECTOR, task.chunk, streamIdOf(group.detectorFile.replace(/^.*[\\/]/, ''))),
  }));
  const reco = new RecoEvent();
  const events = generator.generateChunks(task.chunk, task.chunk + 1, (record, index) => {
    for (let g = 0; g < groups.length; g++) {
      const group = groups[g]!;
      group.detector.reconstruct(record, group.rng, reco);
      group.selection.process(reco, index);
      group.variants?.process(reco, index);
    }
  });
  const result: ChunkResult = {
    chunk: task.chunk,
    events,
    groups: groups.map((g) => ({ detectorFile: g.detectorFile, results: g.selection.results(), ...(g.variants ? { variants: g.variants.results() } : {}) })),
  };
  if (task.chunk === 0) {
    const xs = generator.sampler.crossSection();
    result.crossSection = {
      energyTeV: task.energyTeV,
      sigmaPb: xs.sigmaPb,
      errorPb: xs.errorPb,
      scaleBandPb: xs.scaleBandPb,
      channels: xs.channels.map((c) => ({ name: c.name, sigmaPb: c.sigmaPb, errorPb: c.errorPb, kFactor: c.kFactor })),
      events: task.events,
    };
  }
  return result;
}

/** Number of chunks of a sample (mirrors the generator's chunk plan). */
export { EVENTS_PER_CHUNK } from '../generator/generateEvents.js';
