/**
 * Running analyses on an event file: the Les Houches events are read once,
 * streamed (memory stays flat), passed through the detector profile of each
 * analysis group and through the selection. Used by `tamis cutflow`.
 *
 * Analyses at another collider energy than the file's (sqrt(s) = sum of the
 * two beam energies of the init block) are skipped and listed; if none
 * remains, that is an error.
 *
 * Randomness: the detector of profile k draws from
 * `RandomStream.forStream(seed, STREAM_DETECTOR, k)`, so the same file, seed
 * and analyses give the same bytes.
 */
import { createDetector, type Detector } from '../detector/detector.js';
import { loadDetectorProfile } from '../detector/profile/loader.js';
import { RecoEvent } from '../detector/recoEvent.js';
import { TamisError } from '../errors.js';
import { readLheFile } from '../generator/lhe/lheReader.js';
import { RandomStream } from '../physics/random.js';
import type { Analysis } from './analysis.js';
import { createSelection, type Selection } from './engine.js';
import type { AnalysisResult } from './results.js';

/** Stream id of the detector's random numbers in `tamis cutflow` ("DETR"). */
export const STREAM_DETECTOR = 0x44455452;

export interface EventFileOptions {
  /** Seed of the detector's random numbers (default 1). */
  seed?: number;
  /** Stop after this many events. */
  maxEvents?: number;
}

export interface EventFileResults {
  file: string;
  /** Collider energy of the file, TeV. */
  energyTev: number;
  events: number;
  seed: number;
  /** Results of the analyses run, in the order given. */
  analyses: AnalysisResult[];
  /** Ids of the analyses skipped because their energy differs from the file's. */
  skipped: string[];
}

/**
 * Runs `analyses` on the events of an LHE file (plain or gzip).
 *
 * @throws TamisError for an unreadable or malformed file, or when no analysis matches the file's energy
 * @example
 * const run = await selectEventFile(loadAnalyses(['analyses']), 'signal.lhe', { seed: 7 });
 * run.analyses[0].regions[0].efficiency
 */
export async function selectEventFile(analyses: readonly Analysis[], file: string, options: EventFileOptions = {}): Promise<EventFileResults> {
  const seed = options.seed ?? 1;
  const head = await readLheFile(file, () => undefined, { maxEvents: 1 });
  const energyTev = (head.init.beamEnergies[0] + head.init.beamEnergies[1]) / 1000;
  const matching = analyses.filter((a) => Math.abs(a.energyTev - energyTev) < 1e-3 * energyTev);
  const skipped = analyses.filter((a) => !matching.includes(a)).map((a) => a.id);
  if (matching.length === 0) {
    const energies = [...new Set(analyses.map((a) => `${a.energyTev} TeV`))].join(', ');
    throw new TamisError('bad_input', `the events are at ${energyTev} TeV but the analyses are at ${energies}`, { file, suggestion: 'give analyses of the same collider energy as the event file' });
  }
  const groups = new Map<string, Analysis[]>();
  for (const a of matching) groups.set(a.detectorFile, [...(groups.get(a.detectorFile) ?? []), a]);
  const runs: { detector: Detector; selection: Selection; rng: RandomStream }[] = [...groups].map(([profileFile, group], k) => ({
    detector: createDetector(loadDetectorProfile(profileFile)),
    selection: createSelection(group),
    rng: RandomStream.forStream(seed, STREAM_DETECTOR, k),
  }));
  const reco = new RecoEvent();
  const read = await readLheFile(
    file,
    (record, index) => {
      for (let k = 0; k < runs.length; k++) {
        const run = runs[k]!;
        try {
          run.detector.reconstruct(record, run.rng, reco);
        } catch (error) {
          if (error instanceof TamisError) throw new TamisError(error.code, `event ${index + 1}: ${error.message}`, { file, ...(error.suggestion === undefined ? {} : { suggestion: error.suggestion }) });
          throw error;
        }
        run.selection.process(reco, index);
      }
    },
    options.maxEvents === undefined ? {} : { maxEvents: options.maxEvents },
  );
  const byId = new Map(runs.flatMap((run) => run.selection.results().analyses).map((r) => [r.id, r]));
  return { file, energyTev, events: read.events, seed, analyses: matching.map((a) => byId.get(a.id)!), skipped };
}
