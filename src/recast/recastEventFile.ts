/**
 * Recasting events from a Les Houches file instead of generating them: the
 * file's collider energy picks the analyses, its init block gives the cross
 * section (the sum of the processes' XSECUP, unless the user gives one), and
 * every event passes once through the detector of each profile and every
 * analysis of that energy. Event weights (XWGTUP) weight the counts.
 */
import { basename } from 'node:path';
import { createDetector } from '../detector/detector.js';
import { loadDetectorProfile } from '../detector/profile/loader.js';
import { RecoEvent } from '../detector/recoEvent.js';
import { TamisError } from '../errors.js';
import { readLheFile } from '../generator/lhe/lheReader.js';
import { RandomStream } from '../physics/random.js';
import type { Analysis } from '../selection/analysis.js';
import { createSelection } from '../selection/engine.js';
import type { LimitMethod, UncertaintyModel } from '../stats/index.js';
import { analysisOutcome, limitSettingsOf } from './analysisOutcome.js';
import { groupByDetector, STREAM_RECAST_DETECTOR, streamIdOf } from './eventChunks.js';
import { requirementCosts, requirementVariants } from './requirementCosts.js';
import { fileSha256 } from '../report/summaryJson.js';
import type { PointResult } from './types.js';

export interface EventFileRecastOptions {
  eventFile: string;
  analyses: readonly Analysis[];
  seed: number;
  /** Name of the model in reports (default: the file's name). */
  modelName?: string;
  /** Cross section of the sample in pb (default: from the file's init block). */
  crossSectionPb?: number;
  cl?: number;
  method?: LimitMethod;
  combinationMethod?: LimitMethod;
  uncertaintyModel?: UncertaintyModel;
  requirementCosts?: boolean;
  /** Called every 10 000 events with the number read so far. */
  onProgress?: (events: number) => void;
}

export async function recastEventFile(options: EventFileRecastOptions): Promise<PointResult> {
  const file = options.eventFile;
  const head = await readLheFile(file, () => undefined, { maxEvents: 1 });
  const energyTeV = Number(((head.init.beamEnergies[0] + head.init.beamEnergies[1]) / 1000).toPrecision(10));
  const fromFile = head.init.processes.reduce((s, p) => s + p.crossSectionPb, 0);
  const sigmaPb = options.crossSectionPb ?? fromFile;
  if (!(sigmaPb > 0 && Number.isFinite(sigmaPb))) {
    throw new TamisError('bad_input', `the file's init block gives no positive cross section (sum of XSECUP = ${fromFile})`, { file, suggestion: 'give the sample\u2019s cross section with --cross-section PB' });
  }
  const analyses = options.analyses.filter((a) => Math.abs(a.energyTev - energyTeV) < 1e-3 * energyTeV);
  if (analyses.length === 0) {
    const energies = [...new Set(options.analyses.map((a) => `${a.energyTev} TeV`))].join(', ');
    throw new TamisError('bad_input', `the events are at ${energyTeV} TeV but the analyses are at ${energies}`, { file, suggestion: 'give analyses of the same collider energy as the event file' });
  }
  const withCosts = options.requirementCosts ?? true;
  const energyCode = Math.round(1000 * energyTeV);
  const groups = groupByDetector(analyses).map((group) => ({
    group,
    detector: createDetector(loadDetectorProfile(group.detectorFile)),
    selection: createSelection(group.analyses),
    variants: withCosts ? createSelection(group.analyses.flatMap(requirementVariants), { blame: false }) : undefined,
    rng: RandomStream.forStream(options.seed, energyCode, STREAM_RECAST_DETECTOR, 0, streamIdOf(basename(group.detectorFile))),
  }));
  const reco = new RecoEvent();
  const read = await readLheFile(file, (record, index) => {
    for (const g of groups) {
      try {
        g.detector.reconstruct(record, g.rng, reco);
      } catch (error) {
        if (error instanceof TamisError) throw new TamisError(error.code, `event ${index + 1}: ${error.message}`, { file, ...(error.suggestion ? { suggestion: error.suggestion } : {}) });
        throw error;
      }
      g.selection.process(reco, index);
      g.variants?.process(reco, index);
    }
    if ((index + 1) % 10_000 === 0) options.onProgress?.(index + 1);
  });
  if (read.events === 0) throw new TamisError('bad_file', 'the file holds no event', { file });
  const settings = limitSettingsOf(options);
  const outcomes = groups.flatMap((g) => {
    const results = g.selection.results();
    const variants = new Map((g.variants?.results().analyses ?? []).map((r) => [r.id, r]));
    return g.group.analyses.map((analysis, a) => ({
      ...analysisOutcome(analysis, results.analyses[a]!, sigmaPb, settings),
      requirementCosts: withCosts ? requirementCosts(analysis, variants) : [],
    }));
  });
  const order = new Map(options.analyses.map((a, i) => [a.id, i]));
  outcomes.sort((x, y) => order.get(x.id)! - order.get(y.id)!);
  return {
    model: { name: options.modelName ?? basename(file), file, sha256: fileSha256(file), parameters: {} },
    seed: options.seed,
    eventsPerEnergy: read.events,
    cl: settings.cl,
    energies: [
      {
        energyTeV,
        sigmaPb,
        errorPb: options.crossSectionPb === undefined ? Math.sqrt(head.init.processes.reduce((s, p) => s + p.errorPb * p.errorPb, 0)) : 0,
        // The file carries no scale variation.
        scaleBandPb: [Number.NaN, Number.NaN],
        channels: head.init.processes.map((p) => ({ name: `process ${p.processId}`, sigmaPb: p.crossSectionPb, errorPb: p.errorPb, kFactor: 1 })),
        events: read.events,
      },
    ],
    analyses: outcomes,
  };
}
